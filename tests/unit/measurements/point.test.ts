import { describe, expect, it } from "vitest";
import type { StoredPoint } from "@/lib/contracts/measurement-sets";
import { measuredPointSchema, toMeasuredPoint, usablePoints } from "@/lib/measurements/point";

const stored: StoredPoint = {
  ordinal: 3,
  line: 5,
  wavelengthNm: 632.8,
  quantity: "verdet",
  value: -134,
  sigma: 2,
  temperatureK: 293.15,
  fieldT: 1,
  lengthM: 0.01,
  extra: { source: "HeNe" },
  masked: false,
  maskReason: null,
  note: "checked",
  original: null,
};

describe("stored points as the fit and the overlay take them", () => {
  it("leave out the masked ones", () => {
    expect(usablePoints([stored, { ...stored, ordinal: 4, masked: true }]).map((p) => p.ordinal)).toEqual([3]);
  });

  it("drop what the strict point schema does not know, keeping the text columns", () => {
    expect(measuredPointSchema.safeParse(stored).success).toBe(false);
    const plain = toMeasuredPoint(stored);
    expect(measuredPointSchema.safeParse(plain).success).toBe(true);
    expect(plain.extra).toEqual({ source: "HeNe" });
  });
});
