import { Matrix } from "ml-matrix";
import { leastSquares } from "@/lib/fit/least-squares";
import { type ModelCondition, type NumericParamKey, evaluateModel, modelJacobian, withFreeValues } from "@/lib/fit/model";
import type { ModelParams } from "@/lib/physics/schema";
import type { AnalysisLayout } from "./layout";

/*
 * The expected Δχ² of a plan between a fixed magneticScale and the alternative, without
 * linearizing: the noise-free data of the alternative (the "Asimov" data set; Cowan, Cranmer,
 * Gross & Vitells, Eur. Phys. J. C 71 (2011) 1554, from memory) fitted with magneticScale held at
 * the tested value and every other varied parameter free, by the fit's own least-squares engine
 * (lib/fit/least-squares.ts). The priors and the field × length scale nuisance enter as pseudo-points
 * (a Gaussian prior is one more residual (x − mean)/σ; common practice, no source). χ² of the
 * alternative itself is 0 on its own noise-free data, so the minimum is the expected Δχ². The
 * linearized figure alternative²/σ² is the search's (fast) criterion; this one is what the plan
 * reports, because moving magneticScale by a whole unit pulls λE far outside the linear regime.
 */

export function asimovDeltaChi2(o: {
  layout: AnalysisLayout;
  /** The alternative's parameters (magneticScale at the alternative). */
  truth: ModelParams;
  tested: number;
  conditions: readonly ModelCondition[];
  /** σ of each condition's measurement. */
  sigma: ArrayLike<number>;
}): number {
  const { layout, truth, conditions } = o;
  const nuisanceKeys = layout.keys.filter((k) => k !== "magneticScale") as NumericParamKey[];
  const y = Array.from(evaluateModel(truth, conditions).value);
  const sigma = Array.from(o.sigma);
  const priors = layout.definition.priors.filter((p) => nuisanceKeys.includes(p.key as NumericParamKey));
  for (const p of priors) {
    y.push(truth[p.key as NumericParamKey] as number);
    sigma.push(p.sigma);
  }
  const scaleSigma = layout.withScale ? layout.definition.calibration.scaleSigma : 0;
  if (scaleSigma > 0) {
    y.push(1);
    sigma.push(scaleSigma);
  }
  const n = conditions.length;
  const p = nuisanceKeys.length + (scaleSigma > 0 ? 1 : 0);
  const held = { ...truth, magneticScale: o.tested } as ModelParams;
  if (p === 0) {
    const v = evaluateModel(held, conditions).value;
    return y.reduce((sum, yi, i) => sum + ((yi - v[i]!) / sigma[i]!) ** 2, 0);
  }
  const x0 = [...nuisanceKeys.map((k) => truth[k] as number), ...(scaleSigma > 0 ? [1] : [])];
  const lower = nuisanceKeys.map((k) => layout.jacobian.lower?.[k] ?? -Infinity);
  const jacobianOptions = { ...layout.jacobian, lower: Object.fromEntries(nuisanceKeys.map((k, i) => [k, lower[i]!])) };
  const result = leastSquares({
    y,
    sigma,
    x0,
    lower: [...lower, ...(scaleSigma > 0 ? [0] : [])],
    upper: x0.map(() => Infinity),
    names: [...nuisanceKeys, ...(scaleSigma > 0 ? ["scale"] : [])],
    model: (x, withJacobian) => {
      const params = withFreeValues(held, nuisanceKeys, x);
      const s = scaleSigma > 0 ? x[p - 1]! : 1;
      const value = new Float64Array(y.length);
      const pseudo = (out: Float64Array) => {
        priors.forEach((prior, j) => {
          out[n + j] = x[nuisanceKeys.indexOf(prior.key as NumericParamKey)]!;
        });
        if (scaleSigma > 0) out[n + priors.length] = s;
      };
      if (!withJacobian) {
        const v = evaluateModel(params, conditions).value;
        for (let i = 0; i < n; i++) value[i] = s * v[i]!;
        pseudo(value);
        return { value };
      }
      const jac = modelJacobian(params, nuisanceKeys, conditions, jacobianOptions);
      const jacobian = new Matrix(y.length, p);
      for (let i = 0; i < n; i++) {
        value[i] = s * jac.value[i]!;
        for (let j = 0; j < nuisanceKeys.length; j++) jacobian.set(i, j, s * jac.valueJacobian.get(i, j));
        if (scaleSigma > 0) jacobian.set(i, p - 1, jac.value[i]!);
      }
      pseudo(value);
      priors.forEach((prior, j) => {
        jacobian.set(n + j, nuisanceKeys.indexOf(prior.key as NumericParamKey), 1);
      });
      if (scaleSigma > 0) jacobian.set(n + priors.length, p - 1, 1);
      return { value, jacobian };
    },
  });
  return result.chi2;
}
