import type { NumericModelParamKey } from "@/lib/physics/schema";

/*
 * The valid range of each parameter as shown beside its field. It mirrors the bounds in
 * lib/physics/schema.ts (which stays the one validator: the field errors come from it); the
 * workbench-param-ranges unit test probes the schema at each bound so the two cannot drift apart.
 */

export interface ParamRange {
  min: number;
  max: number;
  /** True when the lower bound itself is not allowed (> rather than ≥). */
  minExclusive: boolean;
  text: string;
}

const r = (min: number, max: number, minExclusive: boolean, unit = ""): ParamRange => ({
  min,
  max,
  minExclusive,
  text: `${minExclusive ? ">" : "≥"} ${min}${unit}, ≤ ${fmtBound(max)}${unit}`,
});

function fmtBound(x: number): string {
  return Math.abs(x) >= 1e5 ? x.toExponential().replace("e+", "e") : String(x);
}

export const PARAM_RANGES: Record<NumericModelParamKey, ParamRange> = {
  ionDensityPerM3: r(0, 1e30, false, " m⁻³"),
  landeG: r(0, 10, true),
  totalJ: { min: 0.5, max: 50, minExclusive: false, text: "1/2, 1, 3/2, … ≤ 50" },
  curieWeissK: { min: -1000, max: 1000, minExclusive: false, text: "−1000 … 1000 K, below the temperature" },
  gilbertDamping: r(0, 10, false),
  epsInf: r(0, 100, true),
  sellmeierB: r(0, 100, false),
  sellmeierWavelengthNm: r(0, 1e6, true, " nm"),
  oscillatorStrength: r(0, 100, false),
  oscillatorWavelengthNm: r(0, 1e6, true, " nm"),
  oscillatorDampingRadPerS: r(0, 1e17, false, " rad/s"),
  gyrationPerT: { min: -10, max: 10, minExclusive: false, text: "−10 … 10 T⁻¹" },
  magneticScale: r(0, 1000, false),
  temperatureK: { min: 0, max: 10000, minExclusive: true, text: "> 0 K and above θCW, ≤ 10000 K" },
  fieldT: { min: -100, max: 100, minExclusive: false, text: "−100 … 100 T" },
  lengthM: r(0, 100, true, " m"),
};
