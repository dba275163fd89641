import type { ModelParams } from "@/lib/physics/schema";
import { TERBIUM_GARNET_DEFAULTS } from "@/lib/model/defaults";

/*
 * The values a fit holds fixed are part of its answer: every fit lists them with where they come
 * from. A value equal to the terbium-garnet reference values carries the source column of
 * physics-model.md §9; any other value is the parameter set's own, whose origin the product does
 * not know unless the caller names it.
 */

export interface Assumption {
  key: string;
  value: number | boolean | string;
  source: string;
}

/** The source column of physics-model.md §9 for the reference values (lib/model/defaults.ts). */
const REFERENCE_SOURCES: Partial<Record<keyof ModelParams, string>> = {
  ionDensityPerM3: "physics-model.md §9: 24 Tb per cubic cell of 12.355 Å (public data)",
  landeG: "physics-model.md §9: Tb³⁺ ground term ⁷F₆ (handbook)",
  totalJ: "physics-model.md §9: Tb³⁺ ground term ⁷F₆ (handbook)",
  curieWeissK: "physics-model.md §9: from memory, uncertain",
  gilbertDamping: "physics-model.md §9: illustrative (no measured value)",
  magneticScale: "first principles (physics-model.md §8)",
  epsInf: "physics-model.md §9: one-term fit to public index data",
  sellmeierB: "physics-model.md §9: one-term fit to public index data",
  sellmeierWavelengthNm: "physics-model.md §9: one-term fit to public index data",
  oscillatorStrength: "physics-model.md §9: illustrative",
  oscillatorWavelengthNm: 'physics-model.md §9: from memory ("near 260–300 nm")',
  oscillatorDampingRadPerS: "physics-model.md §9: illustrative (no measured value)",
  gyrationPerT: "physics-model.md §9: calibrated to V(632.8 nm, 293.15 K, 1 T) = −134 rad/(T·m)",
};

/** The keys whose held value shapes a fitted split (dispersion, density, g, J, θCW, damping, the amplitudes). */
export const ASSUMPTION_KEYS: readonly (keyof ModelParams)[] = [
  "oscillatorWavelengthNm",
  "oscillatorStrength",
  "oscillatorDampingRadPerS",
  "epsInf",
  "sellmeierB",
  "sellmeierWavelengthNm",
  "ionDensityPerM3",
  "landeG",
  "totalJ",
  "curieWeissK",
  "gilbertDamping",
  "gyrationPerT",
  "magneticScale",
  "diamagneticTerm",
  "diamagneticAnomaly",
  "diamagneticDispersion",
];

/** "From memory" and "illustrative" values: a result resting on one of them needs a prior or data that free it. */
export function isUnverifiedSource(source: string): boolean {
  return /from memory|illustrative|not recorded/i.test(source);
}

export const UNRECORDED_SOURCE = "the parameter set's value (its source is not recorded)";

/** The held values of a fit with their sources; `sources` overrides per key (e.g. from a materials library). */
export function heldAssumptions(
  params: ModelParams,
  varied: readonly string[],
  sources: Partial<Record<string, string>> = {},
): Assumption[] {
  return ASSUMPTION_KEYS.filter((k) => !varied.includes(k)).flatMap((key) => {
    const value = params[key];
    // A measured absorption table is data, not a held number: it is listed with the set, not here.
    if (value === undefined || typeof value === "object") return [];
    const reference = TERBIUM_GARNET_DEFAULTS[key];
    const source =
      sources[key] ??
      (key === "diamagneticTerm"
        ? value
          ? "bound-electron gyration of every pole of ε included (physics-model.md §5.5)"
          : "bound-electron (diamagnetic) gyration left out (physics-model.md §5.5)"
        : reference !== undefined && value === reference
          ? (REFERENCE_SOURCES[key] ?? UNRECORDED_SOURCE)
          : key === "magneticScale" && value === 1
            ? REFERENCE_SOURCES.magneticScale!
            : UNRECORDED_SOURCE);
    return [{ key, value, source }];
  });
}
