import { type Browser, chromium } from "playwright-core";

/*
 * Debian's Chromium, headless, as the browser tests and the README screenshot drive it. Never a
 * downloaded browser; the flags keep it quiet on a machine without outside network (without them
 * it opens connections that the closed network refuses, many at a time).
 */

const CHROMIUM_PATH = process.env.GYROLUX_CHROMIUM ?? "/usr/bin/chromium";

const CHROMIUM_ARGS = [
  "--no-sandbox",
  "--disable-gpu",
  "--disable-quic",
  "--no-first-run",
  "--disable-background-networking",
  "--disable-component-update",
  "--disable-sync",
];

export function launchChromium(): Promise<Browser> {
  return chromium.launch({ executablePath: CHROMIUM_PATH, args: CHROMIUM_ARGS, headless: true });
}
