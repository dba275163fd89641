import { describe, expect, it } from "vitest";
import { SPEED_OF_LIGHT_M_PER_S, gyromagneticRatio, MU0_N_PER_A2 } from "@/lib/physics/constants";
import { deltaMzFromCone, freeLlgTrajectory, llgSusceptibilities, lockIn } from "@/lib/physics/llg";
import { staticMagnetization } from "@/lib/physics/magnetization";
import { polderSusceptibilities } from "@/lib/physics/optics";
import type { SpectrumRequest } from "@/lib/physics/schema";
import { computeSpectrum } from "@/lib/physics/spectrum";
import { computeSpinTrace } from "@/lib/physics/spin-trace";
import { MU0, Z0, cAbs, gamma, omegaOfNm, permittivityClosed, polder, rootDecaying } from "./closed-forms";
import { TGG, relErr } from "./fixtures";

describe("free LLG (h = 0)", () => {
  // Reference: the Gilbert equation in Landau–Lifshitz form has the closed-form solution
  // φ(t) = φ0 + ω0 t/(1+α²), tan(θ/2) = tan(θ0/2) exp(−α ω0 t/(1+α²)) (J. C. Mallinson,
  // IEEE Trans. Magn. 23, 2003 (1987), "On damped gyromagnetic precession"; from memory),
  // restated in physics-model.md §4.1.
  it("precesses from +x toward +y at ω0/(1+α²) and decays as tan(θ/2) ∝ exp(−αω0t/(1+α²))", () => {
    for (const alpha of [0, 0.01, 0.3]) {
      const theta0 = Math.PI / 3;
      const times = Array.from({ length: 21 }, (_, i) => i * 0.75);
      const { samples, normError } = freeLlgTrajectory({ w0: 1, alpha, u0: [Math.sin(theta0), 0, Math.cos(theta0)], sampleTimes: times });
      expect(samples).toHaveLength(times.length);
      samples.forEach(([x, y, z], i) => {
        const t = times[i]!;
        const phi = t / (1 + alpha * alpha);
        const tanHalf = Math.tan(theta0 / 2) * Math.exp((-alpha * t) / (1 + alpha * alpha));
        const theta = 2 * Math.atan(tanHalf);
        expect(Math.abs(x - Math.sin(theta) * Math.cos(phi))).toBeLessThan(1e-8);
        expect(Math.abs(y - Math.sin(theta) * Math.sin(phi))).toBeLessThan(1e-8);
        expect(Math.abs(z - Math.cos(theta))).toBeLessThan(1e-8);
      });
      // |u| = 1 to the solver tolerance (1e-10).
      expect(normError).toBeLessThan(1e-9);
    }
  });

  it("precession alone is γB0 only for α = 0; small-angle decay rate is αω0/(1+α²)", () => {
    const alpha = 0.2;
    const t = 10;
    const { samples } = freeLlgTrajectory({
      w0: 1,
      alpha,
      u0: [1e-3, 0, Math.sqrt(1 - 1e-6)],
      sampleTimes: [0, t],
      relativeTolerance: 1e-13,
    });
    const [x, y] = samples[1]!;
    const wrap = (a: number) => a - 2 * Math.PI * Math.round(a / (2 * Math.PI));
    const angle = Math.atan2(y, x);
    expect(Math.abs(wrap(angle - t / (1 + alpha * alpha)))).toBeLessThan(1e-8);
    // The undamped rate γB0 (w0 = 1) would be off by 0.37 rad here.
    expect(Math.abs(wrap(angle - t))).toBeGreaterThan(0.1);
    expect(relErr(Math.hypot(x, y), 1e-3 * Math.exp((-alpha * t) / (1 + alpha * alpha)))).toBeLessThan(1e-6);
  });
});

describe("lab-frame lock-in against the Polder form (linear regime)", () => {
  // Reference: Polder tensor with Gilbert damping, χ± = ωM/(ω0 ∓ ω + i s α ω) (D. Polder, Phil. Mag. 40,
  // 99 (1949); Stancil & Prabhakar, "Spin Waves", ch. 3; physics-model.md §4.2).
  const base: Omit<SpectrumRequest, "wavelengthsNm" | "method"> = { ...TGG, landeG: 2, totalJ: 0.5 };
  it("agrees to ≤ 1e-4 at the corners of the specified range, for B0 > 0 and B0 < 0", () => {
    let worst = 0;
    for (const fieldT of [0.01, 10, -0.01, -10]) {
      for (const temperatureK of [1, 400]) {
        for (const gilbertDamping of [1e-4, 0.5]) {
          const r = computeSpectrum({
            ...base,
            curieWeissK: 0,
            fieldT,
            temperatureK,
            gilbertDamping,
            wavelengthsNm: [200, 20000],
            method: "llg",
          });
          worst = Math.max(worst, r.maxRelDeviationFromAnalytic!);
          expect(r.maxRelDeviationFromAnalytic!).toBeLessThanOrEqual(1e-4);
          expect(r.warnings).toBeUndefined();
        }
      }
    }
    expect(worst).toBeGreaterThan(0);
  });

  it("matches the Polder closed form, written out in the test, below, at and above ω0 and for B0 < 0", () => {
    // Polder 1949 / Stancil & Prabhakar ch. 3: χ± = ωM/(ω0 ∓ ω + i s α ω), evaluated in closed-forms.ts,
    // against both the numerical lock-in and the product's analytic function. A sign error in s, in
    // the mode labels or a factor 2 in ωM would fail by order 1.
    const alpha = 0.1;
    const g = gyromagneticRatio(2);
    for (const b of [1, -1]) {
      const m0 = staticMagnetization({ ...base, curieWeissK: 0, temperatureK: 10, fieldT: b });
      const omega0 = g * b;
      const omegaM = g * MU0_N_PER_A2 * m0;
      for (const ratio of [0.5, 0.9, 1, 1.1, 2]) {
        const omega = ratio * Math.abs(omega0);
        const ref = polder(gamma(2) * b, gamma(2) * MU0 * m0, alpha, omega);
        const num = llgSusceptibilities({ omega, omega0, omegaM, alpha });
        expect(num.settled).toBe(true);
        const ana = polderSusceptibilities(omega0, omegaM, alpha, Math.sign(m0), omega);
        const dev = (re: number, im: number, z: { re: number; im: number }) => Math.hypot(re - z.re, im - z.im) / cAbs(z);
        expect(dev(num.plusRe, num.plusIm, ref.plus)).toBeLessThan(1e-4);
        expect(dev(num.minusRe, num.minusIm, ref.minus)).toBeLessThan(1e-4);
        expect(dev(ana.plus.re, ana.plus.im, ref.plus)).toBeLessThan(1e-12);
        expect(dev(ana.minus.re, ana.minus.im, ref.minus)).toBeLessThan(1e-12);
        expect(dev(ana.diff.re, ana.diff.im, { re: ref.minus.re - ref.plus.re, im: ref.minus.im - ref.plus.im })).toBeLessThan(1e-12);
        // Passive for both field signs.
        expect(ref.plus.im).toBeLessThan(0);
        expect(ref.minus.im).toBeLessThan(0);
      }
    }
  });

  it("gives the same rotations as the analytic path within the χ deviation", () => {
    const lambdas = [300, 632.8, 1064, 3000, 20000];
    const a = computeSpectrum({ ...TGG, wavelengthsNm: lambdas, method: "analytic" });
    const n = computeSpectrum({ ...TGG, wavelengthsNm: lambdas, method: "llg" });
    a.points.forEach((p, i) => {
      const q = n.points[i]!;
      expect(q.thetaElectricRad).toBe(p.thetaElectricRad);
      expect(relErr(q.thetaMagneticRad, p.thetaMagneticRad)).toBeLessThan(1e-4);
    });
  });

  it("at ω = ω0 only χ+ resonates: χ+ = −i ωM/(α ω0)", () => {
    const alpha = 0.1;
    const gamma = gyromagneticRatio(2);
    const omega0 = gamma * 1;
    const m0 = staticMagnetization({ ...base, curieWeissK: 0, temperatureK: 10, fieldT: 1 });
    const omegaM = gamma * MU0_N_PER_A2 * m0;
    const r = llgSusceptibilities({ omega: omega0, omega0, omegaM, alpha });
    expect(r.settled).toBe(true);
    const expected = omegaM / (alpha * omega0);
    expect(Math.abs(r.plusRe) / expected).toBeLessThan(1e-4);
    expect(relErr(-r.plusIm, expected)).toBeLessThan(1e-4);
    // χ− = ωM/(2ω0 + iαω0) (Polder closed form at ω = ω0): off resonance, smaller by about α/2.
    const minus = {
      re: (omegaM * 2 * omega0) / ((2 * omega0) ** 2 + (alpha * omega0) ** 2),
      im: (-omegaM * alpha * omega0) / ((2 * omega0) ** 2 + (alpha * omega0) ** 2),
    };
    expect(Math.hypot(r.minusRe - minus.re, r.minusIm - minus.im) / Math.hypot(minus.re, minus.im)).toBeLessThan(1e-4);
    expect(Math.hypot(r.minusRe, r.minusIm) / expected).toBeLessThan(0.06);
    expect(r.normError).toBeLessThan(1e-5);
  });

  it("conserves |u| to the solver tolerance in the optical range", () => {
    const gamma = gyromagneticRatio(1.5);
    for (const lambda of [200, 1064, 20000]) {
      const omega = (2 * Math.PI * SPEED_OF_LIGHT_M_PER_S) / (lambda * 1e-9);
      const r = llgSusceptibilities({ omega, omega0: gamma, omegaM: gamma * 0.01, alpha: 0.01 });
      expect(r.normError).toBeLessThan(1e-6);
    }
  });
});

describe("nonlinear regime: rotating-frame fixed point vs lab-frame lock-in", () => {
  // physics-model.md §8: under a circular drive the steady state is a fixed point in the frame
  // rotating with the drive: 0 = −u × (W_r ∓ z) + α u × ((±z) × u), W_r = (h, 0, w0). Solved here by
  // Newton's method on (u'x, u'y) with u'z = s√(1 − u'x² − u'y²), independently of the integrator.
  function fixedPoint(w0: number, alpha: number, h: number, drive: 1 | -1, s: 1 | -1): [number, number, number] {
    const residual = (x: number, y: number): [number, number] => {
      const z = s * Math.sqrt(1 - x * x - y * y);
      const v = [h, 0, w0 - drive];
      // −u × v
      const a = [-(y * v[2]! - z * v[1]!), -(z * v[0]! - x * v[2]!), -(x * v[1]! - y * v[0]!)];
      // (±z) × u = drive (−y, x, 0); u × that
      const q = [-drive * y, drive * x, 0];
      const b = [y * q[2]! - z * q[1]!, z * q[0]! - x * q[2]!];
      return [a[0]! + alpha * b[0]!, a[1]! + alpha * b[1]!];
    };
    const lin = { re: w0 * s - drive, im: alpha };
    const d = lin.re * lin.re + lin.im * lin.im;
    let x = (h * lin.re) / d;
    let y = (drive * -h * lin.im) / d;
    for (let it = 0; it < 60; it++) {
      const [f1, f2] = residual(x, y);
      const e = 1e-7;
      const [a1, a2] = residual(x + e, y);
      const [b1, b2] = residual(x, y + e);
      const j11 = (a1 - f1) / e,
        j21 = (a2 - f2) / e,
        j12 = (b1 - f1) / e,
        j22 = (b2 - f2) / e;
      const det = j11 * j22 - j12 * j21;
      const dx = (f1 * j22 - f2 * j12) / det;
      const dy = (j11 * f2 - j21 * f1) / det;
      x -= dx;
      y -= dy;
      if (Math.hypot(dx, dy) < 1e-15) break;
    }
    const [r1, r2] = residual(x, y);
    expect(Math.hypot(r1, r2)).toBeLessThan(1e-13);
    return [x, y, s * Math.sqrt(1 - x * x - y * y)];
  }

  const cases: [number, number, number, 1 | -1, 1 | -1][] = [
    [0.5, 0.1, 0.05, 1, 1],
    [0.5, 0.1, 0.12, 1, 1],
    [0.5, 0.1, 0.4, -1, 1],
    [-0.6, 0.2, 0.15, -1, -1],
  ];
  for (const [w0, alpha, h, drive, s] of cases) {
    it(`w0 = ${w0}, α = ${alpha}, h = ${h}, drive ${drive > 0 ? "+" : "−"}`, () => {
      const [x, y, z] = fixedPoint(w0, alpha, h, drive, s);
      const coneDeg = (Math.acos(Math.abs(z)) * 180) / Math.PI;
      expect(coneDeg).toBeGreaterThan(2.5);
      expect(coneDeg).toBeLessThan(25);
      const r = lockIn({
        w0,
        alpha,
        h,
        drive,
        sign: s,
        relativeTolerance: 1e-11,
        plan: {
          rampPeriods: 8,
          settleTime: Math.ceil((30 * (1 + alpha * alpha)) / (alpha * Math.abs(w0)) / (2 * Math.PI)) * 2 * Math.PI,
          lockInPeriods: 2,
          settled: true,
        },
      });
      // Lab-frame cone amplitude: u_x ± i u_y = (u'_x ± i u'_y) e^{it}.
      const cRe = x;
      const cIm = drive * y;
      expect(Math.hypot(r.cRe - cRe, r.cIm - cIm) / Math.hypot(cRe, cIm)).toBeLessThan(1e-7);
      // δMz: cone formula vs the fixed point's u_z − s, and vs the window mean of u_z − s.
      const cone = Math.hypot(r.cRe, r.cIm);
      const dmz = deltaMzFromCone(s, cone)!;
      expect(relErr(dmz, z - s)).toBeLessThan(1e-6);
      expect(relErr(r.meanUzMinusS, z - s)).toBeLessThan(1e-6);
      // Nonlinearity is visible: the linear (Polder) cone differs at this drive.
      const lin = h / Math.hypot(Math.abs(w0) - drive * s, alpha);
      expect(Math.abs(cone - lin) / lin).toBeGreaterThan(1e-5);
    });
  }
});

describe("intensity and spin trace", () => {
  it("reports a negative-going δMz (along s) that grows with intensity, analytic and llg alike", () => {
    const req = { ...TGG, wavelengthsNm: [632.8], intensityWPerM2: 1e13 };
    const a = computeSpectrum({ ...req, method: "analytic" });
    const n = computeSpectrum({ ...req, method: "llg" });
    const pa = a.points[0]!;
    const pn = n.points[0]!;
    expect(pa.deltaMzPlusAPerM!).toBeLessThan(0);
    expect(relErr(pn.deltaMzPlusAPerM!, pa.deltaMzPlusAPerM!)).toBeLessThan(1e-3);
    // Product reference value (physics-model.md §4.5): 1 GW/cm² at 632.8 nm in the garnet gives
    // δMz/M0 ≈ −8e-11 (one digit).
    expect(pa.deltaMzPlusAPerM! / a.magnetizationAPerM).toBeGreaterThan(-8.5e-11);
    expect(pa.deltaMzPlusAPerM! / a.magnetizationAPerM).toBeLessThan(-7.5e-11);
    // Closed form, formed in the test: a circularly polarized plane wave of intensity I in a medium of
    // index n has |H| = √(n I / Z0) (I = n E0²/Z0, H = n E/Z0; common practice, no source); the cone is
    // |C+| = |χ+| h0/|M0| and δMz = −s|M0| |C|²/(1 + √(1 − |C|²)) (cone geometry, physics-model.md §4.5).
    const index = rootDecaying(permittivityClosed(TGG, 632.8)).re;
    const h0 = Math.sqrt((index * 1e13) / Z0);
    expect(Math.abs(h0 - 2.3e5)).toBeLessThan(0.05e5); // §4.5 product reference value h0 = 2.3e5 A/m
    const m0 = a.magnetizationAPerM;
    const chiPlus = polder(gamma(TGG.landeG) * TGG.fieldT, gamma(TGG.landeG) * MU0 * m0, TGG.gilbertDamping, omegaOfNm(632.8)).plus;
    const cone = (cAbs(chiPlus) * h0) / Math.abs(m0);
    expect(Math.abs(cone - 1.3e-5)).toBeLessThan(0.05e-5); // §4.5 product reference value, cone 1.3e-5 rad
    expect(relErr(pa.deltaMzPlusAPerM!, (-m0 * cone * cone) / (1 + Math.sqrt(1 - cone * cone)))).toBeLessThan(1e-9);
    const b = computeSpectrum({ ...req, fieldT: -1, method: "analytic" });
    expect(b.points[0]!.deltaMzMinusAPerM!).toBeGreaterThan(0);
  });

  it("spin trace samples the + drive and returns χ± close to the Polder form", () => {
    const r = computeSpinTrace({ ...TGG, wavelengthNm: 1064, intensityWPerM2: 0, periods: 3 });
    expect(r.timePeriods.length).toBeGreaterThan(64 * 4);
    expect(r.timePeriods[r.timePeriods.length - 1]!).toBeCloseTo(5, 6);
    for (let i = 1; i < r.timePeriods.length; i++) expect(r.timePeriods[i]!).toBeGreaterThan(r.timePeriods[i - 1]!);
    expect(
      Math.hypot(r.chiPlus.re - r.chiPlusAnalytic.re, r.chiPlus.im - r.chiPlusAnalytic.im) /
        Math.hypot(r.chiPlusAnalytic.re, r.chiPlusAnalytic.im),
    ).toBeLessThan(1e-4);
    expect(
      Math.hypot(r.chiMinus.re - r.chiMinusAnalytic.re, r.chiMinus.im - r.chiMinusAnalytic.im) /
        Math.hypot(r.chiMinusAnalytic.re, r.chiMinusAnalytic.im),
    ).toBeLessThan(1e-4);
    const last = r.ux.length - 1;
    expect(Math.abs(r.uz[last]! - 1)).toBeLessThan(1e-6);
  });
});
