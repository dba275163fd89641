import { Matrix } from "ml-matrix";
import { describe, expect, it } from "vitest";
import { FitCancelledError, FitError, fitMeasurements } from "@/lib/fit/fit";
import { leastSquares } from "@/lib/fit/least-squares";
import { evaluateModel, modelJacobian } from "@/lib/fit/model";
import type { ModelParams } from "@/lib/physics/schema";
import { computeSpectrum } from "@/lib/physics/spectrum";
import { TGG } from "../physics/fixtures";
import { evenly, seededGaussian, syntheticPoints, verdetAt } from "./support";

const base: ModelParams = { ...TGG, temperatureK: 293.15, fieldT: 1, lengthM: 0.01 };
const DEFAULT_FREE = [{ key: "gyrationPerT" as const }, { key: "oscillatorWavelengthNm" as const }, { key: "magneticScale" as const }];
const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);

/*
 * Synthetic truth: a terbium-garnet-like set whose magnetic-dipole part is three times the
 * first-principles one (invented for the test), measured as Verdet constants over 400–1600 nm at
 * two temperatures. The fit starts from the §9 values.
 */
const truth: ModelParams = { ...base, gyrationPerT: 5.0e-3, oscillatorWavelengthNm: 270, magneticScale: 3 };
const conditions = [
  ...evenly(400, 1600, 20).map((w) => verdetAt(w)),
  ...evenly(450, 1550, 10).map((w) => verdetAt(w, { temperatureK: 200 })),
];
const SIGMA = 0.5; // rad/(T·m)

describe("closed form: a model linear in its parameters", () => {
  /*
   * V = a·u(λ) + b·w(λ) + c with fixed basis functions (the first-order dispersion of
   * physics-model.md §5.4 with constant n: u = 1/(λ² − λE²), a flat w = 1, and a linear drift).
   * The textbook weighted least-squares solution is β = (XᵀWX)⁻¹XᵀWy with covariance (XᵀWX)⁻¹
   * (e.g. Press et al., Numerical Recipes, 3rd ed., §15.4). It is computed here by Gauss–Jordan
   * elimination on the 3×3 normal equations, independently of the solver's own algebra.
   */
  const lambdaE = 258;
  const wl = evenly(350, 1600, 40);
  const basis = (l: number) => [1e6 / (l * l - lambdaE * lambdaE), 1, l / 1000];
  const X = wl.map(basis);
  const gauss = seededGaussian(11);
  const sigma = wl.map((l) => 0.2 + 0.001 * l);
  const y = wl.map((l, i) => -80 * basis(l)[0]! + 4.5 - 1.2 * basis(l)[2]! + sigma[i]! * gauss());

  function textbookNormalEquations(): { beta: number[]; cov: number[][] } {
    const p = 3;
    const a = Array.from({ length: p }, () => new Array<number>(p).fill(0));
    const b = new Array<number>(p).fill(0);
    X.forEach((row, i) => {
      const w = 1 / sigma[i]! ** 2;
      for (let j = 0; j < p; j++) {
        b[j]! += w * row[j]! * y[i]!;
        for (let k = 0; k < p; k++) a[j]![k]! += w * row[j]! * row[k]!;
      }
    });
    // Gauss–Jordan on [A | I | b] gives A⁻¹ and A⁻¹b together.
    const aug = a.map((row, j) => [...row, ...Array.from({ length: p }, (_, k) => (j === k ? 1 : 0)), b[j]!]);
    for (let c = 0; c < p; c++) {
      let pivot = c;
      for (let r = c + 1; r < p; r++) if (Math.abs(aug[r]![c]!) > Math.abs(aug[pivot]![c]!)) pivot = r;
      [aug[c], aug[pivot]] = [aug[pivot]!, aug[c]!];
      const d = aug[c]![c]!;
      aug[c] = aug[c]!.map((v) => v / d);
      for (let r = 0; r < p; r++) {
        if (r === c) continue;
        const f = aug[r]![c]!;
        aug[r] = aug[r]!.map((v, k) => v - f * aug[c]![k]!);
      }
    }
    return { beta: aug.map((row) => row[2 * p]!), cov: aug.map((row) => row.slice(p, 2 * p)) };
  }

  it("equals the weighted normal-equations solution to 1e-9 relative, values and covariance", () => {
    const expected = textbookNormalEquations();
    const result = leastSquares({
      y,
      sigma,
      x0: [0, 0, 0],
      model: (x) => {
        const value = Float64Array.from(X, (row) => row[0]! * x[0]! + row[1]! * x[1]! + row[2]! * x[2]!);
        return { value, jacobian: new Matrix(X) };
      },
    });
    expect(result.converged).toBe(true);
    for (let j = 0; j < 3; j++) {
      expect(rel(result.x[j]!, expected.beta[j]!)).toBeLessThan(1e-9);
      for (let k = 0; k < 3; k++) expect(rel(result.covariance.get(j, k), expected.cov[j]![k]!)).toBeLessThan(1e-9);
    }
  });
});

describe("closed form: the full model with oscillatorWavelengthNm fixed", () => {
  /*
   * With λE fixed, V = κE·u(λ) + k·w(λ) + δ, where u = V_e/κE and w = V_m/k are taken from the
   * engine's own split at the §9 values (physics-model.md §5.4 and §4.3: V_e ∝ κE and V_m ∝ k to
   * first order in G and χ±). δ, the nonlinearity, holds the higher orders in G and χ± and the
   * cross term θx (§6.2, about 1e-10 of θ). Its size is measured below and bounds how far the fit
   * may stand from the linear solution.
   */
  it("agrees with the linear solution within the model's nonlinearity", () => {
    const wl = evenly(400, 1600, 30);
    const conds = wl.map((w) => verdetAt(w));
    const points = syntheticPoints(truth, conds, SIGMA, seededGaussian(5));
    const fixedLambda = { ...base, oscillatorWavelengthNm: truth.oscillatorWavelengthNm };
    const split = computeSpectrum({ ...fixedLambda, wavelengthsNm: wl, method: "analytic" }).points;
    const uAt = split.map((p) => p.thetaElectricRad / (base.fieldT * base.lengthM) / fixedLambda.gyrationPerT);
    const w = split.map((p) => p.thetaMagneticRad / (base.fieldT * base.lengthM) / fixedLambda.magneticScale);

    // Linear weighted least squares in (κE, k) by the 2×2 normal equations (Cramer's rule).
    let s11 = 0,
      s12 = 0,
      s22 = 0,
      b1 = 0,
      b2 = 0;
    points.forEach((p, i) => {
      const wt = 1 / p.sigma ** 2;
      s11 += wt * uAt[i]! ** 2;
      s12 += wt * uAt[i]! * w[i]!;
      s22 += wt * w[i]! ** 2;
      b1 += wt * uAt[i]! * p.value;
      b2 += wt * w[i]! * p.value;
    });
    const det = s11 * s22 - s12 * s12;
    const linear = [(s22 * b1 - s12 * b2) / det, (s11 * b2 - s12 * b1) / det];
    // H = (XᵀWX)⁻¹XᵀW maps a change of the data to a change of the linear solution.
    const H = points.map((p, i) => {
      const wt = 1 / p.sigma ** 2;
      return [((s22 * uAt[i]! - s12 * w[i]!) * wt) / det, ((s11 * w[i]! - s12 * uAt[i]!) * wt) / det];
    });

    const fit = fitMeasurements({ params: fixedLambda, free: [{ key: "gyrationPerT" }, { key: "magneticScale" }], points });
    const kappa = fit.values.gyrationPerT!;
    const scale = fit.values.magneticScale!;

    // The nonlinearity at the fitted values, relative to V.
    const exact = evaluateModel({ ...fixedLambda, gyrationPerT: kappa, magneticScale: scale }, conds).value;
    const delta = wl.map((_, i) => exact[i]! - (kappa * uAt[i]! + scale * w[i]!));
    const eta = Math.max(...delta.map((d, i) => Math.abs(d) / Math.abs(exact[i]!)));
    // Its size: 1.3e-9 of V for these values (measured when this test was written).
    expect(eta).toBeLessThan(1e-8);
    expect(eta).toBeGreaterThan(0);

    // δ moves the solution by H·δ; allow twice that bound (plus the Jacobian's 1e-10 differences).
    for (let j = 0; j < 2; j++) {
      const bound = H.reduce((sum, h, i) => sum + Math.abs(h[j]!) * Math.abs(delta[i]!), 0);
      const got = j === 0 ? kappa : scale;
      expect(Math.abs(got - linear[j]!)).toBeLessThanOrEqual(2 * bound + 1e-10 * Math.abs(linear[j]!));
    }
    // And the reported σ equals the linear (XᵀWX)⁻¹ to the same order.
    expect(rel(fit.sigmasUnscaled.gyrationPerT!, Math.sqrt(s22 / det))).toBeLessThan(1e-6);
    expect(rel(fit.sigmasUnscaled.magneticScale!, Math.sqrt(s11 / det))).toBeLessThan(1e-6);
  });
});

describe("fit on synthetic data", () => {
  it("recovers the true values within 3σ and reports the share at every point", () => {
    const points = syntheticPoints(truth, conditions, SIGMA, seededGaussian(42));
    const fit = fitMeasurements({ params: base, free: DEFAULT_FREE, points });
    expect(fit.converged).toBe(true);
    expect(fit.dof).toBe(points.length - 3);
    for (const key of ["gyrationPerT", "oscillatorWavelengthNm", "magneticScale"] as const) {
      expect(Math.abs(fit.values[key]! - truth[key])).toBeLessThan(3 * fit.sigmas[key]!);
    }
    expect(fit.sigmaScaledByChi2).toBe(false);
    expect(fit.sigmas).toEqual(fit.sigmasUnscaled);
    for (const key of fit.free)
      expect(rel(fit.sigmasScaled[key]!, fit.sigmasUnscaled[key]! * Math.sqrt(fit.reducedChi2))).toBeLessThan(1e-12);
    expect(fit.points).toHaveLength(points.length);
    const trueShares = evaluateModel(truth, conditions).magneticShare;
    fit.points.forEach((p, i) => {
      expect(p.magneticShare).not.toBeNull();
      expect(p.magneticShareSigma!).toBeGreaterThan(0);
      expect(Math.abs(p.magneticShare! - trueShares[i]!)).toBeLessThan(4 * p.magneticShareSigma!);
      expect(p.normalizedResidual).toBeCloseTo((p.measured - p.model) / p.sigma, 12);
    });
    expect(fit.separation.separable).toBe(true);
    expect(fit.correlation[0]![0]).toBe(1);
    expect(fit.correlation[0]![2]).toBeCloseTo(fit.correlation[2]![0]!, 12);
  });

  it("reports σ that match the scatter of the fitted values over 200 seeded draws (within 20 %)", () => {
    const draws = 200;
    const keys = ["gyrationPerT", "oscillatorWavelengthNm", "magneticScale"] as const;
    const values: Record<string, number[]> = Object.fromEntries(keys.map((k) => [k, []]));
    const sigmas: Record<string, number[]> = Object.fromEntries(keys.map((k) => [k, []]));
    const shares: number[] = [];
    const shareSigmas: number[] = [];
    const at1064 = conditions.findIndex((c) => c.temperatureK === 293.15 && c.wavelengthNm > 1000);
    for (let d = 0; d < draws; d++) {
      const fit = fitMeasurements({
        params: base,
        free: DEFAULT_FREE,
        points: syntheticPoints(truth, conditions, SIGMA, seededGaussian(1000 + d)),
      });
      for (const k of keys) {
        values[k]!.push(fit.values[k]!);
        sigmas[k]!.push(fit.sigmas[k]!);
      }
      shares.push(fit.points[at1064]!.magneticShare!);
      shareSigmas.push(fit.points[at1064]!.magneticShareSigma!);
    }
    const mean = (a: number[]) => a.reduce((s, v) => s + v, 0) / a.length;
    const std = (a: number[]) => Math.sqrt(a.reduce((s, v) => s + (v - mean(a)) ** 2, 0) / (a.length - 1));
    // The standard deviation of a sample of 200 has a relative standard error of about
    // 1/√(2·199) = 5 % (common practice, no source), so 20 % is four of those.
    const ratios: Record<string, number> = {};
    for (const k of keys) {
      ratios[k] = std(values[k]!) / mean(sigmas[k]!);
      expect(ratios[k]).toBeGreaterThan(0.8);
      expect(ratios[k]).toBeLessThan(1.2);
    }
    ratios.magneticShare = std(shares) / mean(shareSigmas);
    expect(ratios.magneticShare).toBeGreaterThan(0.8);
    expect(ratios.magneticShare).toBeLessThan(1.2);
    console.info(
      `fit σ check over ${draws} draws, scatter / reported σ: ${Object.entries(ratios)
        .map(([k, r]) => `${k} ${r.toFixed(3)}`)
        .join(", ")}`,
    );
  }, 120_000);
});

describe("separation verdict", () => {
  it("says in words when the data cannot tell the parts apart", () => {
    // A narrow band far above λE: both parts are nearly flat there, so they trade off.
    const narrow = evenly(1500, 1560, 12).map((w) => verdetAt(w));
    const fit = fitMeasurements({
      params: base,
      free: [{ key: "gyrationPerT" }, { key: "magneticScale" }],
      points: syntheticPoints(truth, narrow, SIGMA, seededGaussian(3)),
    });
    expect(fit.separation.separable).toBe(false);
    expect(Math.abs(fit.separation.amplitudeCorrelation!)).toBeGreaterThan(0.95);
    expect(fit.separation.reasons.join(" ")).toMatch(/cannot tell the two parts apart/);
  });

  it("does not call a split measured when magneticScale is held fixed", () => {
    const fit = fitMeasurements({
      params: base,
      free: [{ key: "gyrationPerT" }],
      points: syntheticPoints(truth, conditions, SIGMA, seededGaussian(4)),
    });
    expect(fit.separation.separable).toBe(false);
    expect(fit.separation.reasons[0]).toMatch(/must both be free/);
  });
});

describe("options and errors", () => {
  const points = syntheticPoints(truth, conditions, SIGMA, seededGaussian(8));

  it("scales σ and the share σ by √(χ²/dof) on request, never below 1, and not at dof < 3", () => {
    // σ stated at half the true scatter: χ²/dof ≈ 4, so scaling doubles σ.
    const understated = points.map((p) => ({ ...p, sigma: p.sigma / 2 }));
    const plain = fitMeasurements({ params: base, free: DEFAULT_FREE, points: understated });
    const scaled = fitMeasurements({ params: base, free: DEFAULT_FREE, points: understated, scaleByChi2: true });
    expect(plain.reducedChi2).toBeGreaterThan(2);
    const f = Math.sqrt(plain.reducedChi2);
    expect(scaled.sigmaScaledByChi2).toBe(true);
    expect(scaled.sigmaScale).toBeCloseTo(f, 9);
    for (const k of plain.free) expect(rel(scaled.sigmas[k]!, plain.sigmas[k]! * f)).toBeLessThan(1e-9);
    expect(rel(scaled.points[5]!.magneticShareSigma!, plain.points[5]!.magneticShareSigma! * f)).toBeLessThan(1e-9);
    // σ stated at twice the scatter: χ²/dof ≈ 1/4, and scaling leaves σ unchanged.
    const overstated = points.map((p) => ({ ...p, sigma: p.sigma * 2 }));
    const loose = fitMeasurements({ params: base, free: DEFAULT_FREE, points: overstated });
    const looseScaled = fitMeasurements({ params: base, free: DEFAULT_FREE, points: overstated, scaleByChi2: true });
    expect(loose.reducedChi2).toBeLessThan(0.5);
    expect(looseScaled.sigmaScale).toBe(1);
    for (const k of loose.free) expect(looseScaled.sigmas[k]).toBe(loose.sigmas[k]);
    // Four points, two free: dof = 2 is too few to estimate σ from the scatter.
    expect(() => fitMeasurements({ params: base, free: DEFAULT_FREE.slice(0, 2), points: points.slice(0, 4), scaleByChi2: true })).toThrow(
      /at least 3 degrees of freedom/,
    );
  });

  it("keeps a parameter inside its bounds and says it ended on one", () => {
    const fit = fitMeasurements({
      params: base,
      free: [{ key: "gyrationPerT" }, { key: "oscillatorWavelengthNm" }, { key: "magneticScale", min: 0, max: 2 }],
      points,
    });
    expect(fit.values.magneticScale).toBe(2);
    expect(fit.atBound).toEqual(["magneticScale"]);
  });

  it("starts from magneticScale = 0, the edge of its valid range, with one-sided derivatives there", () => {
    const fit = fitMeasurements({ params: { ...base, magneticScale: 0 }, free: DEFAULT_FREE, points });
    expect(Math.abs(fit.values.magneticScale! - truth.magneticScale)).toBeLessThan(3 * fit.sigmas.magneticScale!);
    // The one-sided derivative agrees with the central one where both exist (θm is linear in the
    // scale to first order in χ, physics-model.md §8, so both are the same slope).
    const conds = conditions.slice(0, 5);
    const central = modelJacobian({ ...base, magneticScale: 1e-3 }, ["magneticScale"], conds).valueJacobian;
    const oneSided = modelJacobian({ ...base, magneticScale: 1e-3 }, ["magneticScale"], conds, {
      lower: { magneticScale: 1e-3 },
    }).valueJacobian;
    for (let i = 0; i < conds.length; i++) expect(rel(oneSided.get(i, 0), central.get(i, 0))).toBeLessThan(1e-6);
  });

  it("stops when cancelled", () => {
    let calls = 0;
    expect(() => fitMeasurements({ params: base, free: DEFAULT_FREE, points }, { shouldCancel: () => ++calls > 2 })).toThrow(
      FitCancelledError,
    );
  });

  it("refuses too few points, a duplicate key and a start outside the bounds with a clear message", () => {
    expect(() => fitMeasurements({ params: base, free: DEFAULT_FREE, points: points.slice(0, 3) })).toThrow(
      /needs more points than free parameters/,
    );
    expect(() => fitMeasurements({ params: base, free: [{ key: "gyrationPerT" }, { key: "gyrationPerT" }], points })).toThrow(
      /listed twice/,
    );
    expect(() => fitMeasurements({ params: base, free: [{ key: "magneticScale", min: 2, max: 4 }], points })).toThrow(FitError);
    expect(() => fitMeasurements({ params: base, free: [{ key: "temperatureK" as never }], points })).toThrow(
      /not a model parameter that a fit can free/,
    );
    expect(() =>
      fitMeasurements({ params: base, free: DEFAULT_FREE, points: points.map((p, i) => (i === 4 ? { ...p, fieldT: 0 } : p)) }),
    ).toThrow(/line 6: a Verdet constant needs a nonzero field/);
  });

  it("names a free parameter the data cannot determine, and shows a near-degenerate pair in the correlation", () => {
    // With magneticScale = 0 the magnetic-dipole part is exactly 0 (physics-model.md §8), so the
    // Gilbert damping has no effect on V at all.
    expect(() =>
      fitMeasurements({ params: { ...base, magneticScale: 0 }, free: [{ key: "gyrationPerT" }, { key: "gilbertDamping" }], points }),
    ).toThrow(/gilbertDamping does not change the model at these points/);
    // κE and N enter the electric part only through their product κE·μ0M0 (§5.2, linear in N in
    // the low-field regime); N also sets ωM of the small magnetic part, so the pair is resolvable
    // in principle but nearly degenerate.
    const fit = fitMeasurements({ params: base, free: [{ key: "gyrationPerT" }, { key: "ionDensityPerM3" }], points });
    expect(Math.abs(fit.correlation[0]![1]!)).toBeGreaterThan(0.99);
  });
});
