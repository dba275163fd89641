import { describe, expect, it } from "vitest";
import { hexToRgb, luminance, perceivedDeltaE, simulateLinear, type Vision } from "@/lib/workbench/color-vision";
import { COMPARE_COLORS, COMPARE_DASHES, SERIES_ORDER, SERIES_STYLE } from "@/lib/workbench/palette";

/*
 * Colour-blind safety of the plot palette. Dichromacy is simulated with the severity-1.0 matrices of
 * Machado, Oliveira & Fernandes, IEEE TVCG 15(6) 2009 (lib/workbench/color-vision.ts). A CIE76
 * ΔE of about 10 is a clearly visible difference between two line colours; we demand 15.
 */

const VISIONS: Vision[] = ["normal", "protanopia", "deuteranopia", "tritanopia"];
const MIN_DELTA_E = 15;

function pairs<T>(xs: readonly T[]): [T, T][] {
  const out: [T, T][] = [];
  for (let i = 0; i < xs.length; i++) for (let j = i + 1; j < xs.length; j++) out.push([xs[i]!, xs[j]!]);
  return out;
}

describe("plot palette", () => {
  const lineColors = SERIES_ORDER.map((k) => SERIES_STYLE[k].color);

  for (const vision of VISIONS) {
    it(`keeps spectrum line colours apart for ${vision} (ΔE76 ≥ ${MIN_DELTA_E})`, () => {
      for (const [a, b] of pairs(lineColors)) expect(perceivedDeltaE(a, b, vision), `${a} vs ${b}`).toBeGreaterThanOrEqual(MIN_DELTA_E);
    });
    it(`keeps compare overlay colours apart for ${vision}`, () => {
      for (const [a, b] of pairs(COMPARE_COLORS)) expect(perceivedDeltaE(a, b, vision), `${a} vs ${b}`).toBeGreaterThanOrEqual(MIN_DELTA_E);
    });
  }

  it("separates the total curve from the parts in grey (luminance) and gives every series its own dash", () => {
    const y = (hex: string) => luminance(simulateLinear(hexToRgb(hex), "normal"));
    const total = y(SERIES_STYLE.total.color);
    for (const k of SERIES_ORDER.filter((k) => k !== "total")) expect(Math.abs(y(SERIES_STYLE[k].color) - total)).toBeGreaterThan(0.1);
    const dashes = SERIES_ORDER.map((k) => SERIES_STYLE[k].dash ?? "solid");
    expect(new Set(dashes).size).toBe(dashes.length);
    expect(new Set(COMPARE_DASHES.map((d) => d ?? "solid")).size).toBe(COMPARE_DASHES.length);
  });

  it("does not fall back to the blue-then-orange default of common plotting libraries for the two parts", () => {
    const commonDefaults = ["#1f77b4", "#ff7f0e", "#0072b2", "#e69f00", "#d55e00", "#56b4e9"];
    for (const k of ["electric", "magnetic"] as const) {
      for (const d of commonDefaults) expect(perceivedDeltaE(SERIES_STYLE[k].color, d, "normal"), `${k} vs ${d}`).toBeGreaterThan(20);
    }
  });

  it("simulates a known case: pure red and green collapse for a deuteranope", () => {
    expect(perceivedDeltaE("#ff0000", "#00ff00", "normal")).toBeGreaterThan(80);
    expect(perceivedDeltaE("#ff0000", "#00ff00", "deuteranopia")).toBeLessThan(perceivedDeltaE("#ff0000", "#00ff00", "normal") / 2);
  });
});
