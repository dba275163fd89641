import type { ModelParams } from "@/lib/physics/schema";

/**
 * Terbium gallium garnet at room temperature, 1 T, 10 mm: the values of physics-model.md §9
 * (handbook and public data; oscillator strength and damping there are illustrative). Used to
 * prefill a new parameter set and the workbench's scratch mode.
 */
export const TERBIUM_GARNET_DEFAULTS: ModelParams = {
  ionDensityPerM3: 1.2726e28,
  landeG: 1.5,
  totalJ: 6,
  curieWeissK: -8,
  gilbertDamping: 0.01,
  magneticScale: 1,
  epsInf: 1,
  sellmeierB: 2.7325,
  sellmeierWavelengthNm: 135.83,
  oscillatorStrength: 0.015,
  oscillatorWavelengthNm: 258,
  oscillatorDampingRadPerS: 1e14,
  gyrationPerT: 5.395e-3,
  temperatureK: 293.15,
  fieldT: 1,
  lengthM: 0.01,
};
