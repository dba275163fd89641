import { type ChiSquareProblem, type MinimizeOptions, type MinimizeResult, minimize, withConstraint } from "./minimize";
import { chiSquareSurvival } from "./statistics";

/*
 * Likelihood-ratio inference on a χ² problem (lib/fit/minimize.ts), model-agnostic so the
 * closed-form and Monte-Carlo checks can run it on simple models:
 * - nested-hypothesis tests (a parameter held at a value), with the p-value of Wilks' theorem for
 *   an interior value, P(χ²₁ > Δχ²), and for a value on the boundary of the parameter space the
 *   mixture ½χ²₀ + ½χ²₁ (Chernoff 1954, Ann. Math. Stat. 25, 573; Self & Liang 1987, JASA 82, 605):
 *   p = ½·P(χ²₁ > Δχ²);
 * - information criteria AIC = χ² + 2k (Akaike 1974), AICc = AIC + 2k(k + 1)/(n − k − 1) (Hurvich &
 *   Tsai 1989, Biometrika 76, 297), BIC = χ² + k·ln n (Schwarz 1978), χ² standing for −2 ln L up to
 *   a constant;
 * - profile-likelihood intervals {v : Δχ²(v) ≤ 1} and {v : Δχ²(v) ≤ 4} with every other parameter
 *   refitted at each v (68.27 % and 95.45 % for one parameter, Wilks), for a parameter or for a
 *   derived quantity (held by a soft constraint), cut at the physical range.
 */

export interface InformationCriteria {
  /** Parameters fitted. */
  k: number;
  /** Data points (prior rows are not counted as data). */
  n: number;
  aic: number;
  aicc: number | null;
  bic: number;
}

export function informationCriteria(chi2: number, k: number, n: number): InformationCriteria {
  const aic = chi2 + 2 * k;
  return { k, n, aic, aicc: n - k - 1 > 0 ? aic + (2 * k * (k + 1)) / (n - k - 1) : null, bic: chi2 + k * Math.log(n) };
}

export interface NestedTest {
  chi2: number;
  /** χ²(held) − χ²(free), ≥ 0 (a negative difference from round-off reads 0). */
  deltaChi2: number;
  pValue: number;
  /** The Gaussian-equivalent significance: Φ⁻¹(1 − p) on the boundary, Φ⁻¹(1 − p/2) inside; both equal √Δχ². */
  significanceSigma: number;
  criteria: InformationCriteria;
  /** The held fit ended below the free one: the free fit missed its minimum. */
  heldBelowFree: boolean;
  fit: MinimizeResult;
}

/**
 * The likelihood-ratio test of one parameter held at a value; onBoundary when the value is a bound of that parameter.
 * Both nulls give the same Gaussian-equivalent significance √Δχ²: on the boundary p = ½·P(χ²₁ > Δχ²) = Q(√Δχ²), inside
 * p/2 = Q(√Δχ²), Q being the normal upper tail (P(χ²₁ > d) = 2Q(√d), A&S 26.4.4). Taking √Δχ² directly keeps the
 * figure where p underflows (Δχ² above about 1400), where Φ⁻¹(1 − p) would be infinite.
 */
export function likelihoodRatio(deltaChi2: number, onBoundary: boolean): { pValue: number; significanceSigma: number } {
  const d = Math.max(0, deltaChi2);
  const pValue = onBoundary ? (d > 0 ? 0.5 * chiSquareSurvival(d, 1) : 1) : chiSquareSurvival(d, 1);
  return { pValue, significanceSigma: Math.sqrt(d) };
}

export function nestedTest(
  problem: ChiSquareProblem,
  free: MinimizeResult,
  index: number,
  value: number,
  dataCount: number,
  opts: MinimizeOptions = {},
): NestedTest {
  const fixed = new Map(opts.fixed ?? []);
  fixed.set(index, value);
  const fit = minimize(problem, { allowSingular: true, ...opts, fixed });
  const delta = fit.chi2 - free.chi2;
  const tolerance = 1e-8 * Math.max(1, free.chi2);
  const onBoundary = value === problem.lower[index] || value === problem.upper[index];
  return {
    chi2: fit.chi2,
    deltaChi2: Math.max(0, delta),
    ...likelihoodRatio(delta, onBoundary),
    criteria: informationCriteria(fit.chi2, fit.varied.length, dataCount),
    heldBelowFree: delta < -tolerance,
    fit,
  };
}

export interface ProfilePoint {
  value: number;
  deltaChi2: number;
}

export interface ProfileInterval {
  value: number;
  /** [lo, hi] where Δχ² ≤ 1; an end at the physical limit is that limit. */
  interval68: [number, number];
  interval95: [number, number];
  /** Which ends stop at the physical range rather than at the Δχ² level: [lower end, upper end] for 68 % and 95 %. */
  limited68: [boolean, boolean];
  limited95: [boolean, boolean];
  /** The scanned Δχ² against the value, sorted by value (for the profile plot). */
  curve: ProfilePoint[];
  /** A profile point fell below the best fit: the fit had missed its minimum (Δχ² are then relative to a point that is not the best). */
  lowerMinimum: { value: number; chi2: number } | null;
}

interface Side {
  /** Points on this side, from the optimum outwards. */
  points: ProfilePoint[];
}

const LEVEL_68 = 1;
const LEVEL_95 = 4;

/**
 * Scans Δχ²(v) from the optimum outwards on both sides until it passes 4 or the range ends, then
 * locates the crossings of 1 and 4 by the secant method on √Δχ², which is linear in v for a model
 * linear in its parameters (so the crossing is exact there after one step) and nearly so near the
 * optimum of any smooth model (common practice, no source). precision: the tolerance on √Δχ² at a crossing.
 */
export function profileScan(
  deltaAt: (v: number, from: number) => number,
  best: number,
  step: number,
  lower: number,
  upper: number,
  precision = 1e-7,
): Omit<ProfileInterval, "lowerMinimum"> {
  const sides: Side[] = [];
  const ends: { lo68: number; hi68: number; lo95: number; hi95: number } = { lo68: best, hi68: best, lo95: best, hi95: best };
  const limited: Record<string, boolean> = {};
  for (const dir of [-1, 1] as const) {
    const limit = dir < 0 ? lower : upper;
    const side: Side = { points: [{ value: best, deltaChi2: 0 }] };
    sides.push(side);
    let t = step;
    let prev = best;
    for (let k = 0; k < 40; k++) {
      const v = dir < 0 ? Math.max(limit, best - t) : Math.min(limit, best + t);
      if (v === prev) break;
      const d = Math.max(0, deltaAt(v, prev));
      side.points.push({ value: v, deltaChi2: d });
      prev = v;
      if (d >= LEVEL_95 || v === limit) break;
      // Grow the step while Δχ² is small, so a flat direction is crossed in a few dozen refits.
      t *= d < 0.25 ? 2.5 : 1.6;
    }
    for (const level of [LEVEL_68, LEVEL_95]) {
      const key = `${dir < 0 ? "lo" : "hi"}${level === LEVEL_68 ? "68" : "95"}` as keyof typeof ends;
      const above = side.points.findIndex((p) => p.deltaChi2 >= level);
      if (above < 0) {
        ends[key] = side.points.at(-1)!.value;
        limited[key] = true;
        continue;
      }
      let a = side.points[above - 1]!;
      let b = side.points[above]!;
      const target = Math.sqrt(level);
      // Secant on √Δχ² − √level, kept inside the bracket [a, b] (regula falsi with bisection fallback).
      for (let it = 0; it < 30; it++) {
        const fa = Math.sqrt(a.deltaChi2) - target;
        const fb = Math.sqrt(b.deltaChi2) - target;
        let v = fb !== fa ? b.value - (fb * (b.value - a.value)) / (fb - fa) : (a.value + b.value) / 2;
        const lo = Math.min(a.value, b.value);
        const hi = Math.max(a.value, b.value);
        if (!(v > lo && v < hi)) v = (a.value + b.value) / 2;
        const d = Math.max(0, deltaAt(v, a.value));
        const point = { value: v, deltaChi2: d };
        side.points.push(point);
        if (Math.abs(Math.sqrt(d) - target) < precision || Math.abs(b.value - a.value) < 1e-12 * Math.max(1, Math.abs(v))) {
          a = point;
          b = point;
          break;
        }
        if (d < level) a = point;
        else b = point;
      }
      const fa = Math.sqrt(a.deltaChi2) - target;
      const fb = Math.sqrt(b.deltaChi2) - target;
      ends[key] = a === b || fb === fa ? a.value : a.value - (fa * (b.value - a.value)) / (fb - fa);
      limited[key] = false;
    }
  }
  const curve = sides
    .flatMap((s) => s.points)
    .sort((p, q) => p.value - q.value)
    .filter((p, i, all) => i === 0 || p.value !== all[i - 1]!.value);
  return {
    value: best,
    interval68: [ends.lo68, ends.hi68],
    interval95: [ends.lo95, ends.hi95],
    limited68: [limited.lo68 ?? false, limited.hi68 ?? false],
    limited95: [limited.lo95 ?? false, limited.hi95 ?? false],
    curve,
  };
}

/** A starting step for the scan: the Gaussian σ where it is usable, else a tenth of the spread. */
function scanStep(sigma: number, spread: readonly [number, number]): number {
  if (Number.isFinite(sigma) && sigma > 0) return sigma;
  return Math.max((spread[1] - spread[0]) / 10, 1e-12);
}

/** The profile of parameter `index`: each step refits every other parameter, warm-started from its neighbour. */
export function parameterProfile(
  problem: ChiSquareProblem,
  best: MinimizeResult,
  index: number,
  opts: MinimizeOptions = {},
): ProfileInterval {
  const solutions = new Map<number, Float64Array>([[best.x[index]!, best.x]]);
  let lowerMinimum: ProfileInterval["lowerMinimum"] = null;
  const deltaAt = (v: number, from: number) => {
    const fixed = new Map(opts.fixed ?? []);
    fixed.set(index, v);
    const fit = minimize(problem, { allowSingular: true, ...opts, starts: 1, fixed, start: solutions.get(from) ?? best.x });
    solutions.set(v, fit.x);
    if (fit.chi2 < best.chi2 - 1e-8 * Math.max(1, best.chi2) && (!lowerMinimum || fit.chi2 < lowerMinimum.chi2)) {
      lowerMinimum = { value: v, chi2: fit.chi2 };
    }
    return fit.chi2 - best.chi2;
  };
  const sigma = Math.sqrt(best.covariance.get(index, index));
  const scan = profileScan(deltaAt, best.x[index]!, scanStep(sigma, problem.spread[index]!), problem.lower[index]!, problem.upper[index]!);
  return { ...scan, lowerMinimum };
}

/**
 * The profile of a derived quantity g(x) (e.g. a magnetic share), over [lower, upper]: at each
 * target value g is held by a soft constraint with tolerance `tolerance` and every parameter refitted.
 */
export function functionProfile(
  problem: ChiSquareProblem,
  best: MinimizeResult,
  g: (x: Float64Array, columns: readonly number[] | null) => { value: number; gradient?: number[] },
  sigma: number,
  lower: number,
  upper: number,
  opts: MinimizeOptions = {},
): ProfileInterval {
  const atBest = g(best.x, null).value;
  const tolerance = Math.max(1e-4 * (Number.isFinite(sigma) && sigma > 0 ? sigma : 1), 1e-9);
  const solutions = new Map<number, Float64Array>([[atBest, best.x]]);
  let lowerMinimum: ProfileInterval["lowerMinimum"] = null;
  const deltaAt = (v: number, from: number) => {
    const constrained = withConstraint(problem, g, v, tolerance);
    const fit = minimize(constrained, {
      allowSingular: true,
      stepTolerance: 1e-8,
      ...opts,
      starts: 1,
      start: solutions.get(from) ?? best.x,
    });
    solutions.set(v, fit.x);
    // The χ² of the data and priors alone: the constraint row is the device, not a measurement.
    const last = fit.value.length - 1;
    const penalty = ((fit.value[last]! - v) / tolerance) ** 2;
    const chi2 = fit.chi2 - penalty;
    if (chi2 < best.chi2 - 1e-6 * Math.max(1, best.chi2) && (!lowerMinimum || chi2 < lowerMinimum.chi2)) lowerMinimum = { value: v, chi2 };
    return chi2 - best.chi2;
  };
  const step = Number.isFinite(sigma) && sigma > 0 ? Math.min(sigma, (upper - lower) / 4) : (upper - lower) / 20;
  // A share to about 1e-3 of its σ is plenty: √Δχ² to 2e-3 at the crossings.
  const scan = profileScan(deltaAt, Math.min(upper, Math.max(lower, atBest)), step, lower, upper, 2e-3);
  return { ...scan, lowerMinimum };
}
