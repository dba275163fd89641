import { type NumericParamKey, evaluateModel } from "@/lib/fit/model";
import { computeSpectrumArrays } from "@/lib/physics/spectrum";
import { type CandidateInformation, type PlanSigmas, candidateConditions, candidateInformation, criterionSpec, planSigmas } from "./fisher";
import type { CriterionSpec } from "./information";
import { criterionText, planNotes } from "./notes";
import type { LineRatio, PlanCandidate, PlanPoint, PlanResult, RankedPlan } from "./plan-result";
import { type Design, searchDesigns } from "./search";
import { type PlanRequest, rangeValues, sigmaPerPointRad } from "./schema";

/*
 * The measurement planner: which line × temperature × field points, and how often each, pin down
 * the chosen quantity best. Each candidate point is a measured rotation (rad) with the noise σ of
 * the request; the design's Fisher information is JᵀWJ, W = diag(count/σ²), with J the Jacobian
 * of the shared forward model (lib/fit/model.ts) at the parameter set's values, the same Jacobian
 * the fit uses (fisher.ts). The expected standard error is then the Cramér–Rao bound of a
 * least-squares fit (linearized; valid when the errors are small against the parameters; common
 * practice, no source). The search over designs is search.ts, the words of the result notes.ts.
 */

export type { LineRatio, PlanCandidate, PlanPoint, PlanResult, RankedPlan } from "./plan-result";
export { EXHAUSTIVE_LIMIT, multisetCount } from "./search";
export { criterionText, planNotes } from "./notes";

export class PlanCancelledError extends Error {
  constructor() {
    super("The plan search was cancelled.");
    this.name = "PlanCancelledError";
  }
}

export interface PlanOptions {
  onProgress?: (fractionDone: number) => void;
  shouldCancel?: () => boolean;
  /** Override of EXHAUSTIVE_LIMIT (tests compare both searches on one problem). */
  exhaustiveLimit?: number;
}

export function buildCandidates(request: PlanRequest): PlanCandidate[] {
  const temps = rangeValues(request.temperatures.minK, request.temperatures.maxK, request.temperatures.stepK);
  const fields = rangeValues(request.fields.minT, request.fields.maxT, request.fields.stepT).filter((b) => b !== 0);
  const out: PlanCandidate[] = [];
  // Temperature and field outermost: the lines at one (T, B) are one spectrum call of the model.
  for (const temperatureK of temps)
    for (const fieldT of fields)
      for (const line of request.lines)
        out.push({ index: out.length, lineName: line.name, wavelengthNm: line.wavelengthNm, temperatureK, fieldT });
  return out;
}

/** Share of the progress bar taken by the Jacobian (most of the time when candidates are many). */
const JACOBIAN_SHARE = 0.4;

/** The pure planner. Throws PlanCancelledError when shouldCancel() turns true. */
export function planMeasurements(request: PlanRequest, opts: PlanOptions = {}): PlanResult {
  const { params, criterion } = request;
  const keys = request.freeKeys as NumericParamKey[];
  const sigma = sigmaPerPointRad(request.noise);
  const candidates = buildCandidates(request);
  const C = candidates.length;
  const { label, unit } = criterionText(criterion);
  const conditions = candidateConditions(request, candidates);
  const checkCancel = () => {
    if (opts.shouldCancel?.()) throw new PlanCancelledError();
  };
  const information = candidateInformation(params, keys, conditions, sigma, (done) => {
    checkCancel();
    opts.onProgress?.((JACOBIAN_SHARE * done) / C);
  });
  const spec = criterionSpec(request, keys, information.scale);
  const progress = (f: number) => opts.onProgress?.(Math.min(1, Math.max(0, JACOBIAN_SHARE + (1 - JACOBIAN_SHARE) * f)));
  const search = searchDesigns(
    {
      info: information.info,
      candidateCount: C,
      p: keys.length,
      points: request.points,
      topPlans: request.topPlans,
      spec,
      checkCancel,
      progress,
    },
    opts.exhaustiveLimit,
  );
  progress(1);

  const evaluation = evaluateModel(params, conditions);
  const plans = search.top.items.map((d, i) =>
    describePlan({ keys, information, candidates, evaluation, sigma, design: d, rank: i + 1, spec }),
  );
  const lineRatios = computeLineRatios(request);
  return {
    criterion,
    criterionLabel: label,
    criterionUnit: unit,
    freeKeys: keys,
    candidateCount: C,
    method: search.method,
    designsEvaluated: search.evaluated,
    sigmaPerPointRad: sigma,
    plans,
    sigmaVsPoints: search.sigmaVsPoints,
    lineRatios,
    notes: planNotes({ request, candidates, plans, lineRatios }),
  };
}

/** A design as the results show it: its distinct points with counts, predictions and σ figures. */
function describePlan(o: {
  keys: NumericParamKey[];
  information: CandidateInformation;
  candidates: PlanCandidate[];
  evaluation: { value: Float64Array; magneticShare: Float64Array };
  sigma: number;
  design: Design;
  rank: number;
  spec: CriterionSpec;
}): RankedPlan {
  const counts = new Map<number, number>();
  for (const c of o.design.indices) counts.set(c, (counts.get(c) ?? 0) + 1);
  const points: PlanPoint[] = [...counts.entries()].map(([c, count]) => {
    const rotationRad = o.evaluation.value[c]!;
    const snr = Math.abs(rotationRad) / o.sigma;
    return {
      ...o.candidates[c]!,
      count,
      rotationRad,
      magneticShare: o.evaluation.magneticShare[c]!,
      signalToNoise: snr,
      belowNoise: snr < 1,
    };
  });
  const separable = Number.isFinite(o.design.value);
  // The figures before the sort below: the rows of the information follow the design's order.
  const sigmas: PlanSigmas = separable
    ? planSigmas({ keys: o.keys, information: o.information, sigmaRad: o.sigma, points, spec: o.spec })
    : { expectedSigma: Infinity, partsCorrelation: null, parameterSigma: {} };
  points.sort((a, b) => a.wavelengthNm - b.wavelengthNm || a.temperatureK - b.temperatureK || a.fieldT - b.fieldT);
  const { expectedSigma, partsCorrelation, parameterSigma } = sigmas;
  return { rank: o.rank, points, expectedSigma, separable, partsCorrelation, parameterSigma };
}

function computeLineRatios(request: PlanRequest): LineRatio[] {
  const { params } = request;
  const distinct = [...new Set(request.lines.map((l) => l.wavelengthNm))].sort((a, b) => a - b);
  const arrays = computeSpectrumArrays({
    ...params,
    fieldT: params.fieldT || 1,
    lengthM: request.lengthM,
    wavelengthsNm: distinct,
    method: "analytic",
  });
  return request.lines.map((line) => {
    const j = distinct.indexOf(line.wavelengthNm);
    const electricRad = arrays.thetaElectricRad[j]!;
    const magneticRad = arrays.thetaMagneticRad[j]!;
    return {
      lineName: line.name,
      wavelengthNm: line.wavelengthNm,
      electricRad,
      magneticRad,
      magneticOverElectric: electricRad === 0 ? null : magneticRad / electricRad,
    };
  });
}
