import { describe, expect, it } from "vitest";
import { outputPath, useBrowser } from "./support";

/*
 * The audit page and its menu entry: a viewer (who owns no lab) is not offered it; an owner opens
 * it without a request for a lab not yet chosen, and reads entries in words, not stored keys.
 */

describe("audit in the browser", () => {
  const browser = useBrowser();

  it("is not in a viewer's menu", async () => {
    const page = await browser.signedInPage("viewer");
    await page.goto("/parameter-sets");
    const nav = page.getByRole("navigation", { name: "Main" });
    await nav.getByRole("link", { name: "Lab runs", exact: true }).waitFor();
    await page.waitForLoadState("networkidle", { timeout: 15_000 }).catch(() => undefined);
    expect(await nav.getByRole("link", { name: "Audit", exact: true }).count()).toBe(0);
  });

  it("reads the owner's trail in words, with no request before a lab is chosen", async () => {
    const page = await browser.signedInPage("owner");
    const requests: string[] = [];
    const consoleErrors: string[] = [];
    page.on("request", (r) => requests.push(new URL(r.url()).pathname));
    page.on("console", (m) => {
      if (m.type() === "error") consoleErrors.push(m.text());
    });
    try {
      await page.goto("/parameter-sets");
      await page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "Audit", exact: true }).click();
      const table = page.getByRole("table", { name: "Audit trail" });
      await table.waitFor({ timeout: 30_000 });
      const whatCells = await table.locator("tbody tr td:nth-child(3)").allInnerTexts();
      expect(whatCells.length).toBeGreaterThan(0);
      for (const text of whatCells) expect(text).not.toMatch(/^[a-z_]+\.[a-z_]+$/);
      await page.getByLabel("About person").waitFor();
      expect(requests.filter((p) => p.includes("/api/labs/none"))).toEqual([]);
      expect(consoleErrors).toEqual([]);
    } catch (error) {
      await page.screenshot({ path: outputPath("audit-failure.png"), fullPage: true });
      throw error;
    }
  });
});
