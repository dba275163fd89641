import type { ModelParams } from "@/lib/physics/schema";
import type { IndexFormula } from "./dispersion";
import type { MaterialSourceId } from "./sources";

/*
 * The material library: cited materials that start a parameter set. Site-wide and read-only; data
 * in code, so every value sits beside its source. Tags used in `valueSources`:
 *   "as printed in <source>", "derived here from <source>", "fitted here to <source>",
 *   "chosen here: <reason>" (no source; the reason is the model's own rule), "not used: <reason>".
 * Bump MATERIAL_LIBRARY_VERSION whenever a value changes: sets copied from the library record it.
 */

export const MATERIAL_LIBRARY_VERSION = "2026.12.1";

export interface Range {
  min: number;
  max: number;
}

/** A wavelength band of note: a transparency window, or an absorption band to avoid. */
export interface Band {
  fromNm: number;
  toNm: number;
  note: string;
  sources: MaterialSourceId[];
}

/** One outside check value of a material: what the model's parameter set should reproduce. */
export interface VerdetCheck {
  wavelengthNm: number;
  verdetRadPerTm: number;
  /** False where the source prints a magnitude only (the sign is then the material's). */
  signed: boolean;
  source: MaterialSourceId;
}

export interface IndexCheck {
  wavelengthNm: number;
  n: number;
  /** The source's own precision (half a unit of its last printed digit). */
  precision: number;
  source: MaterialSourceId;
}

/** The ranges inside which this material's parameter set is meant to be used. */
export interface Validity {
  wavelengthNm: Range;
  temperatureK: Range;
  /** |B0| range, T. */
  fieldT: Range;
  /** Why each range ends where it does (one line each), shown with the warnings. */
  notes: { wavelength: string; temperature: string; field: string };
}

export interface MaterialEntry {
  id: string;
  name: string;
  formula: string;
  kind: "paramagnetic crystal" | "diamagnetic glass";
  summary: string;
  /** A parameter set at the reference conditions (293.15 K, 1 T, 10 mm). */
  params: ModelParams;
  /** Where every value of `params` comes from (one line per key). */
  valueSources: Record<string, string>;
  /** The sources this entry cites. */
  sources: MaterialSourceId[];
  /** The index as the source gives it, and check values the library reproduces. */
  index: { formula: IndexFormula; source: MaterialSourceId; rangeNm: Range; checks: IndexCheck[] };
  /** Largest |n_model − n_source| over index.rangeNm, as fitted here (stated, and tested). */
  modelIndexTolerance: number;
  verdetChecks: VerdetCheck[];
  validity: Validity;
  windows: Band[];
  avoid: Band[];
}

const ROOM = { temperatureK: 293.15, fieldT: 1, lengthM: 0.01 } as const;

/**
 * Franta et al. (2025) n and k rows, copied as printed (λ in µm, n, k). The absorption coefficient
 * is α = 4π k / λ (M. Born and E. Wolf, Principles of Optics, ch. 14; common practice). Rows were
 * picked to follow the shape: the Tb³⁺ ⁷F₆ → ⁵D₄ band near 470–500 nm and the rise towards the
 * ⁷F bands above 1.5 µm. Between 1.359 and 1.501 µm and across the band peak (473–496 nm) no row
 * was copied, so the linear interpolation there is coarse.
 */
export const FRANTA_TGG_ROWS: readonly (readonly [number, number, number])[] = [
  [0.461604, 1.996479, 7.937091e-9],
  [0.465018, 1.995476, 9.326974e-9],
  [0.470024, 1.994052, 4.803046e-8],
  [0.473255, 1.99316, 9.548872e-8],
  [0.49573, 1.987498, 7.955818e-7],
  [0.497015, 1.987199, 3.684096e-7],
  [0.5, 1.986516, 7.14352e-8],
  [0.505004, 1.985402, 2.046265e-8],
  [0.51318, 1.98366, 6.28383e-9],
  [0.532194, 1.979946, 5.929252e-9],
  [0.546097, 1.977494, 5.72917e-9],
  [0.587855, 1.971224, 5.338957e-9],
  [0.632805, 1.965886, 5.19325e-9],
  [0.700277, 1.959769, 5.389553e-9],
  [0.799595, 1.95341, 6.460644e-9],
  [0.899642, 1.948912, 8.488034e-9],
  [0.99924, 1.945566, 1.159514e-8],
  [1.06431, 1.943779, 1.43228e-8],
  [1.09375, 1.943048, 1.576439e-8],
  [1.15006, 1.941757, 1.892287e-8],
  [1.31317, 1.938593, 3.164198e-8],
  [1.359, 1.93781, 3.636629e-8],
  [1.50062, 1.935561, 6.209762e-7],
  [1.55014, 1.934811, 2.304751e-6],
  [1.62002, 1.933758, 1.185048e-5],
];

/** α(λ) rows from n, k rows: α = 4π k / λ, λ in m. */
export function absorptionFromK(rows: readonly (readonly [number, number, number])[]) {
  return rows.map(([um, , k]) => ({ wavelengthNm: Number((um * 1000).toFixed(3)), absorptionPerM: (4 * Math.PI * k) / (um * 1e-6) }));
}

/** Schlarb & Sugg (1994), interferometric, 20 °C: λ (µm) → n, as printed. */
const SCHLARB_SUGG_ROWS: readonly (readonly [number, number])[] = [
  [0.40466, 2.0178],
  [0.43583, 2.0057],
  [0.54607, 1.9765],
  [0.633, 1.9656],
  [1.07981, 1.9434],
  [1.08445, 1.9432],
  [1.14091, 1.942],
  [1.15228, 1.9421],
  [1.17668, 1.9415],
];

const terbiumGalliumGarnet: MaterialEntry = {
  id: "tgg",
  name: "Terbium gallium garnet",
  formula: "Tb₃Ga₅O₁₂",
  kind: "paramagnetic crystal",
  summary:
    "The common Faraday-rotator crystal for 500–1100 nm. Index from Schlarb & Sugg, loss from Franta et al., " +
    "the Verdet constant's two parameters fitted here to the handbook pair −134 / −40 rad/(T·m).",
  params: {
    ionDensityPerM3: 1.2726e28,
    landeG: 1.5,
    totalJ: 6,
    curieWeissK: 0,
    gilbertDamping: 0.01,
    magneticScale: 1,
    epsInf: 1.127274,
    sellmeierB: 2.591567,
    sellmeierWavelengthNm: 136.1534,
    oscillatorStrength: 0.015,
    oscillatorWavelengthNm: 238.6767,
    oscillatorDampingRadPerS: 1e11,
    gyrationPerT: 6.47236e-3,
    diamagneticTerm: true,
    diamagneticAnomaly: 0.777,
    diamagneticDispersion: "host",
    absorptionTable: absorptionFromK(FRANTA_TGG_ROWS),
    ...ROOM,
  },
  valueSources: {
    ionDensityPerM3: "derived here from claser (a = 12.355 Å): 24 Tb per cubic cell, N = 24 / a³",
    landeG: "as printed in ashcroftMermin (Tb³⁺ ⁷F₆, g = 3/2)",
    totalJ: "as printed in ashcroftMermin (J = 6)",
    curieWeissK: "chosen here: no measured Curie–Weiss temperature found in the sources; 0 K is the plain Curie law",
    gilbertDamping: "chosen here: no measured value; it matters only near the spin resonance (GHz–THz), not in the optical range",
    magneticScale: "chosen here: 1, the first-principles magnetic-dipole part",
    epsInf: "fitted here to schlarbSugg1994 (9 rows, 404.7–1176.7 nm), with the oscillator below held fixed",
    sellmeierB: "fitted here to schlarbSugg1994, as epsInf",
    sellmeierWavelengthNm: "fitted here to schlarbSugg1994, as epsInf",
    oscillatorStrength:
      "chosen here: keeps ε± passive above about 230 nm even at saturation (model §5.3); no measured strength of the Tb³⁺ 4f–5d band used",
    oscillatorWavelengthNm: "fitted here to wikiVerdet (−134 at 632.8 nm and −40 at 1064 nm), with gyrationPerT",
    oscillatorDampingRadPerS:
      "chosen here: the absorption table carries the measured loss; 1e11 rad/s keeps the Lorentzian tail " +
      "at the 1e-3 /cm scale of crylink outside it",
    gyrationPerT: "fitted here to wikiVerdet (−134 at 632.8 nm, 293.15 K, 1 T), with oscillatorWavelengthNm",
    diamagneticTerm: "chosen here: on, so that the host lattice's bound electrons are counted",
    diamagneticAnomaly: "fitted here to smith1978 on fused silica (see that entry) and carried over; no garnet value in the sources",
    diamagneticDispersion: "chosen here: host, so that the Tb³⁺ pole is not counted twice (model §5.5)",
    absorptionTable: "derived here from franta2025 (α = 4πk/λ of the rows FRANTA_TGG_ROWS); crylink gives < 0.1 %/cm",
    temperatureK: "reference conditions of the handbook values (room temperature)",
    fieldT: "reference conditions: 1 T",
    lengthM: "reference conditions: a 10 mm crystal",
  },
  sources: [
    "schlarbSugg1994",
    "franta2025",
    "wikiVerdet",
    "wikiTgg",
    "cightech",
    "claser",
    "crylink",
    "yasuhara2007",
    "majeed2013",
    "khazanov",
    "ashcroftMermin",
    "smith1978",
  ],
  index: {
    formula: { kind: "table", rows: SCHLARB_SUGG_ROWS.map(([um, n]) => ({ wavelengthNm: um * 1000, n })) },
    source: "schlarbSugg1994",
    rangeNm: { min: 404.66, max: 1176.68 },
    checks: [
      { wavelengthNm: 633, n: 1.9656, precision: 5e-5, source: "schlarbSugg1994" },
      { wavelengthNm: 1079.81, n: 1.9434, precision: 5e-5, source: "schlarbSugg1994" },
    ],
  },
  modelIndexTolerance: 7e-4,
  verdetChecks: [
    { wavelengthNm: 632.8, verdetRadPerTm: -134, signed: true, source: "wikiVerdet" },
    { wavelengthNm: 1064, verdetRadPerTm: -38, signed: true, source: "wikiTgg" },
    { wavelengthNm: 1053, verdetRadPerTm: -36.4, signed: false, source: "yasuhara2007" },
  ],
  validity: {
    wavelengthNm: { min: 461.6, max: 1620 },
    temperatureK: { min: 30, max: 400 },
    fieldT: { min: 0, max: 10 },
    notes: {
      wavelength:
        "the measured absorption table spans 461.6–1620 nm; the index is fitted over 404.7–1176.7 nm, beyond that it is extrapolated",
      temperature:
        "below about 30 K the free-ion J = 6 model misses the Tb³⁺ ground state's crystal-field structure " +
        "(a quasi-doublet with Ising moments, not modelled)",
      field: "|B0| up to 10 T is the model's specified range; no high-field check of this set in the sources",
    },
  },
  windows: [
    { fromNm: 400, toNm: 470, note: "transparent (vendor range)", sources: ["claser", "crylink"] },
    { fromNm: 500, toNm: 1100, note: "transparent; the usual Faraday-rotator range", sources: ["claser", "cightech"] },
  ],
  avoid: [{ fromNm: 470, toNm: 500, note: "Tb³⁺ absorption band (⁷F₆ → ⁵D₄)", sources: ["claser", "cightech", "franta2025"] }],
};

/** Malitson (1965) three-term Sellmeier formula of fused silica (formula 1, C in µm). */
const MALITSON: IndexFormula = {
  kind: "sellmeier",
  constant: 0,
  terms: [
    { b: 0.6961663, c: 0.0684043 },
    { b: 0.4079426, c: 0.1162414 },
    { b: 0.8974794, c: 9.896161 },
  ],
};

/** SCHOTT catalogue Sellmeier formulas (formula 2, C in µm²). */
const N_BK7: IndexFormula = {
  kind: "sellmeier2",
  constant: 0,
  terms: [
    { b: 1.03961212, c: 0.00600069867 },
    { b: 0.231792344, c: 0.0200179144 },
    { b: 1.01046945, c: 103.560653 },
  ],
};
const SF57: IndexFormula = {
  kind: "sellmeier2",
  constant: 0,
  terms: [
    { b: 1.81651371, c: 0.0143704198 },
    { b: 0.428893641, c: 0.0592801172 },
    { b: 1.07186278, c: 121.419942 },
  ],
};

/** A glass has no magnetic ions: the spin keys are present (the schema needs them) but unused. */
const NO_SPINS = {
  ionDensityPerM3: 0,
  landeG: 2,
  totalJ: 0.5,
  curieWeissK: 0,
  gilbertDamping: 0.01,
  magneticScale: 1,
  gyrationPerT: 0,
  oscillatorDampingRadPerS: 0,
} as const;

const noSpinSources = {
  ionDensityPerM3: "not used: a diamagnetic glass has no magnetic ions",
  landeG: "not used: no magnetic ions",
  totalJ: "not used: no magnetic ions",
  curieWeissK: "not used: no magnetic ions",
  gilbertDamping: "not used: no magnetic ions",
  magneticScale: "not used: no magnetic ions",
  gyrationPerT: "not used: no paramagnetic transition (0)",
  oscillatorDampingRadPerS: "as printed in the source formula: its infrared term is undamped",
  diamagneticTerm: "chosen here: on, the glass's whole Faraday effect",
  diamagneticDispersion:
    "chosen here: host, the ultraviolet pole only (the infrared pole, a lattice band, is not bound-electron dispersion)",
  temperatureK: "reference conditions (20 °C formula, used at 293.15 K)",
  fieldT: "reference conditions: 1 T",
  lengthM: "reference conditions: 10 mm",
} as const;

const glassValidity = (fromNm: number, toNm: number, why: string): Validity => ({
  wavelengthNm: { min: fromNm, max: toNm },
  temperatureK: { min: 200, max: 400 },
  fieldT: { min: 0, max: 100 },
  notes: {
    wavelength: why,
    temperature:
      "the index formula is for 20 °C; the Verdet constant of glasses changes by ~1e-4 /K (Williams et al., Appl. Opt. 30, 1176 (1991))",
    field: "a diamagnetic rotation is linear in the field",
  },
});

const fusedSilica: MaterialEntry = {
  id: "fused-silica",
  name: "Fused silica",
  formula: "SiO₂ (glass)",
  kind: "diamagnetic glass",
  summary: "Diamagnetic reference glass. Index from Malitson's formula; the anomaly factor γ fitted here to Smith's fibre Verdet constant.",
  params: {
    ...NO_SPINS,
    epsInf: 1.26128,
    sellmeierB: 0.842829,
    sellmeierWavelengthNm: 101.984,
    oscillatorStrength: 0.8974794,
    oscillatorWavelengthNm: 9896.161,
    diamagneticTerm: true,
    diamagneticAnomaly: 0.777,
    diamagneticDispersion: "host",
    ...ROOM,
  },
  valueSources: {
    ...noSpinSources,
    epsInf: "fitted here to malitson1965: its two ultraviolet terms as one pole, 400–1600 nm (|Δn| < 1e-6)",
    sellmeierB: "fitted here to malitson1965, as epsInf",
    sellmeierWavelengthNm: "fitted here to malitson1965, as epsInf",
    oscillatorStrength: "as printed in malitson1965: the infrared term B₃",
    oscillatorWavelengthNm: "as printed in malitson1965: the infrared term C₃ = 9.896161 µm",
    diamagneticAnomaly: "fitted here to smith1978: 3.61 rad/(T·m) at 632.8 nm (γ = 1 gives 4.65)",
  },
  sources: ["malitson1965", "smith1978", "smf28Verdet"],
  index: {
    formula: MALITSON,
    source: "malitson1965",
    rangeNm: { min: 400, max: 1600 },
    // n(587.6 nm) = 1.45846: Malitson's formula at the d line, the value its paper tabulates (materials-sources.md §1c).
    checks: [
      { wavelengthNm: 587.6, n: 1.45846, precision: 1e-5, source: "malitson1965" },
      { wavelengthNm: 1550, n: 1.44402, precision: 1e-5, source: "malitson1965" },
    ],
  },
  modelIndexTolerance: 2e-6,
  verdetChecks: [
    { wavelengthNm: 632.8, verdetRadPerTm: 3.61, signed: false, source: "smith1978" },
    { wavelengthNm: 1550, verdetRadPerTm: 0.55, signed: false, source: "smf28Verdet" },
  ],
  validity: glassValidity(400, 1600, "the range over which the model's one ultraviolet pole is fitted to Malitson's formula"),
  windows: [{ fromNm: 210, toNm: 3500, note: "transparent (Malitson's formula holds 0.21–6.7 µm)", sources: ["malitson1965"] }],
  avoid: [],
};

const nBk7: MaterialEntry = {
  id: "n-bk7",
  name: "N-BK7",
  formula: "borosilicate crown glass",
  kind: "diamagnetic glass",
  summary: "Common crown glass. Index from the SCHOTT catalogue; γ carried over from fused silica (no BK7 Verdet constant in the sources).",
  params: {
    ...NO_SPINS,
    epsInf: 1.39838,
    sellmeierB: 0.873026,
    sellmeierWavelengthNm: 111.563,
    oscillatorStrength: 1.01046945,
    oscillatorWavelengthNm: 10176.475,
    diamagneticTerm: true,
    diamagneticAnomaly: 0.777,
    diamagneticDispersion: "host",
    ...ROOM,
  },
  valueSources: {
    ...noSpinSources,
    epsInf: "fitted here to schott2017: its two ultraviolet terms as one pole, 400–1600 nm (|Δn| < 4e-6)",
    sellmeierB: "fitted here to schott2017, as epsInf",
    sellmeierWavelengthNm: "fitted here to schott2017, as epsInf",
    oscillatorStrength: "as printed in schott2017: the infrared term B₃",
    oscillatorWavelengthNm: "derived here from schott2017: √C₃ with C₃ = 103.560653 µm²",
    diamagneticAnomaly: "fitted here to smith1978 on fused silica and carried over (no N-BK7 measurement in the sources)",
  },
  sources: ["schott2017", "smith1978"],
  index: {
    formula: N_BK7,
    source: "schott2017",
    rangeNm: { min: 400, max: 1600 },
    checks: [{ wavelengthNm: 587.56, n: 1.5168, precision: 5e-5, source: "schott2017" }],
  },
  modelIndexTolerance: 5e-6,
  verdetChecks: [],
  validity: glassValidity(400, 1600, "the range over which the model's one ultraviolet pole is fitted to the catalogue formula"),
  windows: [{ fromNm: 350, toNm: 2000, note: "transparent (catalogue range 0.3–2.5 µm)", sources: ["schott2017"] }],
  avoid: [],
};

const sf57: MaterialEntry = {
  id: "sf57",
  name: "SF57",
  formula: "dense lead flint glass",
  kind: "diamagnetic glass",
  summary: "Heavy flint with a large diamagnetic Verdet constant. Index from the SCHOTT catalogue; γ carried over from fused silica.",
  params: {
    ...NO_SPINS,
    epsInf: 2.04414,
    sellmeierB: 1.20174,
    sellmeierWavelengthNm: 205.405,
    oscillatorStrength: 1.07186278,
    oscillatorWavelengthNm: 11019.07,
    diamagneticTerm: true,
    diamagneticAnomaly: 0.777,
    diamagneticDispersion: "host",
    ...ROOM,
  },
  valueSources: {
    ...noSpinSources,
    epsInf: "fitted here to schott2017: its two ultraviolet terms as one pole, 400–1600 nm (|Δn| < 2.2e-4)",
    sellmeierB: "fitted here to schott2017, as epsInf",
    sellmeierWavelengthNm: "fitted here to schott2017, as epsInf",
    oscillatorStrength: "as printed in schott2017: the infrared term B₃",
    oscillatorWavelengthNm: "derived here from schott2017: √C₃ with C₃ = 121.419942 µm²",
    diamagneticAnomaly: "fitted here to smith1978 on fused silica and carried over",
  },
  sources: ["schott2017", "smith1978", "sf57Student"],
  index: {
    formula: SF57,
    source: "schott2017",
    rangeNm: { min: 400, max: 1600 },
    checks: [{ wavelengthNm: 587.56, n: 1.84666, precision: 5e-6, source: "schott2017" }],
  },
  modelIndexTolerance: 2.5e-4,
  verdetChecks: [{ wavelengthNm: 650, verdetRadPerTm: 18.6, signed: false, source: "sf57Student" }],
  validity: glassValidity(420, 1600, "the range over which the model's one ultraviolet pole is fitted to the catalogue formula"),
  windows: [{ fromNm: 420, toNm: 2000, note: "transparent (lead glass absorbs below about 400 nm)", sources: ["schott2017"] }],
  avoid: [],
};

export const MATERIALS: readonly MaterialEntry[] = [terbiumGalliumGarnet, fusedSilica, nBk7, sf57];

export function materialById(id: string): MaterialEntry | undefined {
  return MATERIALS.find((m) => m.id === id);
}
