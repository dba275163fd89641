import type { SpectrumPoint } from "@/lib/physics/types";
import { length45M, signedMagneticRatio } from "./derived";
import { fromNm, rotationTo, X_UNIT_LABEL, Y_UNIT_SHORT, type Geometry, type XUnit, type YMode } from "./units";

/*
 * The columns of the marker table in the plot's chosen units: the wavelength always in nm (the
 * marker's name) plus the chosen x unit when it is another one; the rotation and its parts in the
 * chosen y unit (in Verdet mode they become V, Ve and Vm); then the figures that have one natural
 * unit (share, V, L45, θm/θ).
 */

export type MarkerCellKind = "number" | "percent" | "length";

export interface MarkerColumn {
  id: string;
  header: string;
  kind: MarkerCellKind;
  value: (p: SpectrumPoint, g: Geometry) => number | null;
}

const X_SYMBOL: Record<XUnit, string> = { nm: "λ", um: "λ", eV: "E", "cm-1": "ν̃", THz: "f" };

/** withDiamagnetic: the set has the diamagnetic term on, so its sub-part of the electric part gets a column. */
export function markerColumns(xUnit: XUnit, yMode: YMode, withDiamagnetic = false): MarkerColumn[] {
  const cols: MarkerColumn[] = [];
  if (xUnit !== "nm") {
    cols.push({
      id: `x-${xUnit}`,
      header: `${X_SYMBOL[xUnit]} (${X_UNIT_LABEL[xUnit]})`,
      kind: "number",
      value: (p) => fromNm(p.wavelengthNm, xUnit),
    });
  }
  const unit = Y_UNIT_SHORT[yMode];
  const sym = yMode === "verdet" ? ["V", "Ve", "Vm"] : ["θ", "θe", "θm"];
  cols.push(
    { id: "total", header: `${sym[0]} (${unit})`, kind: "number", value: (p, g) => rotationTo(p.thetaRad, yMode, g) },
    { id: "electric", header: `${sym[1]} (${unit})`, kind: "number", value: (p, g) => rotationTo(p.thetaElectricRad, yMode, g) },
    { id: "magnetic", header: `${sym[2]} (${unit})`, kind: "number", value: (p, g) => rotationTo(p.thetaMagneticRad, yMode, g) },
  );
  if (withDiamagnetic) {
    const dia = yMode === "verdet" ? "Vdia" : "θdia";
    cols.push({
      id: "diamagnetic",
      header: `${dia} (${unit})`,
      kind: "number",
      value: (p, g) => (p.thetaDiamagneticRad === undefined ? null : rotationTo(p.thetaDiamagneticRad, yMode, g)),
    });
  }
  cols.push({ id: "share", header: "Magnetic share", kind: "percent", value: (p) => p.magneticShare });
  // In Verdet mode the first column already is V.
  if (yMode !== "verdet") cols.push({ id: "verdet", header: "V (rad/(T·m))", kind: "number", value: (p) => p.verdetRadPerTm });
  cols.push(
    { id: "l45", header: "L45", kind: "length", value: (p, g) => length45M(p.verdetRadPerTm, g.fieldT) },
    { id: "ratio", header: "θm / θ", kind: "number", value: (p) => signedMagneticRatio(p) },
  );
  return cols;
}
