/*
 * Public result types of the physics engine (../shared/physics-model.md §6.3). The command line,
 * the worker and the workbench all speak these shapes.
 */

export interface SpectrumPoint {
  wavelengthNm: number;
  thetaRad: number;
  thetaElectricRad: number;
  thetaMagneticRad: number;
  thetaCrossRad: number;
  ellipticityRad: number;
  /** |θm| / (|θe| + |θm|); null when both parts are 0 (no spins or no field). */
  magneticShare: number | null;
  /** θ / (B0 L); null when B0 = 0. */
  verdetRadPerTm: number | null;
  /** Static change of Mz under the "+" / "−" circular drive (only with an intensity). */
  deltaMzPlusAPerM?: number | null;
  deltaMzMinusAPerM?: number | null;
  /**
   * Rotation of the diamagnetic term alone (§5.5), a sub-part of θe; only when diamagneticTerm is on.
   */
  thetaDiamagneticRad?: number;
  /*
   * Absorption (lib/physics/absorption.ts). Every result of this engine carries them; they are
   * optional so that results saved before they existed still read.
   */
  /** Intensity absorption coefficient α± = −2 ω Im n± / c of each circular mode (1/m; < 0 is gain). */
  absorptionPlusPerM?: number;
  absorptionMinusPerM?: number;
  /** Internal one-pass transmission exp(−α± L) of each circular mode (surface reflections excluded). */
  transmissionPlus?: number;
  transmissionMinus?: number;
  /** Ellipticity angle of the transmitted light, atan(tanh η) (§1); |·| ≤ π/4. */
  ellipticityAngleRad?: number;
}

export interface SpectrumResult {
  magnetizationAPerM: number;
  points: SpectrumPoint[];
  /** Method "llg": largest |χ_llg − χ_Polder| / |χ_Polder| over all wavelengths and both modes. */
  maxRelDeviationFromAnalytic?: number;
  warnings?: string[];
}

/** Progress is the fraction done, 0…1. */
export type ProgressCallback = (fractionDone: number) => void;

/**
 * Column form of a spectrum, for transfer between a worker and the page (typed arrays are
 * transferable). magneticShare and verdetRadPerTm use NaN for null; δMz arrays likewise.
 */
export interface SpectrumArrays {
  magnetizationAPerM: number;
  wavelengthNm: Float64Array;
  thetaRad: Float64Array;
  thetaElectricRad: Float64Array;
  thetaMagneticRad: Float64Array;
  thetaCrossRad: Float64Array;
  ellipticityRad: Float64Array;
  magneticShare: Float64Array;
  verdetRadPerTm: Float64Array;
  deltaMzPlusAPerM?: Float64Array;
  deltaMzMinusAPerM?: Float64Array;
  /** Only when diamagneticTerm is on (§5.5). */
  thetaDiamagneticRad?: Float64Array;
  absorptionPlusPerM: Float64Array;
  absorptionMinusPerM: Float64Array;
  transmissionPlus: Float64Array;
  transmissionMinus: Float64Array;
  ellipticityAngleRad: Float64Array;
  maxRelDeviationFromAnalytic?: number;
  warnings: string[];
  /**
   * Per-wavelength warning flags (WAVELENGTH_FLAG_* in lib/physics/spectrum.ts), so that chunks
   * computed in separate workers can be merged and their warnings rebuilt as one set.
   */
  flags?: Uint8Array;
}

/** Complex number as plain data (crosses worker boundaries unchanged). */
export interface ComplexValue {
  re: number;
  im: number;
}

/** Time trace of u = M/|M| under the "+" drive at one wavelength, with the lock-in result. */
export interface SpinTraceResult {
  /** Time in drive periods, from the start of the ramp. */
  timePeriods: Float64Array;
  ux: Float64Array;
  uy: Float64Array;
  uz: Float64Array;
  chiPlus: ComplexValue;
  chiMinus: ComplexValue;
  chiPlusAnalytic: ComplexValue;
  chiMinusAnalytic: ComplexValue;
  deltaMzPlusAPerM: number | null;
  deltaMzMinusAPerM: number | null;
}
