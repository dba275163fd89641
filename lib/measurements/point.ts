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
  /** The file's other columns for this row, as text ("source": "run 4"), when it had any. */
  extra: z.record(z.string(), z.string().max(200)).optional(),
});
export type MeasuredPoint = z.infer<typeof measuredPointSchema>;

/** The numeric fields of a point a person may correct on the measurement-set page. */
export const EDITABLE_POINT_FIELDS = ["wavelengthNm", "value", "sigma", "temperatureK", "fieldT", "lengthM"] as const;

/** Just the measured point of a stored one (the fit's schema is strict: no mask, note or ordinal). */
export function toMeasuredPoint(p: MeasuredPoint): MeasuredPoint {
  const { line, wavelengthNm, quantity, value, sigma, temperatureK, fieldT, lengthM, extra } = p;
  return { line, wavelengthNm, quantity, value, sigma, temperatureK, fieldT, lengthM, ...(extra ? { extra } : {}) };
}

/** The points a fit or an overlay uses: all but the masked ones. */
export function usablePoints<P extends MeasuredPoint & { masked?: boolean }>(points: readonly P[]): P[] {
  return points.filter((p) => p.masked !== true);
}
