import { describe, expect, it } from "vitest";
import { quantityOfUnit, valueFromSi, valueToSi, wavelengthFromNm, wavelengthToNm } from "@/lib/measurements/units";

describe("measurement units", () => {
  it("converts a datasheet Verdet constant of 0.12 min/(Oe·cm) to 34.9 rad/(T·m) and back", () => {
    // 1 Oe ↔ 1e-4 T in vacuum, 1 min = π/10800 rad, 1 cm = 1e-2 m (common practice, no source):
    // 0.12 · (π/10800) / (1e-4 · 1e-2) = 34.906… rad/(T·m).
    const si = valueToSi(0.12, "min/(Oe·cm)");
    expect(si).toBeCloseTo(34.9, 1);
    expect(si).toBeCloseTo((0.12 * Math.PI) / 10800 / 1e-6, 10);
    expect(valueFromSi(34.9, "min/(Oe·cm)")).toBeCloseTo(0.12, 3);
    expect(valueFromSi(si, "min/(Oe·cm)")).toBeCloseTo(0.12, 12);
  });

  it("converts angles and Verdet constants in degrees", () => {
    // 180° = π rad (definition of the degree).
    expect(valueToSi(180, "deg")).toBeCloseTo(Math.PI, 12);
    expect(valueToSi(180, "deg/(T·m)")).toBeCloseTo(Math.PI, 12);
    expect(valueToSi(12.5, "mrad")).toBeCloseTo(0.0125, 15);
    expect(valueToSi(-134, "rad/(T·m)")).toBe(-134);
    for (const unit of ["rad", "mrad", "deg", "rad/(T·m)", "deg/(T·m)", "min/(Oe·cm)"] as const) {
      expect(valueFromSi(valueToSi(0.731, unit), unit)).toBeCloseTo(0.731, 12);
    }
  });

  it("tells a rotation unit from a Verdet unit", () => {
    expect(quantityOfUnit("mrad")).toBe("rotation");
    expect(quantityOfUnit("min/(Oe·cm)")).toBe("verdet");
  });

  it("converts wavelength axes to nm and back", () => {
    // hc = 1239.84198 eV·nm (CODATA 2018, exact constants): 1.95954 eV ↔ 632.7 nm.
    expect(wavelengthToNm(1239.84198 / 632.8, "eV")).toBeCloseTo(632.8, 9);
    // 1 cm = 1e7 nm: 9398.2 cm⁻¹ ↔ 1064.03 nm.
    expect(wavelengthToNm(1e7 / 1064, "cm-1")).toBeCloseTo(1064, 9);
    // c = 299 792 458 m/s (exact): 193.414 THz ↔ 1550 nm.
    expect(wavelengthToNm(299_792.458 / 1550, "THz")).toBeCloseTo(1550, 9);
    expect(wavelengthToNm(0.8, "um")).toBeCloseTo(800, 12);
    expect(wavelengthFromNm(wavelengthToNm(2.1, "eV"), "eV")).toBeCloseTo(2.1, 12);
  });
});
