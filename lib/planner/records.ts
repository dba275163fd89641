import { z } from "zod";
import { planRequestSchema } from "./schema";

/*
 * Stored planner records and their API shapes: a lab's light sources and the plans saved with a
 * parameter set. Shared by the route handlers, the queries, the client hooks and the tests.
 */

const finite = (what: string) =>
  z
    .number({ error: (issue) => (issue.input === undefined ? `${what} is required` : `${what} must be a number`) })
    .refine(Number.isFinite, { message: `${what} must be finite` });

const nameSchema = z.string({ error: "Must be text." }).trim().min(1, "Give it a name.").max(120, "At most 120 characters.");

const lightSourceFields = {
  name: nameSchema,
  wavelengthNm: finite("wavelength").gt(0, "Must be > 0 nm.").max(1e6, "Must be ≤ 1e6 nm."),
  tunableMinNm: finite("tunable minimum").gt(0, "Must be > 0 nm.").max(1e6, "Must be ≤ 1e6 nm.").nullable().default(null),
  tunableMaxNm: finite("tunable maximum").gt(0, "Must be > 0 nm.").max(1e6, "Must be ≤ 1e6 nm.").nullable().default(null),
  powerW: finite("power").min(0, "Must be ≥ 0 W.").max(1e6, "Must be ≤ 1e6 W.").nullable().default(null),
};

type LightSourceFields = { wavelengthNm: number; tunableMinNm: number | null; tunableMaxNm: number | null };
const tunableRangeRule = (v: LightSourceFields, ctx: z.RefinementCtx) => {
  if ((v.tunableMinNm === null) !== (v.tunableMaxNm === null)) {
    ctx.addIssue({
      code: "custom",
      path: [v.tunableMinNm === null ? "tunableMinNm" : "tunableMaxNm"],
      message: "Give both ends of the tunable range, or neither.",
    });
    return;
  }
  if (v.tunableMinNm !== null && v.tunableMaxNm !== null) {
    if (!(v.tunableMinNm <= v.wavelengthNm && v.wavelengthNm <= v.tunableMaxNm)) {
      ctx.addIssue({
        code: "custom",
        path: ["wavelengthNm"],
        message: `Must lie in the tunable range ${v.tunableMinNm}–${v.tunableMaxNm} nm.`,
      });
    }
  }
};

export const lightSourceInputSchema = z.strictObject(lightSourceFields).superRefine(tunableRangeRule);
export type LightSourceInput = z.infer<typeof lightSourceInputSchema>;

export const createLightSourceSchema = z
  .strictObject({ labId: z.uuid("Must be a lab id."), ...lightSourceFields })
  .superRefine(tunableRangeRule);
export type CreateLightSourceInput = z.infer<typeof createLightSourceSchema>;

/** PATCH: any subset; merged with the stored line and checked again as a whole. */
export const updateLightSourceSchema = z.strictObject({
  name: lightSourceFields.name.optional(),
  wavelengthNm: lightSourceFields.wavelengthNm.optional(),
  tunableMinNm: finite("tunable minimum").gt(0, "Must be > 0 nm.").max(1e6, "Must be ≤ 1e6 nm.").nullable().optional(),
  tunableMaxNm: finite("tunable maximum").gt(0, "Must be > 0 nm.").max(1e6, "Must be ≤ 1e6 nm.").nullable().optional(),
  powerW: finite("power").min(0, "Must be ≥ 0 W.").max(1e6, "Must be ≤ 1e6 W.").nullable().optional(),
});
export type UpdateLightSourceInput = z.infer<typeof updateLightSourceSchema>;

export const listLightSourcesQuery = z.object({ labId: z.uuid("labId must be a lab id.") });

export interface LightSource {
  id: string;
  labId: string;
  name: string;
  wavelengthNm: number;
  tunableMinNm: number | null;
  tunableMaxNm: number | null;
  powerW: number | null;
  createdAt: string;
  updatedAt: string;
}

/** One point of a saved plan (JSON: no Infinity, so σ that cannot be had is null). */
export const savedPlanPointSchema = z.strictObject({
  lineName: z.string().max(120),
  wavelengthNm: finite("wavelength").gt(0),
  temperatureK: finite("temperature").gt(0),
  fieldT: finite("field"),
  count: finite("count").int().min(1).max(1000),
  rotationRad: finite("rotation"),
  belowNoise: z.boolean(),
});

export const savedPlanSchema = z.strictObject({
  criterionLabel: z.string().max(200),
  criterionUnit: z.string().max(40),
  expectedSigma: finite("expected σ").min(0).nullable(),
  method: z.enum(["exhaustive", "greedy"]),
  candidateCount: finite("candidates").int().min(0),
  sigmaPerPointRad: finite("σ per point").gt(0),
  partsCorrelation: finite("correlation").min(-1.000001).max(1.000001).nullable(),
  points: z.array(savedPlanPointSchema).min(1, "A plan needs at least one point.").max(60),
  notes: z.array(z.string().max(600)).max(20),
});
export type SavedPlanBody = z.infer<typeof savedPlanSchema>;

export const savePlanSchema = z.strictObject({
  name: nameSchema,
  setVersion: finite("set version").int().min(1),
  request: planRequestSchema,
  plan: savedPlanSchema,
});
export type SavePlanInput = z.infer<typeof savePlanSchema>;

export interface SavedPlan {
  id: string;
  setId: string;
  setVersion: number;
  name: string;
  request: unknown;
  plan: SavedPlanBody;
  createdBy: { id: string; name: string };
  createdAt: string;
}
