import { describe, expect, it } from "vitest";
import { checkSigns, isOppositeSign, type SignedValue, takeModelSigns, withModelSign } from "@/lib/measurements/sign-check";
import { TERBIUM_GARNET_DEFAULTS } from "@/lib/model/defaults";

/*
 * The sign convention of lib/physics/physics-model.md §1: V = θ/(B0 L) with θ counted from +x
 * toward +y for the observer looking back at the source; under it diamagnetic glasses have V > 0
 * and terbium-rich paramagnets V < 0. Terbium gallium garnet is published negative in that
 * convention: −134 rad/(T·m) at 632.8 nm and −40 rad/(T·m) at 1064 nm (Wikipedia "Verdet
 * constant"; vendor sheet cightech.com; shared/materials-sources.md §0 and table 1a), while many
 * vendor sheets print the magnitude only, e.g. 0.12 min/(Oe·cm) = 34.9 rad/(T·m) at 1064 nm
 * (dayoptics.com, claserinc.com; same table). The checks below use those published magnitudes.
 */

const room = { temperatureK: 293.15, fieldT: 1, lengthM: 0.01 };
const verdet = (wavelengthNm: number, value: number): SignedValue => ({ ...room, wavelengthNm, quantity: "verdet", value });

describe("the sign rule", () => {
  it("calls strictly opposite signs opposite and never a zero or undefined side", () => {
    expect(isOppositeSign(40, -39)).toBe(true);
    expect(isOppositeSign(-40, -39)).toBe(false);
    expect(isOppositeSign(40, 0)).toBe(false);
    expect(isOppositeSign(0, -39)).toBe(false);
    expect(isOppositeSign(40, Number.NaN)).toBe(false);
  });

  it("gives the magnitude the prediction's sign and leaves a value with no prediction as it is", () => {
    expect(withModelSign(40, -39)).toBe(-40);
    expect(withModelSign(-40, -39)).toBe(-40);
    expect(withModelSign(-0.2, 3)).toBe(0.2);
    expect(withModelSign(40, 0)).toBe(40);
    expect(withModelSign(40, Number.NaN)).toBe(40);
  });
});

describe("checkSigns", () => {
  it("predicts the published negative sign of the terbium garnet at 632.8 and 1064 nm", () => {
    const check = checkSigns(TERBIUM_GARNET_DEFAULTS, [verdet(632.8, -134), verdet(1064, -40)]);
    expect(check.predicted[0]).toBeLessThan(0);
    expect(check.predicted[1]).toBeLessThan(0);
    expect(check).toMatchObject({ opposite: 0, compared: 2, total: 2, allOpposite: false, oneSign: true });
  });

  it("flags a vendor sheet's magnitudes as all opposite", () => {
    // 34.9 rad/(T·m) at 1064 nm is 0.12 min/(Oe·cm), a magnitude (dayoptics.com); 36.4 at 1053 nm (Yasuhara 2007, magnitude).
    const check = checkSigns(TERBIUM_GARNET_DEFAULTS, [verdet(1064, 34.9), verdet(1053, 36.4), verdet(632.8, 134)]);
    expect(check).toMatchObject({ opposite: 3, compared: 3, total: 3, allOpposite: true, oneSign: true });
  });

  it("counts only the opposite values of a mixed file", () => {
    const check = checkSigns(TERBIUM_GARNET_DEFAULTS, [verdet(1064, 34.9), verdet(632.8, -134), verdet(532, -200)]);
    expect(check).toMatchObject({ opposite: 1, compared: 3, allOpposite: false, oneSign: false });
  });

  it("leaves values with a zero or undefined prediction out of the comparison", () => {
    const noField = { ...room, fieldT: 0, wavelengthNm: 1064 };
    const values: SignedValue[] = [
      verdet(1064, 34.9),
      // θ = 0 at B = 0 (θ changes sign exactly with B0, physics-model.md §8); a Verdet constant is undefined there.
      { ...noField, quantity: "rotation", value: 1e-4 },
      { ...noField, quantity: "verdet", value: 35 },
      verdet(632.8, 0),
    ];
    const check = checkSigns(TERBIUM_GARNET_DEFAULTS, values);
    expect(check.predicted[1]).toBe(0);
    expect(check.predicted[2]).toBeNaN();
    expect(check).toMatchObject({ opposite: 1, compared: 1, total: 4, allOpposite: true });
  });

  it("says nothing is all opposite when nothing could be compared", () => {
    const check = checkSigns(TERBIUM_GARNET_DEFAULTS, [{ ...room, fieldT: 0, wavelengthNm: 1064, quantity: "rotation", value: 1e-4 }]);
    expect(check).toMatchObject({ opposite: 0, compared: 0, allOpposite: false });
    expect(checkSigns(TERBIUM_GARNET_DEFAULTS, []).allOpposite).toBe(false);
  });

  it("follows the field's sign: at B < 0 the garnet's rotation is positive", () => {
    // θ changes sign exactly with B0 (physics-model.md §8), so a positive rotation at −1 T agrees with the model.
    const check = checkSigns(TERBIUM_GARNET_DEFAULTS, [{ ...room, fieldT: -1, wavelengthNm: 1064, quantity: "rotation", value: 0.004 }]);
    expect(check.predicted[0]).toBeGreaterThan(0);
    expect(check.opposite).toBe(0);
  });
});

describe("takeModelSigns", () => {
  it("stores magnitudes with the model's sign and says how many changed", () => {
    const values = [
      verdet(1064, 34.9),
      verdet(632.8, -134),
      { ...room, fieldT: 0, wavelengthNm: 1064, quantity: "verdet" as const, value: 35 },
    ];
    const { values: signed, changed } = takeModelSigns(TERBIUM_GARNET_DEFAULTS, values);
    expect(signed.map((v) => v.value)).toEqual([-34.9, -134, 35]);
    expect(changed).toBe(1);
    // The points keep everything else, and the input is not changed.
    expect(signed[0]).toEqual({ ...values[0], value: -34.9 });
    expect(values[0]!.value).toBe(34.9);
    expect(checkSigns(TERBIUM_GARNET_DEFAULTS, signed).opposite).toBe(0);
  });
});
