import { describe, expect, it } from "vitest";
import { DEFAULT_VIEW_STATE, parseViewState, rangeSchema, viewStateSchema } from "@/lib/workbench/view-state";

describe("view-state schema", () => {
  it("fills a missing view state with defaults (300–3000 nm × 256 log, laser-line markers)", () => {
    const vs = parseViewState(null);
    expect(vs).toEqual(DEFAULT_VIEW_STATE);
    expect(vs.range).toEqual({ fromNm: 300, toNm: 3000, points: 256, spacing: "log" });
    expect(vs.markersNm).toEqual([632.8, 800, 1064, 1550]);
  });
  it("keeps valid fields and replaces only broken ones", () => {
    const vs = parseViewState({
      xUnit: "eV",
      yMode: "bogus",
      markersNm: [1550, "x"],
      range: { fromNm: 500, toNm: 400, points: 10, spacing: "log" },
    });
    expect(vs.xUnit).toBe("eV");
    expect(vs.yMode).toBe(DEFAULT_VIEW_STATE.yMode);
    expect(vs.markersNm).toEqual(DEFAULT_VIEW_STATE.markersNm);
    expect(vs.range).toEqual(DEFAULT_VIEW_STATE.range);
  });
  it("round-trips through JSON", () => {
    const vs = { ...DEFAULT_VIEW_STATE, markersNm: [1030, 1550], xScale: "linear" as const };
    expect(viewStateSchema.parse(JSON.parse(JSON.stringify(vs)))).toEqual(vs);
  });
  it("limits the number of wavelength points to 5000 and demands an increasing range", () => {
    expect(rangeSchema.safeParse({ fromNm: 300, toNm: 3000, points: 5001, spacing: "log" }).success).toBe(false);
    expect(rangeSchema.safeParse({ fromNm: 300, toNm: 3000, points: 5000, spacing: "log" }).success).toBe(true);
    expect(rangeSchema.safeParse({ fromNm: 300, toNm: 300, points: 10, spacing: "log" }).success).toBe(false);
  });
});
