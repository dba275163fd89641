import { evaluateModel, type ModelCondition } from "@/lib/fit/model";
import type { ModelParams } from "@/lib/physics/schema";

/*
 * The sign check of measured values against the model: one home for the rule the fit
 * (lib/fit/problem.ts) and the upload share. A value is "opposite" when it and the model's
 * prediction at its own conditions have strictly opposite signs; a zero or undefined prediction
 * (B = 0, a Verdet constant at B0 = 0) and a measured zero compare with nothing. Vendor sheets
 * often quote |V| (shared/materials-sources.md §0: many give magnitudes only), so a file whose
 * every value is opposite is most likely a file of magnitudes.
 */

/** What a sign check needs of a point: its conditions and its measured value (in SI). */
export interface SignedValue extends ModelCondition {
  value: number;
}

/** The value and the prediction have strictly opposite signs (a 0 or NaN on either side never is). */
export const isOppositeSign = (value: number, predicted: number): boolean => value * predicted < 0;

/** The magnitude of the value with the sign of the prediction; the value as it is where the prediction is 0 or undefined. */
export const withModelSign = (value: number, predicted: number): number => Math.sign(predicted) * Math.abs(value) || value;

export interface SignCheckResult {
  /** Values whose sign is opposite to the model's prediction at their conditions. */
  opposite: number;
  /** Values that could be compared: a non-zero value and a non-zero, defined prediction. */
  compared: number;
  total: number;
  /** Every compared value is opposite (and at least one was compared): the values are likely magnitudes. */
  allOpposite: boolean;
  /** Every non-zero value has the same sign, as a file of magnitudes has. */
  oneSign: boolean;
  /** The model's prediction at each value's conditions (rad/(T·m) or rad, as the value). */
  predicted: Float64Array;
}

/** The sign comparison of values with the model's predictions for them: the one rule the upload and the fit share. */
export function compareSigns(values: ArrayLike<number>, predicted: ArrayLike<number>): Omit<SignCheckResult, "predicted"> {
  let opposite = 0;
  let compared = 0;
  let positive = 0;
  let negative = 0;
  for (let i = 0; i < values.length; i++) {
    const v = values[i]!;
    const p = predicted[i]!;
    if (v > 0) positive++;
    else if (v < 0) negative++;
    if (v !== 0 && p !== 0 && Number.isFinite(p)) compared++;
    if (isOppositeSign(v, p)) opposite++;
  }
  return {
    opposite,
    compared,
    total: values.length,
    allOpposite: compared > 0 && opposite === compared,
    oneSign: positive === 0 || negative === 0,
  };
}

/** Counts the values with the sign opposite to the model's prediction for `params` on the analytic path the fit uses. */
export function checkSigns(params: ModelParams, values: readonly SignedValue[]): SignCheckResult {
  const predicted = evaluateModel(params, values).value;
  return {
    ...compareSigns(
      values.map((v) => v.value),
      predicted,
    ),
    predicted,
  };
}

/** The values as magnitudes with the model's sign at their own conditions (those with no prediction are kept as they are). */
export function takeModelSigns<V extends SignedValue>(params: ModelParams, values: readonly V[]): { values: V[]; changed: number } {
  const predicted = evaluateModel(params, values).value;
  let changed = 0;
  const signed = values.map((v, i) => {
    const value = withModelSign(v.value, predicted[i]!);
    if (value === v.value) return v;
    changed++;
    return { ...v, value };
  });
  return { values: signed, changed };
}
