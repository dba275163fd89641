import type { SpectrumRequest } from "@/lib/physics/schema";

/**
 * Terbium gallium garnet, physics-model.md §9: g = 3/2, J = 6 (Tb³⁺ ⁷F₆, handbook), N = 24/a³ with
 * a = 12.355 Å (public data), one-term Sellmeier fit to public index data, and the one-oscillator
 * parameters of §9 (λE 258 nm from memory, κE calibrated there, f/ΓE/α illustrative).
 */
export const TGG: Omit<SpectrumRequest, "wavelengthsNm" | "method"> = {
  ionDensityPerM3: 1.2726e28,
  landeG: 1.5,
  totalJ: 6,
  curieWeissK: -8,
  gilbertDamping: 0.01,
  epsInf: 1,
  sellmeierB: 2.7325,
  sellmeierWavelengthNm: 135.83,
  oscillatorStrength: 0.015,
  oscillatorWavelengthNm: 258,
  oscillatorDampingRadPerS: 1e14,
  gyrationPerT: 5.395e-3,
  magneticScale: 1,
  temperatureK: 293.15,
  fieldT: 1,
  lengthM: 1,
};

export const relErr = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);
