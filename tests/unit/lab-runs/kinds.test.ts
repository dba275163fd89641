import { describe, expect, it } from "vitest";
import { TERBIUM_GARNET_DEFAULTS } from "@/lib/model/defaults";
import { computeSpectrumArrays } from "@/lib/physics/spectrum";
import { decodeResult, encodeResult } from "@/lib/lab-runs/encoding";
import { computeRunInProcess, mapPayloadSchema, mapRun, runSpecSchema, spectrumRun } from "@/lib/lab-runs/kinds";
import { wavelengthGrid } from "@/lib/workbench/units";

const map = {
  params: TERBIUM_GARNET_DEFAULTS,
  method: "analytic" as const,
  axis: "field" as const,
  wavelengths: { fromNm: 400, toNm: 1600, count: 5 },
  rows: { from: 0.1, to: 10, count: 3, spacing: "log" as const },
};

describe("lab-run kinds", () => {
  it("a map is one spectrum per row, row-major, whatever the chunking", () => {
    const p = mapPayloadSchema.parse(map);
    const result = computeRunInProcess("map", p);
    expect(result.columns.magneticShare).toHaveLength(15);
    const ys = result.columns.rowValue!;
    for (let j = 0; j < 3; j++) {
      const row = computeSpectrumArrays({
        ...TERBIUM_GARNET_DEFAULTS,
        fieldT: ys[j]!,
        method: "analytic",
        wavelengthsNm: Array.from(result.columns.wavelengthNm!),
      });
      expect(Array.from(result.columns.magneticShare!.slice(j * 5, j * 5 + 5))).toEqual(Array.from(row.magneticShare));
    }
    // Chunks computed out of order assemble to the same columns.
    const chunks = mapRun.chunks(p).reverse();
    const outputs = chunks.map((c) => mapRun.compute(p, c)).reverse();
    expect(mapRun.assemble(p, outputs).columns).toEqual(result.columns);
  });

  it("a long spectrum is split into chunks of at most 256 wavelengths and joins up to one spectrum", () => {
    const payload = {
      params: TERBIUM_GARNET_DEFAULTS,
      method: "analytic" as const,
      wavelengths: { fromNm: 300, toNm: 3000, count: 700, spacing: "log" as const },
    };
    const p = spectrumRun.payloadSchema.parse(payload);
    expect(spectrumRun.chunks(p).map((c) => c.end - c.start)).toEqual([256, 256, 188]);
    const whole = computeSpectrumArrays({
      ...TERBIUM_GARNET_DEFAULTS,
      method: "analytic",
      wavelengthsNm: wavelengthGrid(300, 3000, 700, "log"),
    });
    expect(computeRunInProcess("spectrum", p).columns.thetaRad).toEqual(whole.thetaRad);
  });

  it("refuses grids beyond the limits and input the physics rejects, naming the field", () => {
    const tooBig = runSpecSchema.safeParse({ kind: "map", payload: { ...map, wavelengths: { fromNm: 400, toNm: 1600, count: 513 } } });
    expect(tooBig.success).toBe(false);
    expect(tooBig.error!.issues[0]!.path.join(".")).toBe("payload.wavelengths.count");
    const cold = runSpecSchema.safeParse({ kind: "map", payload: { ...map, axis: "temperature", rows: { from: -20, to: 300, count: 4 } } });
    expect(cold.success).toBe(false);
    expect(cold.error!.issues.map((i) => i.message).join(" ")).toMatch(/Curie–Weiss/);
    const long = runSpecSchema.safeParse({
      kind: "spectrum",
      payload: { params: TERBIUM_GARNET_DEFAULTS, method: "llg", wavelengths: { fromNm: 300, toNm: 3000, count: 20_001 } },
    });
    expect(long.success).toBe(false);
  });

  it("stores the columns as bytes that give back every double, NaN included", () => {
    const columns = { a: Float64Array.from([0.1, -0, Number.NaN, 5e-324, 1.7976931348623157e308]), b: Float64Array.from([Math.PI]) };
    const { meta, data } = encodeResult({ columns, meta: { kind: "test" } });
    const back = decodeResult(meta, data);
    expect(Object.is(back.a![1], -0)).toBe(true);
    expect(Number.isNaN(back.a![2])).toBe(true);
    expect(Array.from(back.a!)).toEqual(Array.from(columns.a));
    expect(Array.from(back.b!)).toEqual([Math.PI]);
  });
});
