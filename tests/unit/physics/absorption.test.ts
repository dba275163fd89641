import { describe, expect, it } from "vitest";
import {
  ellipticityAngleRad,
  ellipticityIsSmall,
  figureOfMeritRadPerT,
  isOpaque,
  meanAbsorptionPerM,
  opaqueBands,
  transmissionOf,
} from "@/lib/physics/absorption";
import type { SpectrumRequest } from "@/lib/physics/schema";
import { computeSpectrumArrays, computeSpectrum } from "@/lib/physics/spectrum";
import { mergeArrays, splitRequest } from "@/lib/compute/spectrum-pool";
import {
  C0,
  c,
  cAdd,
  cExp,
  cMul,
  cSub,
  gamma,
  gyrationClosed,
  MU0,
  omegaOfNm,
  permittivityClosed,
  polder,
  rootDecaying,
} from "./closed-forms";
import { TGG, relErr } from "./fixtures";
import { staticMagnetization } from "@/lib/physics/magnetization";

const req = (over: Partial<SpectrumRequest>, wavelengthsNm: number[]): SpectrumRequest =>
  ({ ...TGG, wavelengthsNm, method: "analytic", ...over }) as SpectrumRequest;

describe("absorption from Im n±", () => {
  it("α = 4π k / λ with k from the closed form of n = n′ − i k, n² = ε, of an isotropic medium (no spins)", () => {
    // n = n′ − i k with n² = ε: n′ = √((|ε| + Re ε)/2) and 2 n′ k = −Im ε (squaring n′ − i k; the
    // form k = √((|ε| − Re ε)/2) cancels when Im ε is tiny); intensity absorption coefficient
    // α = 4π k / λ (M. Born and E. Wolf, "Principles of Optics", ch. 14, and E. Hecht, "Optics";
    // chapter numbers from memory). Without spins or gyration both circular modes see ε alone.
    const over = { ionDensityPerM3: 0, lengthM: 0.003 };
    const lambdas = [280, 400, 632.8, 1064];
    const r = computeSpectrum(req(over, lambdas));
    r.points.forEach((p, i) => {
      const eps = permittivityClosed(TGG, lambdas[i]!);
      const k = -eps.im / (2 * Math.sqrt((Math.hypot(eps.re, eps.im) + eps.re) / 2));
      const alpha = (4 * Math.PI * k) / (lambdas[i]! * 1e-9);
      expect(relErr(p.absorptionPlusPerM!, alpha)).toBeLessThan(1e-9);
      expect(relErr(p.absorptionMinusPerM!, alpha)).toBeLessThan(1e-9);
      // Beer–Lambert: one pass of length L transmits exp(−α L) of the intensity.
      expect(relErr(p.transmissionPlus!, Math.exp(-alpha * 0.003))).toBeLessThan(1e-9);
    });
  });

  it("the transmission of each mode is |t±|² of the slab's Jones eigenvalues t± = exp(−i n± ω L / c)", () => {
    // Independent indices from closed-forms.ts (Lorentz ε, §5.2 G, Polder χ± with s), then |t|².
    for (const [t, b, lengthM, lambda] of [
      [293.15, 1, 0.004, 632.8],
      [4, 5, 0.001, 400],
      [10, -2, 0.0002, 300],
    ] as const) {
      const over = { temperatureK: t, fieldT: b, lengthM };
      const p = computeSpectrum(req(over, [lambda])).points[0]!;
      const omega = omegaOfNm(lambda);
      const m0 = staticMagnetization({ ...TGG, ...over });
      const chi = polder(gamma(TGG.landeG) * b, gamma(TGG.landeG) * MU0 * m0, TGG.gilbertDamping, omega);
      const eps = permittivityClosed(TGG, lambda);
      const gyr = gyrationClosed(TGG, TGG.gyrationPerT, MU0 * m0, lambda);
      const nPlus = cMul(rootDecaying(cAdd(eps, gyr)), rootDecaying(cAdd(c(1), chi.plus)));
      const nMinus = cMul(rootDecaying(cSub(eps, gyr)), rootDecaying(cAdd(c(1), chi.minus)));
      const k0L = (omega * lengthM) / C0;
      const tp = cExp(cMul(c(0, -k0L), nPlus));
      const tm = cExp(cMul(c(0, -k0L), nMinus));
      expect(relErr(p.transmissionPlus!, tp.re ** 2 + tp.im ** 2)).toBeLessThan(1e-9);
      expect(relErr(p.transmissionMinus!, tm.re ** 2 + tm.im ** 2)).toBeLessThan(1e-9);
      // Circular dichroism: T± = exp(2 Im n± ωL/c) and η = (ωL/2c) Im(n− − n+) (§1), so T−/T+ = exp(4η).
      expect(relErr(p.transmissionMinus! / p.transmissionPlus!, Math.exp(4 * p.ellipticityRad))).toBeLessThan(1e-9);
    }
  });

  it("a lossless medium (ΓE = 0, Gilbert α = 0) has α± = 0 exactly, full transmission and no figure of merit", () => {
    const r = computeSpectrum(req({ oscillatorDampingRadPerS: 0, gilbertDamping: 0 }, [400, 632.8, 1064, 1550]));
    for (const p of r.points) {
      expect(p.absorptionPlusPerM).toBe(0);
      expect(p.absorptionMinusPerM).toBe(0);
      expect(p.transmissionPlus).toBe(1);
      expect(p.transmissionMinus).toBe(1);
      expect(p.ellipticityRad).toBe(0);
      expect(figureOfMeritRadPerT(p.verdetRadPerTm, meanAbsorptionPerM(p.absorptionPlusPerM!, p.absorptionMinusPerM!))).toBeNull();
    }
  });

  it("the demo garnet at 256 nm is opaque for 10 mm, and the flag says so", () => {
    const p = computeSpectrum(req({ lengthM: 0.01 }, [256])).points[0]!;
    expect(p.transmissionPlus!).toBeLessThan(1e-10);
    expect(isOpaque(p.transmissionPlus!, p.transmissionMinus!)).toBe(true);
  });
});

describe("ellipticity of the transmitted light", () => {
  it(
    "atan(tanh η) is the axis-ratio angle of the ellipse that (1, 0) becomes " +
      "(Jones vector; polarization ellipse of Born & Wolf ch. 1)",
    () => {
      // Output of the slab for input (1, 0): E = ½ (a + b, −i(a − b)), a = e^{η′}, b = e^{−η′} with only
      // the amplitudes differing (phases removed: they only turn the ellipse). For E = (Ex, Ey) the
      // semi-axes satisfy a₁² + a₂² = |Ex|² + |Ey|² and a₁ a₂ = |Im(Ex* Ey)| (Born & Wolf, ch. 1, the
      // polarization ellipse; section from memory), so
      // tan χ = a₂/a₁ is the smaller root ratio.
      for (const eta of [1e-6, 0.05, 0.3, 1, 2.5, 10, -0.7]) {
        const a = Math.exp(-eta);
        const b = Math.exp(eta);
        const ex = c((a + b) / 2);
        const ey = c(0, -(a - b) / 2);
        const s0 = ex.re ** 2 + ex.im ** 2 + ey.re ** 2 + ey.im ** 2;
        const cross = Math.abs(ex.re * ey.im - ex.im * ey.re);
        // a₁ a₂ = cross, a₁² + a₂² = s0 → (a₂/a₁) solves r/(1 + r²) = cross/s0.
        const q = cross / s0;
        // Smaller root of q r² − r + q = 0, in the form that does not cancel for small q.
        const ratio = (2 * q) / (1 + Math.sqrt(Math.max(0, 1 - 4 * q * q)));
        const chi = Math.atan(ratio);
        // Near circular light (q → ½) the square root amplifies round-off to about √1e-16.
        expect(Math.abs(Math.abs(ellipticityAngleRad(eta)) - chi)).toBeLessThan(1e-7);
        expect(Math.sign(ellipticityAngleRad(eta))).toBe(Math.sign(eta));
        expect(Math.abs(ellipticityAngleRad(eta))).toBeLessThanOrEqual(Math.PI / 4);
      }
    },
  );

  it("the engine's angle stays within π/4 where η is large, and equals η to 1e-4 relative where it is small", () => {
    const r = computeSpectrum(req({ lengthM: 0.01 }, [256, 300, 632.8, 1064]));
    const big = r.points[0]!;
    expect(Math.abs(big.ellipticityRad)).toBeGreaterThan(Math.PI / 4);
    expect(ellipticityIsSmall(big.ellipticityRad)).toBe(false);
    expect(Math.abs(big.ellipticityAngleRad!)).toBeLessThanOrEqual(Math.PI / 4);
    const small = r.points[3]!;
    expect(ellipticityIsSmall(small.ellipticityRad)).toBe(true);
    expect(relErr(small.ellipticityAngleRad!, small.ellipticityRad)).toBeLessThan(1e-4);
  });
});

describe("figure of merit and opaque bands", () => {
  it("|V|/α in rad/T where α > 0; null without a field or without loss", () => {
    expect(figureOfMeritRadPerT(-134, 2)).toBe(67);
    expect(figureOfMeritRadPerT(null, 2)).toBeNull();
    expect(figureOfMeritRadPerT(5, 0)).toBeNull();
    expect(figureOfMeritRadPerT(5, -1)).toBeNull();
  });

  it("Beer–Lambert: T = exp(−α L), e.g. α = 230.26 /m over 1 cm transmits 10 %", () => {
    // ln 10 / 0.01 m = 230.2585 /m gives T = 0.1 exactly (definition of the decadic absorbance).
    expect(transmissionOf(Math.LN10 / 0.01, 0.01)).toBeCloseTo(0.1, 12);
    expect(transmissionOf(0, 5)).toBe(1);
  });

  it("opaque bands are runs where both modes transmit below 1 %", () => {
    const nm = [250, 260, 270, 280, 290, 300];
    const tp = [0, 0.001, 0.5, 0.001, 0.002, 0.2];
    const tm = [0, 0.002, 0.001, 0.003, 0.009, 0.001];
    expect(opaqueBands(nm, tp, tm)).toEqual([
      { fromNm: 250, toNm: 260 },
      { fromNm: 280, toNm: 290 },
    ]);
    expect(opaqueBands([], [], [])).toEqual([]);
  });
});

describe("absorption columns across worker chunks", () => {
  it("merging chunks gives the same columns as one run, in both methods, with the diamagnetic term too", () => {
    for (const method of ["analytic", "llg"] as const) {
      const request = req({ method, lengthM: 0.01, diamagneticTerm: true }, [260, 300, 400, 532, 632.8, 800, 1064]);
      const whole = computeSpectrumArrays(request);
      const merged = mergeArrays(
        request,
        splitRequest(request, 3).map((c) => computeSpectrumArrays(c.request)),
      );
      for (const key of [
        "absorptionPlusPerM",
        "absorptionMinusPerM",
        "transmissionPlus",
        "transmissionMinus",
        "ellipticityAngleRad",
        "thetaDiamagneticRad",
      ] as const) {
        expect(Array.from(merged[key]!)).toEqual(Array.from(whole[key]!));
      }
      expect(merged.thetaDiamagneticRad).toBeDefined();
    }
  });
});
