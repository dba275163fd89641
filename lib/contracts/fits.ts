import { z } from "zod";
import { FREEABLE_KEYS, type FreeableKey, freeParamSchema, priorSchema } from "@/lib/analysis/definition";
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

const pValue = finiteNumber("p-value").min(0, "must be ≥ 0").max(1, "must be ≤ 1");
const interval = z.tuple([finiteNumber("interval end"), finiteNumber("interval end")]);
const words = safeString().max(2000);

/**
 * What the fit's report said, stored beside the summary so a saved version carries the conditions
 * of its result: the held values and their sources, the priors, each set's calibration, the model
 * comparison in numbers and words, the goodness of fit, the profile interval of magneticScale, the
 * verdict and the notes. Every field is optional: versions saved before the report existed lack them.
 */
export const fitInferenceSchema = z.strictObject({
  assumptions: z
    .array(
      z.strictObject({
        key: safeString().max(80),
        value: z.union([finiteNumber("held value"), z.boolean(), safeString().max(200)]),
        source: words,
      }),
    )
    .max(60)
    .optional(),
  priors: z.array(priorSchema).max(FREEABLE_KEYS.length).optional(),
  /** Fitted parameters that are not free model keys: keys that carry only a prior, and the sets' field × length scale factors. */
  nuisances: z
    .array(z.strictObject({ name: safeString().max(260), value: finiteNumber("nuisance value"), sigma: finiteNumber("σ").min(0) }))
    .max(FREEABLE_KEYS.length + 50)
    .optional(),
  sets: z
    .array(
      z.strictObject({
        name: safeString().max(200),
        pointCount: z.number().int().min(1),
        chi2: finiteNumber("χ²").min(0),
        scaleSigma: finiteNumber("scale σ").min(0),
        relativeFloor: finiteNumber("relative floor").min(0),
        temperatureSigmaK: finiteNumber("temperature σ").min(0),
      }),
    )
    .max(50)
    .optional(),
  comparison: z
    .array(
      z.strictObject({
        hypothesis: z.enum(["noMagneticPart", "firstPrinciples"]),
        fixed: z.strictObject({ magneticScale: z.union([z.literal(0), z.literal(1)]) }),
        chi2: finiteNumber("χ²").min(0),
        deltaChi2: finiteNumber("Δχ²"),
        pValue,
        significanceSigma: finiteNumber("significance"),
        aic: finiteNumber("AIC"),
        aicc: finiteNumber("AICc").nullable(),
        bic: finiteNumber("BIC"),
        words,
      }),
    )
    .max(2)
    .optional(),
  goodnessOfFit: z.strictObject({ chi2: finiteNumber("χ²").min(0), dof: z.number().int().min(1), pValue }).optional(),
  profile: z
    .strictObject({
      magneticScale: z.strictObject({ value: finiteNumber("value"), interval68: interval, interval95: interval }).optional(),
    })
    .optional(),
  verdict: z.strictObject({ separable: z.boolean(), reasons: z.array(words).max(40) }).optional(),
  notes: z.array(words).max(40).optional(),
  starts: z.number().int().min(1).optional(),
  tookModelSign: z.boolean().optional(),
});
export type FitInference = z.infer<typeof fitInferenceSchema>;

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
  ...fitInferenceSchema.shape,
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
