import { buildCsv } from "@/lib/csv/write";
import type { PlanResult, RankedPlan } from "./plan";

/*
 * CSV of one plan: a commented header (set, criterion, expected σ, noise) and one row per point.
 * RFC 4180 quoting and defused formula cells (lib/csv/write.ts).
 */

export function planToCsv(o: {
  setName: string;
  setVersion: number;
  result: Pick<PlanResult, "criterionLabel" | "criterionUnit" | "method" | "candidateCount" | "sigmaPerPointRad">;
  plan: RankedPlan;
}): string {
  const { result, plan } = o;
  return buildCsv({
    comments: [
      `Gyrolux measurement plan for "${o.setName}" (version ${o.setVersion})`,
      `criterion: ${result.criterionLabel} ${result.criterionUnit}`,
      `expected standard error: ${Number.isFinite(plan.expectedSigma) ? plan.expectedSigma.toPrecision(4) : "not separable"}`,
      `search: ${result.method}, ${result.candidateCount} candidate points; sigma per point ${result.sigmaPerPointRad.toPrecision(4)} rad`,
    ],
    header: ["line", "wavelength_nm", "temperature_K", "field_T", "count", "predicted_rotation_rad", "signal_to_noise", "below_noise"],
    rows: plan.points.map((p) => [
      p.lineName,
      p.wavelengthNm,
      p.temperatureK,
      p.fieldT,
      p.count,
      p.rotationRad.toPrecision(6),
      p.signalToNoise.toPrecision(4),
      p.belowNoise,
    ]),
  });
}
