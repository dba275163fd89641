/*
 * Benchmark (not a test): the workbench in Debian's Chromium against a running production build
 * with the demo seed (`npm run demo`, or any server of `next build`). Signed in as the demo editor
 * on the scratch workbench (terbium-garnet defaults, 300–3000 nm), it times
 *   1. the numerical spectrum of 256 wavelengths, from the run's start (progress drops to 0) to the
 *      result on screen (progress back at 100 %), after a temperature change;
 *   2. the numerical wavelength × temperature map at each resolution given, from the click on
 *      "Compute" to the map of θ drawn, as cells per second (after one untimed 64 × 32 map);
 * and, during each, the longest task on the page's main thread (PerformanceObserver "longtask",
 * which reports tasks over 50 ms; "none" means no task reached 50 ms). Figures are printed as
 * medians of the runs, never asserted: on a shared machine they move with the load.
 *
 *   npm run bench:browser -- [--url http://localhost:3000] [--runs 3] [--maps 64x32,128x64,256x128]
 */
import { parseArgs } from "node:util";
import type { Page } from "playwright-core";
import { launchChromium } from "./chromium";

const { values: args } = parseArgs({
  options: {
    url: { type: "string", default: "http://localhost:3000" },
    runs: { type: "string", default: "3" },
    maps: { type: "string", default: "64x32,128x64" },
  },
});
const baseURL = args.url!;
const runs = Math.max(1, Number(args.runs));
const mapSizes = args.maps!.split(",").map((s) => {
  const m = /^(\d+)x(\d+)$/.exec(s.trim());
  if (!m) throw new Error(`--maps: "${s}" is not COLSxROWS (e.g. 128x64)`);
  return { cols: Number(m[1]), rows: Number(m[2]) };
});
const TIMEOUT = 600_000;

// Runs in the page before its scripts: long tasks, and the moments the two progress indicators
// change, stamped with the page's own clock (no polling delay from the driver).
const INIT_SCRIPT = `
  window.__bench = { longTasks: [], spectrum: [], mapEnd: [], clicks: [] };
  try {
    new PerformanceObserver((list) => {
      for (const e of list.getEntries()) window.__bench.longTasks.push({ start: e.startTime, end: e.startTime + e.duration });
    }).observe({ type: "longtask", buffered: true });
  } catch (e) { window.__bench.noLongTasks = String(e); }
  document.addEventListener("click", () => window.__bench.clicks.push(performance.now()), true);
  const watch = () => {
    let last = null;
    let mapRunning = false;
    new MutationObserver(() => {
      const bar = document.querySelector('[role="progressbar"][aria-labelledby="run-progress-label"]');
      const v = bar ? Number(bar.getAttribute("aria-valuenow")) : null;
      if (v !== last) { window.__bench.spectrum.push({ t: performance.now(), v }); last = v; }
      const map = document.querySelector('progress[aria-label^="Map progress"]') !== null;
      if (mapRunning && !map) window.__bench.mapEnd.push(performance.now());
      mapRunning = map;
    }).observe(document, { subtree: true, childList: true, attributes: true });
  };
  if (document.readyState === "loading") document.addEventListener("DOMContentLoaded", watch); else watch();
`;

interface Probe {
  longTasks: { start: number; end: number }[];
  spectrum: { t: number; v: number | null }[];
  mapEnd: number[];
  clicks: number[];
}

const probe = (page: Page) => page.evaluate(() => (window as unknown as { __bench: Probe }).__bench);
const resetProbe = (page: Page) =>
  page.evaluate(() => {
    const b = (window as unknown as { __bench: Probe }).__bench;
    b.longTasks.length = 0;
    b.spectrum.length = 0;
    b.mapEnd.length = 0;
    b.clicks.length = 0;
  });

/** The longest long task overlapping [t0, t1] (page clock), or 0 when none reached 50 ms. */
function longestTask(p: Probe, t0: number, t1: number): number {
  let best = 0;
  for (const t of p.longTasks) if (t.end >= t0 && t.start <= t1) best = Math.max(best, t.end - t.start);
  return best;
}

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!;
const taskText = (ms: number) => (ms === 0 ? "none ≥ 50 ms" : `${ms.toFixed(0)} ms`);

async function setField(page: Page, label: string, value: string): Promise<void> {
  const input = page.getByLabel(label, { exact: true });
  await input.fill(value);
  await input.blur();
}

/** One spectrum run after a temperature change: [duration ms, longest task ms]. */
async function spectrumRun(page: Page, temperatureK: number): Promise<[number, number]> {
  await resetProbe(page);
  await setField(page, "Temperature", String(temperatureK));
  await page.waitForFunction(
    () => {
      const s = (window as unknown as { __bench: Probe }).__bench.spectrum;
      const start = s.findIndex((e) => e.v !== null && e.v < 100);
      return start >= 0 && s.slice(start).some((e) => e.v === 100);
    },
    undefined,
    { timeout: TIMEOUT, polling: 100 },
  );
  const p = await probe(page);
  const start = p.spectrum.find((e) => e.v !== null && e.v < 100)!.t;
  const end = p.spectrum.find((e) => e.t >= start && e.v === 100)!.t;
  return [end - start, longestTask(p, start, end)];
}

/** One numerical temperature map: [duration ms, longest task ms, cells]. */
async function mapRun(page: Page, size: { cols: number; rows: number }): Promise<[number, number, number] | null> {
  const resolution = page.getByLabel("Map resolution");
  if ((await resolution.count()) > 0) {
    const value = `${size.cols}x${size.rows}`;
    const options = await resolution.locator("option").evaluateAll((os) => os.map((o) => (o as HTMLOptionElement).value));
    if (!options.includes(value)) return null;
    await resolution.selectOption(value);
  } else if (size.cols !== 64 || size.rows !== 32) {
    // A page without the control draws its fixed 64 × 32 grid.
    return null;
  }
  const button = page.getByRole("button", { name: "Compute wavelength × temperature map" });
  await button.waitFor({ state: "visible" });
  await page.waitForFunction(
    () => [...document.querySelectorAll("button")].some((b) => b.textContent === "Compute wavelength × temperature map" && !b.disabled),
    undefined,
    { timeout: TIMEOUT },
  );
  await resetProbe(page);
  await button.click();
  await page.waitForFunction(() => (window as unknown as { __bench: Probe }).__bench.mapEnd.length > 0, undefined, {
    timeout: TIMEOUT,
    polling: 100,
  });
  const p = await probe(page);
  const start = p.clicks[0]!;
  const end = p.mapEnd[0]!;
  return [end - start, longestTask(p, start, end), size.cols * size.rows];
}

const browser = await launchChromium();
try {
  const context = await browser.newContext({ baseURL, viewport: { width: 1440, height: 900 } });
  await context.addInitScript(INIT_SCRIPT);
  const page = await context.newPage();
  try {
    await page.goto("/sign-in");
  } catch {
    throw new Error(`no server at ${baseURL}: start the production build first (npm run demo), or pass --url`);
  }
  await page.getByLabel("E-mail").fill("postdoc@demo.gyrolux.test");
  await page.getByLabel("Password").fill("gyrolux-demo");
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.waitForURL((url) => !url.pathname.startsWith("/sign-in"), { timeout: 60_000 });

  const t0 = Date.now();
  await page.goto("/workbench", { timeout: TIMEOUT });
  await page.getByText(/^numerical, max deviation from linear response: \d/).waitFor({ timeout: TIMEOUT });
  const firstMs = Date.now() - t0;
  await setField(page, "Points (≤ 5000)", "256");
  await page.getByText(/^numerical, max deviation from linear response: \d/).waitFor({ timeout: TIMEOUT });
  const cores = await page.evaluate(() => navigator.hardwareConcurrency);
  console.log(`Chromium on ${baseURL}, navigator.hardwareConcurrency = ${cores}; medians of ${runs} runs`);
  console.log(`page load to the first numerical spectrum on screen (sign-in done, workers started): ${firstMs} ms (one run)`);

  const spectrum: [number, number][] = [];
  for (let i = 0; i < runs; i++) spectrum.push(await spectrumRun(page, i % 2 === 0 ? 350 : 293.15));
  console.log(
    `numerical spectrum, 256 wavelengths: ${median(spectrum.map((r) => r[0])).toFixed(0)} ms median ` +
      `(${spectrum.map((r) => r[0].toFixed(0)).join(" / ")} ms); longest main-thread task: ` +
      `${taskText(median(spectrum.map((r) => r[1])))} median, ${taskText(Math.max(...spectrum.map((r) => r[1])))} at most`,
  );
  await setField(page, "Temperature", "293.15");

  await page.getByRole("checkbox", { name: "Maps", exact: true }).check();
  await page.getByRole("radio", { name: "Numerical LLG" }).check();
  // One untimed map, then θ on it: θ depends on temperature, so every timed map is drawn as a heat
  // map (the share of these defaults does not, and is shown as a curve instead).
  const cold = await mapRun(page, { cols: 64, rows: 32 });
  console.log(`first numerical map 64 × 32 on the page (untimed setup run): ${cold ? `${cold[0].toFixed(0)} ms` : "–"}`);
  await page.getByLabel("Show on the temperature map").selectOption("theta");
  for (const size of mapSizes) {
    const results: [number, number, number][] = [];
    for (let i = 0; i < runs; i++) {
      const r = await mapRun(page, size);
      if (!r) break;
      results.push(r);
    }
    if (results.length === 0) {
      console.log(`numerical map ${size.cols} × ${size.rows}: not offered by this page`);
      continue;
    }
    const ms = median(results.map((r) => r[0]));
    const cells = results[0]![2];
    console.log(
      `numerical map ${size.cols} × ${size.rows} (${cells} cells): ${ms.toFixed(0)} ms median ` +
        `(${results.map((r) => r[0].toFixed(0)).join(" / ")} ms), ${Math.round((cells * 1000) / ms)} cells/s; ` +
        `longest main-thread task: ${taskText(median(results.map((r) => r[1])))} median, ` +
        `${taskText(Math.max(...results.map((r) => r[1])))} at most`,
    );
  }
} finally {
  await browser.close();
}
