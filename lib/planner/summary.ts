import { analysisDefinitionSchema } from "@/lib/analysis/definition";

/*
 * The words that describe a saved plan beside its points: the analysis it was made for (read back
 * from the stored request), the noise model, the detection and the cost. One home for the saved-plan
 * list, the printable report and the planner's own results.
 */

const fmt = (x: number, digits = 3) => (Number.isFinite(x) ? Number(x.toPrecision(digits)).toString() : "∞");

interface SummaryPlan {
  detection?: {
    alternative: number;
    deltaChi2Null: number;
    significance: number;
    repeatsFor3Sigma: number | null;
    repeatsFor5Sigma: number | null;
  } | null;
  costHours?: number;
  noise?: { absoluteRad: number; relativeFloor: number; minTransmission: number };
}

/** The analysis of a stored request, in words; null when the request predates the analysis definition. */
export function definitionText(request: unknown): string | null {
  const raw = (request as { definition?: unknown } | null)?.definition;
  const parsed = analysisDefinitionSchema.safeParse(raw);
  if (raw === undefined || !parsed.success) return null;
  const d = parsed.data;
  const parts = [`free ${d.free.map((f) => f.key).join(", ")}`];
  if (d.priors.length > 0) parts.push(`priors ${d.priors.map((p) => `${p.key} = ${fmt(p.mean)} ± ${fmt(p.sigma)}`).join(", ")}`);
  const c = d.calibration;
  if (c.scaleSigma > 0) parts.push(`field × length calibration ± ${fmt(100 * c.scaleSigma, 2)} %`);
  if (c.temperatureSigmaK > 0) parts.push(`temperature calibration ± ${fmt(c.temperatureSigmaK)} K`);
  if (c.relativeFloor > 0) parts.push(`fit's relative floor ${fmt(100 * c.relativeFloor, 2)} %`);
  return `Analysis: ${parts.join("; ")}.`;
}

export function noiseText(noise: NonNullable<SummaryPlan["noise"]>): string {
  return (
    `Noise: ${fmt(noise.absoluteRad * 1e6)} µrad per point at full transmission, growing as 1/√transmission, ` +
    `⊕ ${fmt(100 * noise.relativeFloor, 2)} % of θ; points below ${fmt(100 * noise.minTransmission, 2)} % transmission never proposed.`
  );
}

export function detectionText(d: NonNullable<SummaryPlan["detection"]>): string {
  const repeats = (r: number | null) => (r === null ? "not reachable" : `${r}×`);
  return (
    `Detection in this model: ${fmt(d.significance)}σ against magneticScale = 0 for magneticScale = ${fmt(d.alternative)} ` +
    `(expected Δχ² ${fmt(d.deltaChi2Null)}); repeats for 3σ ${repeats(d.repeatsFor3Sigma)}, for 5σ ${repeats(d.repeatsFor5Sigma)}.`
  );
}

export const costText = (hours: number) => `Cost: about ${fmt(hours, 2)} h of lab time.`;

/** Every line that applies to a saved plan. */
export function savedPlanSummary(plan: SummaryPlan, request: unknown): string[] {
  return [
    definitionText(request),
    plan.noise ? noiseText(plan.noise) : null,
    plan.detection ? detectionText(plan.detection) : null,
    plan.costHours !== undefined ? costText(plan.costHours) : null,
  ].filter((l): l is string => l !== null);
}
