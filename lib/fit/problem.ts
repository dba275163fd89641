import { Matrix } from "ml-matrix";
import type { MeasuredPoint } from "@/lib/measurements/point";
import { type SignCheckResult, compareSigns, withModelSign } from "@/lib/measurements/sign-check";
import type { ModelParams } from "@/lib/physics/schema";
import { type FreeableKey, NATURAL_LOWER, effectiveVariance, variedKeys } from "@/lib/analysis/definition";
import type { ChiSquareProblem } from "./minimize";
import { type JacobianOptions, type ModelCondition, type NumericParamKey, evaluateModel, modelJacobian, withFreeValues } from "./model";
import { type FitRequest, type FitSet, requestSets } from "./schema";

/*
 * The physics fit as a χ² problem (lib/fit/minimize.ts). Parameters: the varied model keys (the
 * free ones, then those that carry only a prior), then one field × length scale factor per
 * measurement set whose calibration has a scale σ. Rows: every point of every set, then one row
 * per prior, then one per scale factor (its prior 1 ± scaleSigma). θ ∝ B·L in the linear regime
 * (physics-model.md §6), so a miscalibrated field or length multiplies a set's model values by one
 * factor. A point's σ is its effective σ: its own, the set's relative floor and its temperature σ
 * propagated through the model, in quadrature (effectiveVariance of the analysis definition).
 */

export interface FitRow {
  set: number;
  point: MeasuredPoint;
  /** The value fitted: the measured one, or its magnitude with the model's sign when asked. */
  value: number;
  /** The effective σ of the point. */
  sigma: number;
}

export interface PhysicsProblem extends ChiSquareProblem {
  sets: FitSet[];
  rows: FitRow[];
  conditions: ModelCondition[];
  /** The varied model keys, the first entries of names. */
  keys: NumericParamKey[];
  /** Index of each set's scale factor in names, or −1 when the set has none. */
  scaleIndex: number[];
  /** Number of data rows (the first rows of y). */
  dataCount: number;
  /** The parameter set at x. */
  paramsAt: (x: ArrayLike<number>) => ModelParams;
  /** The model's sign check at the starting values (the upload's rule, lib/measurements/sign-check.ts). */
  signs: Omit<SignCheckResult, "predicted">;
  /** Step scales and lower limits for the model's Jacobian (one-sided at a lower bound). */
  jacobianOptions: JacobianOptions;
  /** The magnetic share at one condition and, with columns, its gradient over those parameter indices. */
  shareAt: (x: Float64Array, condition: ModelCondition, columns: readonly number[] | null) => { value: number; gradient?: number[] };
}

/** The name of a set's field × length scale factor among the fitted values. */
export const scaleName = (setName: string) => `fieldLengthScale[${setName}]`;
/** The set a scale factor's name belongs to, or null for a model key. */
export const setOfScaleName = (name: string) => /^fieldLengthScale\[(.*)\]$/s.exec(name)?.[1] ?? null;

/** How far extra starts range around a value with no finite bound on that side: ±50 % (±1 when it is 0). */
function spreadOf(x0: number, lower: number, upper: number, prior: { mean: number; sigma: number } | undefined): [number, number] {
  if (prior) return [Math.max(lower, prior.mean - 2 * prior.sigma), Math.min(upper, prior.mean + 2 * prior.sigma)];
  if (Number.isFinite(lower) && Number.isFinite(upper)) return [lower, upper];
  const half = Math.abs(x0) * 0.5 || 1;
  if (Number.isFinite(lower)) return [lower, Math.max(x0, lower) + 4 * half];
  if (Number.isFinite(upper)) return [Math.min(x0, upper) - 4 * half, upper];
  return [x0 - half, x0 + half];
}

/** ∂value/∂T at each point by a central difference of ±0.1 % of T (the model is smooth in T, physics-model.md §3). */
function temperatureSlopes(params: ModelParams, conditions: ModelCondition[]): Float64Array {
  const at = (f: number) =>
    evaluateModel(
      params,
      conditions.map((c) => ({ ...c, temperatureK: c.temperatureK * f })),
    ).value;
  const up = at(1.001);
  const down = at(0.999);
  return Float64Array.from(conditions, (c, i) => (up[i]! - down[i]!) / (0.002 * c.temperatureK));
}

export function buildPhysicsProblem(req: FitRequest, slopesAt: ModelParams = req.params): PhysicsProblem {
  const sets = requestSets(req);
  const keys = variedKeys(req) as NumericParamKey[];
  const points = sets.flatMap((s, set) => s.points.map((point) => ({ set, point })));
  const conditions: ModelCondition[] = points.map(({ point: p }) => ({
    wavelengthNm: p.wavelengthNm,
    temperatureK: p.temperatureK,
    fieldT: p.fieldT,
    lengthM: p.lengthM,
    quantity: p.quantity,
  }));
  const predicted = evaluateModel(req.params, conditions).value;
  const signs = compareSigns(
    points.map(({ point }) => point.value),
    predicted,
  );
  const needSlopes = sets.some((s) => s.calibration.temperatureSigmaK > 0);
  const slopes = needSlopes ? temperatureSlopes(slopesAt, conditions) : null;
  const rows: FitRow[] = points.map(({ set, point }, i) => {
    const value = req.takeModelSign ? withModelSign(point.value, predicted[i]!) : point.value;
    const calibration = sets[set]!.calibration;
    return { set, point, value, sigma: Math.sqrt(effectiveVariance(point.sigma, value, calibration, slopes?.[i] ?? 0)) };
  });

  const freeByKey = new Map(req.free.map((f) => [f.key as string, f]));
  const priorByKey = new Map(req.priors.map((p) => [p.key as string, p]));
  const names: string[] = [...keys];
  const x0: number[] = keys.map((k) => req.params[k] as number);
  const lower: number[] = keys.map((k) => Math.max(freeByKey.get(k)?.min ?? -Infinity, NATURAL_LOWER[k as FreeableKey] ?? -Infinity));
  const upper: number[] = keys.map((k) => freeByKey.get(k)?.max ?? Infinity);
  const spread = keys.map((k, j) => spreadOf(x0[j]!, lower[j]!, upper[j]!, priorByKey.get(k)));
  const scaleIndex = sets.map((s) => {
    if (!(s.calibration.scaleSigma > 0)) return -1;
    names.push(scaleName(s.name));
    x0.push(1);
    lower.push(0);
    upper.push(Infinity);
    spread.push([Math.max(0, 1 - 2 * s.calibration.scaleSigma), 1 + 2 * s.calibration.scaleSigma]);
    return names.length - 1;
  });

  const priorRows = req.priors.map((p) => ({ index: keys.indexOf(p.key as NumericParamKey), mean: p.mean, sigma: p.sigma }));
  const scaleRows = sets.flatMap((s, set) =>
    scaleIndex[set]! >= 0 ? [{ index: scaleIndex[set]!, mean: 1, sigma: s.calibration.scaleSigma }] : [],
  );
  const extraRows = [...priorRows, ...scaleRows];
  const n = rows.length;
  const y = Float64Array.from([...rows.map((r) => r.value), ...extraRows.map((r) => r.mean)]);
  const sigma = Float64Array.from([...rows.map((r) => r.sigma), ...extraRows.map((r) => r.sigma)]);

  // The step scale for a key whose value is 0: the size of its bounds, else 1.
  const typicalScale = Object.fromEntries(
    keys.map((k) => [k, Math.max(Math.abs(freeByKey.get(k)?.min ?? 0), Math.abs(freeByKey.get(k)?.max ?? 0)) || 1]),
  );
  const lowerByKey = Object.fromEntries(keys.map((k, j) => [k, lower[j]!]).filter(([, v]) => Number.isFinite(v as number)));
  const paramsAt = (x: ArrayLike<number>) =>
    withFreeValues(
      req.params,
      keys,
      Array.from({ length: keys.length }, (_, j) => x[j]!),
    );

  const model = (x: Float64Array, columns: readonly number[] | null) => {
    const trial = paramsAt(x);
    const factor = Float64Array.from(rows, (r) => (scaleIndex[r.set]! >= 0 ? x[scaleIndex[r.set]!]! : 1));
    const physicsColumns = (columns ?? []).filter((c) => c < keys.length);
    const jac =
      physicsColumns.length > 0
        ? modelJacobian(
            trial,
            physicsColumns.map((c) => keys[c]!),
            conditions,
            { typicalScale, lower: lowerByKey },
          )
        : null;
    const raw = jac ? jac.value : evaluateModel(trial, conditions).value;
    const value = new Float64Array(n + extraRows.length);
    for (let i = 0; i < n; i++) value[i] = factor[i]! * raw[i]!;
    extraRows.forEach((r, e) => {
      value[n + e] = x[r.index]!;
    });
    if (!columns) return { value };
    const jacobian = new Matrix(n + extraRows.length, columns.length);
    columns.forEach((c, col) => {
      const physicsCol = physicsColumns.indexOf(c);
      for (let i = 0; i < n; i++) {
        if (physicsCol >= 0) jacobian.set(i, col, factor[i]! * jac!.valueJacobian.get(i, physicsCol));
        else if (scaleIndex[rows[i]!.set] === c) jacobian.set(i, col, raw[i]!);
      }
      extraRows.forEach((r, e) => {
        if (r.index === c) jacobian.set(n + e, col, 1);
      });
    });
    return { value, jacobian };
  };

  const shareAt = (x: Float64Array, condition: ModelCondition, columns: readonly number[] | null) => {
    const trial = paramsAt(x);
    const physicsColumns = (columns ?? []).filter((c) => c < keys.length);
    if (physicsColumns.length === 0) {
      const value = evaluateModel(trial, [condition]).magneticShare[0]!;
      return columns ? { value, gradient: columns.map(() => 0) } : { value };
    }
    const jac = modelJacobian(
      trial,
      physicsColumns.map((c) => keys[c]!),
      [condition],
      { typicalScale, lower: lowerByKey },
    );
    const gradient = (columns ?? []).map((c) => {
      const k = physicsColumns.indexOf(c);
      return k >= 0 ? jac.shareJacobian.get(0, k) : 0;
    });
    return { value: jac.magneticShare[0]!, gradient };
  };

  return {
    jacobianOptions: { typicalScale, lower: lowerByKey },
    shareAt,
    names,
    x0,
    lower,
    upper,
    spread,
    y,
    sigma,
    model,
    sets,
    rows,
    conditions,
    keys,
    scaleIndex,
    dataCount: n,
    paramsAt,
    signs,
  };
}
