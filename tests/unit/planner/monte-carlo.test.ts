import { describe, expect, it } from "vitest";
import { fitMeasurements } from "@/lib/fit/fit";
import { evaluateModel } from "@/lib/fit/model";
import type { MeasuredPoint } from "@/lib/measurements/point";
import { planMeasurements } from "@/lib/planner/plan";
import { type PlanRequestInput, planRequestSchema } from "@/lib/planner/schema";
import { TGG } from "../physics/fixtures";
import { seededGaussian } from "../fit/support";

/*
 * The planner's expected standard error is the Cramér–Rao bound from JᵀWJ. Here it is checked
 * against what the fit actually delivers: 200 synthetic data sets at the best plan's points (the
 * model at the set's values plus Gaussian noise of the plan's σ), each fitted with the product's
 * fit (weighted Levenberg–Marquardt, lib/fit/fit.ts), and the scatter of the fitted quantity
 * compared with the plan's σ. The standard deviation of 200 draws has a relative standard error
 * of about 1/√(2·199) = 5 % (common practice, no source), so 15 % is three of those.
 */

const SIGMA_RAD = 2e-3;
const LENGTH_M = 0.01;

const request = (criterion: PlanRequestInput["criterion"]): PlanRequestInput => ({
  params: { ...TGG, lengthM: LENGTH_M },
  lines: [
    { name: "green", wavelengthNm: 532 },
    { name: "HeNe", wavelengthNm: 632.8 },
    { name: "YAG", wavelengthNm: 1064 },
    { name: "telecom", wavelengthNm: 1550 },
  ],
  temperatures: { minK: 150, maxK: 293.15, stepK: 143.15 },
  fields: { minT: 1, maxT: 1, stepT: 1 },
  lengthM: LENGTH_M,
  noise: { kind: "sigma", sigmaRad: SIGMA_RAD },
  points: 5,
  criterion,
});

const mean = (a: number[]) => a.reduce((s, v) => s + v, 0) / a.length;
const std = (a: number[]) => Math.sqrt(a.reduce((s, v) => s + (v - mean(a)) ** 2, 0) / (a.length - 1));

describe("planner against a Monte-Carlo of the fit", () => {
  it("expected σ of magneticScale and of the magnetic share match 200 simulated fits within 15 %", () => {
    const shareNm = 1064;
    const byScale = planMeasurements(planRequestSchema.parse(request({ kind: "magneticScale" })));
    const byShare = planMeasurements(planRequestSchema.parse(request({ kind: "share", wavelengthNm: shareNm })));
    expect(byScale.method).toBe("exhaustive");
    const params = { ...TGG, lengthM: LENGTH_M };
    const ratios: string[] = [];
    for (const [label, result] of [
      ["magneticScale", byScale],
      ["share", byShare],
    ] as const) {
      const plan = result.plans[0]!;
      expect(plan.separable).toBe(true);
      const conditions = plan.points.flatMap((p) =>
        Array.from({ length: p.count }, () => ({
          wavelengthNm: p.wavelengthNm,
          temperatureK: p.temperatureK,
          fieldT: p.fieldT,
          lengthM: LENGTH_M,
          quantity: "rotation" as const,
        })),
      );
      const clean = evaluateModel(params, conditions).value;
      const gauss = seededGaussian(label === "share" ? 4242 : 2024);
      const estimates: number[] = [];
      for (let draw = 0; draw < 200; draw++) {
        const points: MeasuredPoint[] = conditions.map((c, i) => ({
          line: i + 2,
          ...c,
          value: clean[i]! + SIGMA_RAD * gauss(),
          sigma: SIGMA_RAD,
        }));
        const fit = fitMeasurements({ params, free: [{ key: "gyrationPerT" }, { key: "magneticScale" }], points });
        expect(fit.converged).toBe(true);
        if (label === "magneticScale") estimates.push(fit.values.magneticScale!);
        else
          estimates.push(
            evaluateModel(fit.params, [
              { wavelengthNm: shareNm, temperatureK: params.temperatureK, fieldT: params.fieldT, lengthM: LENGTH_M, quantity: "rotation" },
            ]).magneticShare[0]!,
          );
      }
      const ratio = std(estimates) / plan.expectedSigma;
      ratios.push(
        `${label} ${ratio.toFixed(3)} (planner σ ${plan.expectedSigma.toPrecision(3)}, scatter ${std(estimates).toPrecision(3)})`,
      );
      expect(ratio).toBeGreaterThan(0.85);
      expect(ratio).toBeLessThan(1.15);
    }
    console.info(`planner Monte-Carlo over 200 fits, scatter / planner σ: ${ratios.join("; ")}`);
  }, 180_000);
});
