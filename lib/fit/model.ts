import { Matrix } from "ml-matrix";
import type { MeasuredQuantity } from "@/lib/measurements/point";
import type { ModelParams } from "@/lib/physics/schema";
import { computeSpectrumArrays } from "@/lib/physics/spectrum";

/*
 * The forward model that the fit and the planner share: the analytic spectrum of
 * physics-model.md §6 evaluated at arbitrary measurement conditions (each point its own
 * wavelength, temperature, field and length), and its Jacobian with respect to the free
 * parameters. One module, so the planner's Fisher information JᵀWJ is built from exactly the
 * Jacobian the fit uses.
 */

/** The conditions of one point; the value it is compared with lives elsewhere. */
export interface ModelCondition {
  wavelengthNm: number;
  temperatureK: number;
  fieldT: number;
  lengthM: number;
  quantity: MeasuredQuantity;
}

/** Model parameters that are numbers, and so may be freed in a fit (booleans never are). */
export type NumericParamKey = { [K in keyof ModelParams]-?: ModelParams[K] extends number ? K : never }[keyof ModelParams];

/** Conditions belong to each point, not to the fit: they are never free. */
const CONDITION_KEYS = new Set<string>(["temperatureK", "fieldT", "lengthM"]);

/** The material keys of a parameter set that hold numbers, in the set's own order. */
export function freeableKeys(params: ModelParams): NumericParamKey[] {
  return (Object.keys(params) as (keyof ModelParams)[]).filter(
    (k): k is NumericParamKey => typeof params[k] === "number" && !CONDITION_KEYS.has(k),
  );
}

export interface ModelEvaluation {
  /** Model value per point: rad/(T·m) for "verdet", rad for "rotation". NaN where undefined (B0 = 0 for a Verdet constant). */
  value: Float64Array;
  /** |θm| / (|θe| + |θm|) per point; NaN where both parts are 0. */
  magneticShare: Float64Array;
}

const groupKey = (c: ModelCondition) => `${c.temperatureK}|${c.fieldT}|${c.lengthM}`;

/**
 * Calls `visit` once per group of points that share temperature, field and length, with the
 * analytic spectrum of that group (its wavelengths sorted and de-duplicated, as the engine wants)
 * and, for each point of the group, its column in that spectrum. One home for the grouping that
 * the fit's model and the planner's optics both need.
 */
export function forEachConditionGroup(
  params: ModelParams,
  points: readonly ModelCondition[],
  visit: (arrays: ReturnType<typeof computeSpectrumArrays>, members: { index: number; column: number }[]) => void,
): void {
  const groups = new Map<string, number[]>();
  points.forEach((p, i) => {
    const key = groupKey(p);
    const list = groups.get(key);
    if (list) list.push(i);
    else groups.set(key, [i]);
  });
  for (const indices of groups.values()) {
    const first = points[indices[0]!]!;
    const wavelengthsNm = [...new Set(indices.map((i) => points[i]!.wavelengthNm))].sort((a, b) => a - b);
    const arrays = computeSpectrumArrays({
      ...params,
      temperatureK: first.temperatureK,
      fieldT: first.fieldT,
      lengthM: first.lengthM,
      wavelengthsNm,
      method: "analytic",
    });
    const column = new Map<number, number>(wavelengthsNm.map((w, j) => [w, j]));
    visit(
      arrays,
      indices.map((index) => ({ index, column: column.get(points[index]!.wavelengthNm)! })),
    );
  }
}

/** Evaluates the analytic model at every point, one spectrum call per group of shared conditions. */
export function evaluateModel(params: ModelParams, points: readonly ModelCondition[]): ModelEvaluation {
  const value = new Float64Array(points.length);
  const magneticShare = new Float64Array(points.length);
  forEachConditionGroup(params, points, (arrays, members) => {
    for (const { index, column } of members) {
      value[index] = points[index]!.quantity === "verdet" ? arrays.verdetRadPerTm[column]! : arrays.thetaRad[column]!;
      magneticShare[index] = arrays.magneticShare[column]!;
    }
  });
  return { value, magneticShare };
}

/** A copy of params with the free keys set to values (same order). */
export function withFreeValues(params: ModelParams, keys: readonly NumericParamKey[], values: ArrayLike<number>): ModelParams {
  const next: Record<string, unknown> = { ...params };
  keys.forEach((k, i) => {
    next[k] = values[i]!;
  });
  return next as ModelParams;
}

/**
 * Relative step of the central differences. The analytic model is smooth and evaluated to about
 * 1e-13 relative (physics-model.md §6.2), so a step near the cube root of that error balances
 * truncation (∝ h²) against round-off (∝ ε/h): common practice, no source.
 */
export const JACOBIAN_RELATIVE_STEP = 1e-5;

/** Step for one parameter: relative to its value, or to a typical scale when the value is 0. */
function stepFor(value: number, typicalScale: number): number {
  return JACOBIAN_RELATIVE_STEP * Math.max(Math.abs(value), typicalScale);
}

export interface ModelJacobian extends ModelEvaluation {
  /** ∂value/∂parameter: one row per point, one column per free key. */
  valueJacobian: Matrix;
  /** ∂magneticShare/∂parameter, same shape. */
  shareJacobian: Matrix;
}

export interface JacobianOptions {
  /** Typical magnitude per key, used for the step when a value is 0 (default 1). */
  typicalScale?: Partial<Record<NumericParamKey, number>>;
  /**
   * Lowest valid value per key (e.g. 0 for magneticScale). Where x − h would fall below it, the
   * derivative is taken one-sided, (−3f(x) + 4f(x+h) − f(x+2h)) / 2h, which is second order like
   * the central difference (common practice, no source).
   */
  lower?: Partial<Record<NumericParamKey, number>>;
}

/** Model values, shares and their Jacobians by central differences on the analytic path. */
export function modelJacobian(
  params: ModelParams,
  keys: readonly NumericParamKey[],
  points: readonly ModelCondition[],
  opts: JacobianOptions = {},
): ModelJacobian {
  const base = evaluateModel(params, points);
  const valueJacobian = new Matrix(points.length, keys.length);
  const shareJacobian = new Matrix(points.length, keys.length);
  keys.forEach((key, col) => {
    const x = params[key] as number;
    const h = stepFor(x, opts.typicalScale?.[key] ?? 1);
    const plus = evaluateModel({ ...params, [key]: x + h }, points);
    const lower = opts.lower?.[key];
    if (lower !== undefined && x - h < lower) {
      const plus2 = evaluateModel({ ...params, [key]: x + 2 * h }, points);
      const forward = (f0: Float64Array, f1: Float64Array, f2: Float64Array, i: number) => (-3 * f0[i]! + 4 * f1[i]! - f2[i]!) / (2 * h);
      for (let i = 0; i < points.length; i++) {
        valueJacobian.set(i, col, forward(base.value, plus.value, plus2.value, i));
        shareJacobian.set(i, col, forward(base.magneticShare, plus.magneticShare, plus2.magneticShare, i));
      }
      return;
    }
    const minus = evaluateModel({ ...params, [key]: x - h }, points);
    for (let i = 0; i < points.length; i++) {
      valueJacobian.set(i, col, (plus.value[i]! - minus.value[i]!) / (2 * h));
      shareJacobian.set(i, col, (plus.magneticShare[i]! - minus.magneticShare[i]!) / (2 * h));
    }
  });
  return { ...base, valueJacobian, shareJacobian };
}
