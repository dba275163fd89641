import { describe, expect, it } from "vitest";
import { describeCrossing, shareCrossingsNm } from "@/lib/workbench/crossing";

const pts = (pairs: [number, number | null][]) => pairs.map(([wavelengthNm, magneticShare]) => ({ wavelengthNm, magneticShare }));

describe("50 % crossing of the magnetic share", () => {
  it("interpolates linearly between the bracketing points", () => {
    expect(
      shareCrossingsNm(
        pts([
          [1000, 0.3],
          [2000, 0.4],
          [3000, 0.6],
        ]),
      ),
    ).toEqual([2500]);
    const [x] = shareCrossingsNm(
      pts([
        [1000, 0.45],
        [1100, 0.55],
      ]),
    );
    expect(x).toBeCloseTo(1050, 10);
  });
  it("reports no crossing when the share stays on one side", () => {
    expect(
      shareCrossingsNm(
        pts([
          [300, 0.02],
          [3000, 0.3],
        ]),
      ),
    ).toEqual([]);
    expect(describeCrossing([])).toBe("does not cross 50 % in range");
  });
  it("finds falling crossings and exact hits once", () => {
    expect(
      shareCrossingsNm(
        pts([
          [1, 0.8],
          [3, 0.2],
        ]),
      ),
    ).toEqual([2]);
    expect(
      shareCrossingsNm(
        pts([
          [1, 0.4],
          [2, 0.5],
          [3, 0.6],
        ]),
      ),
    ).toEqual([2]);
  });
  it("does not bridge null shares (no spins)", () => {
    expect(
      shareCrossingsNm(
        pts([
          [1, 0.4],
          [2, null],
          [3, 0.6],
        ]),
      ),
    ).toEqual([]);
  });
  it("describes a crossing in nm", () => {
    expect(describeCrossing([2500.4])).toBe("crosses 50 % at 2500 nm");
  });
});
