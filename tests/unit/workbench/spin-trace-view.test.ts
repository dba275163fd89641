import { describe, expect, it } from "vitest";
import { TERBIUM_GARNET_DEFAULTS } from "@/lib/model/defaults";
import { spinTraceRequestSchema } from "@/lib/physics/schema";
import { staleReasons, staleText, traceInputsOf } from "@/lib/workbench/spin-trace-view";

const request = spinTraceRequestSchema.parse({ ...TERBIUM_GARNET_DEFAULTS, wavelengthNm: 632.8, intensityWPerM2: 1e13, periods: 12 });
const was = traceInputsOf(request);

describe("a spin trace that no longer matches its inputs", () => {
  it("is current while nothing changed (a fresh but equal parameter object included)", () => {
    expect(staleReasons(was, traceInputsOf({ ...request }))).toEqual([]);
    expect(staleText("trace", was, traceInputsOf({ ...request }))).toBeNull();
  });

  it("is stale after the wavelength changes, captioned with the old wavelength", () => {
    const text = staleText("trace", was, traceInputsOf({ ...request, wavelengthNm: 800 }));
    expect(text).toMatch(/^Stale: this trace was computed at 632\.8 nm/);
    expect(text).toContain("wavelength 632.8 → 800 nm");
  });

  it("names changed parameters, intensity, periods and the diamagnetic switch", () => {
    const now = traceInputsOf({ ...request, temperatureK: 77, intensityWPerM2: 0, periods: 3, diamagneticTerm: true });
    const reasons = staleReasons(was, now);
    expect(reasons).toContain("intensity 1e13 → 0 W/m²");
    expect(reasons).toContain("lock-in periods 12 → 3");
    expect(reasons.at(-1)).toBe("parameters Temperature, Diamagnetic (bound-electron) term");
  });

  it("is stale while the inputs are invalid", () => {
    expect(staleReasons(was, null)).toEqual(["the inputs are incomplete or out of range"]);
  });
});
