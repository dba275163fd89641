import { describe, expect, it } from "vitest";
import { planMeasurements } from "@/lib/planner/plan";
import { type PlanRequestInput, planRequestSchema } from "@/lib/planner/schema";
import { searchDesigns } from "@/lib/planner/search";
import { TGG } from "../physics/fixtures";

/*
 * The planner's design machinery against things outside it: the textbook D-optimal design of a
 * straight line, and the rules of the laboratory the planner must keep (minimum transmission,
 * planning at magneticScale = 0, diverse plans, robust ranges, the cost, the wording).
 */

describe("D-optimal design, closed form", () => {
  it("for y = a + b·x on [−1, 1] the two-point D-optimal design puts the points at the interval's ends", () => {
    // det(XᵀX) of two points x1, x2 is (x1 − x2)², largest at the ends (Atkinson, Donev & Tobias,
    // Optimum Experimental Designs, with SAS, 2007, §6: the D-optimal design for first-order
    // regression on an interval puts equal weight on its ends; from memory).
    const xs = Array.from({ length: 21 }, (_, i) => -1 + i / 10);
    const info = new Float64Array(xs.length * 4);
    for (const [c, x] of xs.entries()) info.set([1, x, x, x * x], c * 4);
    for (const limit of [undefined, 0]) {
      const result = searchDesigns(
        {
          info,
          candidateCount: xs.length,
          p: 2,
          points: 2,
          topPlans: 1,
          spec: { kind: "dOptimal" },
          checkCancel: () => undefined,
          progress: () => undefined,
        },
        limit,
      );
      expect(result.top.items[0]!.indices.map((c) => xs[c])).toEqual([-1, 1]);
    }
  });
});

const LINES = [405, 532, 632.8, 800, 1064, 1310, 1550].map((w) => ({ name: `line ${w}`, wavelengthNm: w }));
const request = (over: Partial<PlanRequestInput> = {}): PlanRequestInput => ({
  params: { ...TGG, lengthM: 0.01 },
  lines: LINES,
  temperatures: { valuesK: [77, 293.15] },
  fields: { valuesT: [0.5, 1] },
  lengthM: 0.01,
  noise: { kind: "sigma", sigmaRad: 1e-4 },
  optics: { relativeFloor: 1e-3, minTransmission: 0.05 },
  points: 5,
  criterion: { kind: "detect" },
  definition: { free: [{ key: "gyrationPerT" }, { key: "oscillatorWavelengthNm" }, { key: "magneticScale", min: 0 }] },
  labTime: { perPointS: 120, perCooldownS: 5400, ambientK: 293.15 },
  ...over,
});
const plan = (over: Partial<PlanRequestInput> = {}) => planMeasurements(planRequestSchema.parse(request(over)));

describe("planner keeps the laboratory's rules", () => {
  it("plans at magneticScale = 0 (one-sided derivatives at the bound) for every criterion", () => {
    for (const criterion of [{ kind: "detect" as const }, { kind: "magneticScale" as const }, { kind: "dOptimal" as const }]) {
      const result = plan({ params: { ...TGG, lengthM: 0.01, magneticScale: 0 }, criterion });
      expect(result.plans[0]!.separable).toBe(true);
      expect(result.plans[0]!.detection!.alternative).toBe(1);
    }
  });

  it("never proposes a point below the minimum transmission, and flags or excludes points past a quarter turn", () => {
    const fields = { valuesT: [0.5, 1, 2] };
    const flagged = plan({ points: 6, criterion: { kind: "magneticScale" }, fields });
    expect(flagged.excluded.lowTransmission).toBeGreaterThan(0);
    for (const p of flagged.plans.flatMap((x) => x.points)) {
      expect(p.transmission).toBeGreaterThanOrEqual(0.05);
      expect(p.flags.includes("phase-wrap")).toBe(Math.abs(p.rotationRad) > Math.PI / 2);
    }
    const excluded = plan({
      points: 6,
      criterion: { kind: "magneticScale" },
      fields,
      optics: { minTransmission: 0.05, excludeWrapped: true },
    });
    expect(excluded.excluded.wrapped).toBeGreaterThan(0);
    for (const p of excluded.plans.flatMap((x) => x.points)) expect(Math.abs(p.rotationRad)).toBeLessThanOrEqual(Math.PI / 2);
  });

  it("offers diverse plans: no two use the same lines at the same temperatures", () => {
    const result = plan({ topPlans: 4 });
    const keys = result.plans.map(
      (p) => `${[...new Set(p.points.map((x) => x.wavelengthNm))]}|${[...new Set(p.points.map((x) => x.temperatureK))]}`,
    );
    expect(result.plans.length).toBeGreaterThan(1);
    expect(new Set(keys).size).toBe(keys.length);
  });

  it("costs measurements × time per point plus cool-downs × time per cool-down", () => {
    for (const p of plan({ topPlans: 4 }).plans) {
      const cool = new Set(p.points.filter((x) => x.temperatureK !== 293.15).map((x) => x.temperatureK)).size;
      expect(p.cooldowns).toBe(cool);
      expect(p.costHours).toBeCloseTo((p.measurements * 120 + cool * 5400) / 3600, 12);
    }
  });

  it("robust design: the worst case never ranks below the average; the chosen plan is shown at each range's ends", () => {
    const ranges = [
      { key: "oscillatorWavelengthNm" as const, min: 240, max: 280 },
      { key: "magneticScale" as const, min: 0.5, max: 3 },
    ];
    const average = plan({ robust: { mode: "average", samples: 6, seed: 3, ranges } });
    const worst = plan({ robust: { mode: "worst", samples: 6, seed: 3, ranges } });
    expect(worst.plans[0]!.rankedValue).toBeGreaterThanOrEqual(average.plans[0]!.rankedValue);
    expect(average.robust!.ends.map((e) => `${e.key}:${e.end}`)).toEqual([
      "oscillatorWavelengthNm:min",
      "oscillatorWavelengthNm:max",
      "magneticScale:min",
      "magneticScale:max",
    ]);
    for (const e of average.robust!.ends) expect(Number.isFinite(e.expectedSigma)).toBe(true);
    // Seeded: the same request plans the same.
    expect(plan({ robust: { mode: "average", samples: 6, seed: 3, ranges } }).plans[0]!.points).toEqual(average.plans[0]!.points);
  });

  it("a prior adds information: σ of the parameter never exceeds its prior σ", () => {
    const result = plan({
      definition: {
        free: [{ key: "gyrationPerT" }, { key: "magneticScale", min: 0 }],
        priors: [{ key: "oscillatorWavelengthNm", mean: 258, sigma: 2 }],
        calibration: { scaleSigma: 0.02, temperatureSigmaK: 0.5, relativeFloor: 0 },
      },
    });
    const sigma = result.plans[0]!.parameterSigma;
    expect(result.freeKeys).toEqual(["gyrationPerT", "magneticScale", "oscillatorWavelengthNm", "fieldLengthScale"]);
    expect(sigma.oscillatorWavelengthNm!).toBeLessThanOrEqual(2);
    expect(sigma.fieldLengthScale!).toBeLessThanOrEqual(0.02);
  });

  it("every note says it holds in this model", () => {
    for (const result of [
      plan(),
      plan({ params: { ...TGG, lengthM: 0.01, diamagneticTerm: true } }),
      plan({ optics: { minTransmission: 0.99 } }),
    ])
      for (const note of result.notes) expect(note).toMatch(/in this model/i);
  });
});
