import { Matrix, inverse } from "ml-matrix";
import { type AnalysisDefinition, type NoiseModel, designedPointSigma, effectiveVariance } from "@/lib/analysis/definition";
import { type ModelCondition, type NumericParamKey, modelJacobian } from "@/lib/fit/model";
import type { ModelParams } from "@/lib/physics/schema";
import { asimovDeltaChi2 } from "./asimov";
import { type CriterionSpec, criterionOf } from "./information";
import type { AnalysisLayout } from "./layout";
import { candidateOptics, temperatureDerivative } from "./optics";
import type { PlanCriterion } from "./schema";

/*
 * The Fisher information of the planner's candidate points for the analysis the fit will run
 * (lib/analysis/definition.ts). Each candidate is one measured rotation θ with the laboratory's
 * σ: polarimeter noise at full transmission grown as 1/√(transmission) (shot noise), the relative
 * floor and the temperature calibration propagated through the model (the effective variance). Its
 * information is rᵢrᵢᵀ/σᵢ², rᵢ = the row of the shared forward model's Jacobian (lib/fit/model.ts,
 * one-sided at a lower bound, as the fit takes it) in scaled parameters, plus θᵢ for the
 * field × length scale nuisance (θ ∝ B·L in this model, physics-model.md §6). The priors (and the
 * scale nuisance's prior 1 ± scaleSigma) add a constant information that every design starts from.
 * The expected σ is the Cramér–Rao bound of that least-squares fit (linearized; common practice, no
 * source).
 */

/** Candidates per Jacobian call: points sharing T and B are one spectrum call, so slices follow the candidate order. */
const JACOBIAN_SLICE = 512;

export { type AnalysisLayout, SCALE_NUISANCE, analysisLayout } from "./layout";

/** What the noise of one designed point depends on beyond the parameters. */
export interface NoiseInputs {
  noise: NoiseModel;
  /** Per point: the share of the reference light that reaches the detector before the sample (power / reference power; 1 without one). */
  powerFactor: ArrayLike<number>;
}

/** One parameter sample's view of a list of points. */
export interface PointInformation {
  thetaRad: Float64Array;
  transmission: Float64Array;
  /** σ of one measurement under the laboratory's noise and the analysis's calibration, rad. */
  sigmaRad: Float64Array;
  magneticShare: Float64Array;
  /** Row-major p×p information of each point in scaled parameters, point after point. */
  info: Float64Array;
}

/**
 * The information of every point at one parameter sample, the Jacobian in slices (`afterSlice` gets
 * the number of points done and may throw, for progress and Cancel).
 */
export function pointInformation(
  params: ModelParams,
  layout: AnalysisLayout,
  conditions: readonly ModelCondition[],
  noise: NoiseInputs,
  afterSlice: (pointsDone: number) => void = () => undefined,
): PointInformation {
  const C = conditions.length;
  const { p, keys, scale } = layout;
  const pp = p * p;
  const { calibration } = layout.definition;
  const optics = candidateOptics(params, conditions);
  const dThetaDT = calibration.temperatureSigmaK > 0 ? temperatureDerivative(params, conditions) : null;
  const info = new Float64Array(C * pp);
  const sigmaRad = new Float64Array(C);
  const magneticShare = new Float64Array(C);
  const row = new Float64Array(p);
  for (let start = 0; start < C; start += JACOBIAN_SLICE) {
    const part = modelJacobian(params, keys, conditions.slice(start, start + JACOBIAN_SLICE), layout.jacobian);
    for (let i = 0; i < part.valueJacobian.rows; i++) {
      const c = start + i;
      const theta = optics.thetaRad[c]!;
      const shot = designedPointSigma(noise.noise, theta, optics.transmission[c]! * noise.powerFactor[c]!);
      const variance = effectiveVariance(shot, theta, calibration, dThetaDT?.[c] ?? 0);
      sigmaRad[c] = Math.sqrt(variance);
      magneticShare[c] = part.magneticShare[i]!;
      for (let j = 0; j < keys.length; j++) row[j] = part.valueJacobian.get(i, j) * scale[j]!;
      if (layout.withScale) row[p - 1] = theta;
      for (let a = 0; a < p; a++) for (let b = 0; b < p; b++) info[c * pp + a * p + b] = (row[a]! * row[b]!) / variance;
    }
    afterSlice(Math.min(C, start + JACOBIAN_SLICE));
  }
  return { thetaRad: optics.thetaRad, transmission: optics.transmission, sigmaRad, magneticShare, info };
}

/**
 * The information every design starts from: each prior's 1/σ² (in scaled parameters) and the
 * scale nuisance's 1/scaleSigma². `withoutMagneticPrior` leaves out a prior on magneticScale:
 * whether the data detect the magnetic-dipole part must not rest on a prior about it.
 */
export function priorInformation(layout: AnalysisLayout, withoutMagneticPrior = false): Float64Array {
  const { p, scale, keys } = layout;
  const out = new Float64Array(p * p);
  for (const prior of layout.definition.priors) {
    if (withoutMagneticPrior && prior.key === "magneticScale") continue;
    const j = keys.indexOf(prior.key as NumericParamKey);
    if (j >= 0) out[j * p + j] = out[j * p + j]! + (scale[j]! / prior.sigma) ** 2;
  }
  if (layout.withScale) out[p * p - 1] = out[p * p - 1]! + 1 / layout.definition.calibration.scaleSigma ** 2;
  return out;
}

/** The alternative magneticScale of the detection: the criterion's, else the prior mean, else the set's value, else 1. */
export function detectionAlternative(criterion: PlanCriterion, definition: AnalysisDefinition, params: ModelParams): number {
  if (criterion.kind === "detect" && criterion.alternative !== undefined) return criterion.alternative;
  const prior = definition.priors.find((p) => p.key === "magneticScale");
  if (prior && prior.mean > 0) return prior.mean;
  return params.magneticScale > 0 ? params.magneticScale : 1;
}

/** The criterion as a linear functional h of the scaled parameters (or D-optimal), at one parameter sample. */
export function criterionSpec(
  criterion: PlanCriterion,
  layout: AnalysisLayout,
  params: ModelParams,
  lengthM: number,
  alternative: number,
): CriterionSpec {
  if (criterion.kind === "dOptimal") return { kind: "dOptimal" };
  const h = new Float64Array(layout.p);
  const m = layout.keys.indexOf("magneticScale");
  if (criterion.kind === "magneticScale") {
    h[m] = layout.scale[m]!;
    return { kind: "linear", h };
  }
  if (criterion.kind === "detect") {
    // Expected Δχ² between magneticScale = 0 and the alternative is alternative²/σ²(magneticScale)
    // (linearized, nuisances profiled; common practice, no source), so the criterion σ/alternative
    // is 1/√Δχ², the reciprocal of the expected significance.
    h[m] = layout.scale[m]! / alternative;
    return { kind: "linear", h };
  }
  // Share at the chosen wavelength, at the set's temperature and field: its gradient from the same
  // Jacobian module (the scale nuisance multiplies both parts and leaves the share alone).
  const at = modelJacobian(
    params,
    layout.keys,
    [
      {
        wavelengthNm: criterion.wavelengthNm,
        temperatureK: params.temperatureK,
        fieldT: params.fieldT || 1,
        lengthM,
        quantity: "rotation",
      },
    ],
    layout.jacobian,
  );
  layout.keys.forEach((_, i) => {
    h[i] = at.shareJacobian.get(0, i) * layout.scale[i]!;
  });
  return { kind: "linear", h };
}

/** Detection figures of a plan: expected Δχ², the significance and the repeats of the whole plan for 3σ and 5σ. */
export interface DetectionFigures {
  /** The magneticScale the detection is designed for. */
  alternative: number;
  /** σ(magneticScale) of the plan without a prior on magneticScale. */
  sigmaMagneticScale: number;
  /** Expected Δχ² between magneticScale = 0 and the alternative: the fit of the null to the alternative's noise-free data. */
  deltaChi2Null: number;
  /** Its linearized value, alternative²/σ²(magneticScale) (the search's criterion). */
  deltaChi2Linear: number;
  /** Expected Δχ² between magneticScale = 1 and the alternative (0 when the alternative is 1). */
  deltaChi2One: number;
  /** √Δχ² against magneticScale = 0, in σ. */
  significance: number;
  /** How many times the whole plan must be repeated for 3σ / 5σ; null when the nuisances' priors never let it get there. */
  repeatsFor3Sigma: number | null;
  repeatsFor5Sigma: number | null;
}

/** The σ figures of one plan. */
export interface PlanFigures {
  /** The criterion's expected standard error; Infinity when the points cannot separate the varied parameters. */
  expectedSigma: number;
  separable: boolean;
  partsCorrelation: number | null;
  /** Expected standard error of each varied parameter (and the scale nuisance), in its own unit. */
  parameterSigma: Record<string, number>;
  detection: DetectionFigures | null;
}

/** Σ count·info over the chosen points, plus a base. */
function summed(info: Float64Array, pp: number, points: readonly { at: number; count: number }[], base: Float64Array, times = 1) {
  const f = new Float64Array(pp);
  for (let k = 0; k < pp; k++) {
    let sum = 0;
    for (const pt of points) sum += pt.count * info[pt.at * pp + k]!;
    f[k] = times * sum + base[k]!;
  }
  return f;
}

const toMatrix = (f: Float64Array, p: number) =>
  new Matrix(Array.from({ length: p }, (_, i) => Array.from(f.subarray(i * p, (i + 1) * p))));

/**
 * The reported figures of a plan from ml-matrix: F = base + Σ count·info, Cov = F⁻¹ in scaled
 * parameters. `at` indexes the rows of `information.info`.
 */
/** A plan as the figures see it: its points' information, counts and the detection's alternative. */
interface PlanInputs {
  layout: AnalysisLayout;
  info: Float64Array;
  points: readonly { at: number; count: number }[];
  alternative: number;
  /** For the expected Δχ² without linearizing: the set's values and each `at`'s condition and σ. */
  asimov?: { params: ModelParams; conditions: readonly ModelCondition[]; sigma: ArrayLike<number> };
}

export function planFigures(o: PlanInputs & { spec: CriterionSpec }): PlanFigures {
  const { layout } = o;
  const { p, scale, names } = layout;
  const pp = p * p;
  const work = new Float64Array(2 * pp + 2 * p);
  const base = priorInformation(layout);
  const fisher = summed(o.info, pp, o.points, base);
  const criterion = criterionOf(fisher, p, o.spec, work);
  if (!Number.isFinite(criterion)) {
    return { expectedSigma: Infinity, separable: false, partsCorrelation: null, parameterSigma: {}, detection: null };
  }
  const cov = inverse(toMatrix(fisher, p));
  const parameterSigma: Record<string, number> = {};
  names.forEach((k, i) => {
    parameterSigma[k] = Math.sqrt(cov.get(i, i)) * scale[i]!;
  });
  const ie = names.indexOf("gyrationPerT");
  const im = names.indexOf("magneticScale");
  const partsCorrelation = ie >= 0 && im >= 0 ? cov.get(ie, im) / Math.sqrt(cov.get(ie, ie) * cov.get(im, im)) : null;
  return {
    expectedSigma: criterion,
    separable: true,
    partsCorrelation,
    parameterSigma,
    detection: im >= 0 ? detectionFigures({ ...o, magneticIndex: im }) : null,
  };
}

const MAX_REPEATS = 1_000_000;

function detectionFigures(o: PlanInputs & { magneticIndex: number }): DetectionFigures | null {
  const { layout, alternative, magneticIndex: im } = o;
  const { p } = layout;
  const pp = p * p;
  const base = priorInformation(layout, true);
  const h = new Float64Array(p);
  h[im] = layout.scale[im]!;
  const work = new Float64Array(2 * pp + 2 * p);
  const sigmaAt = (times: number) => criterionOf(summed(o.info, pp, o.points, base, times), p, { kind: "linear", h }, work);
  const sigma = sigmaAt(1);
  if (!Number.isFinite(sigma)) return null;
  const linear = (alternative / sigma) ** 2;
  const exact = (tested: number) => {
    if (!o.asimov) return ((alternative - tested) / sigma) ** 2;
    const expanded = o.points.flatMap((pt) => Array.from({ length: pt.count }, () => pt.at));
    return asimovDeltaChi2({
      layout,
      truth: { ...o.asimov.params, magneticScale: alternative } as ModelParams,
      tested,
      conditions: expanded.map((at) => o.asimov!.conditions[at]!),
      sigma: expanded.map((at) => o.asimov!.sigma[at]!),
    });
  };
  const deltaChi2Null = exact(0);
  // Repeats: the linearized Δχ² of k repeats (priors do not repeat), corrected by the plan's own
  // ratio of the exact to the linearized figure.
  const correction = linear > 0 ? deltaChi2Null / linear : 1;
  const deltaChi2 = (times: number) => correction * (alternative / sigmaAt(times)) ** 2;
  const repeatsFor = (target: number): number | null => {
    if (deltaChi2(1) >= target) return 1;
    let hi = 2;
    while (hi <= MAX_REPEATS && deltaChi2(hi) < target) hi *= 2;
    if (hi > MAX_REPEATS) return null;
    let lo = hi / 2;
    while (hi - lo > 1) {
      const mid = Math.floor((lo + hi) / 2);
      if (deltaChi2(mid) >= target) hi = mid;
      else lo = mid;
    }
    return hi;
  };
  return {
    alternative,
    sigmaMagneticScale: sigma,
    deltaChi2Null,
    deltaChi2Linear: linear,
    deltaChi2One: alternative === 1 ? 0 : exact(1),
    significance: Math.sqrt(deltaChi2Null),
    repeatsFor3Sigma: repeatsFor(9),
    repeatsFor5Sigma: repeatsFor(25),
  };
}
