import type { Page } from "playwright-core";
import { beforeAll, describe, expect, it } from "vitest";
import { NAV_ITEMS } from "@/components/shell/nav-links";
import { outputPath, useBrowser } from "./support";

/*
 * The product on a 390 px wide phone: every rail page is reachable through the menu (by pointer
 * and by keyboard), Escape closes the menu, and the workbench's plots keep their titles, y labels
 * and x tick labels inside the picture and apart from each other.
 */

const WIDTH = 390;

/**
 * How far the page is wider than the phone, once its lists have loaded (a table that arrives later
 * can still widen it). Against the phone's width, not innerWidth: a mobile browser widens its
 * layout viewport to fit wide content, so innerWidth grows with the overflow it should reveal.
 */
async function horizontalOverflow(page: Page): Promise<number> {
  await page.waitForLoadState("networkidle", { timeout: 5_000 }).catch(() => undefined);
  return page.evaluate((width) => document.documentElement.scrollWidth - width, WIDTH);
}

describe("390 px wide", () => {
  const browser = useBrowser();
  let page: Page;

  beforeAll(async () => {
    page = await browser.signedInPage("owner", { context: { viewport: { width: WIDTH, height: 844 }, isMobile: true, hasTouch: true } });
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
        expect(await horizontalOverflow(page), `${item.href} is wider than the screen`).toBeLessThanOrEqual(0);
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
    } catch (error) {
      await page.screenshot({ path: outputPath("narrow-plots-failure.png"), fullPage: true });
      throw error;
    }
  });
});
