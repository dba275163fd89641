import { describe, expect, it } from "vitest";
import { type ModelCondition, evaluateModel, freeableKeys, modelJacobian } from "@/lib/fit/model";
import { computeSpectrum } from "@/lib/physics/spectrum";
import { TGG } from "../physics/fixtures";

const at = (wavelengthNm: number, over: Partial<ModelCondition> = {}): ModelCondition => ({
  wavelengthNm,
  temperatureK: 293.15,
  fieldT: 1,
  lengthM: 0.01,
  quantity: "verdet",
  ...over,
});

describe("shared forward model", () => {
  it("evaluates each point at its own conditions, equal to a direct spectrum", () => {
    const points = [at(1064), at(632.8), at(632.8, { temperatureK: 77 }), at(800, { quantity: "rotation", fieldT: 2 })];
    const ev = evaluateModel(TGG, points);
    points.forEach((p, i) => {
      const direct = computeSpectrum({
        ...TGG,
        temperatureK: p.temperatureK,
        fieldT: p.fieldT,
        lengthM: p.lengthM,
        wavelengthsNm: [p.wavelengthNm],
        method: "analytic",
      }).points[0]!;
      expect(ev.value[i]).toBe(p.quantity === "verdet" ? direct.verdetRadPerTm : direct.thetaRad);
      expect(ev.magneticShare[i]).toBe(direct.magneticShare);
    });
  });

  it("never offers the measurement conditions as free parameters", () => {
    const keys = freeableKeys(TGG);
    expect(keys).toContain("gyrationPerT");
    expect(keys).not.toContain("temperatureK");
    expect(keys).not.toContain("fieldT");
    expect(keys).not.toContain("lengthM");
  });

  it("differentiates V with respect to magneticScale into the magnetic-dipole part", () => {
    // physics-model.md §4.3/§8: θm scales with magneticScale to first order in χ, θe does not
    // change, so ∂V/∂scale at scale 1 is θm/(B L) up to the cross term (< 1e-6 of the parts, §8).
    const points = [at(632.8), at(1064), at(1550)];
    const jac = modelJacobian(TGG, ["magneticScale", "gyrationPerT"], points);
    points.forEach((p, i) => {
      const direct = computeSpectrum({
        ...TGG,
        temperatureK: 293.15,
        fieldT: 1,
        lengthM: 0.01,
        wavelengthsNm: [p.wavelengthNm],
        method: "analytic",
      }).points[0]!;
      const magneticVerdet = direct.thetaMagneticRad / (1 * 0.01);
      expect(Math.abs(jac.valueJacobian.get(i, 0) - magneticVerdet) / Math.abs(magneticVerdet)).toBeLessThan(1e-4);
      // V_e is linear in κE to first order in G (§5.4): ∂V/∂κE = V_e / κE.
      const electricVerdet = direct.thetaElectricRad / 0.01;
      expect(
        Math.abs(jac.valueJacobian.get(i, 1) - electricVerdet / TGG.gyrationPerT) / Math.abs(electricVerdet / TGG.gyrationPerT),
      ).toBeLessThan(1e-3);
    });
  });
});
