/*
 * The published sources the material library cites (lib/materials/library.ts). One entry per
 * source; every value of a material names one of these, or says it was fitted or chosen here.
 */

export interface MaterialSource {
  id: string;
  /** As one would cite it in a paper. */
  citation: string;
  kind: "paper" | "handbook" | "catalogue" | "database" | "vendor sheet" | "encyclopedia";
  /** Where the values were read, when not from the original itself. */
  seenIn?: string;
}

export const MATERIAL_SOURCES = {
  schlarbSugg1994: {
    id: "schlarbSugg1994",
    citation: "U. Schlarb and B. Sugg, Phys. Status Solidi B 182, K91 (1994): refractive index of terbium gallium garnet, 20 °C",
    kind: "paper",
    seenIn: "refractiveindex.info database, file main/Tb3Ga5O12/nk/Schlarb.yml (CC0)",
  },
  franta2025: {
    id: "franta2025",
    citation: "D. Franta et al., Opt. Laser Technol. 181, 111916 (2025): wide-range n, k of TGG single crystal, room temperature",
    kind: "paper",
    seenIn: "refractiveindex.info database, file main/Tb3Ga5O12/nk/Franta.yml (CC0), rows copied as printed",
  },
  malitson1965: {
    id: "malitson1965",
    citation: "I. H. Malitson, J. Opt. Soc. Am. 55, 1205 (1965): Sellmeier formula of fused silica, 20 °C",
    kind: "paper",
    seenIn: "refractiveindex.info database (main/SiO2, Malitson)",
  },
  schott2017: {
    id: "schott2017",
    citation: "SCHOTT optical glass data sheets (catalogue 2017): N-BK7 and SF57 Sellmeier coefficients, nd",
    kind: "catalogue",
    seenIn: "refractiveindex.info database (specs/schott)",
  },
  wikiVerdet: {
    id: "wikiVerdet",
    citation: 'Wikipedia, "Verdet constant", table of values: TGG −134 rad/(T·m) at 632.8 nm, −40 at 1064 nm (signed)',
    kind: "encyclopedia",
  },
  wikiTgg: {
    id: "wikiTgg",
    citation: 'Wikipedia, "Terbium gallium garnet": −131 rad/(T·m) at 632 nm, −38 at 1064 nm (signed)',
    kind: "encyclopedia",
  },
  cightech: {
    id: "cightech",
    citation: "CIGTech TGG data sheet (cightech.com): −134 / −40 rad/(T·m) at 632 / 1064 nm; use 400–1100 nm excluding 475–500 nm",
    kind: "vendor sheet",
  },
  claser: {
    id: "claser",
    citation: "CLaser TGG data sheet (claserinc.com): lattice a = 12.355 Å; 400–1100 nm excluding 470–500 nm; 0.12 min/(Oe·cm) at 1064 nm",
    kind: "vendor sheet",
  },
  crylink: {
    id: "crylink",
    citation: "Crylink TGG data sheet (photonics-crylink.com): optical loss < 0.1 %/cm; 35 rad/(T·m) at 1064 nm; 400–470 and 500–1500 nm",
    kind: "vendor sheet",
  },
  yasuhara2007: {
    id: "yasuhara2007",
    citation: "R. Yasuhara et al., Opt. Express 15, 11255 (2007): TGG ceramic 36.4 rad/(T·m) at 1053 nm; 87× at liquid-helium temperature",
    kind: "paper",
    seenIn: "abstract (PubMed 19547482)",
  },
  majeed2013: {
    id: "majeed2013",
    citation: "H. Majeed et al., Opt. Express 21, 25148 (2013): TGG Verdet constant at 6.3 K, 28× its room-temperature value",
    kind: "paper",
    seenIn: "as quoted in the product's issue text; the paper itself not seen",
  },
  khazanov: {
    id: "khazanov",
    citation: 'E. Khazanov, "Faraday isolators for high average power lasers" (InTech book chapter, ~2010), Table 1',
    kind: "handbook",
    seenIn: "copies on docstoc/fliphtml5 with a garbled table; (1/V)dV/dT ≈ −3.5e-3 /K as quoted in the trade",
  },
  smith1978: {
    id: "smith1978",
    citation:
      "A. M. Smith, Appl. Opt. 17, 52 (1978): Verdet constant of single-mode silica fibre, 1.56e-2 min/A at 632.8 nm (3.61 rad/(T·m))",
    kind: "paper",
    seenIn: "cited in a public code comment; value converted here (1 min = 2.909e-4 rad, V_B = V_H / μ0)",
  },
  smf28Verdet: {
    id: "smf28Verdet",
    citation:
      "Measurements of the birefringence and Verdet constant in an air-core fiber, J. Lightwave Technol. (~2009): " +
      "SMF-28 0.55 ± 0.01 rad/(T·m) near 1550 nm",
    kind: "paper",
    seenIn: "abstract only",
  },
  sf57Student: {
    id: "sf57Student",
    citation: "Authorea student report: SF-57 Verdet constant 18.6 ± 0.2 rad/(T·m) at 650 nm (three methods)",
    kind: "paper",
    seenIn: "low confidence: an unrefereed report",
  },
  ashcroftMermin: {
    id: "ashcroftMermin",
    citation: "N. W. Ashcroft and N. D. Mermin, Solid State Physics (1976), pp. 657–658: Tb³⁺ ⁷F₆, g = 3/2, J = 6",
    kind: "handbook",
    seenIn: "table reproduced at fizika.si/magnetism/EffectiveMagneticMoments.html",
  },
} as const satisfies Record<string, MaterialSource>;

export type MaterialSourceId = keyof typeof MATERIAL_SOURCES;
