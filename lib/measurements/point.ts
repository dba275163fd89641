import { z } from "zod";
import { finiteNumber } from "@/lib/contracts/validation";

/*
 * One measured point as the product stores and exchanges it, in SI: a Verdet constant in
 * rad/(T·m) or a rotation in rad, with its standard uncertainty in the same unit. Upload,
 * overlay, fit and planner all speak this shape; file units are converted at the edge.
 */

export const measuredQuantitySchema = z.enum(["verdet", "rotation"]);
export type MeasuredQuantity = z.infer<typeof measuredQuantitySchema>;

export const measuredPointSchema = z.strictObject({
  /** Line of the original file (1-based, header is line 1), for messages that point at the data. */
  line: z.number().int().min(1),
  wavelengthNm: finiteNumber("wavelength").gt(0, "must be > 0 nm"),
  quantity: measuredQuantitySchema,
  /** rad/(T·m) for "verdet", rad for "rotation". */
  value: finiteNumber("value"),
  /** Standard uncertainty in the unit of value; > 0 so it can weight a fit. */
  sigma: finiteNumber("σ").gt(0, "must be > 0"),
  temperatureK: finiteNumber("temperature").gt(0, "must be > 0 K"),
  fieldT: finiteNumber("field"),
  lengthM: finiteNumber("length").gt(0, "must be > 0 m"),
});
export type MeasuredPoint = z.infer<typeof measuredPointSchema>;
