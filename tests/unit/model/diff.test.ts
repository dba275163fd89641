import { describe, expect, it } from "vitest";
import { TERBIUM_GARNET_DEFAULTS } from "@/lib/model/defaults";
import {
  changedFields,
  describeRelativeChange,
  diffSnapshots,
  formatValue,
  staleDescriptionValues,
  type SetSnapshot,
} from "@/lib/model/diff";
import { FLAG_META, PARAM_META } from "@/lib/model/param-meta";

const base: SetSnapshot = { name: "TGG 293 K", description: "Room temperature", tags: ["tgg", "garnet"], params: TERBIUM_GARNET_DEFAULTS };

describe("diffSnapshots", () => {
  it("lists name, description, tags and every model parameter, none changed for identical snapshots", () => {
    const rows = diffSnapshots(base, { ...base, params: { ...base.params } });
    expect(rows.map((r) => r.key)).toEqual([
      "name",
      "description",
      "tags",
      ...PARAM_META.map((m) => m.key),
      ...FLAG_META.map((m) => m.key),
      "diamagneticAnomaly",
      "diamagneticDispersion",
      "absorptionTable",
    ]);
    expect(rows.some((r) => r.changed)).toBe(false);
  });

  it("shows the diamagnetic refinements and the absorption table, absent = the defaults", () => {
    const table = [
      { wavelengthNm: 500, absorptionPerM: 0.1 },
      { wavelengthNm: 1000, absorptionPerM: 0.2 },
    ];
    const after = {
      ...base,
      params: { ...base.params, diamagneticAnomaly: 0.777, diamagneticDispersion: "host" as const, absorptionTable: table },
    };
    const changed = diffSnapshots(base, after).filter((r) => r.changed);
    expect(changed.map((r) => [r.key, r.before, r.after.split(" (")[0]])).toEqual([
      ["diamagneticAnomaly", "1 (default)", "0.777"],
      ["diamagneticDispersion", "whole (default)", "host"],
      ["absorptionTable", "none", "2 rows, 500–1000 nm"],
    ]);
    const edited = { ...after, params: { ...after.params, absorptionTable: [table[0]!, { wavelengthNm: 1000, absorptionPerM: 0.3 }] } };
    expect(
      diffSnapshots(after, edited)
        .filter((r) => r.changed)
        .map((r) => r.key),
    ).toEqual(["absorptionTable"]);
  });

  it("marks a changed parameter with its unit and both values", () => {
    const rows = changedFields(base, { ...base, params: { ...base.params, temperatureK: 77 } });
    expect(rows).toEqual([
      { key: "temperatureK", label: "Temperature", unit: "K", before: "293.15", after: "77", changed: true, relative: "\u221273.7 %" },
    ]);
  });

  it("marks text fields and ignores tag order, spacing and duplicates", () => {
    const rows = changedFields(base, { ...base, name: "TGG 77 K", tags: [" garnet", "tgg", "tgg"] });
    expect(rows.map((r) => r.key)).toEqual(["name"]);
    const tagRows = changedFields(base, { ...base, tags: ["tgg"] });
    expect(tagRows).toEqual([{ key: "tags", label: "Tags", unit: "", before: "garnet, tgg", after: "tgg", changed: true, relative: null }]);
  });

  it("treats a missing value (half-filled form) as a change shown as a dash", () => {
    const { fieldT: _dropped, ...rest } = TERBIUM_GARNET_DEFAULTS;
    const rows = changedFields(base, { ...base, params: rest });
    expect(rows).toEqual([{ key: "fieldT", label: "Field B0", unit: "T", before: "1", after: "—", changed: true, relative: null }]);
  });

  it("reads a switch that was never stored as off, and shows a switched term as off → on", () => {
    const { diamagneticTerm: _absent, ...old } = { ...TERBIUM_GARNET_DEFAULTS, diamagneticTerm: undefined };
    expect(changedFields({ ...base, params: old }, { ...base, params: { ...old, diamagneticTerm: false } })).toEqual([]);
    expect(changedFields({ ...base, params: old }, { ...base, params: { ...old, diamagneticTerm: true } })).toEqual([
      {
        key: "diamagneticTerm",
        label: "Diamagnetic (bound-electron) term",
        unit: "",
        before: "off",
        after: "on",
        changed: true,
        relative: null,
      },
    ]);
  });

  it("tells apart values that differ only far down the mantissa", () => {
    const rows = changedFields(base, { ...base, params: { ...base.params, ionDensityPerM3: 1.27260001e28 } });
    expect(rows[0]?.before).toBe("1.2726e28");
    expect(rows[0]?.after).toBe("1.27260001e28");
  });
});

describe("describeRelativeChange", () => {
  it("gives percentages, factors and words", () => {
    expect(describeRelativeChange(293.15, 77)).toBe("\u221273.7 %");
    expect(describeRelativeChange(1, 1.125)).toBe("+12.5 %");
    expect(describeRelativeChange(1e13, 1e14)).toBe("×10");
    expect(describeRelativeChange(0.01, 0.0001)).toBe("×0.01");
    expect(describeRelativeChange(0, 3)).toBe("from 0");
    expect(describeRelativeChange(3, 0)).toBe("to 0");
    expect(describeRelativeChange(-8, 8)).toBe("sign reversed");
    expect(describeRelativeChange(1.2726e28, 1.27260001e28)).toBe("+7.9e-7 %");
    expect(describeRelativeChange(5, 5)).toBeNull();
    expect(describeRelativeChange(5, undefined)).toBeNull();
  });

  it("says which way a negative value moved, not only how its size changed", () => {
    // −8 → −7.5: 6.25 % smaller in size, but the value rose.
    expect(describeRelativeChange(-8, -7.5)).toBe("size \u22126.25 %, value up");
    expect(describeRelativeChange(-8, -10)).toBe("size +25 %, value down");
    expect(describeRelativeChange(-1, -20)).toBe("size ×20, value down");
  });
});

describe("formatValue", () => {
  it("writes large and small magnitudes in e-notation and the rest plainly", () => {
    expect(formatValue(1e14)).toBe("1e14");
    expect(formatValue(5.395e-3)).toBe("0.005395");
    expect(formatValue(2.5e-5)).toBe("2.5e-5");
    expect(formatValue(-8)).toBe("-8");
    expect(formatValue(0)).toBe("0");
    expect(formatValue(293.15)).toBe("293.15");
    expect(formatValue(Number.NaN)).toBe("—");
  });
});

describe("staleDescriptionValues", () => {
  const before = { ...TERBIUM_GARNET_DEFAULTS, gyrationPerT: 6.218e-3 };
  const text = "Diamagnetic term on; κE recalibrated to 6.218e-3 /T so that V(632.8 nm) stays −134 rad/(T·m).";

  it("flags a quoted value that a fit changed", () => {
    const after = { ...before, gyrationPerT: 0.0064186413614499525 };
    expect(staleDescriptionValues(text, before, after)).toEqual([{ key: "gyrationPerT", label: expect.any(String), quoted: "6.218e-3" }]);
  });

  it("says nothing when the quoted values still hold, or the change is below the digits written", () => {
    expect(staleDescriptionValues(text, before, { ...before, temperatureK: 77 })).toEqual([]);
    expect(staleDescriptionValues(text, before, { ...before, gyrationPerT: 6.2181e-3 })).toEqual([]);
  });
});
