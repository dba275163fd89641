import { describe, expect, it } from "vitest";
import { fitMeasurements } from "@/lib/fit/fit";
import { type ModelCondition, evaluateModel, modelJacobian } from "@/lib/fit/model";
import type { MeasuredPoint } from "@/lib/measurements/point";
import type { ModelParams } from "@/lib/physics/schema";
import { type PlanResult, planMeasurements } from "@/lib/planner/plan";
import { type PlanRequestInput, planRequestSchema } from "@/lib/planner/schema";
import { TGG } from "../physics/fixtures";
import { seededGaussian } from "../fit/support";

/*
 * The planner's expected σ and expected Δχ² are linearized figures of the fit it plans for. Here
 * they are checked against what the product's fit (lib/fit/fit.ts) delivers on 200 synthetic data
 * sets at the best plan's points: the model at the truth times one field × length scale factor
 * per data set (drawn from its prior 1 ± scaleSigma), each point's temperature off by its
 * calibration error (drawn, and propagated through the model, not linearized), plus Gaussian
 * noise of the laboratory's absolute σ (grown by 1/√transmission) and relative floor. The fit is
 * given the same analysis definition (free set and calibration: it fits the scale factor as a
 * nuisance with its prior and adds the temperature term to each point's σ itself) and each
 * point's own σ. The
 * standard deviation of 200 draws has a relative standard error of about 1/√(2·199) = 5 %, and
 * the mean of 200 Δχ² (a noncentral χ² with variance 4λ for λ ≫ 1) one of 2/√(200λ) (common
 * practice, no source), so 15 % is three or more of those.
 */

const LENGTH_M = 0.01;
// Small enough that the fit stays in its linear regime (the planner's σ is the linearized bound).
const ABSOLUTE_RAD = 5e-4;
const RELATIVE_FLOOR = 1e-3;
const DRAWS = 200;
const LINES = [
  { name: "violet", wavelengthNm: 405 },
  { name: "green", wavelengthNm: 532 },
  { name: "HeNe", wavelengthNm: 632.8 },
  { name: "Ti:sapphire", wavelengthNm: 800 },
  { name: "YAG", wavelengthNm: 1064 },
  { name: "O-band", wavelengthNm: 1310 },
  { name: "telecom", wavelengthNm: 1550 },
];
const CALIBRATION = { scaleSigma: 0.02, temperatureSigmaK: 2, relativeFloor: 0 };
const FREE = [{ key: "gyrationPerT" as const }, { key: "oscillatorWavelengthNm" as const }, { key: "magneticScale" as const, min: 0 }];

const request = (over: Partial<PlanRequestInput>): PlanRequestInput => ({
  params: { ...TGG, lengthM: LENGTH_M },
  lines: LINES,
  temperatures: { valuesK: [150, 293.15] },
  fields: { valuesT: [1] },
  lengthM: LENGTH_M,
  noise: { kind: "sigma", sigmaRad: ABSOLUTE_RAD },
  optics: { relativeFloor: RELATIVE_FLOOR, minTransmission: 0.01 },
  points: 6,
  criterion: { kind: "magneticScale" },
  definition: { free: FREE, calibration: CALIBRATION },
  ...over,
});

const mean = (a: number[]) => a.reduce((s, v) => s + v, 0) / a.length;
const std = (a: number[]) => Math.sqrt(a.reduce((s, v) => s + (v - mean(a)) ** 2, 0) / (a.length - 1));

/** The best plan's measurements, one condition per repeat, with each point's σ without the temperature term. */
function measurements(result: PlanResult, params: ModelParams, absoluteRad: number, relativeFloor: number) {
  const plan = result.plans[0]!;
  const conditions: ModelCondition[] = [];
  const ownSigma: number[] = [];
  for (const p of plan.points) {
    for (let k = 0; k < p.count; k++) {
      conditions.push({
        wavelengthNm: p.wavelengthNm,
        temperatureK: p.temperatureK,
        fieldT: p.fieldT,
        lengthM: LENGTH_M,
        quantity: "rotation",
      });
      ownSigma.push(Math.hypot(absoluteRad / Math.sqrt(p.transmission), relativeFloor * p.rotationRad));
    }
  }
  // The fit's σ per point: the effective variance of the shared definition, ∂θ/∂T from the engine at the set's values.
  const dT = 1e-3;
  const up = evaluateModel(
    params,
    conditions.map((c) => ({ ...c, temperatureK: c.temperatureK + dT })),
  ).value;
  const down = evaluateModel(
    params,
    conditions.map((c) => ({ ...c, temperatureK: c.temperatureK - dT })),
  ).value;
  const fitSigma = ownSigma.map((s, i) => Math.hypot(s, ((up[i]! - down[i]!) / (2 * dT)) * CALIBRATION.temperatureSigmaK));
  return { conditions, ownSigma, fitSigma };
}

/** One synthetic data set at the truth: its scale factor, temperatures off by their calibration error, then the noise. */
function simulate(truth: ModelParams, m: ReturnType<typeof measurements>, gauss: () => number, calibration = CALIBRATION): MeasuredPoint[] {
  const scale = 1 + calibration.scaleSigma * gauss();
  const shifted = m.conditions.map((c) => ({ ...c, temperatureK: c.temperatureK + calibration.temperatureSigmaK * gauss() }));
  const clean = evaluateModel(truth, shifted).value;
  return m.conditions.map((c, i) => ({ line: i + 2, ...c, value: scale * clean[i]! + m.ownSigma[i]! * gauss(), sigma: m.ownSigma[i]! }));
}

/** The fit the planner plans for: the same free set and calibration, one start (the truth is the start). */
const fitAs = (params: ModelParams, free: typeof FREE, points: MeasuredPoint[], calibration = CALIBRATION) =>
  fitMeasurements({ params, free, points, calibration, starts: 1 }, { maxIterations: 500 });

describe("planner against a Monte-Carlo of the fit, same analysis definition", () => {
  it("never proposes a point below the minimum transmission (checked against the engine)", () => {
    const result = planMeasurements(planRequestSchema.parse(request({})));
    expect(result.excluded.lowTransmission).toBeGreaterThan(0);
    for (const plan of result.plans)
      for (const p of plan.points) {
        const conditions = [{ wavelengthNm: p.wavelengthNm, temperatureK: p.temperatureK, fieldT: p.fieldT, lengthM: LENGTH_M }];
        const jac = modelJacobian(
          { ...TGG, lengthM: LENGTH_M },
          [],
          conditions.map((c) => ({ ...c, quantity: "rotation" as const })),
        );
        expect(jac.value[0]).toBeCloseTo(p.rotationRad, 12);
        expect(p.transmission).toBeGreaterThanOrEqual(0.01);
      }
  });

  it("scatter of 200 simulated fits matches the planner's σ of magneticScale and of the share within 15 %", () => {
    const params = { ...TGG, lengthM: LENGTH_M };
    const ratios: string[] = [];
    for (const criterion of [{ kind: "magneticScale" as const }, { kind: "share" as const, wavelengthNm: 1064 }]) {
      const result = planMeasurements(planRequestSchema.parse(request({ criterion })));
      const plan = result.plans[0]!;
      expect(plan.separable).toBe(true);
      const m = measurements(result, params, ABSOLUTE_RAD, RELATIVE_FLOOR);
      // The planner's σ per point is the same effective variance the fit is given.
      const planSigmas = plan.points.flatMap((p) => Array.from({ length: p.count }, () => p.sigmaRad));
      for (const [i, s] of planSigmas.entries()) expect(s / m.fitSigma[i]!).toBeCloseTo(1, 3);
      const gauss = seededGaussian(criterion.kind === "share" ? 4242 : 2024);
      const estimates: number[] = [];
      let unconverged = 0;
      for (let draw = 0; draw < DRAWS; draw++) {
        const fit = fitAs(params, FREE, simulate(params, m, gauss));
        if (!fit.converged) unconverged++;
        estimates.push(
          criterion.kind === "magneticScale"
            ? fit.values.magneticScale!
            : evaluateModel(fit.params, [{ wavelengthNm: 1064, temperatureK: 293.15, fieldT: 1, lengthM: LENGTH_M, quantity: "rotation" }])
                .magneticShare[0]!,
        );
      }
      const ratio = std(estimates) / plan.expectedSigma;
      ratios.push(`${criterion.kind} ${ratio.toFixed(3)} (planner σ ${plan.expectedSigma.toPrecision(3)}, ${unconverged} unconverged)`);
      expect(unconverged).toBe(0);
      expect(ratio).toBeGreaterThan(0.85);
      expect(ratio).toBeLessThan(1.15);
    }
    console.info(`planner Monte-Carlo over ${DRAWS} fits, scatter / planner σ: ${ratios.join("; ")}`);
  }, 300_000);

  it("planned at magneticScale = 0, the mean Δχ² of null-vs-alternative fits matches the expected Δχ² within 15 %", () => {
    const atNull = { ...TGG, lengthM: LENGTH_M, magneticScale: 0 };
    // The scale nuisance only: the fit takes each point's temperature term at its own starting values, which differ
    // between the null and the alternative fit, so with it Δχ² would compare two different weightings.
    const SCALE_ONLY = { ...CALIBRATION, temperatureSigmaK: 0 };
    const plan0 = planMeasurements(
      planRequestSchema.parse(
        request({ params: atNull, criterion: { kind: "detect", alternative: 1 }, definition: { free: FREE, calibration: SCALE_ONLY } }),
      ),
    );
    expect(plan0.plans[0]!.separable).toBe(true);
    const first = plan0.plans[0]!.detection!;
    // A noise that makes the expected Δχ² about 30 (λ ∝ 1/σ² with the relative floor and the calibration off).
    const absoluteRad = ABSOLUTE_RAD * Math.sqrt(first.deltaChi2Null / 30);
    const result = planMeasurements(
      planRequestSchema.parse(
        request({
          params: atNull,
          criterion: { kind: "detect", alternative: 1 },
          noise: { kind: "sigma", sigmaRad: absoluteRad },
          optics: { relativeFloor: 0, minTransmission: 0.01 },
          definition: { free: FREE, calibration: SCALE_ONLY },
        }),
      ),
    );
    const detection = result.plans[0]!.detection!;
    expect(detection.deltaChi2Null).toBeGreaterThan(10);
    expect(detection.significance).toBeCloseTo(Math.sqrt(detection.deltaChi2Null), 12);
    const truth = { ...TGG, lengthM: LENGTH_M, magneticScale: 1 };
    const m = measurements(result, atNull, absoluteRad, 0);
    const nuisances = FREE.filter((f) => f.key !== "magneticScale");
    const gauss = seededGaussian(77);
    const deltas: number[] = [];
    for (let draw = 0; draw < DRAWS; draw++) {
      const points = simulate(truth, m, gauss, SCALE_ONLY);
      const fitNull = fitAs(atNull, nuisances, points, SCALE_ONLY);
      const fitAlt = fitAs(truth, nuisances, points, SCALE_ONLY);
      deltas.push(fitNull.chi2 - fitAlt.chi2);
    }
    const ratio = mean(deltas) / detection.deltaChi2Null;
    console.info(`planner Monte-Carlo: mean Δχ² ${mean(deltas).toPrecision(3)}, expected ${detection.deltaChi2Null.toPrecision(3)}`);
    expect(ratio).toBeGreaterThan(0.85);
    expect(ratio).toBeLessThan(1.15);
  }, 300_000);
});
