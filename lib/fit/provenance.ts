import { type FitSummary, type SaveFitInput, fitSummarySchema, fittedValuesSchema } from "@/lib/contracts/fits";
import type { FitResult } from "./fit";
import type { FreeableKey } from "@/lib/analysis/definition";

/*
 * The provenance stored with a version that came from a fit (parameter_set_versions.provenance),
 * which the version history shows, and the save body a finished fit sends; their schemas are the
 * fit area's contract (lib/contracts/fits.ts).
 */

/** The provenance stored with a version that came from a fit. */
export interface FitProvenance extends FitSummary {
  kind: "fit";
  values: Partial<Record<FreeableKey, number>>;
}

export function fitProvenance(input: SaveFitInput): FitProvenance {
  return { kind: "fit", ...input.fit, values: input.values };
}

/** Reads a stored provenance back; anything else (null, another kind) is not a fit. */
export function asFitProvenance(value: unknown): FitProvenance | null {
  if (typeof value !== "object" || value === null || (value as { kind?: unknown }).kind !== "fit") return null;
  const summary = fitSummarySchema.safeParse(Object.fromEntries(Object.entries(value).filter(([k]) => k !== "kind" && k !== "values")));
  const values = fittedValuesSchema.safeParse((value as { values?: unknown }).values);
  return summary.success && values.success ? { kind: "fit", ...summary.data, values: values.data } : null;
}

/** The save body for a finished fit. */
export function saveFitBody(options: {
  version: number;
  result: FitResult;
  measurementSets: { id: string; name: string }[];
  fittedAt: Date;
}): SaveFitInput {
  const { result } = options;
  return {
    version: options.version,
    values: result.values,
    fit: {
      measurementSets: options.measurementSets,
      pointCount: result.points.length,
      free: result.bounds,
      sigmas: result.sigmas,
      sigmaScaledByChi2: result.sigmaScaledByChi2,
      correlation: result.correlation,
      chi2: result.chi2,
      dof: result.dof,
      reducedChi2: result.reducedChi2,
      separable: result.separation.separable,
      fittedAt: options.fittedAt.toISOString(),
    },
  };
}
