/*
 * Absorption beside rotation (physics-model.md §1, §6.1): what Im n± says about how much light gets
 * through. Pure functions of the engine's outputs, shared by the engine, the workbench and tests.
 *
 * Conventions (§1): a wave along +z is exp(i(ωt − n ω z / c)), so with Im n ≤ 0 its field falls as
 * exp(Im n · ω z / c) and its intensity as exp(−α z) with α = −2 ω Im n / c (the intensity
 * absorption coefficient, α = 4π k / λ with k = −Im n the extinction coefficient; M. Born and
 * E. Wolf, "Principles of Optics", ch. 14, chapter from memory). Transmission is the internal
 * transmission of one pass (Beer–Lambert, T = exp(−α L)); surface reflections are not included.
 */
import { SPEED_OF_LIGHT_M_PER_S } from "./constants";

/** Both circular modes transmit less than this fraction: the sample counts as opaque there. */
export const OPAQUE_TRANSMISSION = 0.01;

/**
 * |η| above this is outside the small-dichroism form: atan(tanh η) differs from η by about
 * 2η³/3, i.e. by 0.7 % of η at 0.1 rad (series of tanh and atan; common practice, no source).
 */
export const SMALL_ELLIPTICITY_RAD = 0.1;

/** Intensity absorption coefficient of a mode with index n at angular frequency ω (1/m); < 0 means gain. */
export function absorptionCoefficientPerM(omega: number, nIm: number): number {
  // −0 would print as "-0"; a lossless mode has exactly α = 0.
  const a = (-2 * omega * nIm) / SPEED_OF_LIGHT_M_PER_S;
  return a === 0 ? 0 : a;
}

/** Beer–Lambert internal transmission exp(−α L) of one pass. */
export function transmissionOf(alphaPerM: number, lengthM: number): number {
  return Math.exp(-alphaPerM * lengthM);
}

/**
 * The ellipticity angle of the light that leaves the sample when linear light goes in (§1):
 * with t± = exp(−i n± ω L / c), the ratio of the ellipse's axes is (|t−| − |t+|)/(|t−| + |t+|) =
 * tanh η, so the angle is atan(tanh η); it never exceeds π/4 (circular light).
 */
export function ellipticityAngleRad(etaRad: number): number {
  return Math.atan(Math.tanh(etaRad));
}

/** Where η itself may be read as the ellipticity angle. */
export function ellipticityIsSmall(etaRad: number): boolean {
  return Math.abs(etaRad) <= SMALL_ELLIPTICITY_RAD;
}

/** Mean of the two circular-mode coefficients (the isotropic loss), 1/m. */
export function meanAbsorptionPerM(alphaPlusPerM: number, alphaMinusPerM: number): number {
  return (alphaPlusPerM + alphaMinusPerM) / 2;
}

/**
 * Figure of merit |V| / α (rad/T) of a Faraday material, α the mean absorption coefficient: the
 * rotation per tesla bought with one neper of loss (common practice, no source). Null where V is
 * undefined (B0 = 0) or α ≤ 0 (lossless or with gain).
 */
export function figureOfMeritRadPerT(verdetRadPerTm: number | null, alphaMeanPerM: number): number | null {
  if (verdetRadPerTm === null || !Number.isFinite(verdetRadPerTm) || !(alphaMeanPerM > 0)) return null;
  return Math.abs(verdetRadPerTm) / alphaMeanPerM;
}

/** Both circular modes transmit less than `threshold`. */
export function isOpaque(transmissionPlus: number, transmissionMinus: number, threshold = OPAQUE_TRANSMISSION): boolean {
  return transmissionPlus < threshold && transmissionMinus < threshold;
}

/** A run of consecutive computed wavelengths where the sample is opaque (inclusive, nm). */
export interface WavelengthBand {
  fromNm: number;
  toNm: number;
}

/** The runs of consecutive opaque wavelengths, in the order given. */
export function opaqueBands(
  wavelengthNm: ArrayLike<number>,
  transmissionPlus: ArrayLike<number>,
  transmissionMinus: ArrayLike<number>,
  threshold = OPAQUE_TRANSMISSION,
): WavelengthBand[] {
  const bands: WavelengthBand[] = [];
  let open: WavelengthBand | null = null;
  for (let i = 0; i < wavelengthNm.length; i++) {
    const nm = wavelengthNm[i]!;
    if (isOpaque(transmissionPlus[i]!, transmissionMinus[i]!, threshold)) {
      if (open) open.toNm = nm;
      else {
        open = { fromNm: nm, toNm: nm };
        bands.push(open);
      }
    } else open = null;
  }
  return bands;
}

/** A measured absorption table row (the schema's absorptionTable, §2): wavelength in nm, α in 1/m. */
export interface MeasuredAbsorptionRow {
  wavelengthNm: number;
  absorptionPerM: number;
}

/**
 * α(λ) of a measured table by linear interpolation between its rows; null outside the table's
 * range (no extrapolation: the product never invents a loss the table does not state).
 */
export function tableAbsorptionPerM(table: readonly MeasuredAbsorptionRow[], wavelengthNm: number): number | null {
  const first = table[0];
  const last = table[table.length - 1];
  if (!first || !last || wavelengthNm < first.wavelengthNm || wavelengthNm > last.wavelengthNm) return null;
  let lo = 0;
  let hi = table.length - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (table[mid]!.wavelengthNm <= wavelengthNm) lo = mid;
    else hi = mid;
  }
  const a = table[lo]!;
  const b = table[hi]!;
  if (b.wavelengthNm === a.wavelengthNm) return a.absorptionPerM;
  const t = (wavelengthNm - a.wavelengthNm) / (b.wavelengthNm - a.wavelengthNm);
  return a.absorptionPerM + t * (b.absorptionPerM - a.absorptionPerM);
}

/**
 * The circular modes' α± with a measured isotropic loss: the table's α replaces the model's mean
 * (α+ + α−)/2, and the model's circular dichroism (α− − α+, which an unpolarized table cannot tell)
 * is kept, so α± = α_table ∓ (α− − α+)/2.
 */
export function withMeasuredLoss(alphaPlusPerM: number, alphaMinusPerM: number, measuredPerM: number): [number, number] {
  const half = (alphaMinusPerM - alphaPlusPerM) / 2;
  return [measuredPerM - half, measuredPerM + half];
}
