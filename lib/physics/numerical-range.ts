import type { SpectrumRequest } from "./schema";

/*
 * Where the numerical LLG path (method "llg", physics-model.md §7) is specified, from §2: "The
 * numerical path is specified for 200 nm to 20 um, |B0| from 0.01 to 10 T, T from 1 to 400 K and
 * alpha from 1e-4 to 0.5. The analytic path has no such limits."
 *
 * Why these bounds: §7's schedule (2 or 8 ramp periods by |w0|, one lock-in period, rtol 1e-6) was
 * checked to stay within 2e-5 of the Polder form at the corners of this range, where |w0| =
 * |omega0 / omega| <= 0.02 for g <= 2. Outside it nothing vouches for the lock-in: towards the spin
 * resonance the transient needs a settle time of 25 (1 + alpha^2) / (alpha |omega0|), millions of
 * periods at small alpha and never ending at alpha = 0.
 *
 * The one rule for every path that runs the numerical method: the spectrum job (browser pool,
 * worker, command line), the lab-run payloads and the workbench's maps. The analytic method is
 * never limited by it.
 */

/** Closed intervals of the specified range; the field bound applies to |B0|. */
export const NUMERICAL_RANGE = {
  wavelengthNm: [200, 20_000],
  absFieldT: [0.01, 10],
  temperatureK: [1, 400],
  gilbertDamping: [1e-4, 0.5],
} as const;

export type NumericalRangeKey = keyof typeof NUMERICAL_RANGE;

/** What each bound is called and in which unit, for the messages. */
const QUANTITY: Record<NumericalRangeKey, { name: string; unit: string }> = {
  wavelengthNm: { name: "wavelengths", unit: " nm" },
  absFieldT: { name: "|B0|", unit: " T" },
  temperatureK: { name: "T", unit: " K" },
  gilbertDamping: { name: "Gilbert damping α", unit: "" },
};

/**
 * Whether a value lies in the specified range. Pass the value as the request holds it: for
 * absFieldT the signed field (its magnitude is compared). NaN lies nowhere.
 */
export function insideNumericalRange(key: NumericalRangeKey, value: number): boolean {
  const [lo, hi] = NUMERICAL_RANGE[key];
  const v = key === "absFieldT" ? Math.abs(value) : value;
  return v >= lo && v <= hi;
}

/** The rule a value breaks, naming the range and the way out; null inside the range. */
export function numericalRangeProblem(key: NumericalRangeKey, value: number): string | null {
  if (insideNumericalRange(key, value)) return null;
  const [lo, hi] = NUMERICAL_RANGE[key];
  const { name, unit } = QUANTITY[key];
  return `numerical LLG is specified for ${name} from ${lo} to ${hi}${unit}; ${value}${unit} lies outside (use method "analytic")`;
}

/**
 * Every problem of a spectrum request with the numerical range, one "field: rule" line each, in
 * the form of schema.ts formatIssues; none for the analytic method. Only the first wavelength
 * outside the range is named, so a long list gives one line.
 */
export function numericalRangeIssues(
  request: Pick<SpectrumRequest, "method" | "wavelengthsNm" | "fieldT" | "temperatureK" | "gilbertDamping">,
): string[] {
  if (request.method !== "llg") return [];
  const lines: string[] = [];
  const check = (path: string, key: NumericalRangeKey, value: number) => {
    const problem = numericalRangeProblem(key, value);
    if (problem) lines.push(`${path}: ${problem}`);
  };
  const outside = request.wavelengthsNm.findIndex((nm) => !insideNumericalRange("wavelengthNm", nm));
  if (outside >= 0) check(`wavelengthsNm.${outside}`, "wavelengthNm", request.wavelengthsNm[outside]!);
  check("fieldT", "absFieldT", request.fieldT);
  check("temperatureK", "temperatureK", request.temperatureK);
  check("gilbertDamping", "gilbertDamping", request.gilbertDamping);
  return lines;
}
