import { z } from "zod";
import { fromNm, toNm, X_UNITS, type XUnit } from "@/lib/workbench/units";
import type { MeasuredQuantity } from "./point";

/*
 * Units of measurement files, converted to the SI of MeasuredPoint at the edge (upload, command
 * line) and back for display. Wavelength axes reuse the workbench's conversions so a point and
 * the curve it is laid over use the same constants.
 */

export const wavelengthUnitSchema = z.enum(X_UNITS, { error: "Choose a wavelength unit: nm, µm, eV, cm⁻¹ or THz." });
export type WavelengthUnit = XUnit;

export const ROTATION_UNITS = ["rad", "mrad", "deg"] as const;
export type RotationUnit = (typeof ROTATION_UNITS)[number];

export const VERDET_UNITS = ["rad/(T·m)", "deg/(T·m)", "min/(Oe·cm)"] as const;
export type VerdetUnit = (typeof VERDET_UNITS)[number];

export const valueUnitSchema = z.enum([...ROTATION_UNITS, ...VERDET_UNITS], { error: "Choose the unit of the measured values." });
export type ValueUnit = z.infer<typeof valueUnitSchema>;

export const VALUE_UNIT_LABEL: Record<ValueUnit, string> = {
  rad: "rad",
  mrad: "mrad",
  deg: "°",
  "rad/(T·m)": "rad/(T·m)",
  "deg/(T·m)": "°/(T·m)",
  "min/(Oe·cm)": "min/(Oe·cm)",
};

export const WAVELENGTH_UNIT_LABEL: Record<WavelengthUnit, string> = {
  nm: "nm",
  um: "µm",
  eV: "eV",
  "cm-1": "cm⁻¹",
  THz: "THz",
};

/** The units that belong to a measured quantity (a rotation is an angle, a Verdet constant an angle per T·m). */
export function unitsOf(quantity: MeasuredQuantity): readonly ValueUnit[] {
  return quantity === "verdet" ? VERDET_UNITS : ROTATION_UNITS;
}

export function quantityOfUnit(unit: ValueUnit): MeasuredQuantity {
  return (VERDET_UNITS as readonly string[]).includes(unit) ? "verdet" : "rotation";
}

const DEG = Math.PI / 180;
/** 1 arc minute = π/10800 rad (common practice, no source). */
const ARC_MIN = Math.PI / 10_800;
/** 1 Oe of H corresponds to B = μ0·H = 1e-4 T in vacuum (common practice, no source). */
const TESLA_PER_OERSTED = 1e-4;
const M_PER_CM = 1e-2;

/** Size of one unit in SI: rad for rotations, rad/(T·m) for Verdet constants. */
const SI_PER_UNIT: Record<ValueUnit, number> = {
  rad: 1,
  mrad: 1e-3,
  deg: DEG,
  "rad/(T·m)": 1,
  "deg/(T·m)": DEG,
  // 1 min/(Oe·cm) = (π/10800 rad) / (1e-4 T · 1e-2 m) ≈ 290.89 rad/(T·m).
  "min/(Oe·cm)": ARC_MIN / (TESLA_PER_OERSTED * M_PER_CM),
};

/** A value (or its σ: the same factor) in the file's unit → SI. */
export function valueToSi(value: number, unit: ValueUnit): number {
  return value * SI_PER_UNIT[unit];
}

/** SI → the given unit (the inverse of valueToSi). */
export function valueFromSi(valueSi: number, unit: ValueUnit): number {
  return valueSi / SI_PER_UNIT[unit];
}

/** A wavelength axis value in the file's unit → vacuum wavelength in nm. */
export function wavelengthToNm(value: number, unit: WavelengthUnit): number {
  return toNm(value, unit);
}

export function wavelengthFromNm(wavelengthNm: number, unit: WavelengthUnit): number {
  return fromNm(wavelengthNm, unit);
}
