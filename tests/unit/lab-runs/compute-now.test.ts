import { describe, expect, it } from "vitest";
import { computeSpectrumSchema, SYNC_CELL_LIMIT, SYNC_FIT_POINT_LIMIT } from "@/lib/contracts/compute";
import { DomainError } from "@/lib/contracts/errors";
import { fitRequestSchema } from "@/lib/fit/schema";
import { computeNow, fitNow } from "@/lib/lab-runs/compute-now";
import { computeRunInProcess, mapRun } from "@/lib/lab-runs/kinds";
import { TERBIUM_GARNET_DEFAULTS } from "@/lib/model/defaults";
import { computeSpectrumArrays } from "@/lib/physics/spectrum";
import { wavelengthGrid } from "@/lib/workbench/units";

const spectrum = (count: number, method: "analytic" | "llg" = "analytic") =>
  computeSpectrumSchema.parse({ params: TERBIUM_GARNET_DEFAULTS, method, wavelengths: { fromNm: 400, toNm: 1600, count } });

function thrown(fn: () => unknown): DomainError {
  try {
    fn();
  } catch (error) {
    if (error instanceof DomainError) return error;
    throw error;
  }
  throw new Error("no error thrown");
}

describe("synchronous compute", () => {
  it("a small spectrum comes back with the lab run's columns, equal to a plain spectrum of the physics", () => {
    const body = computeNow("spectrum", spectrum(50));
    const direct = computeSpectrumArrays({
      ...TERBIUM_GARNET_DEFAULTS,
      method: "analytic",
      wavelengthsNm: wavelengthGrid(400, 1600, 50, "log"),
    });
    expect(body.columns.thetaRad).toEqual(Array.from(direct.thetaRad));
    expect(body.columns.wavelengthNm).toHaveLength(50);
    expect(body.engineVersion).toMatch(/^\d+\.\d+\.\d+$/);
  });

  it("a small map equals the worker's chunked computation", () => {
    const payload = mapRun.payloadSchema.parse({
      params: TERBIUM_GARNET_DEFAULTS,
      method: "analytic",
      axis: "field",
      wavelengths: { fromNm: 500, toNm: 1000, count: 8 },
      rows: { from: 0.5, to: 2, count: 4 },
    });
    const body = computeNow("map", payload);
    const want = computeRunInProcess("map", payload);
    expect(body.columns.magneticShare).toEqual(Array.from(want.columns.magneticShare!, (v) => (Number.isNaN(v) ? null : v)));
  });

  it("above the limit: payload_too_large naming the cells, the limit and the lab-run route", () => {
    const tooMany = SYNC_CELL_LIMIT.llg + 1;
    const error = thrown(() => computeNow("spectrum", spectrum(tooMany, "llg")));
    expect(error.code).toBe("payload_too_large");
    expect(error.message).toContain(`${tooMany} cells`);
    expect(error.body().error).toMatchObject({
      cells: tooMany,
      limit: SYNC_CELL_LIMIT.llg,
      labRun: { path: "/api/runs", kind: "spectrum" },
    });
    // At the limit it computes.
    expect(computeNow("spectrum", spectrum(SYNC_CELL_LIMIT.llg, "analytic")).columns.thetaRad).toHaveLength(SYNC_CELL_LIMIT.llg);
  });

  it("a fit of more points than the limit is refused before it starts", () => {
    const points = Array.from({ length: SYNC_FIT_POINT_LIMIT + 1 }, (_, i) => ({
      line: i + 2,
      wavelengthNm: 500 + i,
      quantity: "verdet" as const,
      value: -100,
      sigma: 1,
      temperatureK: 293.15,
      fieldT: 1,
      lengthM: 0.01,
    }));
    const parsed = fitRequestSchema.safeParse({ params: TERBIUM_GARNET_DEFAULTS, free: [{ key: "magneticScale" }], points });
    if (!parsed.success) throw new Error(JSON.stringify(parsed.error.issues.slice(0, 2)));
    expect(thrown(() => fitNow(parsed.data)).code).toBe("payload_too_large");
    // Within the limit the fit runs and says how it ended.
    const small = fitRequestSchema.parse({
      params: TERBIUM_GARNET_DEFAULTS,
      free: [{ key: "magneticScale" }],
      points: points.slice(0, 20),
    });
    const fitted = fitNow(small);
    expect(fitted.result.free).toEqual(["magneticScale"]);
    expect(typeof fitted.result.converged).toBe("boolean");
    // The answer is the fit's report: with magneticScale free, the comparison against 0 and 1.
    expect(fitted.result.comparison?.map((c) => c.hypothesis)).toEqual(["noMagneticPart", "firstPrinciples"]);
    expect(fitted.result.goodnessOfFit.dof).toBe(19);
  });
});
