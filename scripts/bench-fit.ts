/*
 * Benchmark (not a test): the fit of 100 Verdet-constant points (400–1600 nm, terbium-garnet set of
 * physics-model.md §9 at 293.15 K and 1 T) with 3 free parameters (gyrationPerT,
 * oscillatorWavelengthNm, magneticScale), single thread, analytic path. The data are the model at
 * invented "true" values plus seeded Gaussian noise; the fit starts from the §9 values. Prints the
 * median and fastest wall time after a JIT warm-up.
 */
import { fitMeasurements } from "../lib/fit/fit";
import { TERBIUM_GARNET_DEFAULTS } from "../lib/model/defaults";
import { seededGaussian, syntheticPoints, verdetAt } from "../tests/unit/fit/support";

const start = { ...TERBIUM_GARNET_DEFAULTS, temperatureK: 293.15, fieldT: 1, lengthM: 0.01 };
const truth = { ...start, gyrationPerT: 5.0e-3, oscillatorWavelengthNm: 270, magneticScale: 3 };
const points = syntheticPoints(
  truth,
  Array.from({ length: 100 }, (_, i) => verdetAt(400 + 12 * i)),
  0.5,
  seededGaussian(0x2026),
);
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
  `fit, 100 points, 3 free parameters, single thread: ${times[5]!.toFixed(1)} ms median of 11, ` +
    `fastest ${times[0]!.toFixed(1)} ms (${iterations} Levenberg–Marquardt iterations)`,
);
