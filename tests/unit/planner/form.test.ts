import { describe, expect, it } from "vitest";
import { defaultPlannerDrafts, planRequestFromDrafts } from "@/lib/planner/form";
import { planRequestSchema } from "@/lib/planner/schema";
import { TGG } from "../physics/fixtures";

const params = { ...TGG, lengthM: 0.01 };
const lines = [
  { name: "YAG", wavelengthNm: 1064 },
  { name: "telecom", wavelengthNm: 1550, powerW: 0.01 },
];

describe("planner screen inputs", () => {
  it("the defaults make a valid request for the fit's default free set, in the fit's order", () => {
    const built = planRequestFromDrafts(defaultPlannerDrafts(params), params, lines);
    expect(built.ok).toBe(true);
    if (!built.ok) return;
    const request = planRequestSchema.parse(built.input);
    expect(request.definition.free.map((f) => f.key)).toEqual(["gyrationPerT", "oscillatorWavelengthNm", "magneticScale"]);
    expect(request.temperatures).toEqual({ valuesK: [293.15, 77] });
    expect(request.optics.minTransmission).toBeCloseTo(0.01, 15);
    expect(request.criterion).toEqual({ kind: "detect" });
  });

  it("reads priors, robust ranges and calibration, and names a bad text", () => {
    const drafts = {
      ...defaultPlannerDrafts(params),
      priors: "oscillatorWavelengthNm=258:10",
      scaleSigmaPct: "2",
      robustMode: "worst" as const,
      robustRanges: "magneticScale=0.5:3",
    };
    const built = planRequestFromDrafts(drafts, params, lines);
    expect(built.ok && planRequestSchema.parse(built.input).robust?.mode).toBe("worst");
    expect(built.ok && built.input.definition?.priors).toEqual([{ key: "oscillatorWavelengthNm", mean: 258, sigma: 10 }]);
    expect(built.ok && built.input.definition?.calibration?.scaleSigma).toBeCloseTo(0.02, 15);
    const bad = planRequestFromDrafts({ ...drafts, priors: "colour=1:2", tSet: "293, warm" }, params, lines);
    expect(bad.ok).toBe(false);
    if (!bad.ok) {
      expect(bad.issues.join("\n")).toMatch(/Priors: "colour" is not a model parameter/);
      expect(bad.issues.join("\n")).toMatch(/Temperatures: give numbers in K/);
    }
  });
});
