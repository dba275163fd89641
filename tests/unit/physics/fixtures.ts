import type { SpectrumRequest } from "@/lib/physics/schema";

/**
 * Terbium gallium garnet: the table of physics-model.md §9, kept here as the tests' own copy (not
 * imported from lib/model/defaults.ts) so a change to the app's defaults cannot move the reference
 * values the physics is checked against. Each value names its row of §9 and that row's source.
 */
export const TGG: Omit<SpectrumRequest, "wavelengthsNm" | "method"> = {
  // §9 "ionDensityPerM3": 24 / a³ with a = 12.355 Å, 24 Tb per cubic cell (public data).
  ionDensityPerM3: 1.2726e28,
  // §9 "landeG": 3/2 for Tb³⁺, ground term ⁷F₆ (handbook).
  landeG: 1.5,
  // §9 "totalJ": 6 (handbook).
  totalJ: 6,
  // §9 "curieWeissK": about −8 K (from memory, uncertain).
  curieWeissK: -8,
  // §9 "oscillatorDampingRadPerS, gilbertDamping": α = 0.01 (illustrative, no measured value).
  gilbertDamping: 0.01,
  // §9 "epsInf, sellmeierB, sellmeierWavelengthNm": 1, 2.7325, 135.83 nm (one-term fit to public index data).
  epsInf: 1,
  sellmeierB: 2.7325,
  sellmeierWavelengthNm: 135.83,
  // §9 "oscillatorStrength": 0.015 (illustrative; keeps ε± passive above 248 nm at saturation).
  oscillatorStrength: 0.015,
  // §9 "oscillatorWavelengthNm": 258 nm (from memory, "near 260–300 nm").
  oscillatorWavelengthNm: 258,
  // §9 "oscillatorDampingRadPerS, gilbertDamping": ΓE = 1e14 rad/s (illustrative, no measured value).
  oscillatorDampingRadPerS: 1e14,
  // §9 "gyrationPerT": 5.395e-3, calibrated there to V(632.8 nm, 293.15 K, 1 T) = −134 rad/(T·m).
  gyrationPerT: 5.395e-3,
  // §2 and §4.3: magneticScale default 1, the unscaled first-principles magnetic part.
  magneticScale: 1,
  // §9 "gyrationPerT" row: the calibration conditions, 293.15 K and 1 T.
  temperatureK: 293.15,
  fieldT: 1,
  // 1 m, so rotation angles read directly as rad/m (a test choice, not a §9 value).
  lengthM: 1,
};

export const relErr = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);
