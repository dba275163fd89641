import {
  ellipticityIsSmall,
  figureOfMeritRadPerT,
  meanAbsorptionPerM,
  OPAQUE_TRANSMISSION,
  opaqueBands,
  SMALL_ELLIPTICITY_RAD,
  type WavelengthBand,
} from "@/lib/physics/absorption";
import type { SpectrumPoint } from "@/lib/physics/types";
import { fmtLength } from "./format";

/*
 * What the absorption panel shows, from the computed points (the physics is in
 * lib/physics/absorption.ts): α in cm⁻¹ (the unit absorption data are quoted in), transmission in
 * %, the transmitted ellipticity angle, the figure of merit |V|/α, and the wavelength runs that are
 * opaque or where η is outside the small-dichroism form.
 */

export interface AbsorptionRow {
  wavelengthNm: number;
  alphaPlusPerCm: number | null;
  alphaMinusPerCm: number | null;
  alphaMeanPerCm: number | null;
  transmissionPlus: number | null;
  transmissionMinus: number | null;
  opaque: boolean;
  ellipticityAngleRad: number | null;
  /** |η| ≤ 0.1 rad: η itself may be read as the angle. */
  etaSmall: boolean;
  figureOfMeritRadPerT: number | null;
}

/** 1 /m = 0.01 /cm. */
const PER_M_TO_PER_CM = 0.01;

export function absorptionRow(p: SpectrumPoint): AbsorptionRow {
  const ap = p.absorptionPlusPerM ?? null;
  const am = p.absorptionMinusPerM ?? null;
  const mean = ap !== null && am !== null ? meanAbsorptionPerM(ap, am) : null;
  const tp = p.transmissionPlus ?? null;
  const tm = p.transmissionMinus ?? null;
  return {
    wavelengthNm: p.wavelengthNm,
    alphaPlusPerCm: ap === null ? null : ap * PER_M_TO_PER_CM,
    alphaMinusPerCm: am === null ? null : am * PER_M_TO_PER_CM,
    alphaMeanPerCm: mean === null ? null : mean * PER_M_TO_PER_CM,
    transmissionPlus: tp,
    transmissionMinus: tm,
    opaque: tp !== null && tm !== null && tp < OPAQUE_TRANSMISSION && tm < OPAQUE_TRANSMISSION,
    ellipticityAngleRad: p.ellipticityAngleRad ?? null,
    etaSmall: ellipticityIsSmall(p.ellipticityRad),
    figureOfMeritRadPerT: mean === null ? null : figureOfMeritRadPerT(p.verdetRadPerTm, mean),
  };
}

/** True when the result carries the absorption columns (results saved before they existed do not). */
export function hasAbsorption(points: readonly SpectrumPoint[]): boolean {
  return points.length > 0 && points.every((p) => p.transmissionPlus !== undefined && p.transmissionMinus !== undefined);
}

/**
 * Where between two computed wavelengths the better-transmitted mode crosses the opaque threshold.
 * ln T = −αL is smooth in λ away from a line, so the crossing is interpolated linearly in ln T:
 * the edge then moves by far less than a grid step when the grid changes (a band edge at the last
 * opaque grid point moved with the grid, by up to one step).
 */
function crossingNm(a: SpectrumPoint, b: SpectrumPoint): number {
  const lnT = (p: SpectrumPoint) => Math.log(Math.max(p.transmissionPlus!, p.transmissionMinus!, Number.MIN_VALUE));
  const ya = lnT(a);
  const yb = lnT(b);
  const target = Math.log(OPAQUE_TRANSMISSION);
  if (!Number.isFinite(ya) || !Number.isFinite(yb) || ya === yb) return (a.wavelengthNm + b.wavelengthNm) / 2;
  const f = Math.min(1, Math.max(0, (target - ya) / (yb - ya)));
  return a.wavelengthNm + f * (b.wavelengthNm - a.wavelengthNm);
}

/**
 * Neighbours further apart than this fraction of the wavelength are no grid to interpolate on (a
 * few marker wavelengths): there the edge stays at the last opaque point computed.
 */
const MAX_INTERPOLATION_GAP = 0.05;

function edgeBetween(opaque: SpectrumPoint, clear: SpectrumPoint | undefined): number {
  if (!clear || Math.abs(clear.wavelengthNm - opaque.wavelengthNm) > MAX_INTERPOLATION_GAP * opaque.wavelengthNm)
    return opaque.wavelengthNm;
  return crossingNm(opaque, clear);
}

/** The opaque runs of a computed spectrum, their inner edges interpolated between grid points (the grid's ends stay). */
export function opaqueBandsOf(points: readonly SpectrumPoint[]): WavelengthBand[] {
  if (!hasAbsorption(points)) return [];
  const wavelengths = points.map((p) => p.wavelengthNm);
  const bands = opaqueBands(
    wavelengths,
    points.map((p) => p.transmissionPlus!),
    points.map((p) => p.transmissionMinus!),
  );
  return bands.map((band) => {
    const first = wavelengths.indexOf(band.fromNm);
    const last = wavelengths.indexOf(band.toNm);
    return { fromNm: edgeBetween(points[first]!, points[first - 1]), toNm: edgeBetween(points[last]!, points[last + 1]) };
  });
}

/** The runs where |η| is beyond the small-dichroism form. */
export function largeEllipticityBands(points: readonly SpectrumPoint[]): WavelengthBand[] {
  const bands: WavelengthBand[] = [];
  let open: WavelengthBand | null = null;
  for (const p of points) {
    if (!ellipticityIsSmall(p.ellipticityRad)) {
      if (open) open.toNm = p.wavelengthNm;
      else {
        open = { fromNm: p.wavelengthNm, toNm: p.wavelengthNm };
        bands.push(open);
      }
    } else open = null;
  }
  return bands;
}

const nm = (v: number) => String(Number(v.toPrecision(4)));

/** "300–703 nm, 1200 nm" (at most `max` runs, then how many more). */
export function formatBands(bands: readonly WavelengthBand[], max = 4): string {
  const shown = bands.slice(0, max).map((b) => (b.fromNm === b.toNm ? `${nm(b.fromNm)} nm` : `${nm(b.fromNm)}–${nm(b.toNm)} nm`));
  const more = bands.length > max ? ` and ${bands.length - max} more` : "";
  return `${shown.join(", ")}${more}`;
}

/** The warning shown beside the rotation, or null when light gets through everywhere. */
export function opaqueWarning(points: readonly SpectrumPoint[], lengthM: number): string | null {
  const bands = opaqueBandsOf(points);
  if (bands.length === 0) return null;
  return (
    `Opaque for this ${fmtLength(lengthM)} sample at ${formatBands(bands)}: ` +
    `both circular modes transmit less than ${OPAQUE_TRANSMISSION * 100} %, ` +
    "so the rotation shown there could not be measured in transmission."
  );
}

/** The note on η, or null when it is small everywhere. */
export function ellipticityNote(points: readonly SpectrumPoint[]): string | null {
  const bands = largeEllipticityBands(points);
  if (bands.length === 0) return null;
  return (
    `|η| exceeds ${SMALL_ELLIPTICITY_RAD} rad at ${formatBands(bands)}: ` +
    "there η is outside the small-dichroism form and is not an angle; " +
    "the ellipticity shown is that of the transmitted light, atan(tanh η), which never exceeds 45°."
  );
}

/** Transmission as a percentage with enough digits to tell 0.3 % from 1e-40 %. */
export function formatTransmission(t: number | null): string {
  if (t === null || Number.isNaN(t)) return "–";
  if (!Number.isFinite(t) || t > 1) return "gain";
  if (t === 0) return "0 % (below 1e-300)";
  const pct = t * 100;
  if (pct >= 1) return `${pct.toFixed(1)} %`;
  if (pct >= 0.01) return `${pct.toPrecision(2)} %`;
  return `${pct.toExponential(1).replace("e+", "e")} %`;
}
