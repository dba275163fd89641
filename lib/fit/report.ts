import { NATURAL_LOWER } from "@/lib/analysis/definition";
import { type Assumption, heldAssumptions } from "./assumptions";
import { type FitOptions, type FitResult, fitResultFrom, parseFitRequest } from "./fit";
import {
  type InformationCriteria,
  type ProfileInterval,
  functionProfile,
  informationCriteria,
  nestedTest,
  parameterProfile,
} from "./inference";
import { FitError } from "./least-squares";
import { type MinimizeOptions, type MinimizeResult, minimize } from "./minimize";
import type { ModelCondition } from "./model";
import { type PhysicsProblem, buildPhysicsProblem } from "./problem";
import type { FitRequest, FitRequestInput } from "./schema";
import { COVERAGE_68, COVERAGE_95, formatSignificance, normalHalfWidth, studentTHalfWidth } from "./statistics";

/*
 * The fit report: the fit (lib/fit/fit.ts) and everything a referee asks of it — the held values
 * and their sources, the model comparison (no magnetic-dipole part, first-principles part), the
 * profile-likelihood intervals of magneticScale and of the magnetic share, the Gaussian intervals
 * beside them, the check that the fit is not worse than a model nested in it, and a verdict in
 * words that never calls the parts separated when the separation rests on a held value.
 */

export type Hypothesis = "noMagneticPart" | "firstPrinciples";

export interface ComparisonRow {
  hypothesis: Hypothesis;
  fixed: { magneticScale: 0 | 1 };
  chi2: number;
  deltaChi2: number;
  pValue: number;
  significanceSigma: number;
  aic: number;
  aicc: number | null;
  bic: number;
  /** The result in words, with its condition. */
  words: string;
}

export interface GaussianInterval {
  /** value ± q·σ with q from the normal distribution, or Student-t at dof when σ were scaled by the scatter. */
  interval68: [number, number] | null;
  interval95: [number, number] | null;
  quantile: "normal" | "student-t";
}

export interface ShareProfile extends ProfileInterval {
  wavelengthNm: number;
  temperatureK: number;
  fieldT: number;
  /** "undetermined" when the 68 % interval covers most of [0, 1]. */
  status: "determined" | "undetermined";
}

export interface RestsOnHeldValue {
  key: string;
  value: number;
  source: string;
  /** Δχ² of the no-magnetic-part test with this key freed as well. */
  deltaChi2Freed: number;
}

export interface NestedCheck {
  /** The nested model (a parameter held at its starting value) that ended below the full fit, if any. */
  worseThan: { key: string; value: number; chi2: number }[];
  /** The full fit restarted from the nested model's optimum ended at this χ² (null when no restart was needed). */
  restartedChi2: number | null;
}

export interface FitReport extends FitResult {
  assumptions: Assumption[];
  /** Present when magneticScale is fitted. */
  comparison: ComparisonRow[];
  informationCriteria: InformationCriteria;
  gaussianIntervals: Record<string, GaussianInterval>;
  profile: { magneticScale?: ProfileInterval };
  /** Profiles of the magnetic share at every distinct point condition (and at extra wavelengths asked for); empty when skipped. */
  shareProfiles: ShareProfile[];
  /** Index into shareProfiles per point, or −1. */
  pointShareProfile: number[];
  restsOn: RestsOnHeldValue[];
  nestedCheck: NestedCheck;
  /** Warnings in words (sign, bounds, iteration limit, nested models, missed minima). */
  notes: string[];
  /** The verdict on the split: separable only when no reason speaks against it. */
  verdict: { separable: boolean; reasons: string[] };
}

/** Where a report stands: the fit itself reports its iterations through onProgress; the steps after it report here. */
export interface ReportStage {
  stage: "comparison" | "nested" | "profile" | "share" | "restsOn";
  /** Steps of this stage done and in all (share: conditions profiled). */
  done: number;
  total: number;
}

export interface ReportOptions extends FitOptions {
  /** Called as each stage after the fit starts and as the share profiles progress. */
  onStage?: (stage: ReportStage) => void;
  /** Sources of held values beyond the reference table (key → where the value comes from). */
  sources?: Partial<Record<string, string>>;
  /** Profile the share at every distinct point condition (default true up to MAX_SHARE_PROFILES conditions). */
  shareProfiles?: boolean;
  /** Extra wavelengths at which to profile the share, at the first point's temperature and field. */
  shareWavelengthsNm?: number[];
}

/** Above this many distinct point conditions the per-point share profiles are skipped (each is a few dozen refits). */
export const MAX_SHARE_PROFILES = 40;
/** A share whose 68 % interval is wider than this covers most of [0, 1]: undetermined. */
export const UNDETERMINED_SHARE_WIDTH = 0.5;
/** Held keys whose freeing is tried to see whether the evidence for a magnetic part rests on them. */
const SHAPE_KEYS = ["oscillatorWavelengthNm", "sellmeierWavelengthNm", "curieWeissK"] as const;

const fmt = (v: number, digits = 3) =>
  Math.abs(v) >= 1e4 || (Math.abs(v) < 1e-3 && v !== 0) ? v.toExponential(digits - 1) : v.toPrecision(digits);

function comparisonWords(h: Hypothesis, z: number, condition: string): string {
  if (h === "noMagneticPart") {
    if (z >= 5) return `In this model${condition}, the data need a magnetic-dipole part at ${formatSignificance(z)}.`;
    if (z >= 3) return `In this model${condition}, the data favour a magnetic-dipole part at ${formatSignificance(z)}.`;
    if (z >= 2) return `In this model${condition}, a magnetic-dipole part is hinted at (${formatSignificance(z)}), not established.`;
    return `In this model${condition}, these data cannot tell whether there is a magnetic-dipole part (${formatSignificance(z)}).`;
  }
  if (z >= 5) return `In this model${condition}, the first-principles value magneticScale = 1 is excluded at ${formatSignificance(z)}.`;
  if (z >= 3) return `In this model${condition}, the first-principles value magneticScale = 1 is disfavoured at ${formatSignificance(z)}.`;
  return `In this model${condition}, the data are consistent with the first-principles value magneticScale = 1 (${formatSignificance(z)}).`;
}

function conditionWords(assumptions: Assumption[]): string {
  const lead = assumptions.filter((a) => a.key === "oscillatorWavelengthNm" || a.key === "sellmeierWavelengthNm");
  if (lead.length === 0) return "";
  return ` with ${lead.map((a) => `${a.key} held at ${a.value}`).join(" and ")}`;
}

function gaussianIntervals(result: FitResult): Record<string, GaussianInterval> {
  const student = result.sigmaScale > 1;
  const q68 = student ? studentTHalfWidth(COVERAGE_68, result.dof) : normalHalfWidth(COVERAGE_68);
  const q95 = student ? studentTHalfWidth(COVERAGE_95, result.dof) : normalHalfWidth(COVERAGE_95);
  return Object.fromEntries(
    result.names.map((k) => {
      const v = result.values[k]!;
      const s = result.sigmas[k]!;
      // At a bound the curvature σ is not an error: no interval is built from it.
      const ok = !result.atBound.includes(k) && Number.isFinite(s);
      return [
        k,
        {
          interval68: ok ? ([v - q68 * s, v + q68 * s] as [number, number]) : null,
          interval95: ok ? ([v - q95 * s, v + q95 * s] as [number, number]) : null,
          quantile: student ? "student-t" : "normal",
        },
      ];
    }),
  );
}

/** The comparison and the nested-model fits with magneticScale held, on the same problem. */
function compare(
  problem: PhysicsProblem,
  best: MinimizeResult,
  req: FitRequest,
  msIndex: number,
  condition: string,
  opts: MinimizeOptions,
) {
  const rows: ComparisonRow[] = [];
  const fits: MinimizeResult[] = [];
  for (const [h, value] of [
    ["noMagneticPart", 0],
    ["firstPrinciples", 1],
  ] as const) {
    if (value < problem.lower[msIndex]! || value > problem.upper[msIndex]!) continue;
    const t = nestedTest(problem, best, msIndex, value, problem.dataCount, { ...opts, starts: req.starts, seed: req.seed });
    fits.push(t.fit);
    rows.push({
      hypothesis: h,
      fixed: { magneticScale: value },
      chi2: t.chi2,
      deltaChi2: t.deltaChi2,
      pValue: t.pValue,
      significanceSigma: t.significanceSigma,
      aic: t.criteria.aic,
      aicc: t.criteria.aicc,
      bic: t.criteria.bic,
      words: comparisonWords(h, t.significanceSigma, condition),
    });
  }
  return { rows, fits };
}

/** The fit with its report. Throws FitError, FitCancelledError. */
export function analyseFit(input: FitRequestInput, opts: ReportOptions = {}): FitReport {
  const req = parseFitRequest(input);
  let problem = buildPhysicsProblem(req);
  const base: MinimizeOptions = { maxIterations: opts.maxIterations, shouldCancel: opts.shouldCancel };
  let best = minimize(problem, { ...base, starts: req.starts, seed: req.seed, onProgress: opts.onProgress });
  if (problem.sets.some((s) => s.calibration.temperatureSigmaK > 0)) {
    problem = buildPhysicsProblem(req, problem.paramsAt(best.x));
    best = minimize(problem, { ...base, start: best.x });
  }
  const notes: string[] = [];
  const stage = (name: ReportStage["stage"], done = 0, total = 1) => opts.onStage?.({ stage: name, done, total });

  // Nested models: each varied model key held at its starting value. The full fit must not end above any of them.
  const msIndex = problem.names.indexOf("magneticScale");
  const worseThan: NestedCheck["worseThan"] = [];
  let nestedBest: MinimizeResult | null = null;
  const condition = conditionWords(heldAssumptions(req.params, problem.names, opts.sources));
  stage("comparison");
  const comparison = msIndex >= 0 ? compare(problem, best, req, msIndex, condition, base) : { rows: [], fits: [] };
  const nestedFits: { key: string; value: number; fit: MinimizeResult }[] = comparison.fits.map((fit, i) => ({
    key: "magneticScale",
    value: comparison.rows[i]!.fixed.magneticScale,
    fit,
  }));
  stage("nested");
  problem.keys.forEach((key, j) => {
    if (key === "magneticScale" || problem.x0[j] === best.x[j]) return;
    try {
      nestedFits.push({
        key,
        value: problem.x0[j]!,
        fit: minimize(problem, { ...base, allowSingular: true, fixed: new Map([[j, problem.x0[j]!]]) }),
      });
    } catch (err) {
      if (!(err instanceof FitError)) throw err;
    }
  });
  for (const n of nestedFits) {
    if (n.fit.chi2 < best.chi2 - 1e-8 * Math.max(1, best.chi2)) {
      worseThan.push({ key: n.key, value: n.value, chi2: n.fit.chi2 });
      if (!nestedBest || n.fit.chi2 < nestedBest.chi2) nestedBest = n.fit;
    }
  }
  let restartedChi2: number | null = null;
  if (nestedBest) {
    const first = best.chi2;
    const restarted = minimize(problem, { ...base, start: nestedBest.x });
    if (restarted.chi2 < best.chi2) best = restarted;
    restartedChi2 = best.chi2;
    notes.push(
      `The fit from its starts ended at χ² = ${fmt(first, 4)}, above the nested model with ${worseThan[0]!.key} held at ` +
        `${worseThan[0]!.value} (χ² = ${fmt(worseThan[0]!.chi2, 4)}); restarted from there it reached χ² = ${fmt(best.chi2, 4)}.`,
    );
  }
  const result = fitResultFrom(problem, req, best);
  // The comparison is relative to the final best fit.
  const rows = nestedBest && msIndex >= 0 ? compare(problem, best, req, msIndex, condition, base).rows : comparison.rows;

  const assumptions = heldAssumptions(req.params, problem.names, opts.sources);
  const criteria = informationCriteria(best.chi2, best.varied.length, problem.dataCount);

  // Profiles.
  const profile: FitReport["profile"] = {};
  if (msIndex >= 0) {
    stage("profile");
    profile.magneticScale = parameterProfile(problem, best, msIndex, base);
    const lm = profile.magneticScale.lowerMinimum;
    if (lm)
      notes.push(
        `The profile of magneticScale found χ² = ${fmt(lm.chi2, 4)} at ${fmt(lm.value)}, below the fit: the fit missed its minimum.`,
      );
  }
  const shareProfiles: ShareProfile[] = [];
  const pointShareProfile = result.points.map(() => -1);
  const conditionKey = (c: { wavelengthNm: number; temperatureK: number; fieldT: number }) =>
    `${c.wavelengthNm}|${c.temperatureK}|${c.fieldT}`;
  const distinct = new Map<string, ModelCondition>();
  problem.conditions.forEach((c) => {
    if (!distinct.has(conditionKey(c))) distinct.set(conditionKey(c), c);
  });
  const wantPoints = (opts.shareProfiles ?? true) && distinct.size <= MAX_SHARE_PROFILES;
  if ((opts.shareProfiles ?? true) && !wantPoints) {
    notes.push(`Share intervals are profiled at up to ${MAX_SHARE_PROFILES} distinct conditions; these data have ${distinct.size}.`);
  }
  const extra = (opts.shareWavelengthsNm ?? []).map((w) => ({ ...problem.conditions[0]!, wavelengthNm: w }));
  const targets = [...(wantPoints ? distinct.values() : []), ...extra];
  const shareSigma = (c: ModelCondition) => {
    const i = problem.conditions.findIndex((d) => conditionKey(d) === conditionKey(c));
    return i >= 0 ? (result.points[i]!.magneticShareSigma ?? Number.NaN) : Number.NaN;
  };
  if (problem.keys.includes("magneticScale") || problem.keys.includes("gyrationPerT")) {
    for (const [k, c] of targets.entries()) {
      stage("share", k, targets.length);
      const atBest = problem.shareAt(best.x, c, null).value;
      if (!Number.isFinite(atBest)) continue;
      const p = functionProfile(problem, best, (x, columns) => problem.shareAt(x, c, columns), shareSigma(c), 0, 1, base);
      const width = p.interval68[1] - p.interval68[0];
      shareProfiles.push({
        ...p,
        wavelengthNm: c.wavelengthNm,
        temperatureK: c.temperatureK,
        fieldT: c.fieldT,
        status: width > UNDETERMINED_SHARE_WIDTH ? "undetermined" : "determined",
      });
    }
    problem.conditions.forEach((c, i) => {
      pointShareProfile[i] = shareProfiles.findIndex((s) => conditionKey(s) === conditionKey(c));
    });
  }

  // Does the evidence for a magnetic part rest on a held value? Free each held shape key as well and test again.
  const restsOn: RestsOnHeldValue[] = [];
  const noPart = rows.find((r) => r.hypothesis === "noMagneticPart");
  if (noPart && noPart.significanceSigma >= 2) {
    stage("restsOn");
    for (const key of SHAPE_KEYS) {
      if (problem.names.includes(key)) continue;
      const freed = { ...req, free: [...req.free, NATURAL_LOWER[key] === undefined ? { key } : { key, min: NATURAL_LOWER[key] }] };
      try {
        const fp = buildPhysicsProblem(freed);
        const fb = minimize(fp, { ...base, allowSingular: true, starts: req.starts, seed: req.seed });
        const t = nestedTest(fp, fb, fp.names.indexOf("magneticScale"), 0, fp.dataCount, { ...base, starts: req.starts, seed: req.seed });
        if (t.significanceSigma < 2) {
          const a = assumptions.find((x) => x.key === key);
          restsOn.push({ key, value: req.params[key], source: a?.source ?? "", deltaChi2Freed: t.deltaChi2 });
        }
      } catch (err) {
        if (!(err instanceof FitError)) throw err;
      }
    }
  }

  // Notes.
  if (result.signCheck.allOpposite && !result.signCheck.tookModelSign) {
    notes.push(
      "Every measured value has the sign opposite to the model's prediction for this material. If these are magnitudes " +
        "(vendor sheets often quote |V|), fit them as magnitudes with the model's sign.",
    );
  }
  for (const k of result.atBound) notes.push(`${k} ended on a bound (${fmt(result.values[k]!)}); its σ there is not an error.`);
  if (!result.converged) notes.push("The fit stopped at its iteration limit before converging.");
  if (worseThan.length > 0 && restartedChi2 === null) notes.push("The fit ended above a nested model.");

  // Verdict.
  const reasons = [...result.separation.reasons];
  // A split is called separated only on evidence (3σ or more, common practice, no source).
  if (noPart && noPart.significanceSigma < 3) reasons.push(noPart.words);
  for (const r of restsOn) {
    reasons.push(
      `The magnetic-dipole part is needed only because ${r.key} is held at ${r.value} (${r.source}): with it free, ` +
        `Δχ² = ${fmt(r.deltaChi2Freed, 2)}. Give ${r.key} a prior or data that determine it.`,
    );
  }
  const undetermined = shareProfiles.filter((s) => s.status === "undetermined");
  if (undetermined.length > 0) {
    const [first] = undetermined;
    const range = `${(100 * first!.interval68[0]).toFixed(0)}–${(100 * first!.interval68[1]).toFixed(0)} %`;
    reasons.push(
      `The magnetic share is undetermined at ${undetermined.length} condition(s): its 68 % interval covers most of [0, 1] ` +
        `(e.g. ${range} at ${first!.wavelengthNm} nm).`,
    );
  }
  const unique = [...new Set(reasons)];

  return {
    ...result,
    assumptions,
    comparison: rows,
    informationCriteria: criteria,
    gaussianIntervals: gaussianIntervals(result),
    profile,
    shareProfiles,
    pointShareProfile,
    restsOn,
    nestedCheck: { worseThan, restartedChi2 },
    notes,
    verdict: { separable: unique.length === 0, reasons: unique },
  };
}
