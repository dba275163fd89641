import { describe, expect, it } from "vitest";
import {
  DEFAULT_FREE_KEYS,
  analysisDefinitionSchema,
  defaultAnalysisDefinition,
  designedPointSigma,
  effectiveVariance,
  priorPenalty,
  variedKeys,
} from "@/lib/analysis/definition";

describe("the analysis definition shared by the fit and the planner", () => {
  it("starts from the fit's default free set, with magneticScale bounded below by 0", () => {
    const d = defaultAnalysisDefinition();
    expect(d.free.map((f) => f.key)).toEqual(DEFAULT_FREE_KEYS);
    expect(d.free.find((f) => f.key === "magneticScale")?.min).toBe(0);
    expect(analysisDefinitionSchema.parse(d)).toEqual(d);
  });

  it("rejects a parameter listed twice and a second prior on one key, naming the place", () => {
    const r = analysisDefinitionSchema.safeParse({
      free: [{ key: "magneticScale" }, { key: "magneticScale" }],
      priors: [
        { key: "oscillatorWavelengthNm", mean: 250, sigma: 5 },
        { key: "oscillatorWavelengthNm", mean: 260, sigma: 5 },
      ],
    });
    expect(r.success).toBe(false);
    const paths = r.error!.issues.map((i) => i.path.join("."));
    expect(paths).toContain("free.1.key");
    expect(paths).toContain("priors.1.key");
  });

  it("rejects a prior with σ ≤ 0 and a key that cannot be fitted", () => {
    expect(
      analysisDefinitionSchema.safeParse({ free: [{ key: "magneticScale" }], priors: [{ key: "magneticScale", mean: 1, sigma: 0 }] })
        .success,
    ).toBe(false);
    expect(analysisDefinitionSchema.safeParse({ free: [{ key: "totalJ" }] }).success).toBe(false);
  });

  it("varies the free keys and, after them, every key that carries a prior", () => {
    expect(
      variedKeys({
        free: [{ key: "gyrationPerT" }, { key: "magneticScale" }],
        priors: [
          { key: "magneticScale", mean: 1, sigma: 1 },
          { key: "oscillatorWavelengthNm", mean: 250, sigma: 10 },
        ],
      }),
    ).toEqual(["gyrationPerT", "magneticScale", "oscillatorWavelengthNm"]);
  });

  it("adds each prior's ((x − μ)/σ)² (Gaussian log-likelihood, textbook form)", () => {
    // (260 − 250)/5 = 2 → 4; (0.5 − 1)/0.25 = −2 → 4.
    const priors = [
      { key: "oscillatorWavelengthNm" as const, mean: 250, sigma: 5 },
      { key: "magneticScale" as const, mean: 1, sigma: 0.25 },
    ];
    expect(priorPenalty(priors, { oscillatorWavelengthNm: 260, magneticScale: 0.5 })).toBeCloseTo(8, 12);
    expect(priorPenalty(priors, {})).toBe(0);
  });

  it("adds the error terms in quadrature (3-4-5 triangle, and 1/√T for the shot-noise term)", () => {
    // σ = 3, floor 0.04 × |100| = 4 → √(9 + 16) = 5.
    expect(Math.sqrt(effectiveVariance(3, -100, { relativeFloor: 0.04, temperatureSigmaK: 0 }))).toBeCloseTo(5, 12);
    // Thermal term: ∂θ/∂T = 2 rad/K × σT 0.5 K = 1 rad → √(0 + 0 + 1) with no other term.
    expect(effectiveVariance(0, 1, { relativeFloor: 0, temperatureSigmaK: 0.5 }, 2)).toBeCloseTo(1, 12);
    // Shot noise at 25 % transmission doubles the full-transmission noise.
    expect(designedPointSigma({ absoluteRad: 1e-6, relativeFloor: 0, minTransmission: 0.01 }, 1, 0.25)).toBeCloseTo(2e-6, 18);
  });
});
