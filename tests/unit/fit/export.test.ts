import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { parseDataFile } from "@/lib/fit/cli-input";
import { fitPointsCsv, fitReportJson } from "@/lib/fit/export";
import { analyseFit } from "@/lib/fit/report";
import { TERBIUM_GARNET_DEFAULTS } from "@/lib/model/defaults";

/*
 * The fit's exports: the JSON carries the per-point share covariance (symmetric, its diagonal the
 * squared share σ), and the CSV one row per point with its share interval where it was profiled.
 */

describe("fit exports", () => {
  const params = { ...TERBIUM_GARNET_DEFAULTS };
  const points = parseDataFile(readFileSync("db/demo/generated-garnet-LM-T4-verdet.csv", "utf8"), params).slice(0, 8);
  const report = analyseFit(
    { params, free: [{ key: "gyrationPerT" }, { key: "magneticScale", min: 0 }], points, starts: 1 },
    { shareProfiles: true },
  );
  const meta = { setName: "test set", fittedAt: "2026-12-03T12:00:00.000Z" };

  it("writes the share covariance into the JSON", () => {
    const out = JSON.parse(fitReportJson(report, meta));
    expect(out.parameterSet).toBe("test set");
    const cov: number[][] = out.shareCovariance;
    expect(cov).toHaveLength(8);
    cov.forEach((row, i) => {
      expect(row[i]).toBeCloseTo(report.points[i]!.magneticShareSigma! ** 2, 14);
      for (const [j, v] of row.entries()) expect(v).toBeCloseTo(cov[j]![i]!, 14);
    });
  });

  it("writes one CSV row per point with its profiled share interval", () => {
    const lines = fitPointsCsv(report, meta)
      .split("\r\n")
      .filter((l) => l !== "");
    const header = lines.find((l) => !l.startsWith("#"))!.split(",");
    const rows = lines
      .filter((l) => !l.startsWith("#"))
      .slice(1)
      .map((l) => l.split(","));
    expect(rows).toHaveLength(8);
    const lo = header.indexOf("magnetic_share_lo68");
    const share = header.indexOf("magnetic_share");
    for (const row of rows) {
      expect(Number(row[lo])).toBeLessThanOrEqual(Number(row[share]));
      expect(Number(row[lo + 1])).toBeGreaterThanOrEqual(Number(row[share]));
    }
    expect(lines.some((l) => l.startsWith("# In this model"))).toBe(true);
  });
});
