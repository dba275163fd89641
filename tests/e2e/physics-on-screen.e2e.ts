import type { Page } from "playwright-core";
import { beforeAll, describe, expect, it } from "vitest";
import { outputPath, useBrowser } from "./support";

/*
 * Physics on the scratch workbench (terbium garnet defaults, 300–3000 nm, 10 mm): the opaque
 * wavelengths are said beside the rotation, the absorption panel draws, the share map says in
 * words that it does not depend on temperature until the diamagnetic term is on, and a spin trace
 * is marked stale once its wavelength changes.
 */

const RUN_TIMEOUT = 120_000;

describe("physics on screen", () => {
  const browser = useBrowser();
  let page: Page;

  beforeAll(async () => {
    page = await browser.signedInPage("editor");
  });

  it("absorption, map independence, the diamagnetic switch and a stale spin trace", async () => {
    await page.goto("/workbench", { timeout: RUN_TIMEOUT });
    await page.getByText(/^numerical, max deviation from linear response: \d/).waitFor({ timeout: RUN_TIMEOUT });

    // Opaque below ~700 nm for 10 mm with the illustrative ΓE: said under the rotation plot.
    const note = page.getByTestId("opaque-warning");
    await note.waitFor({ timeout: RUN_TIMEOUT });
    expect(await note.innerText()).toMatch(/Opaque for this 10 mm sample at 300(\.\d+)?–\d+(\.\d+)? nm/);
    // The absorption plots are drawn once they come near the viewport.
    await page.getByRole("heading", { name: "Absorption and transmission" }).scrollIntoViewIfNeeded();
    await page.getByRole("img", { name: /^Transmission of each circular mode through 10 mm/ }).waitFor();
    await page.getByRole("img", { name: /^Figure of merit \|V\| \/ α/ }).waitFor();

    // Maps: the share over temperature is said to be independent of it (no stripes drawn).
    // The resolution is the user's: the coarsest grid, its expected time said before the run.
    await page.getByRole("checkbox", { name: "Maps", exact: true }).check();
    await page.getByLabel("Map resolution").selectOption("32x16");
    expect(await page.getByTestId("map-expected-time").innerText()).toMatch(/^Expected time: under 1 s \(analytic\)/);
    await page.getByRole("button", { name: "Compute wavelength × temperature map" }).click();
    const independent = page.getByTestId("map-temperature-independent");
    await independent.waitFor({ timeout: RUN_TIMEOUT });
    expect(await page.getByTestId("share-map-temperature").getAttribute("data-grid")).toBe("32x16");
    expect(await independent.innerText()).toMatch(/does not depend on temperature/);
    // θ does depend on it: drawn as a map.
    await page.getByLabel("Show on the temperature map").selectOption("theta");
    await page.getByRole("img", { name: /^Rotation θ \(rad\) over wavelength × temperature/ }).waitFor();

    // Switch on the diamagnetic term: the share now moves with temperature, so it is a map.
    await page.getByLabel("Diamagnetic (bound-electron) term").check();
    await expect
      .poll(() => page.getByRole("button", { name: "Compute wavelength × temperature map" }).isEnabled(), { timeout: RUN_TIMEOUT })
      .toBe(true);
    await page.getByRole("button", { name: "Compute wavelength × temperature map" }).click();
    await page.getByLabel("Show on the temperature map").selectOption("share");
    await page.getByRole("img", { name: /^Magnetic share .* over wavelength × temperature/ }).waitFor({ timeout: RUN_TIMEOUT });
    expect(await independent.count()).toBe(0);

    // Spin trace: a result, then a new wavelength marks it stale with the old one named.
    await page.getByRole("checkbox", { name: "Spin trace", exact: true }).check();
    await page.getByRole("button", { name: "Run spin trace" }).click();
    const result = page.getByTestId("spin-trace-result");
    await result.waitFor({ timeout: RUN_TIMEOUT });
    expect(await result.getAttribute("data-stale")).toBe("false");
    await page.getByLabel("Trace wavelength (nm)").fill("800");
    await expect.poll(() => result.getAttribute("data-stale")).toBe("true");
    expect(await page.getByTestId("spin-trace-stale").innerText()).toMatch(
      /^Stale: this trace was computed at 632\.8 nm .*wavelength 632\.8 → 800 nm/,
    );

    await page.screenshot({ path: outputPath("physics-on-screen.png"), fullPage: true });
  });
});
