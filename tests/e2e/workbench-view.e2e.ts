import type { Locator, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { TERBIUM_GARNET_DEFAULTS } from "@/lib/model/defaults";
import { outputPath, useBrowser } from "./support";

/*
 * The workbench's view, as an editor on a set this test creates: zoom and pan with a y range that
 * fits the window, and a reset; adding a marker reads its values without restarting the run;
 * markers out of range are refused; nearby marker labels do not overlap; the person's own view
 * survives a reload and "Reset view" returns to the lab's shared one.
 */

const RUN_TIMEOUT = 120_000;

// Records every value the run's progress bar shows, so a restarted run cannot slip by unseen.
const INIT_SCRIPT = `
  window.__progress = [];
  const watch = () => {
    new MutationObserver(() => {
      const bar = document.querySelector('[role="progressbar"]');
      if (!bar) return;
      const v = Number(bar.getAttribute("aria-valuenow"));
      if (window.__progress[window.__progress.length - 1] !== v) window.__progress.push(v);
    }).observe(document, { subtree: true, childList: true, attributes: true, attributeFilter: ["aria-valuenow"] });
  };
  if (document.readyState === "loading") document.addEventListener("DOMContentLoaded", watch); else watch();
`;

const domainOf = async (plot: Locator, axis: "x" | "y"): Promise<[number, number]> => {
  const raw = (await plot.getAttribute(`data-${axis}-domain`)) ?? "";
  const [a, b] = raw.split(",").map(Number);
  return [a!, b!];
};

describe("workbench view", () => {
  const browser = useBrowser();
  let page: Page;
  let setId: string;

  const spectrumPlot = () => page.getByRole("group", { name: /^Faraday rotation and its parts/ });
  const badge = () => page.getByText(/^numerical, max deviation from linear response: \d/);
  const progress = () => page.getByRole("progressbar", { name: "Numerical run progress" });
  const markerRow = (nm: string) =>
    page
      .getByRole("table", { name: /Values at markers/ })
      .getByRole("row")
      .filter({ has: page.getByRole("rowheader", { name: nm, exact: true }) });

  async function waitForRun(): Promise<void> {
    await badge().waitFor({ state: "visible", timeout: RUN_TIMEOUT });
    await expect.poll(() => progress().getAttribute("aria-valuenow"), { timeout: RUN_TIMEOUT }).toBe("100");
  }

  beforeAll(async () => {
    page = await browser.signedInPage("editor", { initScript: INIT_SCRIPT });
    // The set is made through the API from a page of the app, where the session cookie applies.
    await page.goto("/parameter-sets");
    const name = `View test ${Date.now().toString(36)}-${process.pid}`;
    setId = await page.evaluate(
      async ({ name, params }) => {
        const labs = (await (await fetch("/api/labs")).json()) as { items: { id: string; role: string; name: string }[] };
        const lab =
          labs.items.find((l) => l.role !== "viewer" && l.name.includes("Lindqvist")) ?? labs.items.find((l) => l.role !== "viewer");
        const r = await fetch("/api/parameter-sets", {
          method: "POST",
          headers: { "Content-Type": "application/json" },
          body: JSON.stringify({ labId: lab!.id, name, params }),
        });
        return ((await r.json()) as { item: { id: string } }).item.id;
      },
      { name, params: TERBIUM_GARNET_DEFAULTS },
    );
    expect(setId).toBeTruthy();
  });

  afterAll(async () => {
    if (setId && page) await page.evaluate((id) => fetch(`/api/parameter-sets/${id}`, { method: "DELETE" }), setId).catch(() => undefined);
  });

  it("zooms, pans and resets, fitting the y range to the visible window", async () => {
    await page.goto(`/workbench/${setId}`, { timeout: RUN_TIMEOUT });
    await waitForRun();
    const plot = spectrumPlot();
    const [x0, x1] = await domainOf(plot, "x");
    const [y0, y1] = await domainOf(plot, "y");
    expect(x0).toBe(300);
    expect(x1).toBe(3000);

    // Drag across the plot from about 900 to 1800 nm: the window becomes that range.
    const box = (await page.locator("[data-plot-overlay]").first().boundingBox())!;
    const at = (nm: number) => box.x + (box.width * Math.log(nm / 300)) / Math.log(10);
    await page.mouse.move(at(900), box.y + box.height / 2);
    await page.mouse.down();
    await page.mouse.move(at(1300), box.y + box.height / 2, { steps: 4 });
    await page.mouse.move(at(1800), box.y + box.height / 2, { steps: 4 });
    await page.mouse.up();
    await expect.poll(() => page.getByTestId("zoom-window").innerText()).toMatch(/^Showing \d/);
    const [zx0, zx1] = await domainOf(plot, "x");
    expect(zx0).toBeGreaterThan(850);
    expect(zx0).toBeLessThan(950);
    expect(zx1).toBeGreaterThan(1700);
    expect(zx1).toBeLessThan(1900);
    // The short-wavelength end no longer sets the scale: the y range shrinks to the window's values.
    const [zy0, zy1] = await domainOf(plot, "y");
    expect(zy1 - zy0).toBeLessThan((y1 - y0) / 3);
    // The drag zoomed; it did not add a marker.
    expect(
      await page
        .getByRole("table", { name: /Values at markers/ })
        .getByRole("row")
        .count(),
    ).toBe(1 + 4);

    // Keyboard: + narrows the window, − widens it, 0 shows everything.
    await plot.focus();
    await page.keyboard.press("+");
    const [kx0, kx1] = await domainOf(plot, "x");
    expect(Math.log(kx1 / kx0)).toBeCloseTo(Math.log(zx1 / zx0) / 2, 6);
    await page.keyboard.press("-");
    const [mx0, mx1] = await domainOf(plot, "x");
    expect(Math.log(mx1 / mx0)).toBeCloseTo(Math.log(zx1 / zx0), 6);

    // Buttons: pan right moves the window, Reset zoom brings back the whole range and y range.
    await page.getByRole("button", { name: "Pan right" }).click();
    const [px0] = await domainOf(plot, "x");
    expect(px0).toBeGreaterThan(mx0);
    await page.getByRole("button", { name: "Reset zoom" }).click();
    expect(await domainOf(plot, "x")).toEqual([300, 3000]);
    expect(await domainOf(plot, "y")).toEqual([y0, y1]);
    await plot.focus();
    await page.keyboard.press("+");
    expect((await domainOf(plot, "x"))[1]).toBeLessThan(3000);
    await page.keyboard.press("0");
    expect(await domainOf(plot, "x")).toEqual([300, 3000]);
  });

  it("adds a marker from the computed spectrum without restarting the run, and refuses 99999 nm", async () => {
    await waitForRun();
    await page.evaluate(() => {
      (window as unknown as { __progress: number[] }).__progress = [];
    });
    const input = page.getByLabel("Marker wavelength (nm)");
    await input.fill("1030");
    await page.getByRole("button", { name: "Add marker" }).click();
    // The row appears and gets the value computed at exactly 1030 nm by the pool.
    await expect.poll(() => markerRow("1030 nm").getAttribute("data-source"), { timeout: RUN_TIMEOUT }).toBe("computed");
    expect(await markerRow("1030 nm").locator("td").first().innerText()).toMatch(/^-?\d/);
    // A restarted run would show the bar below 100 %; re-renders may record 100 again, nothing else.
    const seen = await page.evaluate(() => (window as unknown as { __progress: number[] }).__progress);
    expect(
      seen.filter((v) => v !== 100),
      "the progress bar stayed at 100 %: no new run",
    ).toEqual([]);
    expect(await badge().isVisible()).toBe(true);
    expect(await progress().getAttribute("aria-valuenow")).toBe("100");

    // The 1030 and 1064 nm labels are laid out apart.
    const boxes = await page.evaluate(() =>
      ["1030", "1064"].map((t) => {
        const el = document.querySelector(`[data-marker-label="${t}"] text`);
        const r = el!.getBoundingClientRect();
        return { left: r.left, right: r.right, top: r.top, bottom: r.bottom };
      }),
    );
    const [a, b] = boxes as [
      { left: number; right: number; top: number; bottom: number },
      { left: number; right: number; top: number; bottom: number },
    ];
    const overlap = a.left < b.right && b.left < a.right && a.top < b.bottom && b.top < a.bottom;
    expect(overlap).toBe(false);

    // Out of range: refused with a message, nothing added.
    await input.fill("99999");
    await page.getByRole("button", { name: "Add marker" }).click();
    await page.getByRole("alert").filter({ hasText: "between 1 and 5000 nm" }).waitFor();
    expect(await markerRow("99999 nm").count()).toBe(0);

    // The table and the readout follow the chosen units.
    await page.getByLabel("y axis").selectOption("mrad");
    await page.getByRole("columnheader", { name: "θ (mrad)" }).waitFor();
    await page.getByLabel("x axis").selectOption("eV");
    await page.getByRole("columnheader", { name: "E (eV)" }).waitFor();
    await page.screenshot({ path: outputPath("workbench-view.png"), fullPage: true });
  });

  it("keeps the person's own view across a reload and resets to the lab's shared view", async () => {
    // The changes above were saved as this person's own view.
    await expect
      .poll(() => page.getByTestId("view-status").innerText(), { timeout: 30_000 })
      .toContain("Your own view, saved for you only.");
    await page.reload();
    await page.getByRole("heading", { level: 1 }).waitFor({ timeout: RUN_TIMEOUT });
    expect(await page.getByLabel("x axis").inputValue()).toBe("eV");
    expect(await markerRow("1030 nm").count()).toBe(1);

    await page.getByRole("button", { name: "Reset view" }).click();
    await page.getByRole("dialog", { name: "Reset your view?" }).getByRole("button", { name: "Reset view" }).click();
    await expect.poll(() => page.getByTestId("view-status").innerText()).toMatch(/^Default view\./);
    expect(await page.getByLabel("x axis").inputValue()).toBe("nm");
    expect(await markerRow("1030 nm").count()).toBe(0);
  });
});
