import { describe, expect, it } from "vitest";
import {
  brillouinDerivative,
  isolationDb,
  magnetizationDerivatives,
  maxAngleErrorRad,
  rotatorRequestSchema,
  sizeRotator,
} from "@/lib/planner/rotator";
import { brillouin, staticMagnetization } from "@/lib/physics/magnetization";
import { computeSpectrum } from "@/lib/physics/spectrum";
import { TGG, relErr } from "../physics/fixtures";

const size = (over: Record<string, unknown> = {}) =>
  sizeRotator(rotatorRequestSchema.parse({ params: TGG, wavelengthNm: 1064, temperatureK: 293.15, fieldT: 1, ...over }));

/** θ of the engine itself at one point. */
const engineTheta = (wavelengthNm: number, temperatureK: number, fieldT: number, lengthM: number) =>
  computeSpectrum({ ...TGG, temperatureK, fieldT, lengthM, wavelengthsNm: [wavelengthNm], method: "analytic" }).points[0]!.thetaRad;

describe("rotator sizing", () => {
  it("45° length is (π/4)/(|V|·B), turns the light by exactly π/4, and scales linearly with the angle", () => {
    const r = size();
    const v = computeSpectrum({ ...TGG, wavelengthsNm: [1064], method: "analytic" }).points[0]!.verdetRadPerTm!;
    // physics-model.md §6.3 and §8 "Faraday rotator": L45 = (π/4)/(|V| |B0|).
    expect(relErr(r.length45M!, Math.PI / 4 / Math.abs(v * 1))).toBeLessThan(1e-12);
    expect(relErr(Math.abs(engineTheta(1064, 293.15, 1, r.length45M!)), Math.PI / 4)).toBeLessThan(1e-12);
    // §8: V(1064 nm) = −39.4 rad/(T·m) for the terbium garnet, so L45 ≈ 19.9 mm at 1 T.
    expect(r.length45M!).toBeCloseTo(Math.PI / 4 / 39.4, 3);
    const r90 = size({ targetAngleDeg: 90 });
    const r10 = size({ targetAngleDeg: 10 });
    expect(relErr(r90.lengthM!, 2 * r.length45M!)).toBeLessThan(1e-12);
    expect(relErr(r10.lengthM!, (10 / 45) * r.length45M!)).toBeLessThan(1e-12);
  });

  it("splits the Verdet constant into its magnetic share", () => {
    const r = size();
    // §8: magnetic share 9.2 % at 1064 nm (293.15 K, 1 T) for the terbium garnet.
    expect(r.magneticShare!).toBeCloseTo(0.092, 3);
    expect(Math.sign(r.magneticVerdetRadPerTm)).toBe(1);
    expect(Math.sign(r.verdetRadPerTm)).toBe(-1);
  });

  it("the Brillouin derivative matches a difference quotient of B_J, including near x = 0", () => {
    for (const x of [1e-6, 3e-3, 0.05, 0.7, 3, 25]) {
      // A step large enough that B_J's own round-off (closed form above |y| = 1e-3) stays small.
      const h = 1e-4 * Math.max(x, 1e-2);
      const fd = (brillouin(6, x + h) - brillouin(6, x - h)) / (2 * h);
      expect(relErr(brillouinDerivative(6, x), fd)).toBeLessThan(1e-7);
    }
    // B_J'(0) = (J + 1)/(3J) (slope of the Curie law, Kittel ch. 11).
    expect(relErr(brillouinDerivative(6, 0), 7 / 18)).toBeLessThan(1e-15);
  });

  it("dθ/dT and dθ/dB (closed form through M0) match finite differences of the engine to 1e-6", () => {
    for (const [t, b, w] of [
      [293.15, 1, 1064],
      [77, 2, 632.8],
      [4.2, 5, 1550],
      [20, -1.5, 800],
    ] as const) {
      const r = size({ temperatureK: t, fieldT: b, wavelengthNm: w });
      const L = r.lengthM!;
      const hT = 1e-4 * t;
      const hB = 1e-4 * Math.abs(b);
      const fdT = (engineTheta(w, t + hT, b, L) - engineTheta(w, t - hT, b, L)) / (2 * hT);
      const fdB = (engineTheta(w, t, b + hB, L) - engineTheta(w, t, b - hB, L)) / (2 * hB);
      expect(relErr(r.dThetaDTRadPerK, fdT)).toBeLessThan(1e-6);
      expect(relErr(r.dThetaDBRadPerT, fdB)).toBeLessThan(1e-6);
    }
  });

  it("the M0 derivatives match differences of the magnetization, with a Curie–Weiss field", () => {
    const p = { ...TGG, curieWeissK: 3, temperatureK: 6, fieldT: 0.5 };
    const d = magnetizationDerivatives(p);
    const h = 1e-5;
    const fdB = (staticMagnetization({ ...p, fieldT: 0.5 + h }) - staticMagnetization({ ...p, fieldT: 0.5 - h })) / (2 * h);
    const fdT = (staticMagnetization({ ...p, temperatureK: 6 + h }) - staticMagnetization({ ...p, temperatureK: 6 - h })) / (2 * h);
    expect(relErr(d.dMdB, fdB)).toBeLessThan(1e-7);
    expect(relErr(d.dMdT, fdT)).toBeLessThan(1e-7);
  });

  it("isolation −10·log10(sin²Δθ): 35.2 dB at 1° (common practice, no source)", () => {
    expect(isolationDb((1 * Math.PI) / 180)).toBeCloseTo(35.16, 2);
    expect(isolationDb(maxAngleErrorRad(30))).toBeCloseTo(30, 10);
  });

  it("the temperature and field windows end where the engine's rotation error reaches the isolation target", () => {
    const r = size({ isolationTargetDb: 30 });
    const L = r.lengthM!;
    const theta0 = engineTheta(1064, 293.15, 1, L);
    const w = r.temperatureWindowK!;
    expect(w.low).toBeLessThan(293.15);
    expect(w.high).toBeGreaterThan(293.15);
    for (const t of [w.low, w.high]) expect(isolationDb(engineTheta(1064, t, 1, L) - theta0)).toBeCloseTo(30, 5);
    const f = r.fieldWindowT!;
    for (const b of [f.low, f.high]) expect(isolationDb(engineTheta(1064, 293.15, b, L) - theta0)).toBeCloseTo(30, 5);
    // Roughly linear around 1 T: ±Δθ/|dθ/dB|.
    expect(relErr(f.high - 1, r.maxAngleErrorRad / Math.abs(r.dThetaDBRadPerT))).toBeLessThan(1e-2);
  });

  it("rejects a zero field", () => {
    expect(rotatorRequestSchema.safeParse({ params: TGG, wavelengthNm: 1064, temperatureK: 293.15, fieldT: 0 }).success).toBe(false);
  });
});
