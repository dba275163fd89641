/*
 * Small dense linear algebra for the planner's inner loop: the criterion of a design from its
 * Fisher information F = Σ nᵢ JᵢᵀJᵢ/σ² (in scaled parameters), evaluated thousands of times per
 * search. The reported figures of the final plans are recomputed with ml-matrix (fisher.ts), and a
 * test checks that both agree.
 *
 * Conditioning: F is first normalized to its correlation form R = D F D, D = diag(F)^-1/2, so the
 * Cholesky pivots are 1 − ρ² style numbers whatever the parameters' units. A pivot below
 * SINGULAR_PIVOT means the points cannot tell the parameters apart: the Jacobian is evaluated by
 * central differences to about 1e-8 relative (lib/fit/model.ts), and rows that are parallel in
 * the physics (same wavelength, another temperature or field) come out parallel to that level,
 * i.e. 1 − ρ² ≈ 1e-16…1e-14, far below this threshold, while two distinct wavelengths give
 * 1 − ρ² of order (spread of the ratio of the parts)², far above it.
 */

export const SINGULAR_PIVOT = 1e-10;

/** What the criterion asks of the covariance (in scaled parameters). */
export type CriterionSpec = { kind: "linear" /** σ² = hᵀ Cov h, h in scaled parameters. */; h: Float64Array } | { kind: "dOptimal" };

/**
 * Criterion value of a design from its p×p information (row-major, scaled parameters):
 * σ = √(hᵀ F⁻¹ h), or det(F⁻¹)^(1/2p) for D-optimal. Infinity when F is singular (relative pivot
 * below `pivotFloor`). `work` is scratch of length ≥ 2p² + 2p.
 */
export function criterionOf(info: Float64Array, p: number, spec: CriterionSpec, work: Float64Array, pivotFloor = SINGULAR_PIVOT): number {
  const d = work.subarray(0, p);
  const l = work.subarray(p, p + p * p);
  const y = work.subarray(p + p * p, 2 * p + p * p);
  for (let k = 0; k < p; k++) {
    const fkk = info[k * p + k]!;
    if (!(fkk > 0)) return Infinity;
    d[k] = 1 / Math.sqrt(fkk);
  }
  // Cholesky of R = D F D, lower triangle into l.
  let logDetR = 0;
  for (let i = 0; i < p; i++) {
    for (let j = 0; j <= i; j++) {
      let sum = info[i * p + j]! * d[i]! * d[j]!;
      for (let k = 0; k < j; k++) sum -= l[i * p + k]! * l[j * p + k]!;
      if (i === j) {
        if (!(sum > pivotFloor)) return Infinity;
        l[i * p + i] = Math.sqrt(sum);
        logDetR += Math.log(sum);
      } else {
        l[i * p + j] = sum / l[j * p + j]!;
      }
    }
  }
  if (spec.kind === "dOptimal") {
    // det Cov = det(F)⁻¹ = Π d_k² / det R.
    let logDetCov = -logDetR;
    for (let k = 0; k < p; k++) logDetCov += 2 * Math.log(d[k]!);
    return Math.exp(logDetCov / (2 * p));
  }
  // hᵀ F⁻¹ h = (D h)ᵀ R⁻¹ (D h) = |L⁻¹ D h|².
  let sumSq = 0;
  for (let i = 0; i < p; i++) {
    let sum = spec.h[i]! * d[i]!;
    for (let k = 0; k < i; k++) sum -= l[i * p + k]! * y[k]!;
    y[i] = sum / l[i * p + i]!;
    sumSq += y[i]! * y[i]!;
  }
  return Math.sqrt(sumSq);
}

/** target += scale·source for flat p×p matrices. */
export function addScaled(target: Float64Array, source: Float64Array, sourceOffset: number, pp: number, scale = 1): void {
  for (let k = 0; k < pp; k++) target[k] = target[k]! + scale * source[sourceOffset + k]!;
}
