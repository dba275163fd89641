import { mkdirSync } from "node:fs";
import path from "node:path";
import type { BrowserContextOptions, Page } from "playwright-core";
import { DEMO_PASSWORD } from "@/db/demo-data";

/*
 * Chromium and the server under test, without vitest: the global setup (sessions-setup.ts) runs
 * outside the test runner and shares these paths with the fixture in support.ts.
 */

/** Base URL of the server under test; localhost, not 127.0.0.1 (Next rewrites 127.x hosts). */
export const BASE_URL = process.env.GYROLUX_TEST_BASE_URL ?? "http://localhost:3100";

/** Where screenshots and downloads go. */
export const OUTPUT_DIR = path.resolve(process.env.GYROLUX_TEST_OUTPUT ?? "test-results");

/** The demo accounts' stored sessions (Playwright storage state) of this run. */
export const SESSION_DIR = path.join(OUTPUT_DIR, "sessions");

/** A desktop window against the server under test. */
export const CONTEXT_DEFAULTS: BrowserContextOptions = {
  baseURL: BASE_URL,
  viewport: { width: 1440, height: 900 },
  acceptDownloads: true,
};

/** Signs in through the real sign-in form and waits for the signed-in shell. */
export async function signInThroughForm(page: Page, email: string, password = DEMO_PASSWORD): Promise<void> {
  await page.goto("/sign-in");
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password").fill(password);
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.waitForURL((url) => !url.pathname.startsWith("/sign-in"), { timeout: 30_000 });
}

export function outputPath(name: string): string {
  mkdirSync(OUTPUT_DIR, { recursive: true });
  return path.join(OUTPUT_DIR, name);
}
