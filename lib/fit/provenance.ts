import { type FitSummary, type SaveFitInput, fitSummarySchema, fittedValuesSchema } from "@/lib/contracts/fits";
import type { FitReport } from "./report";
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

/** The save body for a finished fit: the free keys' values become the new version; the report's findings go with them. */
export function saveFitBody(options: {
  version: number;
  result: FitReport;
  measurementSets: { id: string; name: string }[];
  fittedAt: Date;
}): SaveFitInput {
  const { result } = options;
  const free: string[] = result.free;
  const index = free.map((k) => result.names.indexOf(k));
  const pick = (record: Record<string, number>) => Object.fromEntries(free.map((k) => [k, record[k]!]));
  const ms = result.profile.magneticScale;
  return {
    version: options.version,
    values: pick(result.values),
    fit: {
      measurementSets: options.measurementSets,
      pointCount: result.points.length,
      free: result.bounds,
      sigmas: pick(result.sigmas),
      sigmaScaledByChi2: result.sigmaScaledByChi2,
      correlation: index.map((i) => index.map((j) => result.correlation[i]![j]!)),
      chi2: result.chi2,
      dof: result.dof,
      reducedChi2: result.reducedChi2,
      separable: result.verdict.separable,
      fittedAt: options.fittedAt.toISOString(),
      assumptions: result.assumptions,
      priors: result.priors,
      nuisances: result.names
        .filter((n) => !free.includes(n) && Number.isFinite(result.sigmas[n]))
        .map((name) => ({ name, value: result.values[name]!, sigma: result.sigmas[name]! })),
      sets: result.sets,
      comparison: result.comparison,
      goodnessOfFit: result.goodnessOfFit,
      profile: ms ? { magneticScale: { value: ms.value, interval68: ms.interval68, interval95: ms.interval95 } } : {},
      verdict: result.verdict,
      notes: result.notes,
      starts: result.startChi2.length,
      tookModelSign: result.signCheck.tookModelSign,
    },
  };
}
