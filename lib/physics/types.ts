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
