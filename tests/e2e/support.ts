import { existsSync, mkdirSync } from "node:fs";
import path from "node:path";
import type { Browser, BrowserContextOptions, Page } from "playwright-core";
import { afterAll, beforeAll } from "vitest";
import { DEMO, type DemoAccount } from "../demo-accounts";
import { CONTEXT_DEFAULTS, SESSION_DIR, signInThroughForm } from "./browser";
import { launchChromium } from "@/scripts/chromium";

export { BASE_URL, outputPath } from "./browser";

export interface PageOptions {
  /** Context options over the desktop defaults (a phone's viewport, touch). */
  context?: BrowserContextOptions;
  /** A script run in every document before the page's own (probes a test reads back). */
  initScript?: string;
}

export interface BrowserFixture {
  /** A page in a new context that holds the account's stored session: signed in, no form filled. */
  signedInPage(account: DemoAccount, options?: PageOptions): Promise<Page>;
  /** A page in a new context signed in as nobody. */
  guestPage(options?: PageOptions): Promise<Page>;
}

/**
 * One Chromium for the calling test file: launched before its tests and closed after them, with
 * every context it opened. Call it once, at the top of the file's describe.
 */
export function useBrowser(): BrowserFixture {
  let browser: Browser | undefined;
  beforeAll(async () => {
    browser = await launchChromium();
  });
  afterAll(async () => {
    await browser?.close();
  });

  const launched = (): Browser => {
    if (!browser) throw new Error("Chromium is launched in beforeAll: open pages in a hook or a test");
    return browser;
  };
  async function open(storageState: string | undefined, options: PageOptions = {}): Promise<Page> {
    const context = await launched().newContext({ ...CONTEXT_DEFAULTS, ...options.context, storageState });
    if (options.initScript) await context.addInitScript({ content: options.initScript });
    return context.newPage();
  }

  return {
    async signedInPage(account, options) {
      return open(await storedSession(launched(), account), options);
    },
    guestPage(options) {
      return open(undefined, options);
    },
  };
}

/**
 * The file holding the account's session. The first file of a run that asks for the account signs
 * it in through the sign-in form; later files (one at a time, vitest.e2e.config.mts) reuse it.
 */
async function storedSession(browser: Browser, account: DemoAccount): Promise<string> {
  const file = path.join(SESSION_DIR, `${account}.json`);
  if (existsSync(file)) return file;
  mkdirSync(SESSION_DIR, { recursive: true });
  const context = await browser.newContext(CONTEXT_DEFAULTS);
  try {
    await signInThroughForm(await context.newPage(), DEMO[account]);
    await context.storageState({ path: file });
  } finally {
    await context.close();
  }
  return file;
}

/**
 * Resolves once the page's data has arrived: the network is quiet and no loading placeholder
 * (SkeletonRows' pulsing bars, a "Loading…" status) is left. A table that arrives later can still
 * change the page, so width and accessibility checks run only after this.
 */
export async function dataLoaded(page: Page, timeoutMs = 30_000): Promise<void> {
  await page.waitForLoadState("networkidle", { timeout: 15_000 }).catch(() => undefined);
  await page.waitForFunction(
    () =>
      !document.querySelector(".animate-pulse") &&
      !Array.from(document.querySelectorAll("[role=status]")).some((el) => /loading/i.test(el.textContent ?? "")),
    undefined,
    { timeout: timeoutMs },
  );
}
