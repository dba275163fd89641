import { describe, expect, it } from "vitest";
import { BOHR_MAGNETON_J_PER_T, BOLTZMANN_J_PER_K, MU0_N_PER_A2 } from "@/lib/physics/constants";
import {
  brillouin,
  curieConstantK,
  curieWeissSusceptibility,
  saturationMagnetization,
  staticMagnetization,
} from "@/lib/physics/magnetization";
import { TGG, relErr } from "./fixtures";

describe("Brillouin function", () => {
  it("has the Curie-law slope (J+1)/(3J) at small x and tends to 1", () => {
    // Kittel, Introduction to Solid State Physics, ch. 11: B_J(x) ≈ (J+1) x / (3J) for x ≪ 1.
    for (const j of [0.5, 1, 3.5, 6]) {
      expect(relErr(brillouin(j, 1e-6), ((j + 1) * 1e-6) / (3 * j))).toBeLessThan(1e-9);
      expect(brillouin(j, 200)).toBeCloseTo(1, 12);
    }
  });

  it("reduces to tanh x for J = 1/2", () => {
    // Kittel ch. 11: for a two-level system (J = 1/2) M = N μ tanh(x).
    for (const x of [1e-4, 0.3, 1, 4]) expect(relErr(brillouin(0.5, x), Math.tanh(x))).toBeLessThan(1e-12);
  });

  it("is continuous across the series/closed-form switch", () => {
    const j = 6;
    const a = brillouin(j, 0.999e-3 * 12 / 13);
    const b = brillouin(j, 1.001e-3 * 12 / 13);
    expect(Math.abs(b - a)).toBeLessThan(1e-6);
    expect(b).toBeGreaterThan(a);
  });
});

describe("terbium ion and terbium garnet", () => {
  it("Tb³⁺ effective moment g√(J(J+1)) = 9.72 μB", () => {
    // Kittel ISSP, ch. 11, table "Effective magneton numbers p for trivalent lanthanide group ions":
    // Tb³⁺ 4f⁸ ⁷F₆, p(calc) = 9.72 (from memory). Hund's rules give g = 3/2 for L = 3, S = 3, J = 6.
    const l = 3, s = 3, j = 6;
    const g = 1 + (j * (j + 1) + s * (s + 1) - l * (l + 1)) / (2 * j * (j + 1));
    expect(g).toBe(1.5);
    expect(g * Math.sqrt(j * (j + 1))).toBeCloseTo(9.72, 2);
  });

  it("Curie constant of the terbium garnet is 3.138 K", () => {
    // physics-model.md §9 "from the values above" (N = 24/a³, a = 12.355 Å public data; g, J handbook).
    expect(curieConstantK(TGG)).toBeCloseTo(3.138, 3);
    // Independent route: C = μ0 N p² μB² / (3 kB) with Kittel's p = 9.72 (from memory, 3 digits).
    const cFromP = (MU0_N_PER_A2 * TGG.ionDensityPerM3 * 9.72 ** 2 * BOHR_MAGNETON_J_PER_T ** 2) / (3 * BOLTZMANN_J_PER_K);
    expect(relErr(curieConstantK(TGG), cFromP)).toBeLessThan(2e-3);
    // μ0 Ms = 1.335 T (physics-model.md §9).
    expect(MU0_N_PER_A2 * saturationMagnetization(TGG)).toBeCloseTo(1.335, 3);
  });

  it("Brillouin saturation M0/Ms = 0.99847 at 1.5 K and 7 T (g = 3/2, J = 6)", () => {
    // physics-model.md §8 (product reference value; by hand: x = gμB J B/(kB T) = 28.21,
    // B_6(x) = (13/12) coth(13x/12) − (1/12) coth(x/12) = 0.99847).
    const p = { ...TGG, curieWeissK: 0, temperatureK: 1.5, fieldT: 7 };
    expect(staticMagnetization(p) / saturationMagnetization(p)).toBeCloseTo(0.99847, 5);
  });
});

describe("static magnetization", () => {
  it("obeys the Curie law χT = C at low field", () => {
    // Kittel ch. 11, Curie law χ = C/T.
    for (const t of [1, 4.2, 77, 300]) {
      const p = { ...TGG, curieWeissK: 0, temperatureK: t, fieldT: 1e-6 };
      const chi = (MU0_N_PER_A2 * staticMagnetization(p)) / p.fieldT;
      expect(relErr(chi * t, curieConstantK(p))).toBeLessThan(1e-6);
    }
  });

  it("obeys Curie–Weiss χ(T − θCW) = C at low field, for both signs of θCW", () => {
    // Kittel ch. 14 (mean-field theory): χ = C/(T − θ).
    for (const theta of [-8, 5]) {
      const p = { ...TGG, curieWeissK: theta, temperatureK: 20, fieldT: 1e-6 };
      const chi = (MU0_N_PER_A2 * staticMagnetization(p)) / p.fieldT;
      expect(relErr(chi * (p.temperatureK - theta), curieConstantK(p))).toBeLessThan(1e-6);
      expect(relErr(chi, curieWeissSusceptibility(p))).toBeLessThan(1e-6);
    }
  });

  it("solves the mean-field equation self-consistently", () => {
    const p = { ...TGG, curieWeissK: 3, temperatureK: 4, fieldT: 0.5 };
    const m = staticMagnetization(p);
    const lambdaW = p.curieWeissK / curieConstantK(p);
    const x = (p.landeG * BOHR_MAGNETON_J_PER_T * p.totalJ * (p.fieldT + MU0_N_PER_A2 * lambdaW * m)) / (BOLTZMANN_J_PER_K * p.temperatureK);
    expect(relErr(m, saturationMagnetization(p) * brillouin(p.totalJ, x))).toBeLessThan(1e-12);
  });

  it("is odd in the field, exactly, and zero at zero field or without spins", () => {
    const p = { ...TGG, fieldT: 3.7 };
    expect(staticMagnetization({ ...p, fieldT: -3.7 })).toBe(-staticMagnetization(p));
    expect(staticMagnetization({ ...p, fieldT: 0 })).toBe(0);
    expect(staticMagnetization({ ...p, ionDensityPerM3: 0 })).toBe(0);
  });

  it("gives μ0M0 ≈ C B/(T − θCW) for the garnet at room temperature (about 1 % of B)", () => {
    const m = staticMagnetization(TGG);
    expect(relErr(MU0_N_PER_A2 * m, (3.138 * 1) / (293.15 + 8))).toBeLessThan(1e-3);
  });
});
