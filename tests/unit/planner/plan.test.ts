import { describe, expect, it } from "vitest";
import { planMeasurements } from "@/lib/planner/plan";
import { type PlanRequestInput, planRequestSchema, sigmaPerPointRad } from "@/lib/planner/schema";
import { computeSpectrum } from "@/lib/physics/spectrum";
import type { ModelParams } from "@/lib/physics/schema";
import { TGG } from "../physics/fixtures";

/*
 * A model where only the electric-dipole part disperses: a constant index (no Sellmeier pole, no
 * isotropic oscillator strength, undamped transition), so θm is flat in wavelength far above the
 * spin resonance (physics-model.md §4.4) while θe ∝ 1/(λ² − λE²) (§5.4). Material numbers are the
 * terbium garnet's of §9 where they apply; the index 1.95 is the §9 "about 1.95".
 */
const FLAT_MAGNETIC: ModelParams = {
  ...TGG,
  epsInf: 1.95 * 1.95,
  sellmeierB: 0,
  oscillatorStrength: 0,
  oscillatorDampingRadPerS: 0,
  temperatureK: 293.15,
  fieldT: 1,
  lengthM: 0.01,
};

const LINES = [
  { name: "violet diode", wavelengthNm: 405 },
  { name: "green DPSS", wavelengthNm: 532 },
  { name: "HeNe", wavelengthNm: 632.8 },
  { name: "Ti:sapphire", wavelengthNm: 800 },
  { name: "Nd:YAG", wavelengthNm: 1064 },
  { name: "telecom", wavelengthNm: 1550 },
];

/** The two amplitudes only: in this model λE is not what these worked examples are about. */
const TWO_AMPLITUDES = { free: [{ key: "gyrationPerT" as const }, { key: "magneticScale" as const, min: 0 }] };

const request = (over: Partial<PlanRequestInput> = {}): PlanRequestInput => ({
  params: FLAT_MAGNETIC,
  lines: LINES,
  temperatures: { minK: 293.15, maxK: 293.15, stepK: 1 },
  fields: { minT: 1, maxT: 1, stepT: 1 },
  lengthM: 0.01,
  noise: { kind: "sigma", sigmaRad: 1e-5 },
  points: 2,
  criterion: { kind: "magneticScale" },
  definition: TWO_AMPLITUDES,
  ...over,
});

const plan = (over: Partial<PlanRequestInput> = {}, opts = {}) => planMeasurements(planRequestSchema.parse(request(over)), opts);

/** θe and θm per line from the engine directly (not through the Jacobian). */
function parts(params: ModelParams, wavelengthsNm: number[]) {
  const sorted = [...wavelengthsNm].sort((a, b) => a - b);
  const r = computeSpectrum({ ...params, wavelengthsNm: sorted, method: "analytic" });
  return new Map(
    r.points.map((pt) => [
      pt.wavelengthNm,
      { e: pt.thetaElectricRad, m: pt.thetaMagneticRad, transmission: (pt.transmissionPlus! + pt.transmissionMinus!) / 2 },
    ]),
  );
}

describe("planner: worked example, only the electric part disperses", () => {
  const p = parts(
    FLAT_MAGNETIC,
    LINES.map((l) => l.wavelengthNm),
  );

  it("has a flat magnetic part and a dispersing electric part in this model", () => {
    const m = LINES.map((l) => p.get(l.wavelengthNm)!.m);
    // §4.4: θm/L → n ωM/(2c(1+α²)), flat when n is constant; to about 1e-7 (§8).
    for (const x of m) expect(Math.abs(x - m[0]!) / Math.abs(m[0]!)).toBeLessThan(1e-6);
    expect(Math.abs(p.get(405)!.e / p.get(1550)!.e)).toBeGreaterThan(10);
  });

  it("picks the pair of lines with the widest spread of the ratio of the two parts", () => {
    const ratio = (w: number) => p.get(w)!.e / p.get(w)!.m;
    let widest: [number, number] = [0, 0];
    let spread = -1;
    for (const a of LINES)
      for (const b of LINES) {
        const s = Math.abs(ratio(a.wavelengthNm) - ratio(b.wavelengthNm));
        if (s > spread) {
          spread = s;
          widest = [Math.min(a.wavelengthNm, b.wavelengthNm), Math.max(a.wavelengthNm, b.wavelengthNm)];
        }
      }
    expect(widest).toEqual([405, 1550]);
    for (const criterion of [
      { kind: "magneticScale" as const },
      { kind: "dOptimal" as const },
      { kind: "share" as const, wavelengthNm: 1064 },
    ]) {
      const result = plan({ criterion });
      expect(result.method).toBe("exhaustive");
      const best = result.plans[0]!;
      expect(best.points.map((pt) => pt.wavelengthNm)).toEqual(widest);
      expect(best.points.map((pt) => pt.count)).toEqual([1, 1]);
    }
  });

  it("with two candidate lines, measures each once; twice the same line cannot separate the parts", () => {
    const result = plan({ lines: [LINES[1]!, LINES[4]!], topPlans: 3 });
    expect(result.plans[0]!.points.map((pt) => pt.wavelengthNm)).toEqual([532, 1064]);
    expect(result.plans[0]!.separable).toBe(true);
    // The designs that repeat one line cannot separate the parts, so they are not offered beside it.
    expect(result.plans.every((p) => p.separable)).toBe(true);
    const same = plan({ lines: [LINES[1]!], topPlans: 3 });
    expect(same.plans[0]!.separable).toBe(false);
    expect(same.plans[0]!.expectedSigma).toBe(Infinity);
  });

  it("expected σ of magneticScale equals the closed form of a two-parameter linear fit", () => {
    // Two points, θ = a·κE + b·s with a = θe/κE, b = θm/s (both parts first order in their
    // amplitude, §4.3 and §5.4). Cov = σ²(JᵀJ)⁻¹ = σ² J⁻¹J⁻ᵀ, so
    // Var(s) = (a1² σ2² + a2² σ1²) / (a1 b2 − a2 b1)² (2×2 inverse, textbook linear algebra), with
    // σi = σ/√(transmission) (shot noise of the light that gets through).
    const sigma = 1e-5;
    const result = plan({ lines: [LINES[0]!, LINES[5]!], noise: { kind: "sigma", sigmaRad: sigma } });
    const k = FLAT_MAGNETIC.gyrationPerT;
    const a1 = p.get(405)!.e / k;
    const a2 = p.get(1550)!.e / k;
    const b1 = p.get(405)!.m;
    const b2 = p.get(1550)!.m;
    const s1 = sigma / Math.sqrt(p.get(405)!.transmission);
    const s2 = sigma / Math.sqrt(p.get(1550)!.transmission);
    const expected = Math.sqrt(a1 * a1 * s2 * s2 + a2 * a2 * s1 * s1) / Math.abs(a1 * b2 - a2 * b1);
    expect(Math.abs(result.plans[0]!.expectedSigma - expected) / expected).toBeLessThan(1e-4);
    expect(Math.abs(result.plans[0]!.parameterSigma.magneticScale! - expected) / expected).toBeLessThan(1e-4);
    // The two amplitudes are estimated from the same two points: strongly anticorrelated when the
    // parts have opposite signs.
    expect(result.plans[0]!.partsCorrelation).not.toBeNull();
    expect(Math.abs(result.plans[0]!.partsCorrelation!)).toBeLessThan(1);
  });

  it("the search's own criterion agrees with the ml-matrix figures of the reported plan", () => {
    for (const criterion of [
      { kind: "magneticScale" as const },
      { kind: "dOptimal" as const },
      { kind: "share" as const, wavelengthNm: 800 },
    ]) {
      const result = plan({ criterion, points: 3 });
      const fast = result.sigmaVsPoints.find((s) => s.points === 3)!.sigma;
      expect(Math.abs(result.plans[0]!.expectedSigma - fast) / fast).toBeLessThan(1e-8);
    }
  });
});

describe("planner: temperature and field", () => {
  it("raise the signal but do not separate the parts; the best plan takes the lowest T and highest B", () => {
    const result = plan({
      params: { ...TGG, lengthM: 0.01 },
      lines: [LINES[2]!, LINES[4]!],
      temperatures: { minK: 20, maxK: 300, stepK: 40 },
      fields: { minT: 0.5, maxT: 2, stepT: 0.5 },
      optics: { minTransmission: 1e-9 },
      points: 2,
    });
    const best = result.plans[0]!;
    expect(best.points.map((pt) => [pt.temperatureK, pt.fieldT])).toEqual([
      [20, 2],
      [20, 2],
    ]);
    expect(result.notes.join(" ")).toMatch(/do not by themselves separate the parts/);
    expect(result.notes.join(" ")).toMatch(/lowest temperature \(20 K\) and the highest field \(2 T\)/);
  });

  it("one line at many temperatures and fields cannot separate the parts, and says so", () => {
    const result = plan({
      lines: [LINES[2]!],
      temperatures: { minK: 50, maxK: 300, stepK: 50 },
      fields: { minT: 1, maxT: 3, stepT: 1 },
      points: 3,
    });
    expect(result.plans[0]!.separable).toBe(false);
    expect(result.sigmaVsPoints.every((s) => s.sigma === Infinity)).toBe(true);
    expect(result.notes.join(" ")).toMatch(/Only one usable wavelength \(632.8 nm\).*Add a second line/);
  });
});

describe("planner: noise and search", () => {
  it("σ per point is noise/√t, and points below it are flagged", () => {
    expect(sigmaPerPointRad({ kind: "density", radPerSqrtHz: 1e-6, integrationS: 4 })).toBeCloseTo(5e-7, 20);
    const quiet = plan({ noise: { kind: "density", radPerSqrtHz: 1e-7, integrationS: 1 } });
    expect(quiet.plans[0]!.points.every((pt) => !pt.belowNoise)).toBe(true);
    // The 10 mm sample turns 1550 nm light by about 0.16 rad here; a σ of 0.3 rad buries it.
    const noisy = plan({ noise: { kind: "sigma", sigmaRad: 0.3 } });
    const at1550 = noisy.plans[0]!.points.find((pt) => pt.wavelengthNm === 1550)!;
    expect(Math.abs(at1550.rotationRad)).toBeLessThan(0.3);
    expect(at1550.belowNoise).toBe(true);
    expect(noisy.notes.join(" ")).toMatch(/less than the noise/);
    // σ scales with the noise: the Cramér–Rao bound is linear in σ per point.
    expect(noisy.plans[0]!.expectedSigma / quiet.plans[0]!.expectedSigma / (0.3 / 1e-7)).toBeCloseTo(1, 8);
  });

  it("greedy search with exchange finds the exhaustive optimum on a small problem", () => {
    const over = { temperatures: { minK: 100, maxK: 300, stepK: 100 }, fields: { minT: 1, maxT: 2, stepT: 1 }, points: 4 };
    const exhaustive = plan(over);
    const greedy = plan(over, { exhaustiveLimit: 0 });
    expect(exhaustive.method).toBe("exhaustive");
    expect(greedy.method).toBe("greedy");
    expect(greedy.plans[0]!.expectedSigma).toBeLessThanOrEqual(exhaustive.plans[0]!.expectedSigma * 1.0001);
    // σ against the number of points falls as points are added.
    const s = exhaustive.sigmaVsPoints.map((x) => x.sigma).filter(Number.isFinite);
    for (let i = 1; i < s.length; i++) expect(s[i]!).toBeLessThanOrEqual(s[i - 1]!);
  });

  it("reports progress and stops on cancel", () => {
    const seen: number[] = [];
    plan({ points: 3 }, { onProgress: (f: number) => seen.push(f) });
    expect(seen.at(-1)).toBe(1);
    expect(() => plan({ points: 3 }, { shouldCancel: () => true, exhaustiveLimit: 0 })).toThrow(/cancelled/);
  });
});

describe("planner: impossible requests get specific messages", () => {
  const messages = (over: Partial<PlanRequestInput>) => {
    const r = planRequestSchema.safeParse(request(over));
    expect(r.success).toBe(false);
    return r.success ? [] : r.error.issues.map((i) => `${i.path.join(".")}: ${i.message}`);
  };
  it("no lines", () => {
    expect(messages({ lines: [] })).toContain(
      "lines: no lines: add at least one light source (two or more different wavelengths are needed to separate the parts)",
    );
  });
  it("zero points", () => {
    expect(messages({ points: 0 }).join("\n")).toMatch(/^points: zero points: a plan needs at least one point/m);
  });
  it("fewer points than free parameters", () => {
    expect(messages({ points: 1 }).join("\n")).toMatch(/points: 2 free parameters without a prior need at least 2 points/);
  });
  it("a temperature at or below the Curie–Weiss temperature", () => {
    const params = { ...FLAT_MAGNETIC, curieWeissK: 5 };
    expect(messages({ params, temperatures: { minK: 5, maxK: 300, stepK: 5 } }).join("\n")).toMatch(
      /temperatures\.minK: 5 K is at or below the Curie–Weiss temperature of this set \(5 K\)/,
    );
  });
  it("a free key that is not a parameter", () => {
    const definition = { free: [{ key: "gyrationPerT" }, { key: "colour" }] } as unknown as PlanRequestInput["definition"];
    expect(messages({ definition }).join("\n")).toMatch(/definition\.free\.1\.key: "colour" is not a model parameter that a fit can free/);
  });
});
