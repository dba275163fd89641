import { scaleLog } from "d3";
import { describe, expect, it } from "vitest";
import { labelsOverlap, layoutMarkerLabels, type PlacedLabel } from "@/lib/workbench/label-layout";

function anyOverlap(labels: PlacedLabel[]): boolean {
  for (let i = 0; i < labels.length; i++)
    for (let j = i + 1; j < labels.length; j++) if (labelsOverlap(labels[i]!, labels[j]!)) return true;
  return false;
}

describe("marker label layout", () => {
  it("puts the 1030 and 1064 nm labels apart on a 300–3000 nm log axis", () => {
    // The workbench's default axis at desktop and at phone width.
    for (const widthPx of [1000, 300]) {
      const x = scaleLog()
        .domain([300, 3000])
        .range([76, 76 + widthPx]);
      const labels = [632.8, 800, 1030, 1064, 1550].map((nm) => ({ x: x(nm), text: String(nm) }));
      // Without layout 1030 and 1064 collide: 3.3 % of a decade apart is 14 px at 1000 px.
      expect(x(1064) - x(1030)).toBeLessThan(6 * 4);
      const placed = layoutMarkerLabels(labels, { left: 76, right: 76 + widthPx });
      expect(anyOverlap(placed)).toBe(false);
      const [l1030, l1064] = [placed[2]!, placed[3]!];
      expect(l1030.row).not.toBe(l1064.row);
    }
  });

  it("keeps labels that fit on the first row, anchored right of their line", () => {
    const placed = layoutMarkerLabels(
      [
        { x: 100, text: "632.8" },
        { x: 300, text: "1550" },
      ],
      { left: 0, right: 1000 },
    );
    expect(placed.map((p) => [p.row, p.anchor, p.textX])).toEqual([
      [0, "start", 103],
      [0, "start", 303],
    ]);
  });

  it("flips a label at the right edge to the left of its line", () => {
    const [p] = layoutMarkerLabels([{ x: 995, text: "2900" }], { left: 0, right: 1000 });
    expect(p).toMatchObject({ anchor: "end", textX: 992, row: 0 });
  });

  it("returns labels in the order given and stops at the row limit", () => {
    const labels = Array.from({ length: 6 }, (_, i) => ({ x: 500 + i, text: `${1000 + i}` }));
    const placed = layoutMarkerLabels(labels, { left: 0, right: 1000, maxRows: 3 });
    expect(placed.map((p) => p.text)).toEqual(labels.map((l) => l.text));
    expect(Math.max(...placed.map((p) => p.row))).toBe(2);
  });
});
