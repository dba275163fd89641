import type { Page } from "playwright-core";
import { describe, expect, it } from "vitest";
import { outputPath, useBrowser } from "./support";

/*
 * Parameter sets through the browser: an editor creates, edits, compares and restores a set; a
 * viewer finds nothing to edit. Runs against a seeded server (scripts/test.sh).
 */

const SET_URL = /\/parameter-sets\/[0-9a-f-]{36}$/;

class SetPage {
  constructor(readonly page: Page) {}
  field(label: string) {
    return this.page.getByLabel(label, { exact: true });
  }
  get temperature() {
    return this.field("Temperature");
  }
  get description() {
    return this.field("Description");
  }
}

describe("parameter sets in the browser", () => {
  const browser = useBrowser();

  it("lets an editor create, edit, compare and restore a set", async () => {
    const page = await browser.signedInPage("editor");
    const set = new SetPage(page);
    try {
      await page.goto("/parameter-sets");
      await page.getByRole("link", { name: "New parameter set" }).click();
      await page.waitForURL("**/parameter-sets/new");

      const name = `Browser test ${Date.now()}`;
      await expect.poll(() => set.temperature.inputValue(), { timeout: 30_000 }).toBe("293.15");
      await set.field("Name").fill(name);
      await set.description.fill("Created by the browser test");
      await set.field("Tags").fill("e2e, TGG");
      await page.getByRole("button", { name: "Create parameter set" }).click();
      await page.waitForURL(SET_URL, { timeout: 30_000 });
      await page.getByRole("heading", { level: 1, name }).waitFor();

      await set.temperature.fill("77");
      await set.description.fill("Cooled with liquid nitrogen");
      await page.getByRole("button", { name: "Save", exact: true }).click();
      await page.getByText("Saved as version 2.").waitFor();

      await page.getByRole("link", { name: "History", exact: true }).click();
      await page.waitForURL(/\/history$/);
      const versions = page.getByRole("list", { name: "Versions" }).getByRole("listitem");
      await expect.poll(() => versions.count(), { timeout: 30_000 }).toBe(2);
      const diff = page.getByRole("table", { name: "Differences between version 1 and version 2" });
      await expect.poll(() => diff.textContent(), { timeout: 30_000 }).toContain("77 K");
      await expect.poll(() => diff.textContent(), { timeout: 30_000 }).toContain("293.15 K");

      await page.getByRole("button", { name: "Restore this version (version 1)" }).click();
      const dialog = page.getByRole("dialog", { name: "Restore version 1?" });
      await dialog.getByRole("button", { name: "Restore", exact: true }).click();
      await page.getByText("Restored: version 3 now holds the content of version 1.").waitFor();
      await expect.poll(() => versions.count(), { timeout: 30_000 }).toBe(3);

      await page.getByRole("navigation", { name: "Breadcrumb" }).getByRole("link", { name, exact: true }).click();
      await page.waitForURL(SET_URL);
      await expect.poll(() => set.temperature.inputValue(), { timeout: 30_000 }).toBe("293.15");
      expect(await set.description.inputValue()).toBe("Created by the browser test");
    } catch (error) {
      await page.screenshot({ path: outputPath("parameter-sets-editor-failure.png"), fullPage: true });
      throw error;
    } finally {
      await page.context().close();
    }
  });

  it("shows a viewer the values without any edit control", async () => {
    const page = await browser.signedInPage("viewer");
    try {
      await page.goto("/parameter-sets");
      await page.getByRole("table").getByRole("link").first().click();
      await page.waitForURL(SET_URL);
      await page.getByText("You can view; editing needs the editor role").waitFor({ timeout: 30_000 });
      await page.getByText("Temperature", { exact: true }).waitFor();

      const main = page.getByRole("main");
      expect(await main.getByRole("button", { name: "Save" }).count()).toBe(0);
      expect(await main.getByRole("button", { name: "Delete" }).count()).toBe(0);
      expect(await main.locator("input:enabled, textarea:enabled, select:enabled").count()).toBe(0);
      expect(await page.getByRole("link", { name: "New parameter set" }).count()).toBe(0);
    } catch (error) {
      await page.screenshot({ path: outputPath("parameter-sets-viewer-failure.png"), fullPage: true });
      throw error;
    } finally {
      await page.context().close();
    }
  });
});
