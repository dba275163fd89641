import { describe, expect, it } from "vitest";
import { conditionGroups, conditionKey, describeConversion, toPlotUnits } from "@/lib/measurements/overlay";
import type { MeasuredPoint } from "@/lib/measurements/point";

const verdet: MeasuredPoint = {
  line: 2,
  wavelengthNm: 632.8,
  quantity: "verdet",
  value: -134,
  sigma: 2,
  temperatureK: 293.15,
  fieldT: 1,
  lengthM: 0.01,
};
const rotation: MeasuredPoint = {
  line: 3,
  wavelengthNm: 1064,
  quantity: "rotation",
  value: -0.2,
  sigma: 0.004,
  temperatureK: 293.15,
  fieldT: 0.5,
  lengthM: 0.02,
};

describe("measured points in the plot's units", () => {
  it("shows a Verdet value as is on a Verdet axis and as V·B·L at the plot's geometry on an angle axis", () => {
    expect(toPlotUnits(verdet, { xUnit: "nm", yMode: "verdet", geometry: { fieldT: 2, lengthM: 0.05 } })).toMatchObject({
      x: 632.8,
      y: -134,
      sigma: 2,
      rescaled: false,
    });
    // θ = V·B·L (physics-model §1): −134 · 2 T · 0.05 m = −13.4 rad.
    const rad = toPlotUnits(verdet, { xUnit: "nm", yMode: "rad", geometry: { fieldT: 2, lengthM: 0.05 } })!;
    expect(rad.y).toBeCloseTo(-13.4, 12);
    expect(rad.sigma).toBeCloseTo(0.2, 12);
    expect(rad.rescaled).toBe(true);
    const deg = toPlotUnits(verdet, { xUnit: "nm", yMode: "deg", geometry: { fieldT: 2, lengthM: 0.05 } })!;
    expect(deg.y).toBeCloseTo((-13.4 * 180) / Math.PI, 9);
  });

  it("shows a rotation as θ/(B·L) on a Verdet axis, with its own field and length", () => {
    const p = toPlotUnits(rotation, { xUnit: "um", yMode: "verdet", geometry: { fieldT: 1, lengthM: 0.01 } })!;
    // −0.2 rad / (0.5 T · 0.02 m) = −20 rad/(T·m).
    expect(p.y).toBeCloseTo(-20, 12);
    expect(p.sigma).toBeCloseTo(0.4, 12);
    expect(p.x).toBeCloseTo(1.064, 12);
  });

  it("shows a rotation at the plot's own geometry as measured and rescales another geometry", () => {
    const same = toPlotUnits(rotation, { xUnit: "nm", yMode: "mrad", geometry: { fieldT: 0.5, lengthM: 0.02 } })!;
    expect(same.y).toBeCloseTo(-200, 9);
    expect(same.rescaled).toBe(false);
    const other = toPlotUnits(rotation, { xUnit: "nm", yMode: "rad", geometry: { fieldT: 1, lengthM: 0.01 } })!;
    // B·L of the plot (0.01 T·m) equals the point's (0.01 T·m): same value, but marked rescaled.
    expect(other.y).toBeCloseTo(-0.2, 12);
    const doubled = toPlotUnits(rotation, { xUnit: "nm", yMode: "rad", geometry: { fieldT: 1, lengthM: 0.02 } })!;
    expect(doubled.y).toBeCloseTo(-0.4, 12);
  });

  it("has no Verdet value for a rotation at zero field", () => {
    expect(toPlotUnits({ ...rotation, fieldT: 0 }, { xUnit: "nm", yMode: "verdet", geometry: { fieldT: 1, lengthM: 0.01 } })).toBeNull();
  });

  it("says how it converted", () => {
    expect(describeConversion({ yMode: "rad", geometry: { fieldT: 1, lengthM: 0.01 }, quantities: new Set(["verdet"]) })).toBe(
      "Verdet constants are shown as the rotation V·B·L at the plot's B = 1 T, L = 10 mm.",
    );
  });
});

describe("points grouped by their conditions", () => {
  it("gives each (T, B) its own shape in ascending order and says which is the curve's", () => {
    const a = [
      { temperatureK: 293.15, fieldT: 1 },
      { temperatureK: 77, fieldT: 1 },
      { temperatureK: 293.15000000001, fieldT: 1 },
    ];
    const b = [{ temperatureK: 77, fieldT: 0.5 }];
    const groups = conditionGroups([a, b], { temperatureK: 293.4, fieldT: 1 });
    expect(groups.map((g) => [g.temperatureK, g.fieldT, g.shape, g.matchesCurve, g.count])).toEqual([
      [77, 0.5, 0, false, 1],
      [77, 1, 1, false, 1],
      [293.15, 1, 2, true, 2],
    ]);
    expect(conditionKey(a[0]!)).toBe(conditionKey(a[2]!));
  });

  it("a field off by more than 1 mT is another condition", () => {
    expect(conditionGroups([[{ temperatureK: 293, fieldT: 1.01 }]], { temperatureK: 293, fieldT: 1 })[0]!.matchesCurve).toBe(false);
  });
});

describe("the conversion sentence", () => {
  it("writes the plot's length without binary noise", () => {
    expect(0.0133 * 1000).not.toBe(13.3);
    const text = describeConversion({ yMode: "rad", geometry: { fieldT: 1, lengthM: 0.0133 }, quantities: new Set(["verdet"]) });
    expect(text).toContain("B = 1 T, L = 13.3 mm");
  });
});
