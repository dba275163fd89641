import { readFileSync } from "node:fs";
import type { Locator, Page } from "playwright-core";
import { beforeAll, describe, expect, it } from "vitest";
import { outputPath, useBrowser } from "./support";

/*
 * The workbench end to end, as an editor of the demo lab: open the terbium gallium garnet set,
 * let the numerical run finish, read the marker table, change the temperature and watch the run
 * restart, cancel a long run, export CSV. The run happens in the page's workers (asserted without a
 * clock); the longest main-thread task during a numerical run is printed as a figure, never
 * asserted: a time fails the test whenever the machine is busy (npm run bench:browser prints it too).
 */

const RUN_TIMEOUT = 120_000;

// Runs in the page before any script: records long tasks (for the printed figure) and every
// progress value shown, so the test can assert on things that happen faster than it can poll.
const INIT_SCRIPT = `
  window.__longTasks = [];
  window.__progress = [];
  try {
    new PerformanceObserver((list) => {
      for (const e of list.getEntries()) window.__longTasks.push({ duration: e.duration, start: e.startTime });
    }).observe({ type: "longtask", buffered: true });
  } catch (e) { window.__longTaskUnsupported = String(e); }
  const watch = () => {
    const seen = new WeakSet();
    new MutationObserver(() => {
      const bar = document.querySelector('[role="progressbar"]');
      if (!bar) return;
      const v = Number(bar.getAttribute("aria-valuenow"));
      const last = window.__progress[window.__progress.length - 1];
      if (last !== v) window.__progress.push(v);
      if (!seen.has(bar)) seen.add(bar);
    }).observe(document, { subtree: true, childList: true, attributes: true, attributeFilter: ["aria-valuenow"] });
  };
  if (document.readyState === "loading") document.addEventListener("DOMContentLoaded", watch); else watch();
`;

interface WindowProbe {
  __longTasks: { duration: number; start: number }[];
  __progress: number[];
}

class WorkbenchPage {
  constructor(readonly page: Page) {}

  get progress(): Locator {
    return this.page.getByRole("progressbar", { name: "Numerical run progress" });
  }
  get badge(): Locator {
    return this.page.getByText(/^numerical, max deviation from linear response: \d/);
  }
  get markerTable(): Locator {
    return this.page.getByRole("table", { name: /Values at markers/ });
  }

  async waitForNumericalRun(): Promise<void> {
    await this.badge.waitFor({ state: "visible", timeout: RUN_TIMEOUT });
    await expect.poll(() => this.progress.getAttribute("aria-valuenow"), { timeout: RUN_TIMEOUT }).toBe("100");
  }

  /** A cell of the marker row whose wavelength cell reads e.g. "1550 nm", by column header. */
  async valueAt(wavelength: string, column = "Magnetic share"): Promise<string> {
    const headers = await this.markerTable.locator("thead th").allInnerTexts();
    const col = headers.findIndex((h) => h.trim() === column);
    expect(col).toBeGreaterThan(0);
    const row = this.markerTable.getByRole("row").filter({ has: this.page.getByRole("rowheader", { name: wavelength, exact: true }) });
    const cells = await row.locator("th, td").allInnerTexts();
    return cells[col]!.trim();
  }

  async setField(label: string, value: string): Promise<void> {
    const input = this.page.getByLabel(label, { exact: true });
    await input.fill(value);
  }

  async resetProbes(): Promise<void> {
    await this.page.evaluate(() => {
      const w = window as unknown as WindowProbe;
      w.__longTasks = [];
      w.__progress = [];
    });
  }

  async probes(): Promise<WindowProbe> {
    return this.page.evaluate(() => {
      const w = window as unknown as WindowProbe;
      return { __longTasks: w.__longTasks, __progress: w.__progress };
    });
  }
}

describe("workbench", () => {
  const browser = useBrowser();
  let page: Page;
  let wb: WorkbenchPage;

  beforeAll(async () => {
    page = await browser.signedInPage("editor", { initScript: INIT_SCRIPT });
    wb = new WorkbenchPage(page);
  });

  it("runs, restarts, cancels and exports without blocking the main thread", async () => {
    // Find the demo set through the API from the signed-in page.
    await page.goto("/parameter-sets");
    const setId = await page.evaluate(async () => {
      const r = await fetch("/api/parameter-sets?q=Terbium", { headers: { Accept: "application/json" } });
      const body = (await r.json()) as { items: { id: string; name: string }[] };
      // Prefer the room-temperature handbook set; any terbium gallium garnet set will do.
      const tgg = body.items.filter((s) => s.name.toLowerCase().includes("terbium gallium garnet"));
      return (tgg.find((s) => s.name.toLowerCase().includes("handbook")) ?? tgg[0])?.id ?? null;
    });
    expect(setId, "the seeded demo lab has a terbium gallium garnet set").toBeTruthy();

    await page.goto(`/workbench/${setId}`, { timeout: RUN_TIMEOUT });
    await page.getByRole("heading", { level: 1 }).waitFor({ timeout: RUN_TIMEOUT });

    // 1. First numerical run finishes; the marker table has the 1550 nm line.
    await wb.waitForNumericalRun();
    const share1550 = await wb.valueAt("1550 nm");
    expect(share1550).toMatch(/^\d+(\.\d+)? %$/);
    const verdet1550 = await wb.valueAt("1550 nm", "V (rad/(T·m))");

    // 2. Raise the temperature: the run restarts with progress and ends with a new value.
    //    Both parts scale with M0 (physics-model §6.4), so the share barely moves with temperature;
    //    the Verdet constant does. Long tasks are measured over this whole numerical run.
    await wb.resetProbes();
    const temperature = page.getByLabel("Temperature", { exact: true });
    const before = await temperature.inputValue();
    await wb.setField("Temperature", String(Number(before) + 56.85));
    await expect.poll(async () => (await wb.probes()).__progress.some((v) => v < 100), { timeout: RUN_TIMEOUT }).toBe(true);
    await wb.waitForNumericalRun();
    await expect.poll(() => wb.valueAt("1550 nm", "V (rad/(T·m))"), { timeout: RUN_TIMEOUT }).not.toBe(verdet1550);
    expect(await wb.valueAt("1550 nm")).toMatch(/^\d+(\.\d+)? %$/);
    const probes = await wb.probes();
    const progressSeen = probes.__progress;
    expect(progressSeen[progressSeen.length - 1]).toBe(100);
    // The run is computed off the page's thread: the page holds the pool's dedicated workers (a
    // check without a clock; the longest task is a figure of npm run bench:browser).
    expect(page.workers().length).toBeGreaterThanOrEqual(1);
    const longest = Math.max(0, ...probes.__longTasks.map((t) => t.duration));
    console.log(
      `[workbench] longest main-thread task during a numerical run: ${longest.toFixed(0)} ms ` +
        `(${probes.__longTasks.length} tasks over 50 ms, the browser's long-task threshold)`,
    );

    // 3. A long run (5000 points) can be cancelled; the analytic preview stays on screen.
    await wb.setField("Points (≤ 5000)", "5000");
    await expect.poll(() => page.getByRole("button", { name: "Cancel" }).isEnabled(), { timeout: RUN_TIMEOUT }).toBe(true);
    await page.getByRole("button", { name: "Cancel" }).click();
    await page.getByText("Numerical run cancelled").waitFor({ timeout: 30_000 });
    await expect.poll(() => wb.badge.isVisible()).toBe(false);
    expect(await page.getByRole("img", { name: /Faraday rotation/ }).isVisible()).toBe(true);

    // ...then back to 256 points and let it finish.
    await wb.setField("Points (≤ 5000)", "256");
    await wb.waitForNumericalRun();

    // 4. CSV export: # header, one column row, one row per wavelength, CRLF line ends (RFC 4180).
    const [download] = await Promise.all([page.waitForEvent("download"), page.getByRole("button", { name: "Export CSV" }).click()]);
    const file = outputPath("workbench-spectrum.csv");
    await download.saveAs(file);
    const lines = readFileSync(file, "utf8").trimEnd().split("\r\n");
    const header = lines.filter((l) => l.startsWith("#"));
    const body = lines.filter((l) => !l.startsWith("#"));
    expect(header.some((l) => /^# parameter set: .*Terbium gallium garnet/i.test(l))).toBe(true);
    expect(header.some((l) => /^# version: \d+/.test(l))).toBe(true);
    expect(header.some((l) => l.includes("Gyrolux model: one gyrotropic oscillator + LLG spins, physics-model §"))).toBe(true);
    expect(header.some((l) => l.startsWith("# method: llg"))).toBe(true);
    expect(body[0]).toBe(
      "wavelength_nm,theta_rad,theta_electric_rad,theta_magnetic_rad,theta_cross_rad,ellipticity_rad,magnetic_share,verdet_rad_per_T_m," +
        "theta_diamagnetic_rad,absorption_plus_per_m,absorption_minus_per_m,transmission_plus,transmission_minus",
    );
    expect(body.length - 1).toBe(256);

    await page.screenshot({ path: outputPath("workbench.png"), fullPage: true });
  });

  it("labels a scaled magnetic-dipole part on plots, marker table and export, and keeps it with the last good result", async () => {
    const label = "magnetic-dipole part × 3.0, not first-principles";
    await page.goto("/workbench", { timeout: RUN_TIMEOUT });
    await wb.waitForNumericalRun();
    await wb.setField("Magnetic-part scale", "3");
    await page.getByRole("img", { name: new RegExp(`^Faraday rotation .*${label}`) }).waitFor({ timeout: RUN_TIMEOUT });
    await expect.poll(() => wb.markerTable.locator("caption").innerText(), { timeout: RUN_TIMEOUT }).toContain(label);

    // Out-of-range input: nothing is computed, the scaled result stays and is still exported as such.
    await wb.setField("Magnetic-part scale", "-2");
    await page.getByText("Some inputs are out of range; nothing is computed until they are fixed.").waitFor();
    expect(await wb.markerTable.locator("caption").innerText()).toContain(label);
    const [download] = await Promise.all([page.waitForEvent("download"), page.getByRole("button", { name: "Export CSV" }).click()]);
    const file = outputPath("workbench-scaled.csv");
    await download.saveAs(file);
    const header = readFileSync(file, "utf8")
      .split("\r\n")
      .filter((l) => l.startsWith("#"));
    expect(header).toContain(`# label: ${label}`);
    expect(header.some((l) => l.startsWith("# parameters: ") && l.includes("magneticScale=3;"))).toBe(true);
  });
});
