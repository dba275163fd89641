import { Matrix } from "ml-matrix";
import { zodIssueLines } from "@/lib/contracts/validation";
import type { MeasuredQuantity } from "@/lib/measurements/point";
import type { ModelParams } from "@/lib/physics/schema";
import { type FreeParam, type FreeableKey, type Prior, priorPenalty } from "@/lib/analysis/definition";
import { FitCancelledError, FitError } from "./least-squares";
import { type MinimizeResult, minimize } from "./minimize";
import { modelJacobian } from "./model";
import { type PhysicsProblem, buildPhysicsProblem } from "./problem";
import { type FitRequest, type FitRequestInput, fitRequestSchema } from "./schema";
import { chiSquareSurvival } from "./statistics";

/*
 * The fit of the model (physics-model.md, analytic path) to measured points of one or several
 * measurement sets: weighted least squares with the points' effective σ, Gaussian priors and
 * calibration scale factors as nuisance parameters (lib/fit/problem.ts), a few seeded starts (the
 * lowest χ² wins), the standard errors from the covariance (JᵀWJ)⁻¹ at the optimum, and the
 * magnetic share at every point with its covariance propagated through the model's Jacobian
 * (C_share = G C Gᵀ, G = ∂share/∂p: first-order error propagation, common practice, no source).
 * One module serves the worker, the API and the command line.
 */

export { FitCancelledError, FitError };

/** |correlation| of the two amplitudes above which the data cannot tell the parts apart. */
export const SEPARATION_CORRELATION_LIMIT = 0.95;

export interface FitPoint {
  /** The measurement set's name. */
  set: string;
  line: number;
  wavelengthNm: number;
  temperatureK: number;
  fieldT: number;
  lengthM: number;
  quantity: MeasuredQuantity;
  measured: number;
  sigma: number;
  /** σ with the set's relative floor and temperature σ in quadrature: the σ the fit weighed the point by. */
  effectiveSigma: number;
  /** The value fitted (measured, or its magnitude with the model's sign). */
  fitted: number;
  model: number;
  /** (fitted − model) / effective σ. */
  normalizedResidual: number;
  /** |θm| / (|θe| + |θm|) at the fitted values; null where both parts are 0. */
  magneticShare: number | null;
  /** Its standard error, from the reported covariance; null with the share. */
  magneticShareSigma: number | null;
}

export interface SeparationVerdict {
  /** True when the data determine the split: both amplitudes free, weakly correlated, shares resolved. */
  separable: boolean;
  /** Plain-words reasons when not (empty when separable). */
  reasons: string[];
  /** |corr(gyrationPerT, magneticScale)| when both are free. */
  amplitudeCorrelation: number | null;
}

export interface FitSetSummary {
  name: string;
  pointCount: number;
  /** χ² of this set's points alone. */
  chi2: number;
  /** The calibration it was fitted with. */
  scaleSigma: number;
  relativeFloor: number;
  temperatureSigmaK: number;
}

export interface GoodnessOfFit {
  chi2: number;
  dof: number;
  /** P(χ²_dof > χ²): the probability of a χ² at least this large if the model and the σ are right. */
  pValue: number;
}

export interface SignCheck {
  /** Points whose measured value has the sign opposite to the model's prediction at the starting values. */
  opposite: number;
  total: number;
  /**
   * Every point that can be compared (non-zero value and prediction) has the opposite sign:
   * likely magnitudes (vendor sheets quote |V|).
   */
  allOpposite: boolean;
  /** The values were fitted as magnitudes with the model's sign. */
  tookModelSign: boolean;
}

export interface FitResult {
  /** The free model keys (as asked). */
  free: FreeableKey[];
  bounds: FreeParam[];
  priors: Prior[];
  /** Every fitted parameter: the free keys, keys that carry only a prior, then calibration scale factors. */
  names: string[];
  values: Record<string, number>;
  /** The reported standard errors: scaled by max(1, √(χ²/dof)) when sigmaScaledByChi2, else as given by the data's σ. */
  sigmas: Record<string, number>;
  sigmasUnscaled: Record<string, number>;
  sigmasScaled: Record<string, number>;
  sigmaScaledByChi2: boolean;
  /** The factor the reported σ carry (1 unless scaled). */
  sigmaScale: number;
  /** The reported covariance (scaled like sigmas), rows and columns in the order of names. */
  covariance: number[][];
  correlation: number[][];
  /** χ² of the points plus the prior penalties: the quantity minimised. */
  chi2: number;
  chi2Data: number;
  priorPenalty: number;
  /** Points plus prior rows minus fitted parameters. */
  dof: number;
  reducedChi2: number;
  goodnessOfFit: GoodnessOfFit;
  points: FitPoint[];
  /** Covariance of the per-point magnetic shares (rows and columns in the order of points); null above SHARE_COVARIANCE_MAX_POINTS. */
  shareCovariance: number[][] | null;
  sets: FitSetSummary[];
  separation: SeparationVerdict;
  /** Parameters that ended on one of their bounds (their σ is then not a fair error). */
  atBound: string[];
  iterations: number;
  converged: boolean;
  /** χ² reached from each start (NaN where a start could not be evaluated), in order; the lowest won. */
  startChi2: number[];
  signCheck: SignCheck;
  /** The full parameter set at the fitted values. */
  params: ModelParams;
}

/** The share covariance is returned up to this many points (it grows as n²). */
export const SHARE_COVARIANCE_MAX_POINTS = 2000;
/** Below this many degrees of freedom χ²/dof is too uncertain to scale σ by (its relative σ is √(2/dof), common practice, no source). */
export const MIN_DOF_FOR_SCALING = 3;

export interface FitProgress {
  iteration: number;
  maxIterations: number;
  chi2: number;
}

export interface FitOptions {
  onProgress?: (progress: FitProgress) => void;
  shouldCancel?: () => boolean;
  maxIterations?: number;
}

function toRecord(keys: readonly string[], values: ArrayLike<number>): Record<string, number> {
  return Object.fromEntries(keys.map((k, i) => [k, values[i]!]));
}

const orNull = (v: number) => (Number.isFinite(v) ? v : null);
const percent = (v: number) => `${(100 * v).toPrecision(2)} %`;

function separationVerdict(free: readonly string[], correlation: number[][], points: FitPoint[]): SeparationVerdict {
  const reasons: string[] = [];
  const ig = free.indexOf("gyrationPerT");
  const im = free.indexOf("magneticScale");
  let amplitudeCorrelation: number | null = null;
  if (ig < 0 || im < 0) {
    reasons.push(
      "The split is not measured: gyrationPerT and magneticScale must both be free for the data to weigh the electric-dipole part " +
        "against the magnetic-dipole part; the shares shown follow from the values held fixed.",
    );
  } else {
    amplitudeCorrelation = correlation[ig]![im]!;
    if (Math.abs(amplitudeCorrelation) > SEPARATION_CORRELATION_LIMIT) {
      reasons.push(
        "The data cannot tell the two parts apart: the electric gyration and magneticScale are correlated at " +
          `${amplitudeCorrelation.toFixed(3)} (beyond ±${SEPARATION_CORRELATION_LIMIT}), ` +
          "so more of one part and less of the other fits almost as well.",
      );
    }
  }
  const unresolved = points.filter(
    (p) => p.magneticShare !== null && p.magneticShareSigma !== null && p.magneticShareSigma > p.magneticShare,
  );
  if (unresolved.length > 0) {
    const first = unresolved[0]!;
    reasons.push(
      `At ${unresolved.length} of ${points.length} points the standard error of the magnetic share exceeds the share itself ` +
        `(e.g. ${percent(first.magneticShare!)} ± ${percent(first.magneticShareSigma!)} at ${first.wavelengthNm} nm).`,
    );
  }
  return { separable: reasons.length === 0, reasons, amplitudeCorrelation };
}

/** Parses a request with one clear line per problem; throws FitError. */
export function parseFitRequest(input: FitRequestInput): FitRequest {
  const parsed = fitRequestSchema.safeParse(input);
  if (!parsed.success) throw new FitError(zodIssueLines(parsed.error.issues, { rootLabel: "(request)" })[0]!);
  for (const set of parsed.data.sets ?? [{ points: parsed.data.points ?? [] }]) {
    for (const p of set.points) {
      if (p.quantity === "verdet" && p.fieldT === 0)
        throw new FitError(`line ${p.line}: a Verdet constant needs a nonzero field (field_T is 0)`);
    }
  }
  return parsed.data;
}

/** The σ-scaling factor: √(χ²/dof) when asked and larger than 1, else 1. Throws when dof is too small to tell. */
export function sigmaScaleFactor(chi2: number, dof: number, requested: boolean): number {
  if (!requested) return 1;
  if (dof < MIN_DOF_FOR_SCALING) {
    throw new FitError(
      `σ can be scaled by √(χ²/dof) only with at least ${MIN_DOF_FOR_SCALING} degrees of freedom (this fit has ${dof}); ` +
        "fit without scaling",
    );
  }
  // Scaling never shrinks σ: χ²/dof < 1 is as likely a fluctuation as overstated σ (common practice, no source).
  return Math.max(1, Math.sqrt(chi2 / dof));
}

/**
 * Turns a minimum of the physics problem into a result: σ, correlation, goodness of fit, per-point
 * shares with their covariance, per-set χ², the verdict on the split.
 */
export function fitResultFrom(problem: PhysicsProblem, req: FitRequest, min: MinimizeResult): FitResult {
  const names = [...problem.names];
  const n = problem.dataCount;
  const dof = problem.y.length - min.varied.length;
  if (dof < 1)
    throw new FitError(`${n} point(s) cannot determine ${min.varied.length} parameter(s); a fit needs more points than free parameters`);
  let chi2Data = 0;
  const setChi2 = problem.sets.map(() => 0);
  for (let i = 0; i < n; i++) {
    const r = (problem.y[i]! - min.value[i]!) / problem.sigma[i]!;
    chi2Data += r * r;
    setChi2[problem.rows[i]!.set]! += r * r;
  }
  const reducedChi2 = min.chi2 / dof;
  const factor = sigmaScaleFactor(min.chi2, dof, req.scaleByChi2);
  const cov = min.covariance.clone().mul(factor * factor);
  const sigmaUnscaled = names.map((_, j) => Math.sqrt(Math.max(min.covariance.get(j, j), 0)));
  const sigmaScaledAll = sigmaUnscaled.map((s) => s * Math.max(1, Math.sqrt(reducedChi2)));
  const correlation = names.map((_, j) =>
    names.map((__, k) => (j === k ? 1 : min.covariance.get(j, k) / (sigmaUnscaled[j]! * sigmaUnscaled[k]!) || 0)),
  );

  // Shares and their Jacobian at the optimum, over the varied model keys (scale factors leave shares unchanged).
  const fitted = problem.paramsAt(min.x);
  const shareKeys = problem.keys.filter((_, j) => min.varied.includes(j));
  const final = modelJacobian(fitted, shareKeys, problem.conditions, problem.jacobianOptions);
  const keyIndex = shareKeys.map((k) => problem.keys.indexOf(k));
  const shareCovarianceAt = (a: number, b: number) => {
    let v = 0;
    keyIndex.forEach((j, cj) => {
      keyIndex.forEach((k, ck) => {
        v += final.shareJacobian.get(a, cj) * cov.get(j, k) * final.shareJacobian.get(b, ck);
      });
    });
    return v;
  };
  const fitPoints: FitPoint[] = problem.rows.map((row, i) => {
    const share = final.magneticShare[i]!;
    const model = min.value[i]!;
    const pt = row.point;
    return {
      set: problem.sets[row.set]!.name,
      line: pt.line,
      wavelengthNm: pt.wavelengthNm,
      temperatureK: pt.temperatureK,
      fieldT: pt.fieldT,
      lengthM: pt.lengthM,
      quantity: pt.quantity,
      measured: pt.value,
      sigma: pt.sigma,
      effectiveSigma: row.sigma,
      fitted: row.value,
      model,
      normalizedResidual: (row.value - model) / row.sigma,
      magneticShare: orNull(share),
      magneticShareSigma: Number.isFinite(share) ? orNull(Math.sqrt(Math.max(shareCovarianceAt(i, i), 0))) : null,
    };
  });
  let shareCovariance: number[][] | null = null;
  if (n <= SHARE_COVARIANCE_MAX_POINTS) {
    const m = new Matrix(n, n);
    for (let a = 0; a < n; a++) {
      for (let b = a; b < n; b++) {
        const v = shareCovarianceAt(a, b);
        m.set(a, b, Number.isFinite(v) ? v : 0);
        m.set(b, a, Number.isFinite(v) ? v : 0);
      }
    }
    shareCovariance = m.to2DArray();
  }

  const reported = req.scaleByChi2 ? sigmaUnscaled.map((s) => s * factor) : sigmaUnscaled;
  const varied = (list: number[]) => list.map((j) => names[j]!);
  const separation = separationVerdict(names, correlation, fitPoints);
  return {
    free: req.free.map((f) => f.key),
    bounds: req.free,
    priors: req.priors,
    names,
    values: toRecord(names, min.x),
    sigmas: toRecord(names, reported),
    sigmasUnscaled: toRecord(names, sigmaUnscaled),
    sigmasScaled: toRecord(names, sigmaScaledAll),
    sigmaScaledByChi2: req.scaleByChi2,
    sigmaScale: factor,
    covariance: cov.to2DArray(),
    correlation,
    chi2: min.chi2,
    chi2Data,
    priorPenalty: priorPenalty(req.priors, toRecord(names, min.x)),
    dof,
    reducedChi2,
    goodnessOfFit: { chi2: min.chi2, dof, pValue: chiSquareSurvival(min.chi2, dof) },
    points: fitPoints,
    shareCovariance,
    sets: problem.sets.map((s, k) => ({
      name: s.name,
      pointCount: s.points.length,
      chi2: setChi2[k]!,
      scaleSigma: s.calibration.scaleSigma,
      relativeFloor: s.calibration.relativeFloor,
      temperatureSigmaK: s.calibration.temperatureSigmaK,
    })),
    separation,
    atBound: varied(min.atBound),
    iterations: min.iterations,
    converged: min.converged,
    startChi2: min.startChi2,
    signCheck: {
      opposite: problem.signs.opposite,
      total: n,
      allOpposite: problem.signs.allOpposite,
      tookModelSign: req.takeModelSign,
    },
    params: fitted,
  };
}

/** Fits the free parameters of a parameter set to measured points. Throws FitError, FitCancelledError. */
export function fitMeasurements(input: FitRequestInput, opts: FitOptions = {}): FitResult {
  const req = parseFitRequest(input);
  let problem = buildPhysicsProblem(req);
  const run = (start?: ArrayLike<number>) =>
    minimize(problem, {
      starts: start ? 1 : req.starts,
      seed: req.seed,
      start,
      maxIterations: opts.maxIterations,
      onProgress: opts.onProgress,
      shouldCancel: opts.shouldCancel,
    });
  let min = run();
  // With a temperature σ the effective σ depend on ∂value/∂T: taken at the starting values, then once more at the fitted ones.
  if (problem.sets.some((s) => s.calibration.temperatureSigmaK > 0)) {
    problem = buildPhysicsProblem(req, problem.paramsAt(min.x));
    min = run(min.x);
  }
  return fitResultFrom(problem, req, min);
}
