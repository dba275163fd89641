import { Matrix } from "ml-matrix";
import { seededRandom } from "@/lib/random";
import { FitError, type LeastSquaresProgress, type LeastSquaresResult, leastSquares } from "./least-squares";

/*
 * Minimisation of a χ² problem with some parameters held at given values and several seeded
 * starts. Model-agnostic like the solver under it, so the physics fit (lib/fit/fit.ts), the model
 * comparison and the profile likelihood (lib/fit/inference.ts) and the closed-form checks of the
 * tests all run through the same code. Gaussian priors and constraints are extra rows of the
 * problem (pseudo-observations y = μ with σ = the prior's σ and model value x_k), which adds exactly
 * ((x − μ)/σ)² to χ² and the prior's information 1/σ² to JᵀWJ (common practice, no source).
 */

export interface ChiSquareProblem {
  /** One name per parameter (for messages and results). */
  names: readonly string[];
  /** Starting point. */
  x0: ArrayLike<number>;
  lower: ArrayLike<number>;
  upper: ArrayLike<number>;
  /** The range over which extra starts are drawn, per parameter (within the bounds). */
  spread: readonly (readonly [number, number])[];
  /** Observed values per row (data rows first, then prior and constraint rows). */
  y: ArrayLike<number>;
  sigma: ArrayLike<number>;
  /**
   * The model at x for every row; with columns, also ∂value/∂x_j for those parameter indices (one
   * Jacobian column per listed index, in that order). May throw: the trial point is then rejected.
   */
  model: (x: Float64Array, columns: readonly number[] | null) => { value: Float64Array; jacobian?: Matrix };
}

export interface MinimizeOptions {
  /** Parameters held at a value: index → value. */
  fixed?: ReadonlyMap<number, number>;
  /** Number of starts: the first is x0 (or the given start), the rest drawn from the spread. Default 1. */
  starts?: number;
  /** Seed of the extra starts, so that a fit repeats exactly. Default 1. */
  seed?: number;
  /** Overrides x0 as the first start (e.g. a warm start from a neighbouring profile point). */
  start?: ArrayLike<number>;
  maxIterations?: number;
  onProgress?: (progress: LeastSquaresProgress) => void;
  shouldCancel?: () => boolean;
  /** Relative step at which the solver stops (default 1e-10); profiles use a looser one. */
  stepTolerance?: number;
  /** Accept a singular minimum (NaN covariance): for tests and profiles, which need only χ². */
  allowSingular?: boolean;
}

export interface MinimizeResult {
  /** The full parameter vector at the minimum (held values included). */
  x: Float64Array;
  chi2: number;
  /** Covariance over all parameters: rows and columns of held ones are 0. */
  covariance: Matrix;
  /** Indices of the parameters that varied. */
  varied: number[];
  /** Indices (into the full vector) of varied parameters that ended on a bound. */
  atBound: number[];
  value: Float64Array;
  iterations: number;
  converged: boolean;
  /** Starts that ran to the end, and χ² of each (NaN where a start could not be evaluated). */
  startChi2: number[];
}

/** The default number of starts of a fit: the given start plus three drawn over the bounds. */
export const DEFAULT_STARTS = 4;

/** Starts beyond the first, drawn uniformly over each parameter's spread (seeded). */
export function startPoints(problem: ChiSquareProblem, count: number, seed: number, first: ArrayLike<number>): Float64Array[] {
  const uniform = seededRandom(seed);
  const starts = [Float64Array.from(first)];
  for (let s = 1; s < count; s++) {
    starts.push(
      Float64Array.from(problem.spread, ([lo, hi], j) => {
        const v = lo + (hi - lo) * uniform();
        return Math.min(problem.upper[j]!, Math.max(problem.lower[j]!, v));
      }),
    );
  }
  return starts;
}

/** Minimises χ² over the parameters not held, from each start; the lowest χ² wins. Throws FitError when no start works. */
export function minimize(problem: ChiSquareProblem, opts: MinimizeOptions = {}): MinimizeResult {
  const p = problem.names.length;
  const fixed = opts.fixed ?? new Map<number, number>();
  const varied = Array.from({ length: p }, (_, j) => j).filter((j) => !fixed.has(j));
  const full = (sub: ArrayLike<number>) => {
    const x = Float64Array.from(problem.x0);
    for (const [j, v] of fixed) x[j] = v;
    varied.forEach((j, k) => {
      x[j] = sub[k]!;
    });
    return x;
  };
  const starts = startPoints(problem, Math.max(1, opts.starts ?? 1), opts.seed ?? 1, opts.start ?? problem.x0);
  let best: LeastSquaresResult | null = null;
  let firstError: unknown = null;
  const startChi2: number[] = [];
  for (const start of starts) {
    if (varied.length === 0) break;
    try {
      const ls = leastSquares({
        y: problem.y,
        sigma: problem.sigma,
        x0: varied.map((j) => start[j]!),
        lower: varied.map((j) => problem.lower[j]!),
        upper: varied.map((j) => problem.upper[j]!),
        names: varied.map((j) => problem.names[j]!),
        maxIterations: opts.maxIterations,
        onProgress: opts.onProgress,
        shouldCancel: opts.shouldCancel,
        allowSingular: opts.allowSingular,
        stepTolerance: opts.stepTolerance,
        model: (sub, withJacobian) => problem.model(full(sub), withJacobian ? varied : null),
      });
      startChi2.push(ls.chi2);
      if (!best || ls.chi2 < best.chi2) best = ls;
    } catch (err) {
      if (!(err instanceof FitError)) throw err;
      firstError ??= err;
      startChi2.push(Number.NaN);
    }
  }
  if (varied.length === 0) {
    const x = full([]);
    const value = problem.model(x, null).value;
    return {
      x,
      chi2: chiSquare(problem, value),
      covariance: new Matrix(p, p),
      varied,
      atBound: [],
      value,
      iterations: 0,
      converged: true,
      startChi2: [],
    };
  }
  if (!best) throw firstError;
  const covariance = new Matrix(p, p);
  varied.forEach((j, a) => {
    varied.forEach((k, b) => {
      covariance.set(j, k, best.covariance.get(a, b));
    });
  });
  return {
    x: full(best.x),
    chi2: best.chi2,
    covariance,
    varied,
    atBound: best.atBound.map((a) => varied[a]!),
    value: best.value,
    iterations: best.iterations,
    converged: best.converged,
    startChi2,
  };
}

export function chiSquare(problem: Pick<ChiSquareProblem, "y" | "sigma">, value: ArrayLike<number>): number {
  let sum = 0;
  for (let i = 0; i < value.length; i++) {
    const r = (problem.y[i]! - value[i]!) / problem.sigma[i]!;
    sum += r * r;
  }
  return sum;
}

/**
 * The problem with one more row: a soft constraint g(x) = target with tolerance sigma. Used to
 * profile a derived quantity (the magnetic share): minimising χ² + ((g − target)/σ)² with σ small
 * holds g at the target to within σ (a penalty method, common practice, no source).
 */
export function withConstraint(
  problem: ChiSquareProblem,
  g: (x: Float64Array, columns: readonly number[] | null) => { value: number; gradient?: number[] },
  target: number,
  sigma: number,
): ChiSquareProblem {
  const y = Float64Array.from({ length: problem.y.length + 1 }, (_, i) => (i < problem.y.length ? problem.y[i]! : target));
  const s = Float64Array.from({ length: problem.y.length + 1 }, (_, i) => (i < problem.y.length ? problem.sigma[i]! : sigma));
  return {
    ...problem,
    y,
    sigma: s,
    model: (x, columns) => {
      const base = problem.model(x, columns);
      const extra = g(x, columns);
      const value = new Float64Array(base.value.length + 1);
      value.set(base.value);
      value[base.value.length] = extra.value;
      if (!columns || !base.jacobian) return { value };
      const jac = new Matrix(base.jacobian.rows + 1, base.jacobian.columns);
      jac.setSubMatrix(base.jacobian, 0, 0);
      for (let c = 0; c < columns.length; c++) jac.set(base.jacobian.rows, c, extra.gradient?.[c] ?? 0);
      return { value, jacobian: jac };
    },
  };
}
