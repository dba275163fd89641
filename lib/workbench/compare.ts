import type { SpectrumPoint } from "@/lib/physics/types";
import { rotationTo, Y_UNIT_SHORT, type Geometry, type YMode } from "./units";

/*
 * What the compare panel can overlay. Sets differ in field and length, so raw rotations compare
 * apples with pears; the Verdet constant and its parts (rotation per tesla and metre) compare the
 * materials themselves. Raw rotations stay on offer, labelled as being at each set's own B0 and L.
 */

export const COMPARE_QUANTITIES = ["verdet", "verdetElectric", "verdetMagnetic", "theta", "thetaElectric", "thetaMagnetic"] as const;
export type CompareQuantity = (typeof COMPARE_QUANTITIES)[number];

type Part = "total" | "electric" | "magnetic";

const PART_OF: Record<CompareQuantity, Part> = {
  verdet: "total",
  verdetElectric: "electric",
  verdetMagnetic: "magnetic",
  theta: "total",
  thetaElectric: "electric",
  thetaMagnetic: "magnetic",
};

const SYMBOL: Record<CompareQuantity, string> = {
  verdet: "V",
  verdetElectric: "Ve",
  verdetMagnetic: "Vm",
  theta: "θ",
  thetaElectric: "θe",
  thetaMagnetic: "θm",
};

const NAME: Record<CompareQuantity, string> = {
  verdet: "Verdet constant V",
  verdetElectric: "Electric-dipole part of V",
  verdetMagnetic: "Magnetic-dipole part of V",
  theta: "Total rotation θ",
  thetaElectric: "Electric-dipole part θe",
  thetaMagnetic: "Magnetic-dipole part θm",
};

export function isVerdetQuantity(q: CompareQuantity): boolean {
  return q.startsWith("verdet");
}

/** Rotations are shown in the plot's rotation unit; in Verdet mode (no rotation unit) in rad. */
function rotationMode(yMode: YMode): YMode {
  return yMode === "verdet" ? "rad" : yMode;
}

export function compareUnit(q: CompareQuantity, yMode: YMode): string {
  return isVerdetQuantity(q) ? Y_UNIT_SHORT.verdet : Y_UNIT_SHORT[rotationMode(yMode)];
}

/** Option text of the quantity picker. */
export function compareOptionLabel(q: CompareQuantity, yMode: YMode): string {
  return isVerdetQuantity(q) ? `${NAME[q]} (${compareUnit(q, yMode)})` : `${NAME[q]} (${compareUnit(q, yMode)}, each set's own B0 and L)`;
}

/** Column header and axis title: symbol and unit. */
export function compareHeader(q: CompareQuantity, yMode: YMode): string {
  return `${SYMBOL[q]} (${compareUnit(q, yMode)})`;
}

export function compareAxisTitle(q: CompareQuantity, yMode: YMode): string {
  return isVerdetQuantity(q) ? `${NAME[q]} (${compareUnit(q, yMode)})` : `${NAME[q]} (${compareUnit(q, yMode)}) at each set's own B0 and L`;
}

/** The value of a quantity at one point, for a set with its own field and length. */
export function compareValue(q: CompareQuantity, p: SpectrumPoint, g: Geometry, yMode: YMode): number | null {
  const part = PART_OF[q];
  const rad = part === "total" ? p.thetaRad : part === "electric" ? p.thetaElectricRad : p.thetaMagneticRad;
  return rotationTo(rad, isVerdetQuantity(q) ? "verdet" : rotationMode(yMode), g);
}
