import { z } from "zod";
import { finiteNumber } from "@/lib/contracts/validation";

/*
 * One measured point as the product stores and exchanges it, in SI: a Verdet constant in
 * rad/(T·m) or a rotation in rad, with its standard uncertainty in the same unit. Upload,
 * overlay, fit and planner all speak this shape; file units are converted at the edge.
 */

export const measuredQuantitySchema = z.enum(["verdet", "rotation"]);
export type MeasuredQuantity = z.infer<typeof measuredQuantitySchema>;

/*
 * What a stored point may hold. Temperature, field and length take the model's own bounds
 * (conditionsShape in lib/physics/schema.ts), the wavelength the sweep's upper one (1e9 nm) and,
 * below, 1 nm: shorter is X-ray light, outside what this model describes (common practice, no
 * source). |value| ≤ 1e12 in SI is far beyond any measured Faraday rotation; σ ≥ 1e-30 keeps the
 * fit's weight 1/σ² finite (5e-324 would make it Infinity).
 */
export const POINT_LIMITS = {
  wavelengthNm: { min: 1, max: 1e9 },
  absValue: 1e12,
  sigma: { min: 1e-30, max: 1e12 },
  temperatureK: { max: 10_000 },
  absFieldT: 100,
  lengthM: { max: 100 },
} as const;

/** The first bound a point breaks, as a message for its line; null when it is inside every bound. */
export function pointLimitProblem(point: Omit<MeasuredPoint, "line" | "quantity">): string | null {
  const L = POINT_LIMITS;
  if (!(point.wavelengthNm >= L.wavelengthNm.min && point.wavelengthNm <= L.wavelengthNm.max))
    return `wavelength must be from ${L.wavelengthNm.min} nm to ${L.wavelengthNm.max} nm`;
  if (!(Math.abs(point.value) <= L.absValue)) return `the value must be at most ${L.absValue} in SI units`;
  if (!(point.sigma >= L.sigma.min && point.sigma <= L.sigma.max)) return `σ must be from ${L.sigma.min} to ${L.sigma.max} in SI units`;
  if (!(point.temperatureK > 0 && point.temperatureK <= L.temperatureK.max))
    return `temperature must be > 0 K and ≤ ${L.temperatureK.max} K`;
  if (!(Math.abs(point.fieldT) <= L.absFieldT)) return `field must be from −${L.absFieldT} T to ${L.absFieldT} T`;
  if (!(point.lengthM > 0 && point.lengthM <= L.lengthM.max)) return `sample length must be > 0 m and ≤ ${L.lengthM.max} m`;
  return null;
}

export const measuredPointSchema = z.strictObject({
  /** Line of the original file (1-based, header is line 1), for messages that point at the data. */
  line: z.number().int().min(1).max(10_000_000),
  wavelengthNm: finiteNumber("wavelength")
    .min(POINT_LIMITS.wavelengthNm.min, `must be ≥ ${POINT_LIMITS.wavelengthNm.min} nm`)
    .max(POINT_LIMITS.wavelengthNm.max, `must be ≤ ${POINT_LIMITS.wavelengthNm.max} nm`),
  quantity: measuredQuantitySchema,
  /** rad/(T·m) for "verdet", rad for "rotation". */
  value: finiteNumber("value").min(-POINT_LIMITS.absValue).max(POINT_LIMITS.absValue),
  /** Standard uncertainty in the unit of value; > 0 so it can weight a fit. */
  sigma: finiteNumber("σ").min(POINT_LIMITS.sigma.min, `must be ≥ ${POINT_LIMITS.sigma.min}`).max(POINT_LIMITS.sigma.max),
  temperatureK: finiteNumber("temperature").gt(0, "must be > 0 K").max(POINT_LIMITS.temperatureK.max, "must be ≤ 10000 K"),
  fieldT: finiteNumber("field").min(-POINT_LIMITS.absFieldT, "must be ≥ −100 T").max(POINT_LIMITS.absFieldT, "must be ≤ 100 T"),
  lengthM: finiteNumber("length").gt(0, "must be > 0 m").max(POINT_LIMITS.lengthM.max, "must be ≤ 100 m"),
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
