import { type AnalysisDefinition, NATURAL_LOWER, variedKeys } from "@/lib/analysis/definition";
import type { JacobianOptions, NumericParamKey } from "@/lib/fit/model";
import type { ModelParams } from "@/lib/physics/schema";

/* The varied parameters of the analysis a plan is made for, as the planner's Fisher matrix orders, scales and differentiates them. */

/** The name of the field × length calibration nuisance among the varied parameters. */
export const SCALE_NUISANCE = "fieldLengthScale";

/** The varied parameters of an analysis and how the planner scales and differentiates them. */
export interface AnalysisLayout {
  definition: AnalysisDefinition;
  /** Model keys that vary: the free ones, then those with a prior. */
  keys: NumericParamKey[];
  /** Whether the field × length scale nuisance is carried (scaleSigma > 0). */
  withScale: boolean;
  /** keys, then SCALE_NUISANCE when carried. */
  names: string[];
  p: number;
  /** Each parameter's nominal value, or 1 where it is 0, so the information is well conditioned in any units. */
  scale: number[];
  jacobian: JacobianOptions;
}

export function analysisLayout(definition: AnalysisDefinition, params: ModelParams): AnalysisLayout {
  const keys = variedKeys(definition) as NumericParamKey[];
  const withScale = definition.calibration.scaleSigma > 0;
  const names = [...keys, ...(withScale ? [SCALE_NUISANCE] : [])];
  const bounds = new Map(definition.free.map((f) => [f.key as string, f]));
  const lower: Partial<Record<NumericParamKey, number>> = {};
  const typicalScale: Partial<Record<NumericParamKey, number>> = {};
  for (const k of keys) {
    const f = bounds.get(k);
    const lo = Math.max(f?.min ?? -Infinity, NATURAL_LOWER[k as keyof typeof NATURAL_LOWER] ?? -Infinity);
    if (Number.isFinite(lo)) lower[k] = lo;
    // The step scale for a parameter whose value is 0: the size of its bounds, else 1 (as the fit does).
    typicalScale[k] = Math.max(Math.abs(f?.min ?? 0), Math.abs(f?.max ?? 0)) || 1;
  }
  const scale = [...keys.map((k) => Math.abs(params[k] as number) || 1), ...(withScale ? [1] : [])];
  return { definition, keys, withScale, names, p: names.length, scale, jacobian: { lower, typicalScale } };
}
