import { describe, expect, it } from "vitest";
import { TERBIUM_GARNET_DEFAULTS } from "@/lib/model/defaults";
import { NUMERICAL_RANGE, insideNumericalRange, numericalRangeIssues, numericalRangeProblem } from "@/lib/physics/numerical-range";
import type { SpectrumRequest } from "@/lib/physics/schema";
import { SpectrumInputError, computeSpectrumArrays, createSpectrumJob } from "@/lib/physics/spectrum";
import { runSpecSchema } from "@/lib/lab-runs/kinds";
import { checkedSpectrumRequest } from "@/lib/workbench/validate";

/*
 * The numerical method's range (physics-model.md §2: 200 nm to 20 µm, |B0| 0.01 to 10 T, T 1 to
 * 400 K, α 1e-4 to 0.5) on every path that runs it: the spectrum job (which the browser pool, the
 * worker and the command line all go through; the command line itself is checked in
 * tests/unit/physics/cli.test.ts), the lab-run payloads of the API, and the workbench panels' requests.
 * The analytic method is never limited by it.
 */

const request = (over: Partial<SpectrumRequest> = {}): SpectrumRequest => ({
  ...TERBIUM_GARNET_DEFAULTS,
  wavelengthsNm: [632.8, 1064],
  method: "llg",
  ...over,
});

const OUTSIDE: [string, Partial<SpectrumRequest>, RegExp][] = [
  [
    "a wavelength below 200 nm",
    { wavelengthsNm: [150, 632.8] },
    /^wavelengthsNm\.0: numerical LLG is specified for wavelengths from 200 to 20000 nm; 150 nm lies outside/,
  ],
  ["a wavelength above 20 µm", { wavelengthsNm: [632.8, 25_000] }, /^wavelengthsNm\.1: .* 25000 nm lies outside/],
  ["zero field", { fieldT: 0 }, /^fieldT: numerical LLG is specified for \|B0\| from 0\.01 to 10 T; 0 T lies outside/],
  ["a field above 10 T", { fieldT: -12 }, /^fieldT: .* -12 T lies outside/],
  [
    "a temperature above 400 K",
    { temperatureK: 500 },
    /^temperatureK: numerical LLG is specified for T from 1 to 400 K; 500 K lies outside/,
  ],
  [
    "no damping",
    { gilbertDamping: 0 },
    /^gilbertDamping: numerical LLG is specified for Gilbert damping α from 0\.0001 to 0\.5; 0 lies outside/,
  ],
];

describe("the numerical method's range", () => {
  it("holds the bounds of physics-model.md §2, closed at both ends, on |B0| for the field", () => {
    expect(NUMERICAL_RANGE).toEqual({
      wavelengthNm: [200, 20_000],
      absFieldT: [0.01, 10],
      temperatureK: [1, 400],
      gilbertDamping: [1e-4, 0.5],
    });
    expect(insideNumericalRange("wavelengthNm", 200)).toBe(true);
    expect(insideNumericalRange("wavelengthNm", 20_000)).toBe(true);
    expect(insideNumericalRange("wavelengthNm", 199.9)).toBe(false);
    expect(insideNumericalRange("absFieldT", -0.01)).toBe(true);
    expect(insideNumericalRange("absFieldT", 0.009)).toBe(false);
    expect(insideNumericalRange("gilbertDamping", Number.NaN)).toBe(false);
    expect(numericalRangeProblem("temperatureK", 400)).toBeNull();
    expect(numericalRangeProblem("temperatureK", 0.5)).toMatch(/use method "analytic"/);
  });

  it("names one line per broken bound, the first wavelength outside only, and none for the analytic method", () => {
    const far = request({ wavelengthsNm: [100, 150, 632.8], fieldT: 0, gilbertDamping: 0 });
    expect(numericalRangeIssues(far)).toEqual([
      expect.stringMatching(/^wavelengthsNm\.0: .* 100 nm/),
      expect.stringMatching(/^fieldT: /),
      expect.stringMatching(/^gilbertDamping: /),
    ]);
    expect(numericalRangeIssues({ ...far, method: "analytic" })).toEqual([]);
    expect(numericalRangeIssues(request())).toEqual([]);
  });

  describe("spectrum job (pool, worker, command line)", () => {
    it.each(OUTSIDE)("refuses %s with the rule it breaks", (_, over, message) => {
      expect(() => createSpectrumJob(request(over))).toThrow(SpectrumInputError);
      try {
        createSpectrumJob(request(over));
      } catch (error) {
        expect((error as SpectrumInputError).issues).toEqual([expect.stringMatching(message)]);
      }
    });

    it("computes inside the range, at its corners too, and the analytic method outside it", () => {
      const corners = request({ wavelengthsNm: [200, 20_000], fieldT: 10, temperatureK: 400, curieWeissK: 0, gilbertDamping: 1e-4 });
      expect(computeSpectrumArrays(corners).maxRelDeviationFromAnalytic).toBeLessThanOrEqual(1e-4);
      const analytic = computeSpectrumArrays(request({ wavelengthsNm: [150, 25_000], fieldT: 0, gilbertDamping: 0, method: "analytic" }));
      expect(analytic.thetaRad).toHaveLength(2);
    });
  });

  describe("lab runs (POST /api/runs and the lab worker parse the run spec)", () => {
    const map = {
      params: TERBIUM_GARNET_DEFAULTS,
      method: "llg" as const,
      axis: "temperature" as const,
      wavelengths: { fromNm: 400, toNm: 1600, count: 8 },
      rows: { from: 10, to: 300, count: 4 },
    };
    const spectrum = { params: TERBIUM_GARNET_DEFAULTS, method: "llg" as const, wavelengths: { fromNm: 300, toNm: 3000, count: 20 } };
    const issuesOf = (spec: unknown) => {
      const parsed = runSpecSchema.safeParse(spec);
      return parsed.success ? [] : parsed.error.issues.map((i) => ({ path: i.path.join("."), message: i.message }));
    };

    it("accepts a numerical map and spectrum inside the range", () => {
      expect(issuesOf({ kind: "map", payload: map })).toEqual([]);
      expect(issuesOf({ kind: "spectrum", payload: spectrum })).toEqual([]);
    });

    it("refuses each value outside the range at the field that sets it", () => {
      expect(issuesOf({ kind: "map", payload: { ...map, rows: { from: 10, to: 500, count: 4 } } })).toEqual([
        { path: "payload.rows.to", message: expect.stringMatching(/T from 1 to 400 K; 500 K lies outside/) },
      ]);
      expect(issuesOf({ kind: "map", payload: { ...map, wavelengths: { fromNm: 150, toNm: 1600, count: 8 } } })).toEqual([
        { path: "payload.wavelengths.fromNm", message: expect.stringMatching(/200 to 20000 nm; 150 nm lies outside/) },
      ]);
      expect(issuesOf({ kind: "spectrum", payload: { ...spectrum, wavelengths: { fromNm: 300, toNm: 30_000, count: 20 } } })).toEqual([
        { path: "payload.wavelengths.toNm", message: expect.stringMatching(/30000 nm lies outside/) },
      ]);
      expect(issuesOf({ kind: "spectrum", payload: { ...spectrum, params: { ...TERBIUM_GARNET_DEFAULTS, gilbertDamping: 0 } } })).toEqual([
        { path: "payload.params.gilbertDamping", message: expect.stringMatching(/Gilbert damping α/) },
      ]);
      // A temperature map keeps the set's field; a field map the set's temperature.
      const zeroField = { ...TERBIUM_GARNET_DEFAULTS, fieldT: 0 };
      expect(issuesOf({ kind: "map", payload: { ...map, params: zeroField } })).toEqual([
        { path: "payload.params.fieldT", message: expect.stringMatching(/\|B0\|/) },
      ]);
      expect(
        issuesOf({ kind: "map", payload: { ...map, params: zeroField, axis: "field", rows: { from: 0.1, to: 10, count: 4 } } }),
      ).toEqual([]);
    });

    it("checks every row, so a linear field axis through 0 T is refused", () => {
      const through = { ...map, axis: "field" as const, rows: { from: -1, to: 1, count: 5, spacing: "linear" as const } };
      expect(issuesOf({ kind: "map", payload: through })).toEqual([
        { path: "payload.rows.from", message: expect.stringMatching(/; 0 T lies outside/) },
      ]);
      expect(issuesOf({ kind: "map", payload: { ...through, method: "analytic" } })).toEqual([]);
    });
  });

  describe("workbench panels (maps, ΔMz curve)", () => {
    it.each(OUTSIDE)("refuse %s before anything reaches a worker", (_, over, message) => {
      expect(() => checkedSpectrumRequest(request(over))).toThrow(message);
    });

    it("pass a request inside the range, and any analytic one", () => {
      expect(checkedSpectrumRequest(request()).method).toBe("llg");
      expect(checkedSpectrumRequest(request({ fieldT: 0, method: "analytic" })).fieldT).toBe(0);
    });
  });
});
