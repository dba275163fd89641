import { buildCsv } from "@/lib/csv/write";
import { fitOutput } from "./output";
import type { FitReport } from "./report";

/*
 * The fit's exports from the workbench: the report as JSON (the command line's shape, with the
 * per-point share covariance) and the points as CSV (conditions, measured and model values, the
 * normalized residual, the magnetic share with its σ and its 68 % profile interval). The CSV's
 * comment lines carry the conditions of the result: the comparison in words and the held values.
 */

export function fitReportJson(report: FitReport, meta: { setName: string; fittedAt: string }): string {
  return `${JSON.stringify({ parameterSet: meta.setName, fittedAt: meta.fittedAt, ...fitOutput(report) }, null, 2)}\n`;
}

export function fitPointsCsv(report: FitReport, meta: { setName: string; fittedAt: string }): string {
  const comments = [
    `Gyrolux fit of "${meta.setName}" at ${meta.fittedAt}: chi2 = ${report.chi2} for ${report.dof} degrees of freedom, ` +
      `P(chi2 > that) = ${report.goodnessOfFit.pValue}.`,
    `Fitted: ${report.names.map((n) => `${n} = ${report.values[n]} +- ${report.sigmas[n]}`).join("; ")}.`,
    ...report.comparison.map((c) => c.words),
    `Held: ${report.assumptions.map((a) => `${a.key} = ${String(a.value)} (${a.source})`).join("; ")}.`,
    "magnetic_share = |theta_m| / (|theta_e| + |theta_m|) in this model; its covariance between points is in the JSON export.",
  ];
  return buildCsv({
    comments,
    header: [
      "set",
      "wavelength_nm",
      "temperature_K",
      "field_T",
      "length_m",
      "quantity",
      "measured",
      "sigma",
      "effective_sigma",
      "model",
      "normalized_residual",
      "magnetic_share",
      "magnetic_share_sigma",
      "magnetic_share_lo68",
      "magnetic_share_hi68",
    ],
    rows: report.points.map((p, i) => {
      const share = report.shareProfiles[report.pointShareProfile[i] ?? -1];
      return [
        p.set,
        p.wavelengthNm,
        p.temperatureK,
        p.fieldT,
        p.lengthM,
        p.quantity,
        p.measured,
        p.sigma,
        p.effectiveSigma,
        p.model,
        p.normalizedResidual,
        p.magneticShare,
        p.magneticShareSigma,
        share?.interval68[0],
        share?.interval68[1],
      ];
    }),
  });
}
