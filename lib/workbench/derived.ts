import type { SpectrumPoint } from "@/lib/physics/types";

/*
 * Figures the UI derives from one spectrum point (physics-model §6.3): the signed ratio θm/θ and
 * the 45° length of a Faraday rotator, L45 = (π/4) / (|V| |B0|).
 */

/** θm / θ, null when θ = 0. */
export function signedMagneticRatio(point: Pick<SpectrumPoint, "thetaRad" | "thetaMagneticRad">): number | null {
  return point.thetaRad === 0 ? null : point.thetaMagneticRad / point.thetaRad;
}

/** Length (m) that rotates by exactly 45° at field B0; null without rotation or field. */
export function length45M(verdetRadPerTm: number | null, fieldT: number): number | null {
  if (verdetRadPerTm === null || verdetRadPerTm === 0 || fieldT === 0) return null;
  return Math.PI / 4 / (Math.abs(verdetRadPerTm) * Math.abs(fieldT));
}

export interface MarkerValues {
  wavelengthNm: number;
  thetaRad: number;
  thetaElectricRad: number;
  thetaMagneticRad: number;
  magneticShare: number | null;
  verdetRadPerTm: number | null;
  length45M: number | null;
  signedRatio: number | null;
  ellipticityRad: number;
}

export function markerValues(point: SpectrumPoint, fieldT: number): MarkerValues {
  return {
    wavelengthNm: point.wavelengthNm,
    thetaRad: point.thetaRad,
    thetaElectricRad: point.thetaElectricRad,
    thetaMagneticRad: point.thetaMagneticRad,
    magneticShare: point.magneticShare,
    verdetRadPerTm: point.verdetRadPerTm,
    length45M: length45M(point.verdetRadPerTm, fieldT),
    signedRatio: signedMagneticRatio(point),
    ellipticityRad: point.ellipticityRad,
  };
}

/** Marker wavelengths as a request list: finite, positive, sorted, strictly increasing. */
export function normalizeMarkers(markersNm: readonly number[]): number[] {
  const sorted = markersNm.filter((x) => Number.isFinite(x) && x > 0).sort((a, b) => a - b);
  const out: number[] = [];
  for (const x of sorted) if (out.length === 0 || x > out[out.length - 1]!) out.push(x);
  return out;
}

/** Index of the grid point nearest to a wavelength (grids are increasing). */
export function nearestIndex(wavelengthsNm: readonly number[], targetNm: number): number {
  let lo = 0;
  let hi = wavelengthsNm.length - 1;
  if (hi < 0) return -1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (wavelengthsNm[mid]! < targetNm) lo = mid;
    else hi = mid;
  }
  return Math.abs(wavelengthsNm[lo]! - targetNm) <= Math.abs(wavelengthsNm[hi]! - targetNm) ? lo : hi;
}
