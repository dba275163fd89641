import { writeFileSync } from "node:fs";
import path from "node:path";
import { evaluateModel, type ModelCondition } from "@/lib/fit/model";
import { TERBIUM_GARNET_DEFAULTS } from "@/lib/model/defaults";
import { HC_EV_NM } from "@/lib/workbench/units";
import { DEMO_GLASS_SET_ID, DEMO_SETS } from "@/db/demo-data";
import type { ModelParams } from "@/lib/physics/schema";
import { gaussianFrom, seededRandom } from "@/lib/random";

/*
 * Writes the demo measurement files in db/demo/: the analytic model at invented "true" parameters
 * plus seeded Gaussian noise of the stated σ. Invented data for the demo lab, not measurements.
 * Run: npx tsx scripts/generate-demo-measurements.ts (the output is committed; the seed and the
 * browser test read it).
 */

const round = (value: number, digits: number) => Number(value.toPrecision(digits));
const out = (name: string) => path.resolve(import.meta.dirname, "../db/demo", name);

// The garnet rod LM-T4: the handbook set with a stronger magnetic-dipole part, so a fit has
// something to find. Invented "truth" for the demo.
const GARNET_TRUTH: ModelParams = { ...TERBIUM_GARNET_DEFAULTS, gyrationPerT: 5.3e-3, magneticScale: 2 };

/** The garnet rod's Verdet spectrum at one temperature: `count` wavelengths spaced evenly in log from `fromNm` to 1600 nm. */
function garnetFile(temperatureK: number, seed: number, count: number, fromNm: number): string {
  const normal = gaussianFrom(seededRandom(seed));
  const wavelengthsNm = Array.from({ length: count }, (_, i) => Math.round(fromNm * (1600 / fromNm) ** (i / (count - 1))));
  const conditions: ModelCondition[] = wavelengthsNm.map((wavelengthNm) => ({
    wavelengthNm,
    temperatureK,
    fieldT: 1,
    lengthM: 0.01,
    quantity: "verdet",
  }));
  const model = evaluateModel(GARNET_TRUTH, conditions);
  const lines = [
    `# GENERATED demo data (invented, not a measurement): garnet rod LM-T4 at ${temperatureK} K, Lindqvist Moor Faraday Laboratory.`,
    "# Made by scripts/generate-demo-measurements.ts: the analytic model at the handbook garnet set with",
    "# gyrationPerT = 5.3e-3 and magneticScale = 2, plus seeded Gaussian noise of the sigma column.",
    "wavelength_nm,verdet_rad_per_T_m,sigma,temperature_K,field_T,length_m",
  ];
  conditions.forEach((c, i) => {
    const value = model.value[i]!;
    const sigma = round(0.015 * Math.abs(value) + 0.3, 2);
    lines.push([c.wavelengthNm, round(value + sigma * normal(), 5), sigma, c.temperatureK, c.fieldT, c.lengthM].join(","));
  });
  return `${lines.join("\n")}\n`;
}

// The borate glass as the demo lab last saved it.
const glassParams = DEMO_SETS.find((set) => set.id === DEMO_GLASS_SET_ID)?.versions.at(-1)?.params;
if (!glassParams) throw new Error("demo borate glass set not found");

function glassFile(): string {
  const normal = gaussianFrom(seededRandom(77_2026));
  const energiesEv = [3.0, 2.75, 2.5, 2.25, 2.0, 1.8, 1.6, 1.4, 1.25, 1.1, 0.95, 0.8];
  const conditions: ModelCondition[] = [77, 293.15].flatMap((temperatureK) =>
    energiesEv.map((eV) => ({ wavelengthNm: HC_EV_NM / eV, temperatureK, fieldT: 0.5, lengthM: 0.02, quantity: "rotation" as const })),
  );
  const model = evaluateModel(glassParams!, conditions);
  const lines = [
    "# GENERATED demo data (invented, not a measurement): Tb-doped borate glass LM-B7 at 0.5 T, 20 mm.",
    '# Made by scripts/generate-demo-measurements.ts from the demo set "Tb-doped borate glass — sample LM-B7"',
    "# plus seeded Gaussian noise of the sigma column. Field and length are not in the file: enter them once.",
    "energy_eV\trotation_mrad\tsigma_mrad\ttemperature_K",
  ];
  conditions.forEach((c, i) => {
    const valueMrad = model.value[i]! * 1e3;
    const sigma = round(0.02 * Math.abs(valueMrad) + 0.05, 2);
    lines.push([energiesEv[i % energiesEv.length], round(valueMrad + sigma * normal(), 5), sigma, c.temperatureK].join("\t"));
  });
  return `${lines.join("\n")}\n`;
}

const files = {
  "generated-garnet-LM-T4-verdet.csv": garnetFile(293.15, 8_2026, 24, 420),
  // The same rod cooled in a nitrogen cryostat: the temperature series a global fit needs.
  "generated-garnet-LM-T4-verdet-77K.csv": garnetFile(77, 9_2026, 14, 500),
  "generated-glass-LM-B7-rotation.tsv": glassFile(),
};
for (const [name, text] of Object.entries(files)) writeFileSync(out(name), text);
console.log(
  `[demo] wrote ${Object.keys(files)
    .map((name) => `db/demo/${name}`)
    .join(", ")}`,
);
