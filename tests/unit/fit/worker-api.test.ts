import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { parseDataFile } from "@/lib/fit/cli-input";
import { type FitRunProgress, createFitWorkerApi } from "@/lib/fit/worker-api";
import { TERBIUM_GARNET_DEFAULTS } from "@/lib/model/defaults";

/*
 * The object the fit worker exposes: the report (not only the fit) comes back, and progress covers
 * the fit's iterations and then each stage of the report in order.
 */

describe("the fit worker's API", () => {
  it("returns the report with its comparison and posts the fit's iterations, then the report's stages", async () => {
    const params = { ...TERBIUM_GARNET_DEFAULTS };
    const points = parseDataFile(readFileSync("db/demo/generated-garnet-LM-T4-verdet.csv", "utf8"), params);
    const seen: FitRunProgress[] = [];
    const report = await createFitWorkerApi().fit(
      {
        params,
        free: [{ key: "gyrationPerT" }, { key: "magneticScale", min: 0 }],
        sets: [{ name: "garnet", points }],
        starts: 1,
      },
      { shareProfiles: false, shareWavelengthsNm: [1064] },
      (p) => seen.push(p),
    );
    expect(report.comparison.map((r) => r.hypothesis)).toEqual(["noMagneticPart", "firstPrinciples"]);
    expect(report.profile.magneticScale).toBeDefined();
    // Only the asked-for wavelength is profiled.
    expect(report.shareProfiles.map((s) => s.wavelengthNm)).toEqual([1064]);
    expect(report.pointShareProfile.every((i) => i === -1)).toBe(true);
    const kinds = seen.map((p) => (p.kind === "fit" ? "fit" : p.stage));
    expect(kinds[0]).toBe("fit");
    const stages = [...new Set(kinds.filter((k) => k !== "fit"))];
    expect(stages.slice(0, 4)).toEqual(["comparison", "nested", "profile", "share"]);
  });
});
