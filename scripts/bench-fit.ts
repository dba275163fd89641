/*
 * Benchmark (not a test): the fit of 100 Verdet-constant points (400–1600 nm, terbium-garnet set of
 * physics-model.md §9 at 293.15 K and 1 T) with 3 free parameters (gyrationPerT,
 * oscillatorWavelengthNm, magneticScale), single thread, analytic path. The data are the model at
 * invented "true" values plus seeded Gaussian noise; the fit starts from the §9 values. Prints the
 * median and fastest wall time after a JIT warm-up: of one start, of the default multi-start fit
 * (4 seeded starts) and of the fit report without per-point share profiles (comparison, profile of
 * magneticScale, nested models). Figures only: nothing here is asserted.
 */
import { fitMeasurements } from "../lib/fit/fit";
import { analyseFit } from "../lib/fit/report";
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

function time(label: string, runs: number, run: () => string) {
  let note = run();
  const times: number[] = [];
  for (let i = 0; i < runs; i++) {
    const t0 = performance.now();
    note = run();
    times.push(performance.now() - t0);
  }
  times.sort((a, b) => a - b);
  console.log(
    `${label}, 100 points, 3 free parameters, single thread: ${times[Math.floor(runs / 2)]!.toFixed(1)} ms median of ${runs}, ` +
      `fastest ${times[0]!.toFixed(1)} ms (${note})`,
  );
}

time(
  "fit, one start",
  11,
  () => `${fitMeasurements({ params: start, free, points, starts: 1 }).iterations} Levenberg–Marquardt iterations`,
);
time("fit, 4 seeded starts", 5, () => {
  const r = fitMeasurements({ params: start, free, points, starts: 4 });
  return `χ² from the starts ${r.startChi2.map((c) => c.toFixed(1)).join(", ")}`;
});
time("fit report without share profiles, 4 starts", 3, () => {
  const r = analyseFit({ params: start, free, points, starts: 4 }, { shareProfiles: false });
  return `${r.comparison.length} comparisons, magneticScale profile of ${r.profile.magneticScale?.curve.length ?? 0} refits`;
});
