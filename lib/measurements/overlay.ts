import { fmtStored } from "@/lib/workbench/format";
import { fromNm, rotationTo, type Geometry, type XUnit, type YMode } from "@/lib/workbench/units";
import type { MeasuredPoint } from "./point";

/*
 * Measured points in the units of the workbench's spectrum plot. The plot's y axis is either a
 * Verdet constant or a rotation at the set's own field B and length L (the curve's geometry), so:
 *   - y = Verdet: a Verdet value is shown as is; a rotation θ measured at (B, L) as θ/(B·L);
 *   - y = angle: a Verdet value V is shown as the rotation V·B·L at the plot's B and L; a
 *     rotation measured at another B or L is shown as θ·(B_plot·L_plot)/(B·L).
 * Both assume a rotation linear in B·L (the Verdet constant's definition, physics-model §1), which
 * holds below saturation; a rotation measured at the plot's own B and L is shown as measured.
 * σ is scaled by the same factor, so error bars stay standard uncertainties.
 */

export interface OverlayPoint {
  x: number;
  y: number;
  /** Standard uncertainty in the plot's y unit (≥ 0). */
  sigma: number;
  point: MeasuredPoint;
  /** True when the value was rescaled from another field or length (or from a Verdet constant to an angle). */
  rescaled: boolean;
}

/** One point in the plot's units, or null where the conversion is undefined (θ at B·L = 0 as a Verdet constant). */
export function toPlotUnits(point: MeasuredPoint, options: { xUnit: XUnit; yMode: YMode; geometry: Geometry }): OverlayPoint | null {
  const { yMode, geometry } = options;
  const x = fromNm(point.wavelengthNm, options.xUnit);
  const pointBL = point.fieldT * point.lengthM;
  const plotBL = geometry.fieldT * geometry.lengthM;
  let factor: number;
  let rescaled: boolean;
  if (yMode === "verdet") {
    if (point.quantity === "verdet") {
      factor = 1;
      rescaled = false;
    } else {
      if (pointBL === 0) return null;
      factor = 1 / pointBL;
      rescaled = false;
    }
  } else {
    // Factor from the stored SI value to a rotation in rad at the plot's B and L.
    const sameGeometry = point.fieldT === geometry.fieldT && point.lengthM === geometry.lengthM;
    if (point.quantity === "verdet") {
      factor = plotBL;
      rescaled = true;
    } else if (sameGeometry) {
      factor = 1;
      rescaled = false;
    } else {
      if (pointBL === 0) return null;
      factor = plotBL / pointBL;
      rescaled = true;
    }
    // rotationTo is linear for angle units: the unit factor of the axis.
    const unit = rotationTo(1, yMode, geometry) ?? 1;
    factor *= unit;
  }
  const y = point.value * factor;
  const sigma = Math.abs(point.sigma * factor);
  if (!Number.isFinite(x) || !Number.isFinite(y) || !Number.isFinite(sigma)) return null;
  return { x, y, sigma, point, rescaled };
}

/** A sentence for the legend saying how the points were converted for this y axis. */
export function describeConversion(options: {
  yMode: YMode;
  geometry: Geometry;
  quantities: ReadonlySet<MeasuredPoint["quantity"]>;
}): string {
  const { yMode, geometry, quantities } = options;
  // Rounded like every stored value on screen: 0.0133 m × 1000 is 13.299999999999999 in binary64.
  const bl = `B = ${fmtStored(geometry.fieldT)} T, L = ${fmtStored(geometry.lengthM * 1000)} mm`;
  if (yMode === "verdet") {
    return quantities.has("rotation")
      ? "Measured rotations are shown as Verdet constants θ/(B·L) at each point's own field and length."
      : "Verdet constants are shown as measured.";
  }
  const parts: string[] = [];
  if (quantities.has("verdet")) parts.push(`Verdet constants are shown as the rotation V·B·L at the plot's ${bl}`);
  if (quantities.has("rotation"))
    parts.push(`rotations measured at another field or length are scaled to the plot's ${bl} (linear in B·L)`);
  return `${parts.join("; ").replace(/^./, (c) => c.toUpperCase())}.`;
}

/* ---- points grouped by their measurement conditions (temperature, field) ---- */

/** Within this the curve's conditions count as the point's: 0.5 K (a cryostat's usual stability) and 1 mT. */
export const SAME_TEMPERATURE_K = 0.5;
export const SAME_FIELD_T = 1e-3;

export interface ConditionGroup {
  key: string;
  temperatureK: number;
  fieldT: number;
  /** Index into the plot's marker shapes (one shape per condition, in ascending T then B). */
  shape: number;
  /** The curve was computed at these conditions; otherwise the curve does not predict these points. */
  matchesCurve: boolean;
  count: number;
}

/** Conditions rounded so that 293.15 K from one file and 293.1500001 K from a conversion are one group. */
export function conditionKey(point: Pick<MeasuredPoint, "temperatureK" | "fieldT">): string {
  return `${Number(point.temperatureK.toPrecision(6))} K|${Number(point.fieldT.toPrecision(6))} T`;
}

/** The distinct (T, B) of the points of every shown set, each with its marker shape and whether it is the curve's. */
export function conditionGroups(
  pointSets: readonly (readonly Pick<MeasuredPoint, "temperatureK" | "fieldT">[])[],
  curve: { temperatureK: number; fieldT: number },
): ConditionGroup[] {
  const byKey = new Map<string, { temperatureK: number; fieldT: number; count: number }>();
  for (const points of pointSets) {
    for (const p of points) {
      const key = conditionKey(p);
      const group = byKey.get(key);
      if (group) group.count += 1;
      else byKey.set(key, { temperatureK: p.temperatureK, fieldT: p.fieldT, count: 1 });
    }
  }
  return [...byKey.entries()]
    .sort(([, a], [, b]) => a.temperatureK - b.temperatureK || a.fieldT - b.fieldT)
    .map(([key, g], shape) => ({
      key,
      ...g,
      shape,
      matchesCurve:
        Math.abs(g.temperatureK - curve.temperatureK) <= SAME_TEMPERATURE_K && Math.abs(g.fieldT - curve.fieldT) <= SAME_FIELD_T,
    }));
}
