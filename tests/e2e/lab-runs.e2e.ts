import { readFileSync } from "node:fs";
import type { Page } from "playwright-core";
import { beforeAll, describe, expect, it } from "vitest";
import { DEMO_GARNET_SET_ID } from "@/db/demo-data";
import { outputPath, useBrowser } from "./support";

/*
 * Lab runs in the browser, as the demo lab's editor: submit a numerical map from the workbench to
 * the lab's machines (scripts/test.sh starts one worker beside the server), follow its progress on
 * the runs page, and open the finished map with its exports.
 */

const TIMEOUT = 150_000;

describe("lab runs", () => {
  const browser = useBrowser();
  let page: Page;

  beforeAll(async () => {
    page = await browser.signedInPage("editor");
  });

  it("submits a numerical map from the workbench, shows its progress, and opens the result", async () => {
    await page.goto(`/workbench/${DEMO_GARNET_SET_ID}`, { timeout: TIMEOUT });
    const panel = page.getByRole("region", { name: "Run on the lab's machines" });
    await panel.getByLabel("What to compute").selectOption("map-temperature");
    await panel.getByLabel("Method").selectOption("llg");
    await panel.getByLabel("Wavelengths (columns)").fill("160");
    await panel.getByLabel("Rows", { exact: true }).fill("64");
    // Out of range first: the rule is said at the field and nothing is sent.
    await panel.getByLabel("Rows", { exact: true }).fill("999");
    await expect.poll(() => panel.getByText("must be ≤ 256").count()).toBeGreaterThan(0);
    expect(await panel.getByRole("button", { name: "Submit to the lab’s machines" }).isDisabled()).toBe(true);
    // 160 × 128 numerical cells keep a worker busy for a second or two (about 14,000 cells/s on
    // two threads here): long enough that the list sees the run while it is running (a 160 × 64
    // map was sometimes done before the list had loaded).
    await panel.getByLabel("Rows", { exact: true }).fill("128");
    await panel.getByRole("button", { name: "Submit to the lab’s machines" }).click();
    await panel.getByRole("status").getByText("Submitted:").waitFor({ timeout: 30_000 });

    await page.goto("/lab-runs", { timeout: TIMEOUT });
    const row = page.getByTestId("run-row").filter({ hasText: "160 wavelengths" }).first();
    await row.waitFor();
    expect(await row.textContent()).toContain("Terbium");
    // Progress: the run is seen running with a progress bar before it is done.
    await row.getByRole("progressbar").waitFor({ timeout: TIMEOUT });
    await page.screenshot({ path: outputPath("lab-runs-progress.png"), fullPage: true });
    await row.getByText("Done").waitFor({ timeout: TIMEOUT });

    await row.getByRole("link").click();
    // The link is a client-side navigation; the map below is what says the page is ready.
    await page.waitForURL(/\/lab-runs\/[0-9a-f-]{36}$/, { waitUntil: "commit" });
    const map = page.getByTestId("run-map");
    await map.waitFor({ timeout: 60_000 });
    expect(await map.textContent()).toContain("160 × 128 cells");
    const download = page.waitForEvent("download");
    await page.getByRole("button", { name: "Export map CSV" }).click();
    const saved = await download;
    // Named after the temperatures the map spans, not one temperature.
    expect(saved.suggestedFilename()).toMatch(/-map-[\d.]+-[\d.]+K-[\d.]+T-run-[0-9a-f]{8}\.csv$/);
    const file = await saved.path();
    const lines = readFileSync(file!, "utf8").trim().split("\n");
    const rows = lines.filter((l) => !l.startsWith("#"));
    expect(rows).toHaveLength(1 + 160 * 128);
    expect(rows[0]).toContain("wavelength_nm,temperature_K,field_T,length_m");
    expect(rows[0]).toContain("theta_electric_rad");

    // The quantity picker: the map shows θe instead of the share.
    await page.getByLabel("Show on the map").selectOption("thetaElectric");
    await expect.poll(() => map.getByText("Electric-dipole part").count()).toBeGreaterThan(0);
    await page.screenshot({ path: outputPath("lab-runs-result.png"), fullPage: true });

    // Open in the workbench: the set's workbench, starting from the run.
    await page.getByRole("link", { name: "Open in the workbench" }).click();
    await page.waitForURL(/\/workbench\/[0-9a-f-]{36}\?run=/, { waitUntil: "commit" });
    await page.getByText("Opened from a lab run").waitFor({ timeout: 60_000 });
  });
});
