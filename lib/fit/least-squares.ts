import { Matrix, inverse, solve } from "ml-matrix";

/*
 * Weighted nonlinear least squares by Levenberg–Marquardt with box bounds, on ml-matrix.
 * Model-agnostic, so the same solver fits the physics (lib/fit/fit.ts) and the closed-form
 * checks of the tests. The method (Marquardt's damping of the normal equations scaled by their
 * diagonal, λ down ×10 on success and up ×10 on failure) is the textbook one: Press et al.,
 * Numerical Recipes, 3rd ed., §15.5.2; the final undamped Gauss–Newton steps ("polish") make a
 * model that is linear in its parameters land on the normal-equations solution to round-off.
 * Bounds are enforced by projecting each trial point onto the box (common practice, no source).
 */

export interface ModelOutput {
  /** Model value per point. */
  value: Float64Array;
  /** ∂value/∂parameter, one row per point, one column per parameter (only when asked for). */
  jacobian?: Matrix;
}

export interface LeastSquaresProblem {
  /** Measured values. */
  y: ArrayLike<number>;
  /** Their standard uncertainties (> 0); weights are 1/σ². */
  sigma: ArrayLike<number>;
  /** Starting point. */
  x0: ArrayLike<number>;
  lower?: ArrayLike<number>;
  upper?: ArrayLike<number>;
  /**
   * The model at x. May throw (e.g. a parameter outside the model's valid range): the trial point
   * is then rejected like one with a larger χ².
   */
  model: (x: Float64Array, withJacobian: boolean) => ModelOutput;
  /** Parameter names, for messages. */
  names?: readonly string[];
  maxIterations?: number;
  /** Relative step below which the iteration has converged (default 1e-10). */
  stepTolerance?: number;
  onProgress?: (progress: LeastSquaresProgress) => void;
  shouldCancel?: () => boolean;
  /**
   * Return a NaN covariance instead of failing when the normal equations are singular at the
   * minimum: for callers that need only χ² (likelihood-ratio tests and profiles, where a flat
   * direction is an answer, not an error).
   */
  allowSingular?: boolean;
}

export interface LeastSquaresProgress {
  iteration: number;
  maxIterations: number;
  chi2: number;
}

export interface LeastSquaresResult {
  x: Float64Array;
  chi2: number;
  /** Unscaled covariance (JᵀWJ)⁻¹ at x. */
  covariance: Matrix;
  /** Model value at x. */
  value: Float64Array;
  /** Model Jacobian at x. */
  jacobian: Matrix;
  iterations: number;
  converged: boolean;
  /** Indices of parameters that ended on a bound. */
  atBound: number[];
}

export class FitCancelledError extends Error {
  constructor() {
    super("The fit was cancelled.");
    this.name = "FitCancelledError";
  }
}

/** A fit that cannot proceed: the message says why in words a user can act on. */
export class FitError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "FitError";
  }
}

interface State {
  x: Float64Array;
  value: Float64Array;
  jacobian: Matrix;
  chi2: number;
}

function chiSquare(value: Float64Array, y: ArrayLike<number>, sigma: ArrayLike<number>): number {
  let sum = 0;
  for (let i = 0; i < value.length; i++) {
    const r = (y[i]! - value[i]!) / sigma[i]!;
    sum += r * r;
  }
  return sum;
}

/** JᵀWJ and JᵀW(y − f) with W = diag(1/σ²). */
function normalEquations(state: State, y: ArrayLike<number>, sigma: ArrayLike<number>): { a: Matrix; b: Matrix } {
  const n = state.value.length;
  const p = state.jacobian.columns;
  const a = new Matrix(p, p);
  const b = new Matrix(p, 1);
  for (let i = 0; i < n; i++) {
    const w = 1 / (sigma[i]! * sigma[i]!);
    const r = y[i]! - state.value[i]!;
    for (let j = 0; j < p; j++) {
      const jij = state.jacobian.get(i, j);
      b.set(j, 0, b.get(j, 0) + w * jij * r);
      for (let k = j; k < p; k++) a.set(j, k, a.get(j, k) + w * jij * state.jacobian.get(i, k));
    }
  }
  for (let j = 0; j < p; j++) for (let k = 0; k < j; k++) a.set(j, k, a.get(k, j));
  return { a, b };
}

/**
 * Solves (A + λ diag A) δ = b after scaling A to unit diagonal, which makes the solve independent
 * of the parameters' units (a wavelength in nm beside a gyration of 1e-3 /T).
 */
function dampedStep(a: Matrix, b: Matrix, lambda: number): Float64Array | null {
  const p = a.rows;
  const d = new Float64Array(p);
  for (let j = 0; j < p; j++) {
    const ajj = a.get(j, j);
    if (!(ajj > 0) || !Number.isFinite(ajj)) return null;
    d[j] = 1 / Math.sqrt(ajj);
  }
  const scaled = new Matrix(p, p);
  const rhs = new Matrix(p, 1);
  for (let j = 0; j < p; j++) {
    rhs.set(j, 0, b.get(j, 0) * d[j]!);
    for (let k = 0; k < p; k++) scaled.set(j, k, a.get(j, k) * d[j]! * d[k]!);
    scaled.set(j, j, scaled.get(j, j) * (1 + lambda));
  }
  let z: Matrix;
  try {
    z = solve(scaled, rhs);
  } catch {
    // A singular (undamped) system has no step: the caller treats it like a failed one.
    return null;
  }
  const step = new Float64Array(p);
  for (let j = 0; j < p; j++) step[j] = z.get(j, 0) * d[j]!;
  return step.every(Number.isFinite) ? step : null;
}

/** (JᵀWJ)⁻¹ computed on the unit-diagonal scaled matrix, for the same reason as dampedStep. */
export function covarianceFromNormalMatrix(a: Matrix, names: readonly string[] = []): Matrix {
  const p = a.rows;
  const d = new Float64Array(p);
  for (let j = 0; j < p; j++) {
    const ajj = a.get(j, j);
    if (!(ajj > 0))
      throw new FitError(
        `${names[j] ?? `free parameter ${j + 1}`} does not change the model at these points, ` +
          "so the data cannot determine it; fix it or add data",
      );
    d[j] = 1 / Math.sqrt(ajj);
  }
  const scaled = new Matrix(p, p);
  for (let j = 0; j < p; j++) for (let k = 0; k < p; k++) scaled.set(j, k, a.get(j, k) * d[j]! * d[k]!);
  let inv: Matrix;
  try {
    inv = inverse(scaled);
  } catch {
    throw new FitError(
      "the free parameters are not independent at these points (singular normal equations); free fewer parameters or add data",
    );
  }
  const cov = new Matrix(p, p);
  for (let j = 0; j < p; j++) for (let k = 0; k < p; k++) cov.set(j, k, inv.get(j, k) * d[j]! * d[k]!);
  for (let j = 0; j < p; j++) {
    if (!(cov.get(j, j) > 0) || !Number.isFinite(cov.get(j, j))) {
      throw new FitError(
        "the free parameters are not independent at these points (singular normal equations); free fewer parameters or add data",
      );
    }
  }
  return cov;
}

const MAX_LAMBDA = 1e16;

export function leastSquares(problem: LeastSquaresProblem): LeastSquaresResult {
  const { y, sigma } = problem;
  const p = problem.x0.length;
  const lower = Float64Array.from({ length: p }, (_, j) => problem.lower?.[j] ?? -Infinity);
  const upper = Float64Array.from({ length: p }, (_, j) => problem.upper?.[j] ?? Infinity);
  const clamp = (x: Float64Array) => x.map((v, j) => Math.min(upper[j]!, Math.max(lower[j]!, v)));
  const maxIterations = problem.maxIterations ?? 200;
  const stepTolerance = problem.stepTolerance ?? 1e-10;

  const evaluate = (x: Float64Array, withJacobian: boolean): State | null => {
    let out: ModelOutput;
    try {
      out = problem.model(x, withJacobian);
    } catch {
      return null;
    }
    const chi2 = chiSquare(out.value, y, sigma);
    if (!Number.isFinite(chi2)) return null;
    if (withJacobian && !out.jacobian) throw new Error("model did not return the Jacobian it was asked for");
    return { x, value: out.value, jacobian: out.jacobian ?? new Matrix(0, 0), chi2 };
  };

  const start = clamp(Float64Array.from(problem.x0));
  const first = evaluate(start, true);
  if (!first) throw new FitError("the model cannot be evaluated at the starting values (check the fixed parameters against the data)");
  let state: State = first;
  let lambda = 1e-3;
  let iterations = 0;
  let converged = false;
  const relStep = (a: Float64Array, b: Float64Array) => {
    let max = 0;
    for (let j = 0; j < p; j++) max = Math.max(max, Math.abs(a[j]! - b[j]!) / Math.max(Math.abs(a[j]!), Math.abs(b[j]!), Number.MIN_VALUE));
    return max;
  };

  while (iterations < maxIterations) {
    if (problem.shouldCancel?.()) throw new FitCancelledError();
    iterations++;
    const { a, b } = normalEquations(state, y, sigma);
    const step = dampedStep(a, b, lambda);
    if (!step) break;
    const trialX = clamp(state.x.map((v, j) => v + step[j]!));
    // A tiny step under light damping is the minimum; under heavy damping it only means "try".
    if (lambda <= 1 && relStep(trialX, state.x) <= stepTolerance) {
      converged = true;
      break;
    }
    // The Jacobian (2p model calls) only for a step that is taken: a rejected trial costs one call.
    const probe = evaluate(trialX, false);
    const trial: State | null = probe && probe.chi2 <= state.chi2 ? evaluate(trialX, true) : null;
    if (trial && trial.chi2 <= state.chi2) {
      const moved = relStep(trialX, state.x);
      state = trial;
      lambda = Math.max(lambda / 10, 1e-12);
      problem.onProgress?.({ iteration: iterations, maxIterations, chi2: state.chi2 });
      if (moved <= stepTolerance) {
        converged = true;
        break;
      }
    } else {
      lambda *= 10;
      if (lambda > MAX_LAMBDA) {
        // No downhill step even along the (scaled) gradient: a minimum to the accuracy of χ².
        converged = true;
        break;
      }
    }
  }

  // Gauss–Newton polish: undamped steps, kept only while they do not raise χ².
  for (let k = 0; k < 3; k++) {
    if (problem.shouldCancel?.()) throw new FitCancelledError();
    const { a, b } = normalEquations(state, y, sigma);
    const step = dampedStep(a, b, 0);
    if (!step) break;
    const trialX = clamp(state.x.map((v, j) => v + step[j]!));
    if (relStep(trialX, state.x) === 0) break;
    const trial = evaluate(trialX, true);
    if (!trial || trial.chi2 > state.chi2 * (1 + 1e-12) + 1e-300) break;
    state = trial;
  }

  const { a } = normalEquations(state, y, sigma);
  let covariance: Matrix;
  try {
    covariance = covarianceFromNormalMatrix(a, problem.names);
  } catch (err) {
    if (!(problem.allowSingular && err instanceof FitError)) throw err;
    covariance = new Matrix(p, p).fill(Number.NaN);
  }
  const atBound: number[] = [];
  for (let j = 0; j < p; j++) if (state.x[j] === lower[j] || state.x[j] === upper[j]) atBound.push(j);
  return { x: state.x, chi2: state.chi2, covariance, value: state.value, jacobian: state.jacobian, iterations, converged, atBound };
}
