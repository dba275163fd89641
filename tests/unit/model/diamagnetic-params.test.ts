import { describe, expect, it } from "vitest";
import { DEMO_SETS } from "@/db/demo-data";
import { TERBIUM_GARNET_DEFAULTS } from "@/lib/model/defaults";
import { FLAG_META, PARAM_META } from "@/lib/model/param-meta";
import { MODEL_FLAG_KEYS, modelParamsSchema } from "@/lib/physics/schema";
import { computeSpectrum } from "@/lib/physics/spectrum";
import { PARAM_RANGES } from "@/lib/workbench/param-ranges";
import { draftsFromParams, validateParams } from "@/lib/workbench/validate";

describe("the diamagnetic switch as a model parameter", () => {
  it("is a switch, never among the numeric parameters (number boxes, ranges, what a fit may free)", () => {
    const numeric = PARAM_META.map((m) => m.key) as string[];
    for (const key of MODEL_FLAG_KEYS) {
      expect(numeric).not.toContain(key);
      expect(Object.keys(PARAM_RANGES)).not.toContain(key);
    }
    expect(FLAG_META.map((m) => m.key)).toEqual([...MODEL_FLAG_KEYS]);
  });

  it("is off by default: a stored set without the key parses and computes as before", () => {
    const parsed = modelParamsSchema.parse(TERBIUM_GARNET_DEFAULTS);
    expect(parsed.diamagneticTerm).toBeUndefined();
    expect(modelParamsSchema.safeParse({ ...TERBIUM_GARNET_DEFAULTS, diamagneticTerm: 1 }).success).toBe(false);
  });

  it("round-trips through the workbench drafts as a checkbox value", () => {
    const on = validateParams({ ...draftsFromParams(TERBIUM_GARNET_DEFAULTS), diamagneticTerm: "true" });
    expect(on.params?.diamagneticTerm).toBe(true);
    const off = validateParams(draftsFromParams(TERBIUM_GARNET_DEFAULTS));
    expect(off.params?.diamagneticTerm).toBe(false);
    expect(draftsFromParams({ ...TERBIUM_GARNET_DEFAULTS, diamagneticTerm: true }).diamagneticTerm).toBe("true");
  });
});

describe("demo garnet sets", () => {
  const garnets = DEMO_SETS.map((s) => s.versions[s.versions.length - 1]!).filter((v) => /garnet/i.test(v.name));
  it("switch the diamagnetic term on and say so", () => {
    expect(garnets.length).toBeGreaterThanOrEqual(3);
    for (const v of garnets) {
      expect(v.params.diamagneticTerm).toBe(true);
      // The library's garnet (the last handbook version) says it through its value sources instead of a tag.
      if (!v.tags.includes("library")) expect(v.tags).toContain("diamagnetic term");
      expect(v.description).toMatch(/diamagnetic/i);
    }
  });

  it("the room-temperature handbook garnet still gives the handbook V(632.8 nm) = −134 rad/(T·m)", () => {
    // Published TGG Verdet constant −134 rad/(T·m) at 632.8 nm (physics-model.md §9, public data);
    // the demo recalibrates κE with the term on to keep it.
    const tgg = garnets.find((v) => /handbook/i.test(v.name))!;
    const p = computeSpectrum({ ...tgg.params, wavelengthsNm: [632.8], method: "analytic" }).points[0]!;
    expect(p.verdetRadPerTm!).toBeCloseTo(-134, 1);
    expect(p.thetaDiamagneticRad!).toBeGreaterThan(0);
  });
});
