import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { saveFitSchema } from "@/lib/contracts/fits";
import { parseDataFile } from "@/lib/fit/cli-input";
import { asFitProvenance, fitProvenance, saveFitBody } from "@/lib/fit/provenance";
import { analyseFit } from "@/lib/fit/report";
import { TERBIUM_GARNET_DEFAULTS } from "@/lib/model/defaults";

/*
 * A saved fit carries its report: the body a finished fit sends passes the save contract even when
 * the fit had nuisance parameters (a prior on a held key, a set's field × length scale), the new
 * version takes only the free keys, and the stored provenance reads back with the comparison, the
 * profile interval, the held values and the verdict.
 */

describe("the saved provenance of a fit", () => {
  const params = { ...TERBIUM_GARNET_DEFAULTS };
  const points = parseDataFile(readFileSync("db/demo/generated-garnet-LM-T4-verdet.csv", "utf8"), params);
  const report = analyseFit(
    {
      params,
      free: [{ key: "gyrationPerT" }, { key: "oscillatorWavelengthNm" }, { key: "magneticScale", min: 0 }],
      // A prior of a few per cent on a held key makes it a nuisance (the value is the model document's "from memory" one).
      priors: [{ key: "curieWeissK", mean: params.curieWeissK, sigma: 0.5 }],
      sets: [{ name: "garnet rod", points, calibration: { scaleSigma: 0.01, relativeFloor: 0, temperatureSigmaK: 0 } }],
      starts: 1,
    },
    { shareProfiles: false },
  );
  const body = saveFitBody({
    version: 3,
    result: report,
    measurementSets: [{ id: "6a1f0c2e-5b1d-4c1e-9f00-00000000c001", name: "garnet rod" }],
    fittedAt: new Date("2026-12-03T12:00:00Z"),
  });

  it("passes the save contract with only the free keys as the new values", () => {
    const parsed = saveFitSchema.safeParse(body);
    expect(parsed.success, JSON.stringify(parsed.error?.issues)).toBe(true);
    expect(Object.keys(body.values).sort()).toEqual(["gyrationPerT", "magneticScale", "oscillatorWavelengthNm"]);
    expect(body.fit.correlation).toHaveLength(3);
    expect(body.fit.nuisances?.map((n) => n.name)).toEqual(["curieWeissK", "fieldLengthScale[garnet rod]"]);
  });

  it("reads back with the comparison, the interval, the held values and the verdict", () => {
    const stored = asFitProvenance(JSON.parse(JSON.stringify(fitProvenance(saveFitSchema.parse(body)))));
    expect(stored).not.toBeNull();
    expect(stored!.comparison?.map((c) => c.hypothesis)).toEqual(["noMagneticPart", "firstPrinciples"]);
    expect(stored!.comparison?.[0]?.words).toMatch(/^In this model/);
    expect(stored!.profile?.magneticScale?.interval68).toEqual(report.profile.magneticScale!.interval68);
    expect(stored!.assumptions?.some((a) => a.key === "landeG")).toBe(true);
    expect(stored!.verdict).toEqual(report.verdict);
    expect(stored!.goodnessOfFit).toEqual(report.goodnessOfFit);
    expect(stored!.sets?.[0]?.scaleSigma).toBe(0.01);
  });

  it("still reads a provenance saved before fits carried their report", () => {
    const { assumptions, priors, nuisances, sets, comparison, goodnessOfFit, profile, verdict, notes, starts, tookModelSign, ...old } =
      body.fit;
    expect(asFitProvenance({ kind: "fit", ...old, values: body.values })?.chi2).toBe(body.fit.chi2);
  });
});
