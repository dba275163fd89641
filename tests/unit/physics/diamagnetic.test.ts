import { describe, expect, it } from "vitest";
import { ELECTRON_MASS_KG, ELEMENTARY_CHARGE_C, SPEED_OF_LIGHT_M_PER_S } from "@/lib/physics/constants";
import { diamagneticGyration } from "@/lib/physics/optics";
import type { SpectrumRequest } from "@/lib/physics/schema";
import { backgroundIndex, computeSpectrum } from "@/lib/physics/spectrum";
import { omegaOfNm, permittivityClosed } from "./closed-forms";
import { TGG, relErr } from "./fixtures";

/*
 * The optional bound-electron (diamagnetic) term of physics-model.md §5.5.
 */

const lambdas = [400, 532, 632.8, 800, 1064, 1550];

const run = (over: Partial<SpectrumRequest>, wavelengthsNm = lambdas) =>
  computeSpectrum({ ...TGG, wavelengthsNm, method: "analytic", ...over } as SpectrumRequest);

// A lossless glass with one Sellmeier pole and one undamped oscillator (ΓE = 0), no spins.
const glass = {
  ionDensityPerM3: 0,
  oscillatorDampingRadPerS: 0,
  oscillatorStrength: 0.02,
  oscillatorWavelengthNm: 200,
  gyrationPerT: 0,
} as const;

/** e/(2 m_e c) from CODATA 2018, written out here (not taken from the product's constants module). */
// CODATA 2018 (Tiesinga et al., Rev. Mod. Phys. 93, 025010 (2021)): e = 1.602176634e-19 C (exact),
// m_e = 9.1093837015e-31 kg, c = 299792458 m/s (exact).
const BECQUEREL = 1.602176634e-19 / (2 * 9.1093837015e-31 * 299792458);

/**
 * dn/dλ of the model's own ε with ΓE = 0, in closed form: with λ in metres,
 * n² = ε∞ + B λ²/(λ² − λS²) + f λ²/(λ² − λE²) (an undamped Lorentz pole f ωE²/(ωE² − ω²) written in
 * wavelength), so d(n²)/dλ = −2λ [B λS²/(λ² − λS²)² + f λE²/(λ² − λE²)²] and dn/dλ = d(n²)/dλ / (2n).
 */
function dnDlambdaClosed(
  p: { epsInf: number; sellmeierB: number; sellmeierWavelengthNm: number; oscillatorStrength: number; oscillatorWavelengthNm: number },
  nm: number,
): number {
  const l = nm * 1e-9;
  const ls = p.sellmeierWavelengthNm * 1e-9;
  const le = p.oscillatorWavelengthNm * 1e-9;
  const n2 = p.epsInf + (p.sellmeierB * l * l) / (l * l - ls * ls) + (p.oscillatorStrength * l * l) / (l * l - le * le);
  const dn2 = -2 * l * ((p.sellmeierB * ls * ls) / (l * l - ls * ls) ** 2 + (p.oscillatorStrength * le * le) / (l * l - le * le) ** 2);
  return dn2 / (2 * Math.sqrt(n2));
}

describe("diamagnetic term: constants and the Becquerel form", () => {
  it("e/(2 m_e c) = 293.34 rad/(T·m) from CODATA 2018, and the product uses those constants", () => {
    // 293.34 rad/(T m): physics-model.md §5.5; recomputed from CODATA 2018 above.
    expect(BECQUEREL).toBeCloseTo(293.34, 2);
    expect(ELEMENTARY_CHARGE_C / (2 * ELECTRON_MASS_KG * SPEED_OF_LIGHT_M_PER_S)).toBe(BECQUEREL);
  });

  it("worked example with a constant dn/dλ: V = (e/2mₑc) λ |dn/dλ|", () => {
    // Becquerel's formula V = −(e/2mₑc) λ dn/dλ (H. Becquerel, C. R. Acad. Sci. 125, 679 (1897),
    // citation from memory; restated in physics-model.md §5.5 with e/2mₑc = 293.34). For a glass with
    // dn/dλ = −0.03 µm⁻¹ (−3.0e4 m⁻¹) at 632.8 nm:
    // V = 293.34 × 632.8e-9 m × 3.0e4 m⁻¹ = 5.569 rad/(T·m) (arithmetic done by hand).
    const v = BECQUEREL * 632.8e-9 * 3.0e4;
    expect(v).toBeCloseTo(5.569, 3);
  });

  it("with ΓE = 0, G_dia = −(e B0 / 2mₑ) dε/dω exactly as §5.5 says (finite difference of the closed ε)", () => {
    const p = { ...TGG, ...glass };
    for (const nm of [300, 632.8, 1550]) {
      const w = omegaOfNm(nm);
      const h = w * 1e-5;
      // dε/dω by a central difference of the closed-form ε (closed-forms.ts), λ = 2πc/ω.
      const epsAt = (om: number) => permittivityClosed(p, (2 * Math.PI * 299792458) / om / 1e-9).re;
      const dEps = (epsAt(w + h) - epsAt(w - h)) / (2 * h);
      const expected = (-(1.602176634e-19 * 2.5) / (2 * 9.1093837015e-31)) * dEps;
      const g = diamagneticGyration(p, 2.5, w);
      expect(relErr(g.re, expected)).toBeLessThan(1e-7);
      expect(Math.abs(g.im)).toBe(0);
    }
  });

  it("the engine's diamagnetic part per B L matches (e/2mₑc) λ |dn/dλ| of its own ε (ΓE = 0, no spins)", () => {
    for (const fieldT of [1, 7]) {
      const r = run({ ...glass, fieldT, lengthM: 0.01, diamagneticTerm: true });
      for (const pt of r.points) {
        const dn = dnDlambdaClosed({ ...TGG, ...glass }, pt.wavelengthNm);
        expect(dn).toBeLessThan(0); // normal dispersion in this band
        const becquerel = BECQUEREL * pt.wavelengthNm * 1e-9 * Math.abs(dn);
        // First order in G_dia; the next order is (G_dia/ε)² ≈ 1e-8 here.
        expect(relErr(pt.thetaDiamagneticRad! / (fieldT * 0.01), becquerel)).toBeLessThan(1e-6);
        // Without spins the diamagnetic part is the whole electric part and the whole rotation.
        expect(pt.thetaDiamagneticRad).toBe(pt.thetaElectricRad);
        expect(relErr(pt.verdetRadPerTm!, becquerel)).toBeLessThan(1e-6);
      }
    }
  });

  it("agrees with a finite difference of the engine's own background index", () => {
    const p = { ...TGG, ...glass };
    const r = run({ ...glass, diamagneticTerm: true, lengthM: 1 }, [632.8]);
    const h = 0.01;
    const dn = (backgroundIndex(p, 632.8 + h) - backgroundIndex(p, 632.8 - h)) / (2 * h * 1e-9);
    expect(relErr(r.points[0]!.thetaDiamagneticRad!, BECQUEREL * 632.8e-9 * Math.abs(dn))).toBeLessThan(1e-6);
  });
});

describe("diamagnetic term in the spectrum", () => {
  it("N = 0 with the term on: nonzero, positive rotation (diamagnetic sign, §1 and §8), sign follows B0", () => {
    const r = run({ ionDensityPerM3: 0, diamagneticTerm: true });
    for (const p of r.points) {
      expect(p.thetaRad).toBeGreaterThan(0);
      expect(p.thetaMagneticRad).toBe(0);
      expect(p.magneticShare).toBe(0);
    }
    const neg = run({ ionDensityPerM3: 0, diamagneticTerm: true, fieldT: -1 });
    neg.points.forEach((p, i) => {
      expect(p.thetaRad).toBe(-r.points[i]!.thetaRad);
    });
    // B0 = 0: nothing rotates even with the term on.
    for (const p of run({ diamagneticTerm: true, fieldT: 0 }).points) expect(p.thetaRad).toBe(0);
  });

  it("TGG with the term on: the split stays exact and the diamagnetic part is a sub-part of θe", () => {
    for (const method of ["analytic", "llg"] as const) {
      const r = run({ diamagneticTerm: true, method });
      const off = run({ method });
      r.points.forEach((p, i) => {
        expect(Math.abs(p.thetaRad - (p.thetaElectricRad + p.thetaMagneticRad + p.thetaCrossRad))).toBeLessThan(
          1e-12 * Math.abs(p.thetaRad),
        );
        // θe(on) − θe(off) is the diamagnetic part to first order in G (G_dia/G ≈ 1e-3 → relative 1e-3 agreement).
        const delta = p.thetaElectricRad - off.points[i]!.thetaElectricRad;
        expect(relErr(delta, p.thetaDiamagneticRad!)).toBeLessThan(1e-2);
        expect(p.thetaDiamagneticRad!).toBeGreaterThan(0);
        // The magnetic part does not see G at all (§6.2: d_m = ε Δχ / S_m).
        expect(p.thetaMagneticRad).toBe(off.points[i]!.thetaMagneticRad);
      });
    }
  });

  it("with the term on the magnetic share moves with temperature and field; without it, it does not", () => {
    const share = (over: Partial<SpectrumRequest>) => run(over, [1064]).points[0]!.magneticShare!;
    // Off: both parts scale with M0 (§6.4), so the share is the same at any T and B to ~1e-6 (the cross term).
    expect(relErr(share({ temperatureK: 77 }), share({}))).toBeLessThan(1e-4);
    expect(relErr(share({ fieldT: 0.1 }), share({}))).toBeLessThan(1e-4);
    // On: the diamagnetic part does not follow M0, so the share changes.
    const on = { diamagneticTerm: true };
    expect(relErr(share({ ...on, temperatureK: 77 }), share(on))).toBeGreaterThan(1e-3);
    expect(relErr(share({ ...on, fieldT: 7, temperatureK: 4 }), share({ ...on, fieldT: 0.1, temperatureK: 4 }))).toBeGreaterThan(1e-3);
  });

  it("off is bit-identical to the engine before the term existed (absent and false alike)", () => {
    // Recorded from the analytic engine before the diamagnetic term was added, for the §9 garnet at
    // 293.15 K, 1 T, 10 mm (a regression reference of this product, not an outside value).
    const before = [
      [-18.255513984390543, -18.304110055920102, 0.04859607062818592, 9.0137006590521e-10, 0.8226704428824505],
      [-1.3400125913975651, -1.3851784649050913, 0.04516587347308525, 3.444114274809647e-11, 0.009255353635416802],
      [-0.3944450699464962, -0.4390916597497938, 0.04464658978489087, 1.8406712830863495e-11, 0.00154590300741328],
      [-0.15644409285390165, -0.2009455020788597, 0.04450140921008061, 1.4877415659404808e-11, 0.00047010125045685236],
    ];
    const appDefaults = { ...TGG, lengthM: 0.01 };
    for (const flag of [undefined, false]) {
      const r = computeSpectrum({ ...appDefaults, diamagneticTerm: flag, wavelengthsNm: [300, 632.8, 1064, 1550], method: "analytic" });
      r.points.forEach((p, i) => {
        expect([p.thetaRad, p.thetaElectricRad, p.thetaMagneticRad, p.thetaCrossRad, p.ellipticityRad]).toEqual(before[i]);
        expect(p.thetaDiamagneticRad).toBeUndefined();
      });
    }
  });
});
