/*
 * Benchmark (not a test): the fit of 100 Verdet-constant points (400–1600 nm, terbium-garnet set of
 * physics-model.md §9 at 293.15 K and 1 T) with 3 free parameters (gyrationPerT,
 * oscillatorWavelengthNm, magneticScale), single thread, analytic path. The data are the model at
 * invented "true" values plus seeded Gaussian noise; the fit starts from the §9 values. Prints the
 * median and fastest wall time after a JIT warm-up.
 */
import { fitMeasurements } from "../lib/fit/fit";
import { evaluateModel } from "../lib/fit/model";
import type { MeasuredPoint } from "../lib/measurements/point";
import { TERBIUM_GARNET_DEFAULTS } from "../lib/model/defaults";

let seed = 0x2026;
const uniform = () => {
  seed = (seed + 0x6d2b79f5) >>> 0;
  let t = seed;
  t = Math.imul(t ^ (t >>> 15), t | 1);
  t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
  return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
};
const gauss = () => Math.sqrt(-2 * Math.log(1 - uniform())) * Math.cos(2 * Math.PI * uniform());

const start = { ...TERBIUM_GARNET_DEFAULTS, temperatureK: 293.15, fieldT: 1, lengthM: 0.01 };
const truth = { ...start, gyrationPerT: 5.0e-3, oscillatorWavelengthNm: 270, magneticScale: 3 };
const conditions = Array.from({ length: 100 }, (_, i) => ({ wavelengthNm: 400 + 12 * i, temperatureK: 293.15, fieldT: 1, lengthM: 0.01, quantity: "verdet" as const }));
const clean = evaluateModel(truth, conditions).value;
const points: MeasuredPoint[] = conditions.map((c, i) => ({ line: i + 2, ...c, value: clean[i]! + 0.5 * gauss(), sigma: 0.5 }));
const free = [{ key: "gyrationPerT" as const }, { key: "oscillatorWavelengthNm" as const }, { key: "magneticScale" as const }];

let iterations = 0;
const run = () => {
  iterations = fitMeasurements({ params: start, free, points }).iterations;
};
for (let i = 0; i < 3; i++) run();
const times: number[] = [];
for (let i = 0; i < 11; i++) {
  const t0 = performance.now();
  run();
  times.push(performance.now() - t0);
}
times.sort((a, b) => a - b);
console.log(
  `fit, 100 points, 3 free parameters, single thread: ${times[5]!.toFixed(1)} ms median of 11, fastest ${times[0]!.toFixed(1)} ms (${iterations} Levenberg–Marquardt iterations)`,
);
