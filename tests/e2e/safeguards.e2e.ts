import type { Page } from "playwright-core";
import { describe, expect, it } from "vitest";
import { DEMO_LAB, DEMO_SETS, OTHER_LAB } from "@/db/demo-data";
import { TERBIUM_GARNET_DEFAULTS } from "@/lib/model/defaults";
import type { DemoAccount } from "../demo-accounts";
import { outputPath, useBrowser } from "./support";

/*
 * What keeps a user's work and trust: unsaved edits survive a click in the rail or Back unless the
 * user chooses to leave; an edit conflict is brought into view and merged field by field; the form
 * explains bad input; a viewer is not offered saves that would fail; a set of another lab shows a
 * not-found page; a lab role change asks first.
 */

const SET_URL = /\/parameter-sets\/[0-9a-f-]{36}$/;

interface ApiSet {
  id: string;
  version: number;
  name: string;
  params: Record<string, number>;
}

/** Creates a set in the demo lab through the API, as the signed-in page's user. */
async function createSet(page: Page, name: string): Promise<ApiSet> {
  return page.evaluate(
    async ({ labId, name, params }) => {
      const r = await fetch("/api/parameter-sets", {
        method: "POST",
        headers: { "Content-Type": "application/json", Accept: "application/json" },
        body: JSON.stringify({ labId, name, description: "Browser test", tags: ["e2e"], params }),
      });
      if (!r.ok) throw new Error(`create failed: ${r.status} ${await r.text()}`);
      return ((await r.json()) as { item: ApiSet }).item;
    },
    { labId: DEMO_LAB.id, name, params: TERBIUM_GARNET_DEFAULTS },
  );
}

async function getSet(page: Page, id: string): Promise<ApiSet> {
  return page.evaluate(async (id) => {
    const r = await fetch(`/api/parameter-sets/${id}`, { headers: { Accept: "application/json" } });
    return ((await r.json()) as { item: ApiSet }).item;
  }, id);
}

describe("safeguards in the browser", () => {
  const browser = useBrowser();

  async function withPage(account: DemoAccount, shot: string, body: (page: Page) => Promise<void>): Promise<void> {
    const page = await browser.signedInPage(account);
    try {
      await body(page);
    } catch (error) {
      await page.screenshot({ path: outputPath(`${shot}-failure.png`), fullPage: true });
      throw error;
    } finally {
      await page.context().close();
    }
  }

  it("asks before a rail link or Back discards unsaved edits, and stays when the user cancels", async () => {
    await withPage("editor", "unsaved-guard", async (page) => {
      await page.goto("/parameter-sets");
      const set = await createSet(page, `Guard test ${Date.now()}`);
      await page.goto(`/parameter-sets/${set.id}`);
      const temperature = page.getByLabel("Temperature", { exact: true });
      await expect.poll(() => temperature.inputValue(), { timeout: 30_000 }).toBe("293.15");
      await temperature.fill("77");
      await page.getByText("Unsaved changes").waitFor();

      const dialog = page.getByRole("dialog", { name: "Leave without saving?" });
      const rail = page.getByRole("navigation", { name: "Main" });

      // A rail link: cancel keeps the page and the edit.
      await rail.getByRole("link", { name: "Workbench", exact: true }).click();
      await dialog.waitFor();
      await dialog.getByRole("button", { name: "Cancel" }).click();
      await dialog.waitFor({ state: "hidden" });
      expect(new URL(page.url()).pathname).toBe(`/parameter-sets/${set.id}`);
      expect(await temperature.inputValue()).toBe("77");

      // A link in the page header (a Next <Link>) is guarded the same way.
      await page.getByRole("link", { name: "History", exact: true }).click();
      await dialog.waitFor();
      await dialog.getByRole("button", { name: "Cancel" }).click();
      expect(new URL(page.url()).pathname).toBe(`/parameter-sets/${set.id}`);

      // Back: cancel stays, with the edit.
      await page.goBack();
      await dialog.waitFor();
      await dialog.getByRole("button", { name: "Cancel" }).click();
      expect(new URL(page.url()).pathname).toBe(`/parameter-sets/${set.id}`);
      expect(await temperature.inputValue()).toBe("77");

      // Leaving on purpose works, and nothing was saved.
      await rail.getByRole("link", { name: "Workbench", exact: true }).click();
      await dialog.getByRole("button", { name: "Leave and discard changes" }).click();
      await page.waitForURL((url) => url.pathname === "/workbench", { timeout: 30_000 });
      expect((await getSet(page, set.id)).version).toBe(1);

      // A saved form leaves without asking.
      await page.goto(`/parameter-sets/${set.id}`);
      await expect.poll(() => temperature.inputValue(), { timeout: 30_000 }).toBe("293.15");
      await rail.getByRole("link", { name: "Lab", exact: true }).click();
      await page.waitForURL((url) => url.pathname === "/lab", { timeout: 30_000 });
      expect(await dialog.isVisible()).toBe(false);
    });
  });

  it("brings an edit conflict into view and saves only this user's changes on top of the newer version", async () => {
    await withPage("editor", "conflict-merge", async (page) => {
      await page.setViewportSize({ width: 1280, height: 700 });
      await page.goto("/parameter-sets");
      const set = await createSet(page, `Conflict test ${Date.now()}`);
      await page.goto(`/parameter-sets/${set.id}`);
      const temperature = page.getByLabel("Temperature", { exact: true });
      await expect.poll(() => temperature.inputValue(), { timeout: 30_000 }).toBe("293.15");

      // Someone else saves version 2 with a new field and length.
      await page.evaluate(async (id) => {
        const r = await fetch(`/api/parameter-sets/${id}`, {
          method: "PATCH",
          headers: { "Content-Type": "application/json", Accept: "application/json" },
          body: JSON.stringify({ version: 1, description: "Remeasured by a colleague", params: undefined }),
        });
        if (!r.ok) throw new Error(`patch failed: ${r.status}`);
      }, set.id);
      const theirs = await page.evaluate(async (id) => {
        const current = (await (await fetch(`/api/parameter-sets/${id}`)).json()) as { item: ApiSet };
        const r = await fetch(`/api/parameter-sets/${id}`, {
          method: "PATCH",
          headers: { "Content-Type": "application/json", Accept: "application/json" },
          body: JSON.stringify({ version: current.item.version, params: { ...current.item.params, fieldT: 2 } }),
        });
        return ((await r.json()) as { item: ApiSet }).item;
      }, set.id);
      expect(theirs.version).toBe(3);

      // This user, still on version 1, changes only the temperature and saves from the bottom.
      await temperature.fill("77");
      await page.getByRole("button", { name: "Save", exact: true }).click();
      const banner = page.getByRole("alert").filter({ hasText: "Someone saved version 3" });
      await banner.waitFor({ timeout: 30_000 });
      const inView = await banner.evaluate((el) => {
        const r = el.getBoundingClientRect();
        return r.top >= 0 && r.top < window.innerHeight && document.activeElement === el;
      });
      expect(inView, "the banner is scrolled into view and has the focus").toBe(true);

      await banner.getByRole("button", { name: /Apply my changes to version 3/ }).click();
      const preview = banner.getByRole("table", { name: "What saving the merge changes in version 3" });
      await preview.waitFor();
      const previewText = await preview.textContent();
      expect(previewText).toContain("293.15 K");
      expect(previewText).toContain("77 K");
      expect(previewText).not.toContain("Field B0");
      await banner.getByRole("button", { name: "Save merged version" }).click();
      await page.getByText("Saved as version 4.").waitFor({ timeout: 30_000 });

      const saved = await getSet(page, set.id);
      expect(saved.params.temperatureK).toBe(77);
      expect(saved.params.fieldT).toBe(2);
      expect((saved as unknown as { description: string }).description).toBe("Remeasured by a colleague");
    });
  });

  it("explains bad input: long tags, Not a number, a decimal comma, scientific values", async () => {
    await withPage("editor", "form-input", async (page) => {
      await page.setViewportSize({ width: 1280, height: 900 });
      await page.goto("/parameter-sets/new");
      const tags = page.getByLabel("Tags", { exact: true });
      await tags.waitFor({ timeout: 30_000 });
      await tags.fill(`tgg, ${"x".repeat(120)}`);
      await tags.blur();
      await page.getByText("Each tag at most 40 characters.").waitFor();
      expect(await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth)).toBeLessThanOrEqual(0);

      const damping = page.getByLabel("Oscillator damping ΓE", { exact: true });
      expect(await damping.inputValue()).toMatch(/^\d(\.\d+)?e\d+$/);

      const field = page.getByLabel("Field B0", { exact: true });
      await field.fill("1e");
      await field.blur();
      await page.getByText("Not a number").waitFor();
      await field.fill("");
      await field.blur();
      await page.getByText("Required", { exact: true }).waitFor();
      await field.fill("0,5");
      await field.blur();
      await expect.poll(() => page.getByText("Required", { exact: true }).count()).toBe(0);
      expect(await page.getByText("Not a number").count()).toBe(0);

      const name = page.getByLabel("Name", { exact: true });
      await name.fill("n".repeat(121));
      await name.blur();
      await page.getByText("At most 120 characters.").waitFor();
    });
  });

  it("offers a viewer no save that would fail, and shows another lab's set as not found", async () => {
    await withPage("viewer", "viewer", async (page) => {
      await page.goto("/workbench", { timeout: 120_000 });
      await page.getByRole("heading", { level: 1 }).waitFor({ timeout: 60_000 });
      // The labs load before the button would appear; give them the time, then expect none.
      await page.waitForResponse((r) => r.url().includes("/api/labs"), { timeout: 30_000 }).catch(() => undefined);
      await page.waitForTimeout(1000);
      expect(await page.getByRole("button", { name: "Save as new parameter set" }).count()).toBe(0);

      const foreign = DEMO_SETS.find((s) => s.labId === OTHER_LAB.id);
      expect(foreign).toBeDefined();
      for (const url of [
        `/parameter-sets/${foreign!.id}`,
        "/parameter-sets/00000000-0000-4000-8000-000000000000",
        "/parameter-sets/not-an-id",
      ]) {
        await page.goto(url);
        await page.getByRole("heading", { name: "There is nothing at this address" }).waitFor({ timeout: 30_000 });
        expect(await page.getByText("Something went wrong").count()).toBe(0);
        expect(await page.getByRole("button", { name: "Try again" }).count()).toBe(0);
      }
    });
  });

  it("asks before changing a member's role and keeps it when cancelled", async () => {
    await withPage("owner", "role-change", async (page) => {
      await page.goto("/lab");
      const select = page.getByLabel(/^Role of /).first();
      await select.waitFor({ timeout: 30_000 });
      const before = await select.inputValue();
      const other = before === "viewer" ? "editor" : "viewer";
      await select.selectOption(other);
      const dialog = page.getByRole("dialog", { name: /^Make .+ of .+\?$/ });
      await dialog.waitFor();
      await dialog.getByRole("button", { name: "Cancel" }).click();
      await dialog.waitFor({ state: "hidden" });
      expect(await select.inputValue()).toBe(before);
    });
  });

  it("checks the name in Save as new as it is typed, so no stale message stays", async () => {
    await withPage("editor", "save-as-new", async (page) => {
      await page.goto("/workbench", { timeout: 120_000 });
      await page.getByRole("button", { name: "Save as new parameter set" }).click({ timeout: 60_000 });
      const form = page.getByRole("form", { name: "Save as new parameter set" });
      const name = form.getByLabel("Name", { exact: true });
      expect(await name.getAttribute("maxlength")).toBe("120");
      await name.fill("   ");
      await form.getByRole("button", { name: "Save", exact: true }).click();
      await form.getByText("Enter a name.").waitFor();
      await name.fill("What-if from the browser test");
      await expect.poll(() => form.getByText("Enter a name.").count()).toBe(0);
    });
  });

  it("creates a set from the form without asking to leave", async () => {
    await withPage("editor", "create-no-guard", async (page) => {
      await page.goto("/parameter-sets/new");
      const name = page.getByLabel("Name", { exact: true });
      await name.waitFor({ timeout: 30_000 });
      await name.fill(`Created ${Date.now()}`);
      await page.getByRole("button", { name: "Create parameter set" }).click();
      await page.waitForURL(SET_URL, { timeout: 30_000 });
      expect(await page.getByRole("dialog", { name: "Leave without saving?" }).isVisible()).toBe(false);
    });
  });
});
