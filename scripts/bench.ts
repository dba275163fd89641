/*
 * Benchmark (not a test): 256-wavelength terbium-garnet spectrum, 300–3000 nm, 293.15 K, 1 T
 * (physics-model.md §9 parameters), single-threaded. Prints the median time of several runs after
 * a JIT warm-up for the numerical (LLG) and analytic paths, and the largest numerical-vs-analytic
 * relative deviation of χ±. Targets: numerical ≤ 100 ms at ≤ 1e-4, analytic ≤ 2 ms.
 */
import { TERBIUM_GARNET_DEFAULTS } from "../lib/model/defaults";
import type { SpectrumRequest } from "../lib/physics/schema";
import { computeSpectrum } from "../lib/physics/spectrum";

const wavelengthsNm = Array.from({ length: 256 }, (_, i) => 300 + (2700 * i) / 255);
const tgg: Omit<SpectrumRequest, "method"> = { ...TERBIUM_GARNET_DEFAULTS, wavelengthsNm };

/** Median and fastest wall time of `repeats` runs after `warmup` runs (the fastest is the least disturbed by other load). */
function timeMs(run: () => void, warmup: number, repeats: number): { median: number; min: number } {
  for (let i = 0; i < warmup; i++) run();
  const times: number[] = [];
  for (let i = 0; i < repeats; i++) {
    const t0 = performance.now();
    run();
    times.push(performance.now() - t0);
  }
  times.sort((a, b) => a - b);
  return { median: times[Math.floor(times.length / 2)]!, min: times[0]! };
}

let deviation = Number.NaN;
const llg = timeMs(() => {
  deviation = computeSpectrum({ ...tgg, method: "llg" }).maxRelDeviationFromAnalytic ?? Number.NaN;
}, 3, 9);
const analytic = timeMs(() => computeSpectrum({ ...tgg, method: "analytic" }), 20, 51);

console.log(
  `numerical (llg) spectrum, 256 wavelengths 300–3000 nm, single thread: ${llg.median.toFixed(1)} ms median of 9, fastest ${llg.min.toFixed(1)} ms (target ≤ 100 ms)`,
);
console.log(`analytic spectrum, 256 wavelengths: ${analytic.median.toFixed(3)} ms median of 51, fastest ${analytic.min.toFixed(3)} ms (target ≤ 2 ms)`);
console.log(`largest numerical-vs-analytic relative deviation of χ±: ${deviation.toExponential(2)} (target ≤ 1e-4)`);
