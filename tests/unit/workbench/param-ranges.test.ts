import { describe, expect, it } from "vitest";
import { TERBIUM_GARNET_DEFAULTS } from "@/lib/model/defaults";
import { modelParamsSchema, type NumericModelParamKey } from "@/lib/physics/schema";
import { PARAM_RANGES } from "@/lib/workbench/param-ranges";

// The ranges shown beside the fields must be the schema's own bounds.
describe("parameter ranges shown in the workbench", () => {
  const valid = (key: NumericModelParamKey, value: number) => {
    const params = { ...TERBIUM_GARNET_DEFAULTS, temperatureK: 2000, curieWeissK: -1000, [key]: value };
    return modelParamsSchema.safeParse(params).success;
  };
  for (const [key, range] of Object.entries(PARAM_RANGES) as [NumericModelParamKey, (typeof PARAM_RANGES)[NumericModelParamKey]][]) {
    it(`${key}: ${range.text}`, () => {
      if (key === "temperatureK") return; // bounded below by θCW too; checked by the schema's own tests
      expect(valid(key, range.max)).toBe(true);
      expect(valid(key, range.max * 1.001 + 1e-9)).toBe(false);
      expect(valid(key, range.min)).toBe(!range.minExclusive);
    });
  }
});
