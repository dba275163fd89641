import { z } from "zod";
import { FREEABLE_KEYS, type FreeableKey, freeParamSchema } from "@/lib/analysis/definition";
import { finiteNumber, INT4_MAX, safeString } from "./validation";

/*
 * Fits saved as a new version of a parameter set: the request body of
 * POST /api/parameter-sets/{id}/fits and the summary stored with the version as its provenance
 * (lib/fit/provenance.ts reads and writes it).
 */

export const fitKeySchema = z.enum(FREEABLE_KEYS as [FreeableKey, ...FreeableKey[]], { error: "not a parameter a fit can free" });
export const fittedValuesSchema = z.partialRecord(fitKeySchema, finiteNumber("fitted value"));

export const fitMeasurementSetRefSchema = z.strictObject({
  id: z.uuid({ error: "must be a measurement set id" }),
  name: safeString().trim().min(1).max(200),
});

/** What the fit was: everything but the fitted values, which the body carries once. */
export const fitSummarySchema = z.strictObject({
  measurementSets: z.array(fitMeasurementSetRefSchema).min(1, "name the measurement set(s) the fit used").max(50),
  pointCount: z.number().int().min(1),
  free: z.array(freeParamSchema).min(1).max(FREEABLE_KEYS.length),
  sigmas: z.partialRecord(fitKeySchema, finiteNumber("σ").min(0, "must be ≥ 0")),
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
      .min(1, "Must be ≥ 1.")
      .max(INT4_MAX, `Must be at most ${INT4_MAX}.`),
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
