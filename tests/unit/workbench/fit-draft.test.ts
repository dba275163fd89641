import { describe, expect, it } from "vitest";
import { MAX_FIT_STARTS } from "@/lib/fit/schema";
import { TERBIUM_GARNET_DEFAULTS } from "@/lib/model/defaults";
import {
  EMPTY_CALIBRATION,
  MAX_SHARE_WAVELENGTHS,
  initialParamDrafts,
  readCalibration,
  readParamDrafts,
  readStarts,
  readWavelengths,
} from "@/lib/workbench/fit-draft";
import { fitProgressView } from "@/lib/workbench/fit-progress";
import { fmtProbability } from "@/lib/workbench/format";

const start = { ...TERBIUM_GARNET_DEFAULTS };

describe("reading the fit panel's parameter drafts", () => {
  it("frees the usual parameters with magneticScale bounded below at 0 and no priors", () => {
    const r = readParamDrafts(initialParamDrafts(), start);
    const byKey = (a: { key: string }, b: { key: string }) => a.key.localeCompare(b.key);
    expect([...r.free].sort(byKey)).toEqual([{ key: "gyrationPerT" }, { key: "magneticScale", min: 0 }, { key: "oscillatorWavelengthNm" }]);
    expect(r.priors).toEqual([]);
    expect(r.errors).toEqual({});
  });

  it("centres a prior with no mean on the starting value, on a held parameter too", () => {
    const d = initialParamDrafts();
    d.oscillatorWavelengthNm.priorSigma = "10";
    d.curieWeissK = { ...d.curieWeissK, priorMean: "-0.5", priorSigma: "0.2" };
    const r = readParamDrafts(d, start);
    expect(r.priors).toEqual(
      [
        { key: "curieWeissK", mean: -0.5, sigma: 0.2 },
        { key: "oscillatorWavelengthNm", mean: start.oscillatorWavelengthNm, sigma: 10 },
      ].sort((a, b) => Object.keys(start).indexOf(a.key) - Object.keys(start).indexOf(b.key)),
    );
    expect(r.free.map((f) => f.key)).not.toContain("curieWeissK");
  });

  it("flags each field it cannot read and keeps the rest", () => {
    const d = initialParamDrafts();
    d.gyrationPerT.min = "abc";
    d.magneticScale.priorSigma = "0";
    d.oscillatorWavelengthNm = { ...d.oscillatorWavelengthNm, min: "500", max: "400" };
    d.curieWeissK.priorMean = "3";
    const r = readParamDrafts(d, start);
    expect(r.errors.gyrationPerT).toMatch(/Bounds must be numbers/);
    expect(r.errors.magneticScale).toMatch(/prior σ must be a number above 0/);
    expect(r.errors.oscillatorWavelengthNm).toMatch(/lower bound must be below/);
    expect(r.errors.curieWeissK).toMatch(/Give the prior a σ/);
    expect(r.priors).toEqual([]);
  });

  it("refuses a start outside the bounds", () => {
    const d = initialParamDrafts();
    d.magneticScale.min = "2";
    expect(readParamDrafts(d, start).errors.magneticScale).toMatch(/starting value 1 lies outside/);
  });
});

describe("reading a set's calibration", () => {
  it("turns per cent into fractions and empty into none", () => {
    expect(readCalibration(EMPTY_CALIBRATION)).toEqual({ calibration: { scaleSigma: 0, relativeFloor: 0, temperatureSigmaK: 0 } });
    expect(readCalibration({ scalePercent: "1", floorPercent: "0.5", temperatureSigmaK: "0.2" })).toEqual({
      calibration: { scaleSigma: 0.01, relativeFloor: 0.005, temperatureSigmaK: 0.2 },
    });
  });

  it("names the field and speaks per cent in its limits", () => {
    expect(readCalibration({ ...EMPTY_CALIBRATION, scalePercent: "80" })).toEqual({ error: "Field × length σ: must be ≤ 50 %" });
    expect(readCalibration({ ...EMPTY_CALIBRATION, temperatureSigmaK: "-1" })).toEqual({ error: "Temperature σ: must be ≥ 0 K" });
    expect(readCalibration({ ...EMPTY_CALIBRATION, floorPercent: "x" })).toHaveProperty("error");
  });
});

describe("starts and share wavelengths", () => {
  it("reads starts within 1 … the request's limit", () => {
    expect(readStarts("")).toEqual({ starts: 4 });
    expect(readStarts("8")).toEqual({ starts: 8 });
    for (const bad of ["0", "2.5", String(MAX_FIT_STARTS + 1), "many"]) expect(readStarts(bad)).toHaveProperty("error");
  });

  it("reads a list of wavelengths, once each", () => {
    expect(readWavelengths("")).toEqual({ wavelengthsNm: [] });
    expect(readWavelengths("1064, 1550 1064;632.8")).toEqual({ wavelengthsNm: [1064, 1550, 632.8] });
    expect(readWavelengths("1064, -3")).toEqual({ error: '"-3" is not a wavelength in nm above 0.' });
    expect(readWavelengths(Array.from({ length: MAX_SHARE_WAVELENGTHS + 1 }, (_, i) => 500 + i).join(","))).toHaveProperty("error");
  });
});

describe("fit progress", () => {
  it("fills the fit's part ever more slowly, then moves through the report's stages in order", () => {
    const fit = [1, 5, 50].map((iteration) => fitProgressView({ kind: "fit", iteration, maxIterations: 200, chi2: 10 }).fraction);
    expect(fit[0]!).toBeLessThan(fit[1]!);
    expect(fit[2]!).toBeLessThan(0.3);
    const stages = (["comparison", "nested", "profile", "share", "restsOn"] as const).map(
      (stage) => fitProgressView({ kind: "stage", stage, done: 0, total: 1 }).fraction,
    );
    expect([...stages].sort((a, b) => a - b)).toEqual(stages);
    const share = fitProgressView({ kind: "stage", stage: "share", done: 6, total: 24 });
    expect(share.text).toBe("Profiling the magnetic share: 6 of 24 conditions");
    expect(share.fraction).toBeCloseTo(0.55 + 0.4 * 0.25, 12);
  });
});

describe("probabilities as printed", () => {
  it("keeps small p-values visible in powers of ten", () => {
    expect(fmtProbability(0.785)).toBe("0.785");
    expect(fmtProbability(2.4e-7)).toBe("2.4e-7");
    expect(fmtProbability(0)).toBe("< 1e-300");
    expect(fmtProbability(Number.NaN)).toBe("–");
  });
});
