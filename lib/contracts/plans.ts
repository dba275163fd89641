import { z } from "zod";
import { planRequestSchema } from "@/lib/planner/schema";
import { recordNameSchema } from "./light-sources";
import { finiteNumber as finite, int4Field, safeString } from "./validation";

/* Plans saved with a parameter set: the stored record, its request schema and answer shape. */

/** One point of a saved plan (JSON: no Infinity, so σ that cannot be had is null). */
export const savedPlanPointSchema = z.strictObject({
  lineName: safeString().max(120),
  wavelengthNm: finite("wavelength").gt(0),
  temperatureK: finite("temperature").gt(0),
  fieldT: finite("field"),
  count: finite("count").int().min(1).max(1000),
  rotationRad: finite("rotation"),
  belowNoise: z.boolean(),
  /** Fraction of the light that leaves the sample there (absent in plans saved before the noise model). */
  transmission: finite("transmission").min(0).max(1).optional(),
  flags: z
    .array(z.enum(["phase-wrap", "below-noise"]))
    .max(2)
    .optional(),
});

export const savedPlanSchema = z.strictObject({
  criterionLabel: safeString().max(200),
  criterionUnit: safeString().max(40),
  expectedSigma: finite("expected σ").min(0).nullable(),
  method: z.enum(["exhaustive", "greedy"]),
  candidateCount: finite("candidates").int().min(0),
  sigmaPerPointRad: finite("σ per point").gt(0),
  partsCorrelation: finite("correlation").min(-1.000001).max(1.000001).nullable(),
  points: z.array(savedPlanPointSchema).min(1, "A plan needs at least one point.").max(60),
  notes: z.array(safeString().max(600)).max(20),
  /** Detection of the magnetic-dipole part in this model; absent or null when the plan does not determine magneticScale. */
  detection: z
    .strictObject({
      alternative: finite("alternative").gt(0),
      deltaChi2Null: finite("expected Δχ²").min(0),
      significance: finite("significance").min(0),
      repeatsFor3Sigma: finite("repeats").int().min(1).nullable(),
      repeatsFor5Sigma: finite("repeats").int().min(1).nullable(),
    })
    .nullable()
    .optional(),
  /** Lab time of the plan, hours. */
  costHours: finite("cost").min(0).optional(),
  /** The laboratory noise the plan assumed. */
  noise: z
    .strictObject({
      absoluteRad: finite("polarimeter noise").gt(0),
      relativeFloor: finite("relative floor").min(0).max(1),
      minTransmission: finite("minimum transmission").gt(0).max(1),
    })
    .optional(),
});
export type SavedPlanBody = z.infer<typeof savedPlanSchema>;

export const savePlanSchema = z.strictObject({
  name: recordNameSchema,
  setVersion: int4Field("set version", 1),
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
