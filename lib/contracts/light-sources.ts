import { z } from "zod";
import { finiteNumber as finite, nameSchema } from "./validation";

/*
 * A lab's light sources (the lines the planner may choose from): request schemas and answer
 * shape, shared by the route handlers, the queries, the client hooks and the tests.
 */

/** A light source or a saved plan is named like this. */
export const recordNameSchema = nameSchema({ max: 120, missing: "Give it a name." });

const lightSourceFields = {
  name: recordNameSchema,
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
