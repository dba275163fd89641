import { describe, expect, it } from "vitest";
import { TERBIUM_GARNET_DEFAULTS } from "@/lib/model/defaults";
import type { ModelParams } from "@/lib/physics/schema";
import { computeMapBlock } from "@/lib/compute/map-block";
import {
  axisIndependence,
  CONSTANT_REL_TOL,
  formatQuantity,
  MAP_QUANTITIES,
  maxColumnChange,
  quantityDomain,
  quantityLevels,
  type MapQuantity,
  cellAt,
  DEFAULT_FIELD_AXIS,
  DEFAULT_MAP_RESOLUTION,
  expectedMapTime,
  formatShare,
  MAP_RESOLUTIONS,
  mapValues,
  parseResolution,
  resolutionKey,
  MAP_COLS,
  MAP_ROWS,
  mapColumns,
  maxDeviation,
  methodCaption,
  moveCell,
  parseFieldAxis,
  planMap,
  rowParams,
  temperatureRows,
  type CellGeometry,
} from "@/lib/workbench/maps";
import type { WavelengthRange } from "@/lib/workbench/view-state";

const params: ModelParams = {
  ionDensityPerM3: 1.27e28,
  landeG: 1.5,
  totalJ: 6,
  curieWeissK: -8,
  gilbertDamping: 0.1,
  epsInf: 1,
  sellmeierB: 2.7325,
  sellmeierWavelengthNm: 135.83,
  oscillatorStrength: 0,
  oscillatorWavelengthNm: 250,
  oscillatorDampingRadPerS: 0,
  gyrationPerT: 0,
  magneticScale: 1,
  temperatureK: 293.15,
  fieldT: 1,
  lengthM: 0.01,
};
const range: WavelengthRange = { fromNm: 400, toNm: 1600, points: 200, spacing: "log" };

describe("cell under the pointer", () => {
  const g: CellGeometry = { left: 76, top: 30, width: 640, height: 320, nx: 64, ny: 32 };
  it("maps the corners of the plotting area to the corner cells (row 0 at the bottom)", () => {
    expect(cellAt(76, 350, g)).toEqual({ i: 0, j: 0 });
    expect(cellAt(76 + 640, 30, g)).toEqual({ i: 63, j: 31 });
    expect(cellAt(76 + 0.1, 30 + 0.1, g)).toEqual({ i: 0, j: 31 });
  });
  it("finds an interior cell from its centre and its edges", () => {
    // Cell (10, 5): x 176…186, y from the bottom 50…60 → SVG y 290…300.
    expect(cellAt(181, 295, g)).toEqual({ i: 10, j: 5 });
    expect(cellAt(176, 300, g)).toEqual({ i: 10, j: 5 });
    expect(cellAt(185.99, 290.01, g)).toEqual({ i: 10, j: 5 });
  });
  it("is null outside the plotting area or on an empty grid", () => {
    expect(cellAt(75, 200, g)).toBeNull();
    expect(cellAt(300, 29, g)).toBeNull();
    expect(cellAt(300, 351, g)).toBeNull();
    expect(cellAt(717, 200, g)).toBeNull();
    expect(cellAt(Number.NaN, 200, g)).toBeNull();
    expect(cellAt(100, 100, { ...g, nx: 0 })).toBeNull();
  });
});

describe("keyboard movement between cells", () => {
  it("starts in the middle, then moves by one (ten with Shift) and stays on the grid", () => {
    expect(moveCell(null, "ArrowRight", 64, 32)).toEqual({ i: 32, j: 16 });
    expect(moveCell({ i: 3, j: 4 }, "ArrowRight", 64, 32)).toEqual({ i: 4, j: 4 });
    expect(moveCell({ i: 3, j: 4 }, "ArrowUp", 64, 32)).toEqual({ i: 3, j: 5 });
    expect(moveCell({ i: 3, j: 4 }, "ArrowDown", 64, 32, true)).toEqual({ i: 3, j: 0 });
    expect(moveCell({ i: 60, j: 4 }, "ArrowRight", 64, 32, true)).toEqual({ i: 63, j: 4 });
    expect(moveCell({ i: 0, j: 0 }, "ArrowLeft", 64, 32)).toEqual({ i: 0, j: 0 });
  });
  it("jumps to the ends, clears on Escape and ignores other keys", () => {
    expect(moveCell({ i: 3, j: 4 }, "Home", 64, 32)).toEqual({ i: 0, j: 4 });
    expect(moveCell({ i: 3, j: 4 }, "End", 64, 32)).toEqual({ i: 63, j: 4 });
    expect(moveCell({ i: 3, j: 4 }, "PageUp", 64, 32)).toEqual({ i: 3, j: 31 });
    expect(moveCell({ i: 3, j: 4 }, "PageDown", 64, 32)).toEqual({ i: 3, j: 0 });
    expect(moveCell({ i: 3, j: 4 }, "Escape", 64, 32)).toBeNull();
    expect(moveCell({ i: 3, j: 4 }, "a", 64, 32)).toBeUndefined();
    expect(moveCell({ i: 3, j: 4 }, "Tab", 64, 32)).toBeUndefined();
  });
});

describe("map grid", () => {
  it("uses the current range, log-spaced, for the analytic method", () => {
    const cols = mapColumns({ ...range, fromNm: 100, toNm: 30_000 }, "analytic")!;
    expect(cols.note).toBeNull();
    expect(cols.xs).toHaveLength(MAP_COLS);
    expect(cols.xs[0]).toBe(100);
    expect(cols.xs[MAP_COLS - 1]).toBe(30_000);
    expect(cols.xs[1]! / cols.xs[0]!).toBeCloseTo(cols.xs[2]! / cols.xs[1]!, 10);
  });
  it("cuts the numerical columns to 200 nm–20 µm and says so", () => {
    const cols = mapColumns({ ...range, fromNm: 100, toNm: 30_000 }, "llg")!;
    expect(cols.xs[0]).toBe(200);
    expect(cols.xs[MAP_COLS - 1]).toBe(20_000);
    expect(cols.note).toMatch(/200–2e\+4|200–20000/);
    expect(mapColumns({ ...range, fromNm: 50, toNm: 150 }, "llg")).toBeNull();
    expect(mapColumns(range, "llg")!.note).toBeNull();
  });
  it("runs the temperature rows from above θCW (≥ 1 K) to 400 K", () => {
    const ys = temperatureRows(params, "llg")!;
    expect(ys).toHaveLength(MAP_ROWS);
    expect(ys[0]).toBe(1);
    expect(ys[MAP_ROWS - 1]).toBe(400);
    expect(temperatureRows({ ...params, curieWeissK: 100 }, "llg")![0]).toBe(101);
    // θCW = 450 K: nothing in 1–400 K for the numerical path; the analytic map goes above.
    expect(temperatureRows({ ...params, curieWeissK: 450, temperatureK: 500 }, "llg")).toBeNull();
    expect(temperatureRows({ ...params, curieWeissK: 450, temperatureK: 500 }, "analytic")![0]).toBe(451);
  });
  it("checks the field axis, stricter for the numerical method", () => {
    expect(parseFieldAxis(DEFAULT_FIELD_AXIS, "llg")).toEqual({ fromT: 0.01, toT: 10 });
    expect(parseFieldAxis({ fromT: "0.001", toT: "10" }, "analytic")).toEqual({ fromT: 0.001, toT: 10 });
    expect(parseFieldAxis({ fromT: "0.001", toT: "10" }, "llg")).toHaveProperty("error", expect.stringMatching(/0\.01.*10 T/));
    expect(parseFieldAxis({ fromT: "0.1", toT: "20" }, "llg")).toHaveProperty("error");
    expect(parseFieldAxis({ fromT: "0", toT: "1" }, "analytic")).toHaveProperty("error", expect.stringMatching(/> 0/));
    expect(parseFieldAxis({ fromT: "2", toT: "1" }, "analytic")).toHaveProperty("error");
    expect(parseFieldAxis({ fromT: "x", toT: "1" }, "analytic")).toHaveProperty("error");
    expect(parseFieldAxis({ fromT: "1", toT: "200" }, "analytic")).toHaveProperty("error");
  });
  it("builds field rows with the sign of the set's field", () => {
    const { plan } = planMap("field", "llg", { ...params, fieldT: -1 }, range, DEFAULT_FIELD_AXIS);
    expect(plan).not.toBeNull();
    expect(plan!.yType).toBe("log");
    expect(plan!.ys[0]).toBe(-0.01);
    expect(plan!.ys[MAP_ROWS - 1]).toBe(-10);
    expect(rowParams(plan!, params, 3).fieldT).toBe(plan!.ys[3]);
    expect(rowParams(plan!, params, 3).temperatureK).toBe(params.temperatureK);
  });
  it("ties each numerical-range problem to its control and plans nothing then", () => {
    const noDamping = planMap("temperature", "llg", { ...params, gilbertDamping: 0 }, range, DEFAULT_FIELD_AXIS);
    expect(noDamping.plan).toBeNull();
    expect(noDamping.problems).toEqual([{ control: "method", message: expect.stringMatching(/Gilbert damping/) }]);
    // The analytic method has no such limits.
    expect(planMap("temperature", "analytic", { ...params, gilbertDamping: 0 }, range, DEFAULT_FIELD_AXIS).plan).not.toBeNull();
    // Temperature map at the set's field of 0 T; field map at the set's 500 K.
    expect(planMap("temperature", "llg", { ...params, fieldT: 0 }, range, DEFAULT_FIELD_AXIS).problems[0]?.message).toMatch(/\|B0\|/);
    expect(planMap("field", "llg", { ...params, temperatureK: 500 }, range, DEFAULT_FIELD_AXIS).problems[0]?.message).toMatch(/500 K/);
    const axis = planMap("field", "llg", params, range, { fromT: "0.001", toT: "10" });
    expect(axis.plan).toBeNull();
    expect(axis.problems.map((p) => p.control)).toEqual(["fieldAxis"]);
    // The temperature map does not use the field axis.
    expect(planMap("temperature", "llg", params, range, { fromT: "0.001", toT: "10" }).plan).not.toBeNull();
  });
  it("never plans a numerical row outside 200 nm–20 µm, 0.01–10 T, 1–400 K", () => {
    for (const kind of ["temperature", "field"] as const) {
      const { plan } = planMap(kind, "llg", params, { ...range, fromNm: 150, toNm: 25_000 }, DEFAULT_FIELD_AXIS);
      expect(plan).not.toBeNull();
      for (const x of plan!.xs) expect(x >= 200 && x <= 20_000).toBe(true);
      for (let j = 0; j < plan!.ys.length; j++) {
        const p = rowParams(plan!, params, j);
        expect(Math.abs(p.fieldT) >= 0.01 && Math.abs(p.fieldT) <= 10).toBe(true);
        expect(p.temperatureK >= 1 && p.temperatureK <= 400).toBe(true);
      }
      expect(plan!.notes).toHaveLength(1);
    }
  });
});

describe("resolution and expected time", () => {
  it("offers 32 × 16 to 256 × 128, defaults to 64 × 32, and plans the chosen grid", () => {
    expect(MAP_RESOLUTIONS.map(resolutionKey)).toEqual(["32x16", "64x32", "128x64", "256x128"]);
    expect(DEFAULT_MAP_RESOLUTION).toEqual({ cols: MAP_COLS, rows: MAP_ROWS });
    expect(parseResolution("128x64")).toEqual({ cols: 128, rows: 64 });
    expect(parseResolution("4096x4096")).toEqual(DEFAULT_MAP_RESOLUTION);
    for (const kind of ["temperature", "field"] as const) {
      const { plan } = planMap(kind, "llg", params, range, DEFAULT_FIELD_AXIS, { cols: 256, rows: 128 });
      expect(plan!.xs).toHaveLength(256);
      expect(plan!.ys).toHaveLength(128);
    }
  });

  it("says the expected time from the measured rate, and waits for a measurement on the numerical path", () => {
    expect(expectedMapTime(8192, "llg", 4096)).toBe("Expected time: about 2.0 s at the 4,100 cells/s this browser measured.");
    expect(expectedMapTime(32768, "llg", 1000)).toMatch(/about 33 s/);
    expect(expectedMapTime(512, "llg", 8000)).toMatch(/under 1 s/);
    expect(expectedMapTime(8192, "llg", null)).toMatch(/shown once this browser's speed is measured/);
    // Analytic: 3.2 µs a cell from the engine benchmark, so 256 × 128 stays under a second.
    expect(expectedMapTime(32768, "analytic", null)).toMatch(/under 1 s \(analytic\)/);
  });
});

describe("progress and caption", () => {
  it("keeps the largest deviation over all rows", () => {
    expect(maxDeviation([1e-6, undefined, 3e-5, 2e-5])).toBe(3e-5);
    expect(maxDeviation([undefined])).toBeUndefined();
    expect(methodCaption("llg", 32, 3.04e-5)).toBe(
      "Computed with numerical LLG; largest deviation from linear response over all 32 rows: 3.0e-5.",
    );
    expect(methodCaption("analytic", 32, undefined)).toMatch(/analytic/);
  });
  it("formats the share", () => {
    expect(formatShare(0.1234)).toBe("12.3 %");
    expect(formatShare(null)).toMatch(/undefined/);
  });
});

describe("what a map shows and when it says so in words", () => {
  it("finds the largest change along the second axis, column by column", () => {
    // 3 columns × 2 rows; column 1 changes by 2 of its largest |value| 4 → 0.5.
    const values = [1, 2, 0, 1, 4, 0];
    expect(maxColumnChange(values, 3, 2)).toEqual({ relative: 0.5, column: 1 });
    expect(maxColumnChange([null, null, 1, null], 2, 2)).toBeNull();
    expect(maxColumnChange([0, 0, 0, 0], 2, 2)).toEqual({ relative: 0, column: 0 });
  });

  it("says a quantity constant to 1e-9 along the axis does not depend on it", () => {
    const r = axisIndependence("theta", "temperature", true, { relative: 5e-10 });
    expect(r.independent).toBe(true);
    expect(r.reason).toMatch(/does not depend on temperature/);
    expect(axisIndependence("theta", "temperature", true, { relative: 0.3 }).independent).toBe(false);
    expect(axisIndependence("verdet", "field", false, null).reason).toMatch(/undefined/);
  });

  it("knows from the model that the share is independent of T and B without the diamagnetic term, and not with it", () => {
    expect(axisIndependence("share", "temperature", false, { relative: 3e-6 }).independent).toBe(true);
    expect(axisIndependence("share", "field", false, { relative: 3e-6 }).reason).toMatch(/diamagnetic term/);
    expect(axisIndependence("share", "temperature", true, { relative: 3e-3 }).independent).toBe(false);
  });

  it("reads each quantity from a computed block (NaN as undefined), and ranges and levels fit the quantity", () => {
    const col = (v: number) => Float64Array.of(v, Number.NaN);
    const values = mapValues({
      magneticShare: col(0.031),
      thetaRad: col(-1.34),
      thetaElectricRad: col(-1.385),
      thetaMagneticRad: col(0.045),
      verdetRadPerTm: col(-134),
    });
    expect(MAP_QUANTITIES.map((q) => values[q])).toEqual([
      [0.031, null],
      [-1.34, null],
      [-1.385, null],
      [0.045, null],
      [-134, null],
    ]);
    expect(quantityDomain([0.2, 0.4], "share")).toEqual([0, 1]);
    expect(quantityDomain([-3, null, 2], "theta")).toEqual([-3, 2]);
    expect(quantityLevels([-3, 2], "theta")).toEqual([0]);
    expect(quantityLevels([-3, -2], "verdet")).toEqual([]);
    expect(quantityLevels([0, 1], "share")).toEqual([0.5]);
    expect(formatQuantity(-134, "verdet")).toBe("-134 rad/(T·m)");
  });
});

describe("maps computed by the engine", () => {
  const rowsOf = async (kind: "temperature" | "field", over: Partial<ModelParams>, q: MapQuantity) => {
    const params = { ...TERBIUM_GARNET_DEFAULTS, ...over };
    const planned = planMap(kind, "analytic", params, range, DEFAULT_FIELD_AXIS);
    if (!planned.plan) throw new Error("no plan");
    const plan = planned.plan;
    const base = { ...rowParams(plan, params, 0), wavelengthsNm: plan.xs, method: "analytic" as const };
    const block = await computeMapBlock({ base, axis: kind, rowValues: plan.ys });
    return maxColumnChange(mapValues(block.values)[q], plan.xs.length, plan.ys.length);
  };

  it("without the diamagnetic term the share is stripes (first-order constant); with it the share moves with T and B", async () => {
    // Both parts ∝ M0 (§6.4): only the second-order terms in G and χ move the share.
    const offT = (await rowsOf("temperature", {}, "share"))!.relative;
    const offB = (await rowsOf("field", { temperatureK: 4 }, "share"))!.relative;
    const onT = (await rowsOf("temperature", { diamagneticTerm: true }, "share"))!.relative;
    const onB = (await rowsOf("field", { diamagneticTerm: true, temperatureK: 4 }, "share"))!.relative;
    // Off: below 1e-5 (measured 1.2e-7 over T, 1.6e-6 over B at 4 K). On: the diamagnetic part does
    // not follow M0, so the share moves by ~20 % over 1–400 K; over B only where M0 saturates (4 K).
    expect(offT).toBeLessThan(1e-5);
    expect(offB).toBeLessThan(1e-5);
    expect(onT).toBeGreaterThan(0.05);
    expect(onB).toBeGreaterThan(100 * offB);
  });

  it("no spins with the term on: θ is exactly the same at every temperature (detected from the data)", async () => {
    const change = (await rowsOf("temperature", { ionDensityPerM3: 0, diamagneticTerm: true }, "theta"))!;
    expect(change.relative).toBeLessThanOrEqual(CONSTANT_REL_TOL);
    expect(axisIndependence("theta", "temperature", true, change).independent).toBe(true);
  });
});
