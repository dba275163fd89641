import erfcinv from "@stdlib/math-base-special-erfcinv";
import gammainc from "@stdlib/math-base-special-gammainc";
import tQuantile from "@stdlib/stats-base-dists-t-quantile";

/*
 * The few distribution functions the inference needs, on stdlib's implementations. Tails are
 * computed directly (not as 1 − CDF), so a p-value of 1e-30 keeps its digits and a 12σ result
 * reads 12σ.
 */

/** P(χ²_k > x): the upper regularised incomplete gamma function Q(k/2, x/2) (Abramowitz & Stegun 26.4.19 with 6.5.3). */
export function chiSquareSurvival(x: number, k: number): number {
  if (!(x > 0)) return 1;
  return gammainc(x / 2, k / 2, true, true);
}

/** z with P(Z > z) = p for a standard normal Z, i.e. Φ⁻¹(1 − p) = √2·erfc⁻¹(2p) (A&S 26.2.2 with 7.1.2). */
export function normalUpperQuantile(p: number): number {
  if (!(p < 1)) return Number.NEGATIVE_INFINITY;
  if (!(p > 0)) return Number.POSITIVE_INFINITY;
  return Math.SQRT2 * erfcinv(2 * p);
}

/** The Student-t quantile with dof degrees of freedom (two-sided coverage c ↦ t at (1 + c)/2). */
export function studentTHalfWidth(coverage: number, dof: number): number {
  return tQuantile((1 + coverage) / 2, dof);
}

/** The standard normal quantile at (1 + coverage)/2: 1 for 68.27 %, 2 for 95.45 %. */
export function normalHalfWidth(coverage: number): number {
  return normalUpperQuantile((1 - coverage) / 2);
}

/** Coverage of ±1σ and ±2σ of a normal distribution: erf(1/√2) and erf(√2) (A&S 26.2.2). */
export const COVERAGE_68 = 0.682689492137086;
export const COVERAGE_95 = 0.954499736103642;

/** A significance in σ as printed. */
export function formatSignificance(z: number): string {
  return Number.isFinite(z) ? `${z.toFixed(1)}σ` : "–";
}
