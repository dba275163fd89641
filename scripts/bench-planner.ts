/*
 * Benchmark (not a test): the planner on the demo lab's lines (db/demo-light-sources.ts) for the
 * demo terbium-garnet set (physics-model.md §9 values), single-threaded as in the planner's
 * worker, for the fit's default free set (three parameters). Prints, per scenario, the number of
 * candidate points (and how many pass the minimum transmission), whether the search was
 * exhaustive or greedy, the designs evaluated, the best ranked criterion and the wall time
 * (median of 3 after a warm-up run). The last scenario is the 20,000-candidate maximum.
 */
import { DEMO_LIGHT_SOURCES } from "../db/demo-light-sources";
import { TERBIUM_GARNET_DEFAULTS } from "../lib/model/defaults";
import { planMeasurements } from "../lib/planner/plan";
import { type PlanRequestInput, planRequestSchema } from "../lib/planner/schema";

const lines = DEMO_LIGHT_SOURCES.map((l) => ({ name: l.name, wavelengthNm: l.wavelengthNm, powerW: l.powerW ?? null }));
const fiveLines = [632.8, 800, 1064, 1310, 1550].map((w) => ({ name: `${w} nm`, wavelengthNm: w }));

const scenarios: { label: string; request: PlanRequestInput }[] = [
  {
    label: "planner defaults: 10–300 K step 10, 0.5–2 T step 0.5, 4 points, σ(share at 1064 nm)",
    request: {
      params: TERBIUM_GARNET_DEFAULTS,
      lines,
      temperatures: { minK: 10, maxK: 300, stepK: 10 },
      fields: { minT: 0.5, maxT: 2, stepT: 0.5 },
      lengthM: 0.01,
      noise: { kind: "density", radPerSqrtHz: 1e-6, integrationS: 1 },
      points: 4,
      criterion: { kind: "share", wavelengthNm: 1064 },
    },
  },
  {
    label: "lines only (one T, one B), 3 points, σ(magneticScale)",
    request: {
      params: TERBIUM_GARNET_DEFAULTS,
      lines,
      temperatures: { minK: 293.15, maxK: 293.15, stepK: 1 },
      fields: { minT: 1, maxT: 1, stepT: 1 },
      lengthM: 0.01,
      noise: { kind: "sigma", sigmaRad: 1e-6 },
      points: 3,
      criterion: { kind: "magneticScale" },
    },
  },
  {
    label: "fine grid: 10–300 K step 2, 0.5–2.5 T step 0.1, 12 points, D-optimal",
    request: {
      params: TERBIUM_GARNET_DEFAULTS,
      lines,
      temperatures: { minK: 10, maxK: 300, stepK: 2 },
      fields: { minT: 0.5, maxT: 2.5, stepT: 0.1 },
      lengthM: 0.01,
      noise: { kind: "sigma", sigmaRad: 1e-6 },
      points: 12,
      criterion: { kind: "dOptimal" },
    },
  },
  {
    label: "detect at room temperature and 77 K, calibration nuisances, 6 points",
    request: {
      params: TERBIUM_GARNET_DEFAULTS,
      lines,
      temperatures: { valuesK: [293.15, 77] },
      fields: { valuesT: [0.5, 1, 1.5, 2] },
      lengthM: 0.01,
      noise: { kind: "sigma", sigmaRad: 1e-5 },
      optics: { relativeFloor: 1e-3, minTransmission: 0.01 },
      points: 6,
      criterion: { kind: "detect" },
      definition: {
        free: [{ key: "gyrationPerT" }, { key: "oscillatorWavelengthNm" }, { key: "magneticScale", min: 0 }],
        calibration: { scaleSigma: 0.01, temperatureSigmaK: 0.5, relativeFloor: 0 },
      },
    },
  },
  {
    label: "20,000 candidates: 5 lines × 200 temperatures (10–308.5 K) × 20 fields (0.1–2 T), 6 points, detect",
    request: {
      params: TERBIUM_GARNET_DEFAULTS,
      lines: fiveLines,
      temperatures: { minK: 10, maxK: 308.5, stepK: 1.5 },
      fields: { minT: 0.1, maxT: 2, stepT: 0.1 },
      lengthM: 0.01,
      noise: { kind: "sigma", sigmaRad: 1e-5 },
      optics: { relativeFloor: 1e-3, minTransmission: 0.01 },
      points: 6,
      criterion: { kind: "detect" },
    },
  },
];

for (const { label, request } of scenarios) {
  const parsed = planRequestSchema.parse(request);
  planMeasurements(parsed);
  const times: number[] = [];
  let last = planMeasurements(parsed);
  for (let i = 0; i < 3; i++) {
    const t0 = performance.now();
    last = planMeasurements(parsed);
    times.push(performance.now() - t0);
  }
  times.sort((a, b) => a - b);
  const best = last.plans[0];
  console.log(label);
  console.log(
    `  candidates ${last.candidateCount} (${last.candidateCount - last.excluded.lowTransmission - last.excluded.wrapped} usable), ` +
      `${last.method}, designs evaluated ${last.designsEvaluated}, ` +
      `best ${best ? best.rankedValue.toPrecision(3) : "–"} ${last.criterionUnit}, ` +
      `time ${times[1]!.toFixed(0)} ms (fastest ${times[0]!.toFixed(0)} ms)`,
  );
  console.log(
    `  best plan: ${best?.points.map((p) => `${p.wavelengthNm} nm @ ${p.temperatureK} K, ${p.fieldT} T ×${p.count}`).join("; ")}`,
  );
}
