import { format as d3format, scaleLinear, scaleLog, type ScaleContinuousNumeric } from "d3";
import { padExtent } from "@/lib/workbench/zoom";

/*
 * Scale helpers shared by the plots: d3 does the mathematics (domains, ticks, formats); React
 * renders the SVG.
 */

export type ScaleType = "log" | "linear";
export type NumScale = ScaleContinuousNumeric<number, number>;

export function makeScale(type: ScaleType, domain: [number, number], range: [number, number], nice = true): NumScale {
  const s: NumScale = type === "log" ? scaleLog().domain(domain).range(range) : scaleLinear().domain(domain).range(range);
  return nice && type === "linear" ? s.nice() : s;
}

export interface Tick {
  value: number;
  label: string;
  major: boolean;
}

/** Ticks with labels; on log axes the minor ticks get an empty label. */
export function ticksOf(scale: NumScale, type: ScaleType, count: number): Tick[] {
  // Log axes label only the "nice" ticks (1, 2, 5 × 10ⁿ); linear axes use d3's precision-aware default.
  const values = scale.ticks(count);
  // Very small or large linear ticks (a spin cone of 1e-5, uz − s of 1e-10) read better as exponents.
  const maxAbs = Math.max(0, ...values.map(Math.abs));
  const tiny = type === "linear" && maxAbs > 0 && (maxAbs < 1e-3 || maxAbs >= 1e6);
  const format = type === "log" ? scale.tickFormat(count, "~g") : tiny ? d3format("~e") : scale.tickFormat(count);
  // A log axis spanning less than a decade gets few labelled ticks; fall back to labelling all.
  const labelled = values.map((v) => format(v));
  const anyLabel = labelled.some((l) => l !== "");
  return values.map((value, i) => ({ value, label: anyLabel ? labelled[i]! : String(value), major: anyLabel ? labelled[i] !== "" : true }));
}

/** Extent of finite values across several arrays, padded so lines don't touch the frame. */
export function paddedExtent(arrays: readonly (readonly (number | null)[])[], log = false): [number, number] | null {
  let lo = Infinity;
  let hi = -Infinity;
  for (const a of arrays) {
    for (const v of a) {
      if (v === null || !Number.isFinite(v) || (log && v <= 0)) continue;
      if (v < lo) lo = v;
      if (v > hi) hi = v;
    }
  }
  return Number.isFinite(lo) ? padExtent(lo, hi, log) : null;
}
