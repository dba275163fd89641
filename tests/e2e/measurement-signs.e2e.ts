import { readFileSync } from "node:fs";
import path from "node:path";
import type { Page } from "playwright-core";
import { beforeAll, describe, expect, it } from "vitest";
import { DEMO_GARNET_SET_ID, DEMO_SETS } from "@/db/demo-data";
import { axeFindings, describeFindings } from "./axe";
import { dataLoaded, outputPath, useBrowser } from "./support";

/*
 * The upload's sign check on a 390 px phone, by keyboard where it matters: the demo garnet file with
 * every value's minus sign dropped (magnitudes, as many vendor sheets print them) is checked against
 * the demo garnet set, whose model predicts a negative Verdet constant (physics-model.md §1: terbium
 * garnets have V < 0). The warning says every value is opposite; the person takes the model's sign,
 * takes it back, takes it again, stores the set, and its page says where the signs came from.
 */

const DEMO_FILE = path.resolve(import.meta.dirname, "../../db/demo/generated-garnet-LM-T4-verdet.csv");
const NAME = `Magnitudes upload ${Date.now().toString(36)}`;
const GARNET = DEMO_SETS.find((s) => s.id === DEMO_GARNET_SET_ID)!;
const GARNET_NAME = GARNET.versions.at(-1)!.name;
const WIDTH = 390;

/** The demo file with the value column's signs dropped: its second column holds the Verdet constants. */
function magnitudesFile(): Buffer {
  const lines = readFileSync(DEMO_FILE, "utf8").split("\n");
  const data = lines.map((line) => (/^\d/.test(line) ? line.replace(/^([^,]*),-/, "$1,") : line));
  expect(data.filter((line) => /^\d/.test(line) && line.split(",")[1]!.startsWith("-"))).toEqual([]);
  return Buffer.from(data.join("\n"));
}

async function expectNoSideways(page: Page, what: string): Promise<void> {
  const { clientWidth, overflow } = await page.evaluate(() => {
    const root = document.documentElement;
    return { clientWidth: root.clientWidth, overflow: root.scrollWidth - root.clientWidth };
  });
  expect(clientWidth, `${what} widened the layout viewport`).toBe(WIDTH);
  expect(overflow, `${what} is ${overflow} px wider than the screen`).toBeLessThanOrEqual(0);
}

/** No serious or critical axe-core finding (contrast among them) in the state the page is in. */
async function expectAccessible(page: Page): Promise<void> {
  expect(describeFindings(await axeFindings(page))).toEqual([]);
}

const activeText = (page: Page) => page.evaluate(() => document.activeElement?.textContent ?? "");

describe("the upload's sign check", () => {
  const browser = useBrowser();
  let page: Page;

  beforeAll(async () => {
    page = await browser.signedInPage("editor", { context: { viewport: { width: WIDTH, height: 844 }, isMobile: true, hasTouch: true } });
  });

  it("warns that every magnitude opposes the garnet model, takes the model's sign on request and undoes it", async () => {
    await page.goto("/measurement-sets");
    await page.getByRole("heading", { name: "Measurements", level: 1 }).waitFor();
    await page.getByRole("button", { name: "Upload measurements" }).click();
    await page
      .getByLabel("Measurement file")
      .setInputFiles({ name: "lm-t4-magnitudes.csv", mimeType: "text/csv", buffer: magnitudesFile() });
    await page.getByText("All 24 rows are valid").waitFor();

    // No check until the material is chosen.
    const check = page.getByTestId("sign-check");
    expect(await check.getByLabel("Check the signs against").inputValue()).toBe("");
    expect(await check.getByRole("alert").count()).toBe(0);

    await check.getByLabel("Check the signs against").selectOption({ label: GARNET_NAME });
    const warning = check.getByRole("alert");
    await warning.getByText(`Every value has the sign opposite to what the model predicts for “${GARNET_NAME}”`).waitFor();
    expect(await warning.innerText()).toContain("Vendor sheets often quote |V|, the magnitude only");
    await dataLoaded(page);
    await expectNoSideways(page, "the sign warning");
    await expectAccessible(page);
    await check.screenshot({ path: outputPath("upload-sign-warning-390.png") });

    // By keyboard: the action, then its undo, each takes the focus of the other.
    const take = warning.getByRole("button", { name: "These are magnitudes: store them with the model's sign" });
    await take.focus();
    await page.keyboard.press("Enter");
    const taken = check.getByRole("status").filter({ hasText: `Stored with the model's sign of “${GARNET_NAME}”` });
    await taken.waitFor();
    // The file's first value, 390.03 on line 5, becomes the model's −390.03.
    expect(await taken.innerText()).toContain("all 24 values will be stored with the sign this model predicts");
    expect(await taken.innerText()).toContain("line 5: 390.03 → -390.03 rad/(T·m)");
    await page.getByText("All 24 rows are valid (Verdet constants converted to rad/(T·m), with the model's sign)").waitFor();
    await expect.poll(() => activeText(page)).toBe("Keep the file's signs");
    await page.keyboard.press("Enter");
    await warning.waitFor();
    await expect.poll(() => activeText(page)).toBe("These are magnitudes: store them with the model's sign");
    await page.keyboard.press("Enter");
    await taken.waitFor();
    await expectNoSideways(page, "the taken sign");
    await expectAccessible(page);
    await check.screenshot({ path: outputPath("upload-sign-taken-390.png") });

    await page.getByLabel("Name", { exact: true }).fill(NAME);
    await page.getByRole("button", { name: "Store measurement set" }).click();
    await page.getByText("Measurement set stored").waitFor({ timeout: 30_000 });
  });

  it("shows on the set's page that the signs came from the model, and stores the model's sign", async () => {
    await page.goto(`/measurement-sets?q=${encodeURIComponent(NAME)}`);
    await page.getByRole("link", { name: NAME }).click();
    await page.getByRole("heading", { name: NAME, level: 1 }).waitFor();
    const note = page.getByTestId("sign-source");
    await note.waitFor();
    const noteText = await note.innerText();
    expect(noteText).toContain("Signs taken from the model: the file held magnitudes, and at upload 24 values took the sign");
    expect(noteText).toMatch(new RegExp(`the model of “${GARNET_NAME}” \\(version \\d+\\) predicts at their own conditions`));
    await expect.poll(() => page.getByTestId("point-row").count()).toBe(24);
    expect(await page.getByTestId("point-row").first().innerText()).toContain("-390.03");
    await dataLoaded(page);
    await expectNoSideways(page, "the set's page");
    await expectAccessible(page);
    await page.screenshot({ path: outputPath("measurement-set-sign-source-390.png") });
  });

  it("deletes the uploaded set", async () => {
    await page.goto(`/measurement-sets?q=${encodeURIComponent(NAME)}`);
    await page.getByRole("link", { name: NAME }).waitFor();
    const deleted = await page.evaluate(async (name) => {
      const list = await fetch(`/api/measurement-sets?q=${encodeURIComponent(name)}`).then((r) => r.json());
      const id = list.items[0]?.id as string | undefined;
      return id ? (await fetch(`/api/measurement-sets/${id}`, { method: "DELETE" })).status : 0;
    }, NAME);
    expect(deleted).toBe(204);
  });
});
