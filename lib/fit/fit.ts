import { zodIssueLines } from "@/lib/contracts/validation";
import type { MeasuredQuantity } from "@/lib/measurements/point";
import type { ModelParams } from "@/lib/physics/schema";
import { FitCancelledError, FitError, leastSquares } from "./least-squares";
import { type NumericParamKey, evaluateModel, modelJacobian, withFreeValues } from "./model";
import { type FreeParam, type FreeableKey, NATURAL_LOWER } from "@/lib/analysis/definition";
import { type FitRequestInput, fitRequestSchema } from "./schema";

/*
 * The fit of the model (physics-model.md, analytic path) to measured points: weighted least
 * squares with the points' σ, the standard errors from the covariance (JᵀWJ)⁻¹ at the optimum, and
 * the magnetic share at every point with its standard error propagated through the model's
 * Jacobian (σ²_share = g C gᵀ, g = ∂share/∂p: first-order error propagation, common practice, no
 * source). One module serves the worker, the API and the command line.
 */

export { FitCancelledError, FitError };

/** |correlation| of the two amplitudes above which the data cannot tell the parts apart. */
export const SEPARATION_CORRELATION_LIMIT = 0.95;

export interface FitPoint {
  line: number;
  wavelengthNm: number;
  temperatureK: number;
  fieldT: number;
  lengthM: number;
  quantity: MeasuredQuantity;
  measured: number;
  sigma: number;
  model: number;
  /** (measured − model) / σ. */
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

export interface FitResult {
  free: FreeableKey[];
  bounds: FreeParam[];
  values: Record<string, number>;
  /** The reported standard errors: scaled by √(χ²/dof) when sigmaScaledByChi2, else as given by the data's σ. */
  sigmas: Record<string, number>;
  sigmasUnscaled: Record<string, number>;
  sigmasScaled: Record<string, number>;
  sigmaScaledByChi2: boolean;
  /** The reported covariance (scaled like sigmas), rows and columns in the order of free. */
  covariance: number[][];
  correlation: number[][];
  chi2: number;
  dof: number;
  reducedChi2: number;
  points: FitPoint[];
  separation: SeparationVerdict;
  /** Free parameters that ended on one of their bounds (their σ is then not a fair error). */
  atBound: FreeableKey[];
  iterations: number;
  converged: boolean;
  /** The full parameter set at the fitted values. */
  params: ModelParams;
}

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

/** Fits the free parameters of a parameter set to measured points. Throws FitError, FitCancelledError. */
export function fitMeasurements(input: FitRequestInput, opts: FitOptions = {}): FitResult {
  const parsed = fitRequestSchema.safeParse(input);
  if (!parsed.success) throw new FitError(zodIssueLines(parsed.error.issues, { rootLabel: "(request)" })[0]!);
  const { params, free, points, scaleByChi2 } = parsed.data;
  for (const p of points) {
    if (p.quantity === "verdet" && p.fieldT === 0)
      throw new FitError(`line ${p.line}: a Verdet constant needs a nonzero field (field_T is 0)`);
  }
  const keys = free.map((f) => f.key) as NumericParamKey[];
  const conditions = points.map((p) => ({
    wavelengthNm: p.wavelengthNm,
    temperatureK: p.temperatureK,
    fieldT: p.fieldT,
    lengthM: p.lengthM,
    quantity: p.quantity,
  }));
  // The step scale for a parameter whose value is 0: the size of its bounds, else 1.
  const typicalScale = Object.fromEntries(free.map((f) => [f.key, Math.max(Math.abs(f.min ?? 0), Math.abs(f.max ?? 0)) || 1]));
  const lowerBounds = free.map((f) => Math.max(f.min ?? -Infinity, NATURAL_LOWER[f.key] ?? -Infinity));
  const lower = Object.fromEntries(free.map((f, j) => [f.key, lowerBounds[j]!]).filter(([, v]) => Number.isFinite(v)));
  const ls = leastSquares({
    y: points.map((p) => p.value),
    sigma: points.map((p) => p.sigma),
    x0: keys.map((k) => params[k] as number),
    lower: lowerBounds,
    upper: free.map((f) => f.max ?? Infinity),
    names: keys,
    maxIterations: opts.maxIterations,
    onProgress: opts.onProgress,
    shouldCancel: opts.shouldCancel,
    model: (x, withJacobian) => {
      const trial = withFreeValues(params, keys, x);
      if (!withJacobian) return { value: evaluateModel(trial, conditions).value };
      const jac = modelJacobian(trial, keys, conditions, { typicalScale, lower });
      return { value: jac.value, jacobian: jac.valueJacobian };
    },
  });

  // The share and its Jacobian at the optimum (the solver's last model call may have been a
  // rejected trial elsewhere).
  const fitted = withFreeValues(params, keys, ls.x);
  const final = modelJacobian(fitted, keys, conditions, { typicalScale, lower });

  const n = points.length;
  const p = keys.length;
  const dof = n - p;
  const reducedChi2 = ls.chi2 / dof;
  const scale = scaleByChi2 ? reducedChi2 : 1;
  // ml-matrix arithmetic is in place: scale a copy.
  const cov = ls.covariance.clone().mul(scale);
  const sigmaUnscaled = keys.map((_, j) => Math.sqrt(ls.covariance.get(j, j)));
  const sigmaScaled = sigmaUnscaled.map((s) => s * Math.sqrt(reducedChi2));
  const correlation = keys.map((_, j) =>
    keys.map((__, k) => (j === k ? 1 : ls.covariance.get(j, k) / (sigmaUnscaled[j]! * sigmaUnscaled[k]!))),
  );

  const fitPoints: FitPoint[] = points.map((pt, i) => {
    const share = final.magneticShare[i]!;
    let shareVar = 0;
    for (let j = 0; j < p; j++)
      for (let k = 0; k < p; k++) shareVar += final.shareJacobian.get(i, j) * cov.get(j, k) * final.shareJacobian.get(i, k);
    const model = ls.value[i]!;
    return {
      line: pt.line,
      wavelengthNm: pt.wavelengthNm,
      temperatureK: pt.temperatureK,
      fieldT: pt.fieldT,
      lengthM: pt.lengthM,
      quantity: pt.quantity,
      measured: pt.value,
      sigma: pt.sigma,
      model,
      normalizedResidual: (pt.value - model) / pt.sigma,
      magneticShare: orNull(share),
      magneticShareSigma: Number.isFinite(share) ? orNull(Math.sqrt(Math.max(shareVar, 0))) : null,
    };
  });

  const reported = scaleByChi2 ? sigmaScaled : sigmaUnscaled;
  return {
    free: [...keys] as FreeableKey[],
    bounds: free,
    values: toRecord(keys, ls.x),
    sigmas: toRecord(keys, reported),
    sigmasUnscaled: toRecord(keys, sigmaUnscaled),
    sigmasScaled: toRecord(keys, sigmaScaled),
    sigmaScaledByChi2: scaleByChi2,
    covariance: cov.to2DArray(),
    correlation,
    chi2: ls.chi2,
    dof,
    reducedChi2,
    points: fitPoints,
    separation: separationVerdict(keys, correlation, fitPoints),
    atBound: ls.atBound.map((j) => keys[j]!) as FreeableKey[],
    iterations: ls.iterations,
    converged: ls.converged,
    params: fitted,
  };
}
