import { z } from "zod";

/*
 * One measured point as the product stores and exchanges it, in SI: a Verdet constant in
 * rad/(T·m) or a rotation in rad, with its standard uncertainty in the same unit. Upload,
 * overlay, fit and planner all speak this shape; file units are converted at the edge.
 */

export const measuredQuantitySchema = z.enum(["verdet", "rotation"]);
export type MeasuredQuantity = z.infer<typeof measuredQuantitySchema>;

const finite = z.number().refine(Number.isFinite, { message: "must be finite" });

export const measuredPointSchema = z.strictObject({
  /** Line of the original file (1-based, header is line 1), for messages that point at the data. */
  line: z.number().int().min(1),
  wavelengthNm: finite.refine((v) => v > 0, { message: "must be > 0 nm" }),
  quantity: measuredQuantitySchema,
  /** rad/(T·m) for "verdet", rad for "rotation". */
  value: finite,
  /** Standard uncertainty in the unit of value; > 0 so it can weight a fit. */
  sigma: finite.refine((v) => v > 0, { message: "must be > 0" }),
  temperatureK: finite.refine((v) => v > 0, { message: "must be > 0 K" }),
  fieldT: finite,
  lengthM: finite.refine((v) => v > 0, { message: "must be > 0 m" }),
});
export type MeasuredPoint = z.infer<typeof measuredPointSchema>;
