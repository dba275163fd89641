import { z } from "zod";
import { finiteNumber, safeString } from "@/lib/contracts/validation";
import type { FitResult } from "./fit";
import { FREEABLE_KEYS, type FreeableKey, freeParamSchema } from "./schema";

/*
 * Saving a fit as a new version of a parameter set: the request body of
 * POST /api/parameter-sets/{id}/fits and the provenance stored with the version
 * (parameter_set_versions.provenance), which the version history shows.
 */

const keySchema = z.enum(FREEABLE_KEYS as [FreeableKey, ...FreeableKey[]], { error: "not a parameter a fit can free" });
const fittedValuesSchema = z.partialRecord(keySchema, finiteNumber("fitted value"));

export const fitMeasurementSetRefSchema = z.strictObject({
  id: z.uuid({ error: "must be a measurement set id" }),
  name: safeString().trim().min(1).max(200),
});

/** What the fit was: everything but the fitted values, which the body carries once. */
export const fitSummarySchema = z.strictObject({
  measurementSets: z.array(fitMeasurementSetRefSchema).min(1, "name the measurement set(s) the fit used").max(50),
  pointCount: z.number().int().min(1),
  free: z.array(freeParamSchema).min(1).max(FREEABLE_KEYS.length),
  sigmas: z.partialRecord(keySchema, finiteNumber("σ").min(0, "must be ≥ 0")),
  sigmaScaledByChi2: z.boolean(),
  correlation: z
    .array(
      z
        .array(finiteNumber("correlation").refine((v) => Math.abs(v) <= 1 + 1e-9, { message: "must lie in [−1, 1]" }))
        .max(FREEABLE_KEYS.length),
    )
    .max(FREEABLE_KEYS.length),
  chi2: finiteNumber("χ²").min(0, "must be ≥ 0"),
  dof: z.number().int().min(1),
  reducedChi2: finiteNumber("reduced χ²").min(0, "must be ≥ 0"),
  separable: z.boolean(),
  fittedAt: z.iso.datetime({ error: "must be an ISO date-time" }),
});
export type FitSummary = z.infer<typeof fitSummarySchema>;

export const saveFitSchema = z
  .object({
    /** The version the fit started from; a newer current version answers 409 like PATCH. */
    version: z
      .number({ error: "Send the version the fit started from (a whole number)." })
      .int("Must be a whole number.")
      .min(1, "Must be ≥ 1."),
    values: fittedValuesSchema,
    fit: fitSummarySchema,
  })
  .superRefine((body, ctx) => {
    const free = body.fit.free.map((f) => f.key);
    const valueKeys = Object.keys(body.values);
    if (valueKeys.length !== free.length || !free.every((k) => k in body.values)) {
      ctx.addIssue({ code: "custom", path: ["values"], message: `must hold exactly the free parameters (${free.join(", ")})` });
    }
    if (!free.every((k) => k in body.fit.sigmas))
      ctx.addIssue({ code: "custom", path: ["fit", "sigmas"], message: "must hold a σ for every free parameter" });
    if (body.fit.correlation.length !== free.length || body.fit.correlation.some((row) => row.length !== free.length)) {
      ctx.addIssue({ code: "custom", path: ["fit", "correlation"], message: `must be ${free.length}×${free.length}` });
    }
  });
export type SaveFitInput = z.infer<typeof saveFitSchema>;

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
