import { describe, expect, it } from "vitest";
import { clampDomain, isFullDomain, panDomain, panToInclude, visibleYExtent, zoomDomain } from "@/lib/workbench/zoom";

describe("zoom and pan of the x window", () => {
  const full: [number, number] = [300, 3000];

  it("zooms about a centre that keeps its place on a linear axis", () => {
    const z = zoomDomain(full, 0.5, 1200, full, "linear");
    // 1200 sits at 1/3 of the full span; it stays at 1/3 of the new window.
    expect((1200 - z[0]) / (z[1] - z[0])).toBeCloseTo((1200 - 300) / 2700, 12);
    expect(z[1] - z[0]).toBeCloseTo(1350, 9);
  });

  it("zooms in logarithms on a log axis", () => {
    const z = zoomDomain(full, 0.5, 1000, full, "log");
    const frac = (v: number, d: readonly number[]) => (Math.log(v) - Math.log(d[0]!)) / (Math.log(d[1]!) - Math.log(d[0]!));
    expect(frac(1000, z)).toBeCloseTo(frac(1000, full), 12);
    expect(Math.log(z[1] / z[0])).toBeCloseTo(Math.log(10) / 2, 12);
  });

  it("never leaves the full range and never zooms out past it", () => {
    expect(zoomDomain(full, 4, 1000, full, "log")).toEqual(full);
    const edge = zoomDomain([300, 600], 1.5, 300, full, "linear");
    expect(edge[0]).toBe(300);
    expect(edge[1]).toBeCloseTo(750, 9);
    expect(panDomain([300, 600], -1, full, "linear")).toEqual([300, 600]);
    const right = panDomain([2500, 2900], 1, full, "linear");
    expect(right[1]).toBe(3000);
    expect(right[1] - right[0]).toBeCloseTo(400, 9);
  });

  it("keeps a minimum span, so repeated zooming cannot collapse the window", () => {
    let d: [number, number] = [...full];
    for (let i = 0; i < 60; i++) d = zoomDomain(d, 0.5, 1064, full, "linear");
    expect(d[1] - d[0]).toBeCloseTo(2700 * 1e-3, 6);
    expect(d[0]).toBeLessThan(1064);
    expect(d[1]).toBeGreaterThan(1064);
  });

  it("pans by a fraction of the window and follows a cursor outside it", () => {
    expect(panDomain([1000, 1200], 0.5, full, "linear")).toEqual([1100, 1300]);
    expect(panToInclude([1000, 1200], 1250, full, "linear")).toEqual([1050, 1250]);
    expect(panToInclude([1000, 1200], 1100, full, "linear")).toEqual([1000, 1200]);
  });

  it("clamps a window given in either order", () => {
    expect(clampDomain([2000, 1000], full, "linear")).toEqual([1000, 2000]);
    expect(isFullDomain(null, full)).toBe(true);
    expect(isFullDomain([300, 3000], full)).toBe(true);
    expect(isFullDomain([300, 2999], full)).toBe(false);
  });
});

describe("automatic y range of the visible window", () => {
  // A spectrum whose short-wavelength end is 100× larger than the rest, like θ near 300 nm.
  const xs = [300, 400, 600, 800, 1000, 1200];
  const theta = [-50, -2, -0.8, -0.5, -0.3, -0.2];

  it("fits the whole data without a window (padded by 5 %)", () => {
    expect(visibleYExtent(xs, [theta], null)).toEqual([-50 - 49.8 * 0.05, -0.2 + 49.8 * 0.05]);
  });

  it("fits only the values inside the window, so the 300 nm end no longer squashes the rest", () => {
    const y = visibleYExtent(xs, [theta], [600, 1200])!;
    expect(y[0]).toBeCloseTo(-0.8 - 0.6 * 0.05, 12);
    expect(y[1]).toBeCloseTo(-0.2 + 0.6 * 0.05, 12);
  });

  it("ignores nulls and non-finite values and takes every series", () => {
    const y = visibleYExtent(
      xs,
      [
        [null, 1, NaN, 3, null, null],
        [0, 0, 0, 2, 0, 0],
      ],
      [400, 800],
    )!;
    expect(y[0]).toBeCloseTo(-0.15, 12);
    expect(y[1]).toBeCloseTo(3.15, 12);
    expect(visibleYExtent(xs, [[null, null, null, null, null, null]], [400, 800])).toBeNull();
  });

  it("widens a flat window and uses factors on a log axis", () => {
    expect(visibleYExtent([1, 2], [[5, 5]], null)).toEqual([4.5, 5.5]);
    expect(visibleYExtent([1, 2, 3], [[-1, 2, 8]], [1, 3], true)).toEqual([2 / 1.2, 8 * 1.2]);
  });
});
