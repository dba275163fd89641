import { readFileSync } from "node:fs";
import path from "node:path";
import type { Page } from "playwright-core";
import { beforeAll, describe, expect, it } from "vitest";
import { DEMO_GARNET_SET_ID } from "@/db/demo-data";
import { outputPath, useBrowser } from "./support";

/*
 * Measurements end to end, as an editor of the demo lab: upload the demo measurement file, check
 * the preview and the proposed mapping, change the mapping (temperature typed once for the file),
 * store it, lay it over the garnet set's spectrum in the workbench in two y units, and delete it.
 */

const DEMO_FILE = path.resolve(import.meta.dirname, "../../db/demo/generated-garnet-LM-T4-verdet.csv");
const NAME = `Browser upload ${Date.now().toString(36)}`;

describe("measurements in the browser", () => {
  const browser = useBrowser();
  let page: Page;

  beforeAll(async () => {
    page = await browser.signedInPage("editor");
  });

  it("uploads the demo file with a changed mapping and shows it in the lab's table", async () => {
    await page.goto("/measurement-sets");
    await page.getByRole("heading", { name: "Measurements", level: 1 }).waitFor();
    // The seeded sets are listed.
    await page.getByRole("row").filter({ hasText: "Garnet rod LM-T4 — Verdet spectrum, 293 K (generated)" }).waitFor();

    await page.getByRole("button", { name: "Upload measurements" }).click();
    await page
      .getByLabel("Measurement file")
      .setInputFiles({ name: "lm-t4-browser.csv", mimeType: "text/csv", buffer: readFileSync(DEMO_FILE) });
    await page.getByText(/Preview: the first 8 of 24 data rows \(header on line 4\)/).waitFor();

    // The default column names map themselves.
    expect(await page.getByLabel("Wavelength column").inputValue()).toBe("wavelength_nm");
    expect(await page.getByLabel("Value column").inputValue()).toBe("verdet_rad_per_T_m");
    expect(await page.getByLabel("Value unit").inputValue()).toBe("rad/(T·m)");
    expect(await page.getByLabel("σ column (same unit as the values)").inputValue()).toBe("sigma");

    // Take the temperature from the form instead of the file: first the missing value is named…
    await page.getByLabel("Temperature column (K)").selectOption({ index: 0 });
    await page.getByTestId("upload-problems").getByText("Temperature: choose a column or enter one value for the whole file.").waitFor();
    // …then one value for every row makes all rows valid.
    await page.getByLabel("Temperature for the whole file (K)").fill("293.15");
    await page.getByText("All 24 rows are valid").waitFor();

    await page.getByLabel("Name", { exact: true }).fill(NAME);
    await page.getByLabel("Sample", { exact: true }).fill("LM-T4 (browser test)");
    await page.getByRole("button", { name: "Store measurement set" }).click();
    await page.getByText("Measurement set stored").waitFor({ timeout: 30_000 });
    const row = page.getByRole("row").filter({ hasText: NAME });
    await row.waitFor();
    expect(await row.innerText()).toContain("420–1600 nm");
    await page.screenshot({ path: outputPath("measurements-table.png"), fullPage: true });
  });

  it("overlays the uploaded points with error bars on the workbench spectrum", async () => {
    await page.goto(`/workbench/${DEMO_GARNET_SET_ID}`);
    const picker = page.getByRole("region", { name: "Measured data on the plot" });
    await picker.waitFor({ timeout: 120_000 });
    await picker.getByRole("checkbox", { name: new RegExp(NAME) }).check();
    const points = page.locator('[data-testid^="overlay-"] [data-testid="measured-point"]');
    await expect.poll(() => points.count(), { timeout: 30_000 }).toBe(24);
    // Default y axis is a rotation: the Verdet values are drawn as V·B·L at the set's own B and L.
    expect(await page.getByTestId("overlay-conversion").innerText()).toContain(
      "Verdet constants are shown as the rotation V·B·L at the plot's B = 1 T, L = 10 mm",
    );

    await page.getByLabel("y axis").selectOption("verdet");
    expect(await page.getByTestId("overlay-conversion").innerText()).toContain("Verdet constants are shown as measured.");
    await expect.poll(() => points.count()).toBe(24);
    // The first point's tooltip carries its line in the file and its value ± σ in the axis unit.
    expect(await points.first().locator("title").textContent()).toMatch(/^line 5: 420 nm, -390 ± 6\.2 rad\/\(T·m\) at 293\.15 K, 1 T$/);
    // The legend names the points' conditions; the demo garnet's curve is at the same 293.15 K and 1 T.
    expect(await page.getByTestId("overlay-conditions").innerText()).toContain("293.15 K, 1 T · 24 points · the curve's conditions");
    await page.screenshot({ path: outputPath("workbench-measured-overlay.png"), fullPage: true });
  });

  it("masks a point with a reason on the set's page, as a new revision the overlay follows", async () => {
    await page.goto(`/measurement-sets?q=${encodeURIComponent(NAME)}`);
    await page.getByRole("link", { name: NAME }).click();
    await page.getByRole("heading", { name: NAME, level: 1 }).waitFor();
    await expect.poll(() => page.getByTestId("point-row").count()).toBe(24);
    await page.getByRole("button", { name: "Edit the point on line 5" }).click();
    const editor = page.getByRole("form", { name: "Edit the point on line 5" });
    await editor.getByLabel(/Mask this point/).check();
    await editor.getByRole("button", { name: "Save as a new revision" }).click();
    await editor.getByText("Say why the point is masked.").waitFor();
    await editor.getByLabel("Why").fill("laser power drifted");
    await editor.getByLabel("Note").fill("re-measure next week");
    await editor.getByRole("button", { name: "Save as a new revision" }).click();
    await page.getByText("Saved the point on line 5 as revision 2.").waitFor();
    await page.getByText(/Revision 2, line 5: masked; reason “laser power drifted”; note “re-measure next week”/).waitFor();
    const row = page.getByTestId("point-row").filter({ hasText: "laser power drifted" });
    expect(await row.innerText()).toContain("Masked");
    await page.screenshot({ path: outputPath("measurement-set-points.png"), fullPage: true });

    await page.goto(`/workbench/${DEMO_GARNET_SET_ID}`);
    const picker = page.getByRole("region", { name: "Measured data on the plot" });
    await picker.waitFor({ timeout: 120_000 });
    await picker.getByRole("checkbox", { name: new RegExp(NAME) }).check();
    const points = page.locator('[data-testid^="overlay-"] [data-testid="measured-point"]');
    await expect.poll(() => points.count(), { timeout: 30_000 }).toBe(23);
  });

  it("deletes the uploaded set after a confirmation", async () => {
    await page.goto(`/measurement-sets?q=${encodeURIComponent(NAME)}`);
    const row = page.getByRole("row").filter({ hasText: NAME });
    await row.getByRole("button", { name: /Delete/ }).click();
    const dialog = page.getByRole("dialog", { name: "Delete this measurement set?" });
    await dialog.getByRole("button", { name: "Delete set" }).click();
    await dialog.waitFor({ state: "hidden" });
    await page.getByText("No measurement set matches these filters.").waitFor();
  });
});
