/*
 * Verdet-constant helpers: the E ↔ κE conversion (physics-model.md §5.4), the 45° rotator length
 * (§6.3, §8) and the passivity limit (§5.3).
 */
import { MU0_N_PER_A2, angularFrequencyFromNm } from "./constants";
import { staticMagnetization } from "./magnetization";
import { type DielectricParams, permittivity } from "./optics";
import { rootDecaying } from "./complex";

/** Reference conditions at which the user knows the electric-dipole Verdet constant (§5.4 defaults). */
export interface VerdetReference {
  referenceWavelengthNm?: number;
  referenceTemperatureK?: number;
  referenceFieldT?: number;
}

export const DEFAULT_VERDET_REFERENCE = {
  referenceWavelengthNm: 632.8,
  referenceTemperatureK: 293.15,
  referenceFieldT: 1,
} as const;

/** Material parameters the conversion needs: the spins (for M0) and the dielectric (for n). */
export interface GyrationConversionParams extends DielectricParams {
  ionDensityPerM3: number;
  landeG: number;
  totalJ: number;
  curieWeissK: number;
}

/** −2π (μ0 M0(T_ref, B_ref)/B_ref) λE / n(λ_ref), in m: E = κE × this (§5.4). */
function conversionFactorM(params: GyrationConversionParams, ref: VerdetReference): number {
  const { referenceWavelengthNm: lambdaRef, referenceTemperatureK: tRef, referenceFieldT: bRef } = { ...DEFAULT_VERDET_REFERENCE, ...ref };
  if (!(tRef > params.curieWeissK)) throw new RangeError("referenceTemperatureK: must be above the Curie–Weiss temperature");
  if (bRef === 0) throw new RangeError("referenceFieldT: must be nonzero");
  const m0 = staticMagnetization({ ...params, temperatureK: tRef, fieldT: bRef });
  if (m0 === 0) throw new RangeError("ionDensityPerM3: M0 at the reference conditions is 0, so κE cannot be set from a Verdet constant");
  const nRef = rootDecaying(permittivity(params, lambdaRef, angularFrequencyFromNm(lambdaRef))).re;
  return (-2 * Math.PI * ((MU0_N_PER_A2 * m0) / bRef) * params.oscillatorWavelengthNm * 1e-9) / nRef;
}

/**
 * κE (1/T) from the dispersion constant E (rad m/T) of V_e(λ) ≈ E / (λ² − λE²), defined exactly by
 * κE = −E n(λ_ref) B_ref / (2π λE μ0 M0(T_ref, B_ref)) (§5.4). Alternatively pass the electric-dipole
 * Verdet constant at λ_ref, verdetRadPerTm, and E = V (λ_ref² − λE²) is used.
 */
export function verdetToGyration(
  params: GyrationConversionParams,
  value: ({ dispersionRadMPerT: number } | { verdetRadPerTm: number }) & VerdetReference,
): number {
  const lambdaRefM = (value.referenceWavelengthNm ?? DEFAULT_VERDET_REFERENCE.referenceWavelengthNm) * 1e-9;
  const lambdaEM = params.oscillatorWavelengthNm * 1e-9;
  const e =
    "dispersionRadMPerT" in value ? value.dispersionRadMPerT : value.verdetRadPerTm * (lambdaRefM * lambdaRefM - lambdaEM * lambdaEM);
  return e / conversionFactorM(params, value);
}

/**
 * The inverse: E = −2π κE (μ0 M0(T_ref, B_ref)/B_ref) λE / n(λ_ref) (§5.4), and the first-order
 * electric Verdet constant at λ_ref, E / (λ_ref² − λE²).
 */
export function gyrationToVerdet(
  params: GyrationConversionParams & { gyrationPerT: number },
  ref: VerdetReference = {},
): { dispersionRadMPerT: number; verdetRadPerTm: number } {
  const lambdaRefM = (ref.referenceWavelengthNm ?? DEFAULT_VERDET_REFERENCE.referenceWavelengthNm) * 1e-9;
  const lambdaEM = params.oscillatorWavelengthNm * 1e-9;
  const e = params.gyrationPerT * conversionFactorM(params, ref);
  return { dispersionRadMPerT: e, verdetRadPerTm: e / (lambdaRefM * lambdaRefM - lambdaEM * lambdaEM) };
}

/**
 * Length of a 45° Faraday rotator, L45 = (π/4)/(|V| |B0|) (§6.3). θ is linear in L, so this length
 * gives |θ| = π/4 exactly. Null when V B0 = 0 (no rotation to use).
 */
export function rotatorLength45M(verdetRadPerTm: number, fieldT: number): number | null {
  const vb = Math.abs(verdetRadPerTm * fieldT);
  return vb > 0 && Number.isFinite(vb) ? Math.PI / 4 / vb : null;
}

export interface PassivityParams {
  oscillatorStrength: number;
  oscillatorWavelengthNm: number;
  oscillatorDampingRadPerS: number;
  gyrationPerT: number;
  magnetizationAPerM: number;
}

/**
 * Shortest passive wavelength in nm (§5.3): both ε± are passive where λ ≥ 2|K| λE / f,
 * K = κE μ0 M0. 0 when every wavelength is passive (K = 0, or ΓE = 0 so that ε± are real);
 * Infinity when f = 0 and K ≠ 0 (gain everywhere).
 */
export function passivityLimitNm(p: PassivityParams): number {
  const k = Math.abs(p.gyrationPerT * MU0_N_PER_A2 * p.magnetizationAPerM);
  if (k === 0 || p.oscillatorDampingRadPerS === 0) return 0;
  if (p.oscillatorStrength === 0) return Infinity;
  return (2 * k * p.oscillatorWavelengthNm) / p.oscillatorStrength;
}
