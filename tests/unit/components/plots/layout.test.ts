import { describe, expect, it } from "vitest";
import { estimateTextWidth, spaceOutLabels, tickCountFor, wrapText } from "@/components/plots/axes";
import { frameTop, titleLines } from "@/components/plots/plot-frame";
import { makeScale, ticksOf } from "@/components/plots/scale";

describe("narrow plots", () => {
  it("asks for fewer x ticks on a narrow axis", () => {
    expect(tickCountFor(1000, 8)).toBe(8);
    expect(tickCountFor(250, 8)).toBe(3);
    expect(tickCountFor(60, 8)).toBe(2);
  });

  it("drops tick labels that would overlap, keeping the first and the ticks themselves", () => {
    // A log wavelength axis 300–5000 nm squeezed into 250 px (a 390 px wide phone).
    const scale = makeScale("log", [300, 5000], [76, 326], false);
    const ticks = ticksOf(scale, "log", tickCountFor(250, 8)).map((t) => ({ ...t, px: scale(t.value) }));
    const spaced = spaceOutLabels(ticks);
    expect(spaced).toHaveLength(ticks.length);
    const shown = spaced.filter((t) => t.label !== "");
    expect(shown.length).toBeGreaterThanOrEqual(2);
    for (let i = 1; i < shown.length; i++) {
      const prev = shown[i - 1]!;
      const cur = shown[i]!;
      const gap = cur.px - estimateTextWidth(cur.label, 11) / 2 - (prev.px + estimateTextWidth(prev.label, 11) / 2);
      expect(gap).toBeGreaterThanOrEqual(6);
    }
  });

  it("wraps a long title into lines that fit, and makes room for them above the plot", () => {
    const title = "Magnetic share |θm| / (|θe| + |θm|) — crosses 50 % at 1421 nm and 2718 nm";
    const lines = titleLines(title, 340, 76);
    expect(lines.length).toBeGreaterThan(1);
    expect(lines.join(" ")).toBe(title);
    for (const line of lines) expect(estimateTextWidth(line, 12)).toBeLessThanOrEqual(340 - 76 - 8);
    expect(frameTop(null, { title, width: 340, left: 76 })).toBe(30 + (lines.length - 1) * 15);
    expect(frameTop(null, { title, width: 1400, left: 76 })).toBe(30);
    expect(frameTop("magneticScale = 2.0 (not first-principles)")).toBe(44);
  });

  it("keeps a single long word whole rather than splitting it", () => {
    expect(wrapText("Supercalifragilistic", 20, 12)).toEqual(["Supercalifragilistic"]);
  });
});
