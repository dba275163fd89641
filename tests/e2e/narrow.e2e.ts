import type { Page } from "playwright-core";
import { beforeAll, describe, expect, it } from "vitest";
import { NAV_ITEMS } from "@/components/shell/nav-links";
import { DEMO_GARNET_SET_ID } from "@/db/demo-data";
import { dataLoaded, outputPath, useBrowser } from "./support";

/*
 * The product on a 390 px wide phone: every rail page is reachable through the menu (by pointer
 * and by keyboard), Escape closes the menu, and the workbench's plots keep their titles, y labels
 * and x tick labels inside the picture and apart from each other.
 */

const WIDTH = 390;
const PHONE = { viewport: { width: WIDTH, height: 844 }, isMobile: true, hasTouch: true };

/**
 * How far the document is wider than its layout viewport, measured as the browser lays it out:
 * documentElement.scrollWidth against clientWidth (not innerWidth, which mobile emulation widens
 * to fit wide content, hiding the overflow it should reveal). clientWidth itself must stay the
 * phone's width, or the page has widened the viewport and the comparison would be void.
 */
async function horizontalOverflow(page: Page): Promise<{ clientWidth: number; overflow: number }> {
  await dataLoaded(page);
  return page.evaluate(() => {
    const root = document.documentElement;
    return { clientWidth: root.clientWidth, overflow: root.scrollWidth - root.clientWidth };
  });
}

/** Every signed-in page that is not in the menu, with the demo's ids (db/demo-data.ts). */
const OTHER_PAGES = [
  `/parameter-sets/${DEMO_GARNET_SET_ID}`,
  `/parameter-sets/${DEMO_GARNET_SET_ID}/history`,
  `/parameter-sets/${DEMO_GARNET_SET_ID}/report`,
  "/parameter-sets/new",
  `/workbench/${DEMO_GARNET_SET_ID}`,
];

/** The signed-out pages. */
const PUBLIC_PAGES = ["/sign-in", "/sign-up", "/forgot-password"];

async function expectFits(page: Page, href: string): Promise<void> {
  const { clientWidth, overflow } = await horizontalOverflow(page);
  if (overflow > 0) await page.screenshot({ path: outputPath(`narrow-overflow${href.replaceAll("/", "-")}.png`), fullPage: true });
  expect(clientWidth, `${href} widened the layout viewport`).toBe(WIDTH);
  expect(overflow, `${href} is ${overflow} px wider than the screen`).toBeLessThanOrEqual(0);
}

describe("390 px wide", () => {
  const browser = useBrowser();
  let page: Page;

  beforeAll(async () => {
    page = await browser.signedInPage("owner", { context: PHONE });
  });

  it("reaches every rail page through the menu, and Escape closes it", async () => {
    const menu = page.getByRole("button", { name: "Menu" });
    const nav = page.getByRole("navigation", { name: "Main" });
    try {
      await page.goto("/parameter-sets");
      await menu.waitFor();
      expect(await nav.isVisible()).toBe(false);
      for (const item of NAV_ITEMS) {
        await menu.click();
        expect(await menu.getAttribute("aria-expanded")).toBe("true");
        await nav.getByRole("link", { name: item.label, exact: true }).click();
        await page.waitForURL((url) => url.pathname === item.href, { timeout: 30_000 });
        await expect.poll(() => menu.getAttribute("aria-expanded")).toBe("false");
        await page.getByRole("heading", { level: 1 }).first().waitFor({ timeout: 30_000 });
        await expectFits(page, item.href);
      }

      // Keyboard: open with Enter, reach a link with Tab, close with Escape (focus back on the button).
      await menu.focus();
      await page.keyboard.press("Enter");
      expect(await menu.getAttribute("aria-expanded")).toBe("true");
      await page.keyboard.press("Tab");
      expect(await page.evaluate(() => document.activeElement?.textContent)).toBe(NAV_ITEMS[0].label);
      await page.keyboard.press("Escape");
      expect(await menu.getAttribute("aria-expanded")).toBe("false");
      expect(await nav.isVisible()).toBe(false);
      expect(await page.evaluate(() => document.activeElement?.textContent?.trim())).toBe("Menu");
    } catch (error) {
      await page.screenshot({ path: outputPath("narrow-menu-failure.png"), fullPage: true });
      throw error;
    }
  });

  it("fits every other page, with its data loaded, into the screen's width", async () => {
    const failures: string[] = [];
    const check = async (target: Page, href: string) => {
      await target.goto(href, { timeout: 120_000 });
      await target.getByRole("heading", { level: 1 }).first().waitFor({ timeout: 60_000 });
      try {
        await expectFits(target, href);
      } catch (error) {
        failures.push(error instanceof Error ? error.message.split("\n")[0]! : String(error));
      }
    };
    for (const href of OTHER_PAGES) await check(page, href);
    const guest = await browser.guestPage({ context: PHONE });
    for (const href of PUBLIC_PAGES) await check(guest, href);
    expect(failures).toEqual([]);
  });

  it("keeps plot titles, y labels and x tick labels whole and apart", async () => {
    try {
      await page.goto("/workbench", { timeout: 120_000 });
      const plots = page.locator("svg[role=img]");
      await expect.poll(() => plots.count(), { timeout: 120_000 }).toBeGreaterThanOrEqual(2);
      await page.screenshot({ path: outputPath("narrow-workbench.png"), fullPage: true });
      const problems = await page.evaluate(() => {
        const out: string[] = [];
        for (const svg of Array.from(document.querySelectorAll<SVGSVGElement>("svg[role=img]"))) {
          const name = svg.getAttribute("aria-label") ?? "plot";
          const box = svg.getBoundingClientRect();
          if (box.right > window.innerWidth + 0.5) out.push(`${name}: the plot is wider than the screen`);
          for (const text of Array.from(svg.querySelectorAll<SVGTextElement>("text"))) {
            const t = text.getBoundingClientRect();
            if (!text.textContent || t.width === 0) continue;
            if (t.left < box.left - 0.5 || t.right > box.right + 0.5 || t.top < box.top - 0.5 || t.bottom > box.bottom + 0.5) {
              out.push(`${name}: "${text.textContent}" is cut off`);
            }
          }
          // x tick labels sit in one row just under the plotting area; none may overlap another.
          const ticks = Array.from(svg.querySelectorAll<SVGTextElement>("g[transform^='translate('] > text[text-anchor='middle']"))
            .filter((t) => t.textContent)
            .map((t) => t.getBoundingClientRect())
            .sort((a, b) => a.left - b.left);
          for (let i = 1; i < ticks.length; i++) {
            const a = ticks[i - 1]!;
            const b = ticks[i]!;
            if (Math.abs(a.top - b.top) < 2 && b.left < a.right) out.push(`${name}: x tick labels overlap`);
          }
        }
        return out;
      });
      expect(problems).toEqual([]);

      // The plots come first: the first one starts on the first screen, and the inputs wait in a drawer.
      const firstPlotTop = await plots.first().evaluate((svg) => svg.getBoundingClientRect().top + window.scrollY);
      expect(firstPlotTop, "the first plot starts below the first screen").toBeLessThan(844);
      const inputs = page.getByRole("complementary", { name: "Parameters" });
      const toggle = page.getByRole("button", { name: /^Inputs/ });
      expect(await inputs.isVisible()).toBe(false);
      await toggle.click();
      expect(await toggle.getAttribute("aria-expanded")).toBe("true");
      await inputs.getByLabel(/^From/).first().waitFor();
      await page.keyboard.press("Escape");
      await expect.poll(() => inputs.isVisible()).toBe(false);
      expect(await page.evaluate(() => document.activeElement?.getAttribute("aria-controls"))).toBe("workbench-inputs");
    } catch (error) {
      await page.screenshot({ path: outputPath("narrow-plots-failure.png"), fullPage: true });
      throw error;
    }
  });
});
