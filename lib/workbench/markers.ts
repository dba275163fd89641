import type { SpectrumPoint } from "@/lib/physics/types";
import { parseNumber } from "./validate";
import { MARKER_MAX_NM, MARKER_MIN_NM } from "./view-state";

export { MARKER_MAX_NM, MARKER_MIN_NM };

/*
 * Marker wavelengths: what may be entered, and how a marker reads its values from a computed
 * spectrum without a new run. A marker on a grid point takes that point; between grid points
 * the workbench computes the one wavelength (see use-marker-values) and, until that arrives,
 * shows values interpolated linearly in wavelength between the two neighbours, marked as such.
 */

export type MarkerCheck = { nm: number; error: null } | { nm: null; error: string };

/** A typed marker wavelength (nm) → the number, or a message that says what is wrong. */
export function checkMarkerText(text: string, existingNm: readonly number[], maxMarkers: number): MarkerCheck {
  if (text.trim() === "") return { nm: null, error: "Enter a wavelength in nm, e.g. 1064." };
  const nm = parseNumber(text);
  if (nm === null) return { nm: null, error: `"${text.trim()}" is not a number; enter a wavelength in nm, e.g. 1064.` };
  return checkMarkerNm(nm, existingNm, maxMarkers);
}

export function checkMarkerNm(nm: number, existingNm: readonly number[], maxMarkers: number): MarkerCheck {
  if (!Number.isFinite(nm) || nm < MARKER_MIN_NM || nm > MARKER_MAX_NM) {
    return {
      nm: null,
      error:
        `A marker must lie between ${MARKER_MIN_NM} and ${MARKER_MAX_NM} nm; ` +
        `${Number.isFinite(nm) ? `${nm} nm` : "that value"} is outside.`,
    };
  }
  if (existingNm.includes(nm)) return { nm: null, error: `There is already a marker at ${nm} nm.` };
  if (existingNm.length >= maxMarkers) return { nm: null, error: `At most ${maxMarkers} markers; remove one first.` };
  return { nm, error: null };
}

export function isMarkerInRange(nm: number): boolean {
  return Number.isFinite(nm) && nm >= MARKER_MIN_NM && nm <= MARKER_MAX_NM;
}

/** The grid point at exactly this wavelength, if the spectrum has one (grids are increasing). */
export function exactPoint(points: readonly SpectrumPoint[], nm: number): SpectrumPoint | null {
  let lo = 0;
  let hi = points.length - 1;
  while (lo <= hi) {
    const mid = (lo + hi) >> 1;
    const w = points[mid]!.wavelengthNm;
    if (w === nm) return points[mid]!;
    if (w < nm) lo = mid + 1;
    else hi = mid - 1;
  }
  return null;
}

const lerp = (a: number, b: number, t: number) => a + (b - a) * t;
const lerpNullable = (a: number | null, b: number | null, t: number) => (a === null || b === null ? null : lerp(a, b, t));

/**
 * Values at `nm` interpolated linearly in wavelength between the two grid neighbours; null
 * outside the grid (no extrapolation). Rotations vary smoothly away from the resonances the
 * grid resolves, so this is a stand-in for a moment, never the value exported.
 */
export function interpolatePoint(points: readonly SpectrumPoint[], nm: number): SpectrumPoint | null {
  const n = points.length;
  if (n === 0 || !(nm >= points[0]!.wavelengthNm) || !(nm <= points[n - 1]!.wavelengthNm)) return null;
  const exact = exactPoint(points, nm);
  if (exact) return exact;
  let lo = 0;
  let hi = n - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (points[mid]!.wavelengthNm < nm) lo = mid;
    else hi = mid;
  }
  const a = points[lo]!;
  const b = points[hi]!;
  const t = (nm - a.wavelengthNm) / (b.wavelengthNm - a.wavelengthNm);
  return {
    wavelengthNm: nm,
    thetaRad: lerp(a.thetaRad, b.thetaRad, t),
    thetaElectricRad: lerp(a.thetaElectricRad, b.thetaElectricRad, t),
    thetaMagneticRad: lerp(a.thetaMagneticRad, b.thetaMagneticRad, t),
    thetaCrossRad: lerp(a.thetaCrossRad, b.thetaCrossRad, t),
    ellipticityRad: lerp(a.ellipticityRad, b.ellipticityRad, t),
    magneticShare: lerpNullable(a.magneticShare, b.magneticShare, t),
    verdetRadPerTm: lerpNullable(a.verdetRadPerTm, b.verdetRadPerTm, t),
  };
}
