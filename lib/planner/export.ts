import type { PlanResult, RankedPlan } from "./plan";

/*
 * CSV of one plan: a commented header (set, criterion, expected σ, noise) and one row per point.
 * Plain RFC 4180 quoting for text cells.
 */

const cell = (v: string | number | boolean) => {
  const s = String(v);
  return /[",\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
};

export function planToCsv(o: {
  setName: string;
  setVersion: number;
  result: Pick<PlanResult, "criterionLabel" | "criterionUnit" | "method" | "candidateCount" | "sigmaPerPointRad">;
  plan: RankedPlan;
}): string {
  const { result, plan } = o;
  const lines = [
    `# Gyrolux measurement plan for "${o.setName.replace(/\n/g, " ")}" (version ${o.setVersion})`,
    `# criterion: ${result.criterionLabel} ${result.criterionUnit}`,
    `# expected standard error: ${Number.isFinite(plan.expectedSigma) ? plan.expectedSigma.toPrecision(4) : "not separable"}`,
    `# search: ${result.method}, ${result.candidateCount} candidate points; sigma per point ${result.sigmaPerPointRad.toPrecision(4)} rad`,
    ["line", "wavelength_nm", "temperature_K", "field_T", "count", "predicted_rotation_rad", "signal_to_noise", "below_noise"].join(","),
  ];
  for (const p of plan.points) {
    lines.push(
      [
        p.lineName,
        p.wavelengthNm,
        p.temperatureK,
        p.fieldT,
        p.count,
        p.rotationRad.toPrecision(6),
        p.signalToNoise.toPrecision(4),
        p.belowNoise,
      ]
        .map(cell)
        .join(","),
    );
  }
  return `${lines.join("\n")}\n`;
}
