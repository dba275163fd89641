import type { SpectrumRequest } from "./schema";
import type { SpectrumArrays } from "./types";
import { passivityLimitNm } from "./verdet";

/*
 * Per-wavelength flags of a spectrum run (one bit each in SpectrumArrays.flags) and the warning
 * texts built from them (physics-model.md §5.3, §4.5, §7).
 */

/** ε± has gain here (§5.3). */
export const WAVELENGTH_FLAG_GAIN = 1;
/** The precession cone reached |C| ≥ 1, δMz null (§4.5). */
export const WAVELENGTH_FLAG_CONE = 2;
/** The LLG transient could not be settled (§7). */
export const WAVELENGTH_FLAG_UNSETTLED = 4;
/** Outside the measured absorption table's range: the oscillator's Lorentzian tail gives the loss there. */
export const WAVELENGTH_FLAG_OUTSIDE_TABLE = 8;

/**
 * Passivity (§5.3): Im ε± = −ΓE ω ωE (f ωE ± 2Kω)/|D|², so one of ε± has gain where f·ωE < 2|K|ω;
 * with ΓE = 0 both are exactly real. K = κE μ0 M0, ω and ωE in rad/s.
 */
export function hasGain(
  request: Pick<SpectrumRequest, "oscillatorDampingRadPerS" | "oscillatorStrength">,
  omegaE: number,
  gyrationK: number,
  omega: number,
): boolean {
  return request.oscillatorDampingRadPerS > 0 && request.oscillatorStrength * omegaE < 2 * Math.abs(gyrationK) * omega;
}

/**
 * Warning texts from the per-wavelength flags (§5.3, §4.5, §7). A pure function of the request and
 * the columns, so the pool can rebuild one set of warnings after merging chunks.
 */
export function spectrumWarnings(
  request: Pick<
    SpectrumRequest,
    "gyrationPerT" | "oscillatorStrength" | "oscillatorWavelengthNm" | "oscillatorDampingRadPerS" | "absorptionTable"
  >,
  arrays: Pick<SpectrumArrays, "wavelengthNm" | "flags" | "magnetizationAPerM">,
): string[] {
  const warnings: string[] = [];
  const flags = arrays.flags;
  if (!flags) return warnings;
  const pick = (bit: number) => {
    const list: number[] = [];
    for (let i = 0; i < flags.length; i++) if (flags[i]! & bit) list.push(arrays.wavelengthNm[i]!);
    return list;
  };
  const gain = pick(WAVELENGTH_FLAG_GAIN);
  if (gain.length > 0) {
    const limit = passivityLimitNm({ ...request, magnetizationAPerM: arrays.magnetizationAPerM });
    warnings.push(
      `passivity: ε± has gain (Im ε± > 0) where f·ωE < 2|κE μ0 M0|·ω, i.e. below ${formatNm(limit)} nm; ` +
        `affected wavelengths (nm): ${listWavelengths(gain)}`,
    );
  }
  const cone = pick(WAVELENGTH_FLAG_CONE);
  if (cone.length > 0) {
    warnings.push(`intensity: the precession cone reaches |C| ≥ 1, so δMz is undefined (null) at (nm): ${listWavelengths(cone)}`);
  }
  const unsettled = pick(WAVELENGTH_FLAG_UNSETTLED);
  if (unsettled.length > 0) {
    warnings.push(
      "llg: the free-precession transient cannot be given time to decay (|ω0/ω| > 0.05 with small damping) " +
        `at (nm): ${listWavelengths(unsettled)}; the deviation from the analytic form may exceed 1e-4 there`,
    );
  }
  const outside = pick(WAVELENGTH_FLAG_OUTSIDE_TABLE);
  const table = request.absorptionTable;
  if (outside.length > 0 && table && table.length > 0) {
    warnings.push(
      `absorption: the measured table covers ${formatNm(table[0]!.wavelengthNm)}–${formatNm(table[table.length - 1]!.wavelengthNm)} nm; ` +
        `outside it the loss is the oscillator's Lorentzian tail, at (nm): ${listWavelengths(outside)}`,
    );
  }
  return warnings;
}

function listWavelengths(values: number[]): string {
  const shown = values.slice(0, 8).map((v) => String(v));
  return values.length > 8 ? `${shown.join(", ")}, … (${values.length} in all)` : shown.join(", ");
}

function formatNm(v: number): string {
  return Number.isFinite(v) ? String(Number(v.toPrecision(5))) : "∞";
}
