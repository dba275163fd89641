import { describe, expect, it } from "vitest";
import {
  BOHR_MAGNETON_J_PER_T,
  BOLTZMANN_J_PER_K,
  ELECTRON_G_FACTOR,
  ELECTRON_MASS_KG,
  ELEMENTARY_CHARGE_C,
  EPS0_F_PER_M,
  HBAR_J_S,
  MU0_N_PER_A2,
  PLANCK_J_S,
  SPEED_OF_LIGHT_M_PER_S,
  VACUUM_IMPEDANCE_OHM,
  angularFrequencyFromNm,
  gyromagneticRatio,
} from "@/lib/physics/constants";
import { relErr } from "./fixtures";

// Reference values: CODATA 2018, NIST "Fundamental Physical Constants" tables
// (https://physics.nist.gov/cuu/Constants/, Tiesinga et al., Rev. Mod. Phys. 93, 025010 (2021)).
describe("CODATA 2018 constants", () => {
  it("match the published values", () => {
    expect(BOHR_MAGNETON_J_PER_T).toBe(9.2740100783e-24);
    expect(HBAR_J_S).toBe(1.054571817e-34);
    expect(PLANCK_J_S).toBe(6.62607015e-34);
    expect(BOLTZMANN_J_PER_K).toBe(1.380649e-23);
    expect(MU0_N_PER_A2).toBe(1.25663706212e-6);
    expect(EPS0_F_PER_M).toBe(8.8541878128e-12);
    expect(SPEED_OF_LIGHT_M_PER_S).toBe(299792458);
    expect(ELEMENTARY_CHARGE_C).toBe(1.602176634e-19);
    expect(ELECTRON_MASS_KG).toBe(9.1093837015e-31);
    expect(ELECTRON_G_FACTOR).toBe(2.00231930436256);
  });

  it("are mutually consistent with derived CODATA 2018 quantities", () => {
    // ħ = h / 2π (exact in the 2019 SI).
    expect(relErr(PLANCK_J_S / (2 * Math.PI), HBAR_J_S)).toBeLessThan(1e-9);
    // μ_B = e ħ / (2 m_e) = 9.2740100783e-24 J/T (CODATA 2018).
    expect(relErr((ELEMENTARY_CHARGE_C * HBAR_J_S) / (2 * ELECTRON_MASS_KG), 9.2740100783e-24)).toBeLessThan(1e-9);
    // ε0 μ0 c² = 1 (CODATA 2018 adjusts μ0 and derives ε0 from it).
    expect(Math.abs(EPS0_F_PER_M * MU0_N_PER_A2 * SPEED_OF_LIGHT_M_PER_S ** 2 - 1)).toBeLessThan(1e-9);
    // Z0 = 376.730313668 Ω (CODATA 2018 characteristic impedance of vacuum).
    expect(relErr(VACUUM_IMPEDANCE_OHM, 376.730313668)).toBeLessThan(1e-10);
    // μ0 = 4π × 1e-7 × (1 + 5.5e-10) (CODATA 2018: μ0/(4π 1e-7) = 1.00000000055).
    expect(relErr(MU0_N_PER_A2 / (4 * Math.PI * 1e-7), 1.00000000055)).toBeLessThan(1e-10);
    // μB / kB = 0.67171381563 K/T (CODATA 2018 "Bohr magneton in K/T"; from memory): the scale of the
    // Brillouin argument x = g μB J B/(kB T).
    expect(relErr(BOHR_MAGNETON_J_PER_T / BOLTZMANN_J_PER_K, 0.67171381563)).toBeLessThan(1e-10);
    // e / m_e = 1.75882001076e11 C/kg (CODATA 2018 electron charge-to-mass quotient).
    expect(relErr(ELEMENTARY_CHARGE_C / ELECTRON_MASS_KG, 1.75882001076e11)).toBeLessThan(1e-10);
  });

  it("give the free-electron gyromagnetic ratio γe/2π = 28.02495 GHz/T", () => {
    // CODATA 2018: γe/2π = 28 024.951 4242 MHz/T (physics-model.md §8 quotes 28.02495 GHz/T).
    const gammaOver2Pi = gyromagneticRatio(ELECTRON_G_FACTOR) / (2 * Math.PI);
    expect(relErr(gammaOver2Pi, 28.0249514242e9)).toBeLessThan(1e-9);
    // γ is linear in g: the terbium value g = 3/2 gives 20.99 GHz/T (product reference value, physics-model.md §9).
    expect(Math.abs(gyromagneticRatio(1.5) / (2 * Math.PI) / 1e9 - 20.99)).toBeLessThan(0.005);
  });

  it("convert wavelength to angular frequency", () => {
    // 632.8 nm HeNe: ν = c/λ = 473.755 THz (c exact; common practice, no source).
    expect(relErr(angularFrequencyFromNm(632.8) / (2 * Math.PI), 473.7551e12)).toBeLessThan(1e-6);
  });
});
