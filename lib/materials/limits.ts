import { computeSpectrum } from "@/lib/physics/spectrum";
import type { ModelParams } from "@/lib/physics/schema";
import { MATERIALS, type MaterialEntry, materialById } from "./library";
import { MATERIAL_SOURCES } from "./sources";

/*
 * The model's limits where they bite: one pure function shared by the workbench, the maps, the
 * fit and the planner. It speaks of a library material's validity ranges (when the set came from
 * one) and of the free-ion Tb³⁺ description at low temperature (any set with g = 3/2, J = 6 spins).
 */

/**
 * The library material a set stands on: the one whose index background (ε∞, B, λS) the set shares
 * exactly. A copied set keeps it through fits of κE, λE or the scale, so its ranges keep applying.
 */
export function materialOfParams(params: Pick<ModelParams, "epsInf" | "sellmeierB" | "sellmeierWavelengthNm">): MaterialEntry | undefined {
  return MATERIALS.find(
    (m) =>
      m.params.epsInf === params.epsInf &&
      m.params.sellmeierB === params.sellmeierB &&
      m.params.sellmeierWavelengthNm === params.sellmeierWavelengthNm,
  );
}

export interface LimitQuery {
  /** The material the set was copied from; absent = found from the parameters (materialOfParams). */
  materialId?: string | null;
  params: Pick<ModelParams, "ionDensityPerM3" | "landeG" | "totalJ" | "epsInf" | "sellmeierB" | "sellmeierWavelengthNm">;
  /** Every temperature the view computes at (one for a spectrum, a range for a map or a fit). */
  temperaturesK: readonly number[];
  fieldsT: readonly number[];
  wavelengthsNm: readonly number[];
}

/** Below this the free-ion J = 6 magnetization is off for Tb³⁺ in a garnet (Wawrzyńczak et al., PRB 2019: crystal field rules). */
export const TERBIUM_FREE_ION_MIN_K = 30;

/** Published low-temperature enhancements V(T)/V(room) of the terbium garnet, against which the warning compares. */
export const TERBIUM_GARNET_ENHANCEMENTS = [
  { temperatureK: 4.2, ratio: 87, wavelengthNm: 1053, source: MATERIAL_SOURCES.yasuhara2007 },
  { temperatureK: 6.3, ratio: 28, wavelengthNm: 632.8, source: MATERIAL_SOURCES.majeed2013 },
] as const;

const isTerbiumLike = (p: LimitQuery["params"]) => p.ionDensityPerM3 > 0 && p.landeG === 1.5 && p.totalJ === 6;

/** V(T)/V(293.15 K) of the library garnet in this model, at the wavelength of a published figure. */
export function modelEnhancement(material: MaterialEntry, temperatureK: number, wavelengthNm: number): number {
  const at = (t: number) =>
    computeSpectrum({ ...material.params, temperatureK: t, wavelengthsNm: [wavelengthNm], method: "analytic" }).points[0]!.verdetRadPerTm!;
  return at(temperatureK) / at(293.15);
}

const fmt = (v: number) => String(Number(v.toPrecision(3)));

function outside(values: readonly number[], min: number, max: number): number[] {
  return values.filter((v) => v < min || v > max);
}

/** Warnings, one line each; empty when the view stays inside every range. */
export function modelLimitWarnings(q: LimitQuery): string[] {
  const warnings: string[] = [];
  const material = q.materialId ? materialById(q.materialId) : materialOfParams(q.params);
  const minT = q.temperaturesK.length > 0 ? Math.min(...q.temperaturesK) : Number.NaN;
  if (isTerbiumLike(q.params) && minT < TERBIUM_FREE_ION_MIN_K) {
    const garnet = materialById("tgg")!;
    const published = TERBIUM_GARNET_ENHANCEMENTS.map(
      (e) => `${e.ratio}× at ${e.temperatureK} K (${e.source.citation.split(":")[0]})`,
    ).join(", ");
    const model = TERBIUM_GARNET_ENHANCEMENTS.map((e) => `${fmt(modelEnhancement(garnet, e.temperatureK, e.wavelengthNm))}×`).join(" and ");
    warnings.push(
      `temperature: below ~${TERBIUM_FREE_ION_MIN_K} K the free-ion model misses the terbium ground state's crystal-field structure; ` +
        `published enhancements of the garnet's Verdet constant over room temperature are ${published}; this model gives ${model}.`,
    );
  }
  if (!material) return warnings;
  const v = material.validity;
  const badT = outside(q.temperaturesK, v.temperatureK.min, v.temperatureK.max);
  // The terbium warning above already says why low temperatures fail; do not say it twice.
  if (badT.length > 0 && !(isTerbiumLike(q.params) && minT < TERBIUM_FREE_ION_MIN_K)) {
    warnings.push(`temperature: ${material.name} is meant for ${v.temperatureK.min}–${v.temperatureK.max} K; ${v.notes.temperature}.`);
  }
  const badB = q.fieldsT.filter((b) => Math.abs(b) > v.fieldT.max || Math.abs(b) < v.fieldT.min);
  if (badB.length > 0) warnings.push(`field: ${material.name} is meant for |B0| ≤ ${v.fieldT.max} T; ${v.notes.field}.`);
  const badL = outside(q.wavelengthsNm, v.wavelengthNm.min, v.wavelengthNm.max);
  if (badL.length > 0) {
    warnings.push(
      `wavelength: ${material.name} is meant for ${v.wavelengthNm.min}–${v.wavelengthNm.max} nm ` +
        `(${badL.length} of ${q.wavelengthsNm.length} wavelengths outside); ${v.notes.wavelength}.`,
    );
  }
  for (const band of material.avoid) {
    if (q.wavelengthsNm.some((nm) => nm >= band.fromNm && nm <= band.toNm)) {
      warnings.push(`wavelength: ${band.fromNm}–${band.toNm} nm is the ${band.note} of ${material.name}; avoid it for rotation work.`);
    }
  }
  return warnings;
}
