/*
 * Zoom and pan of a plot's x window, and the y range that fits what the window shows. Pure
 * functions on [lo, hi] domains in the plot's own units; on a log axis the arithmetic runs on
 * the logarithms, so a zoom keeps the point under the pointer where it is on screen.
 */

export type Domain = readonly [number, number];
export type AxisType = "log" | "linear";

/** Narrowest window, as a fraction of the full span (in log units on a log axis). */
export const MIN_SPAN_FRACTION = 1e-3;

const fwd = (v: number, type: AxisType) => (type === "log" ? Math.log(v) : v);
const back = (v: number, type: AxisType) => (type === "log" ? Math.exp(v) : v);

/** Fits a window inside the full domain, keeping its span where possible (sliding, not clipping). */
export function clampDomain(view: Domain, full: Domain, type: AxisType): [number, number] {
  const f0 = fwd(full[0], type);
  const f1 = fwd(full[1], type);
  let a = fwd(Math.min(view[0], view[1]), type);
  let b = fwd(Math.max(view[0], view[1]), type);
  const fullSpan = f1 - f0;
  const minSpan = fullSpan * MIN_SPAN_FRACTION;
  if (!(b - a >= minSpan)) {
    const mid = Number.isFinite((a + b) / 2) ? (a + b) / 2 : (f0 + f1) / 2;
    a = mid - minSpan / 2;
    b = mid + minSpan / 2;
  }
  if (b - a >= fullSpan) return [full[0], full[1]];
  if (a < f0) {
    b += f0 - a;
    a = f0;
  }
  if (b > f1) {
    a -= b - f1;
    b = f1;
  }
  return [back(a, type), back(b, type)];
}

/**
 * Zooms by `factor` (< 1 in, > 1 out) about `centre`, which stays at the same place on screen.
 * The result never leaves the full domain.
 */
export function zoomDomain(view: Domain, factor: number, centre: number, full: Domain, type: AxisType): [number, number] {
  const a = fwd(view[0], type);
  const b = fwd(view[1], type);
  const c = Number.isFinite(fwd(centre, type)) ? Math.min(b, Math.max(a, fwd(centre, type))) : (a + b) / 2;
  return clampDomain([back(c - (c - a) * factor, type), back(c + (b - c) * factor, type)], full, type);
}

/** Moves the window by `fraction` of its own span (positive: towards larger values). */
export function panDomain(view: Domain, fraction: number, full: Domain, type: AxisType): [number, number] {
  const a = fwd(view[0], type);
  const b = fwd(view[1], type);
  const d = (b - a) * fraction;
  return clampDomain([back(a + d, type), back(b + d, type)], full, type);
}

/** The smallest shift of the window that brings `x` inside it. */
export function panToInclude(view: Domain, x: number, full: Domain, type: AxisType): [number, number] {
  if (x >= view[0] && x <= view[1]) return [view[0], view[1]];
  const a = fwd(view[0], type);
  const b = fwd(view[1], type);
  const v = fwd(x, type);
  const d = v < a ? v - a : v - b;
  return clampDomain([back(a + d, type), back(b + d, type)], full, type);
}

/** True when the window shows the whole domain (up to rounding). */
export function isFullDomain(view: Domain | null, full: Domain): boolean {
  if (!view) return true;
  const span = Math.abs(full[1] - full[0]);
  return Math.abs(view[0] - full[0]) <= span * 1e-9 && Math.abs(view[1] - full[1]) <= span * 1e-9;
}

/**
 * The y range of the values whose x lies in the window, padded by 5 % (log axes: a factor 1.2) so
 * lines do not touch the frame; null when nothing finite is visible. Without this the 300 nm end
 * of a spectrum, hundreds of times larger than the rest, would set the scale of every window.
 */
export function visibleYExtent(
  xs: readonly number[],
  series: readonly (readonly (number | null)[])[],
  window: Domain | null,
  log = false,
): [number, number] | null {
  let lo = Infinity;
  let hi = -Infinity;
  const x0 = window ? Math.min(window[0], window[1]) : -Infinity;
  const x1 = window ? Math.max(window[0], window[1]) : Infinity;
  for (const values of series) {
    for (let i = 0; i < xs.length; i++) {
      const x = xs[i]!;
      if (!(x >= x0 && x <= x1)) continue;
      const v = values[i];
      if (v === null || v === undefined || !Number.isFinite(v) || (log && v <= 0)) continue;
      if (v < lo) lo = v;
      if (v > hi) hi = v;
    }
  }
  return Number.isFinite(lo) ? padExtent(lo, hi, log) : null;
}

/** [lo, hi] widened so lines do not touch the frame: 5 % (log axes: a factor 1.2); a flat range gets ±10 %. */
export function padExtent(lo: number, hi: number, log = false): [number, number] {
  if (log) return lo === hi ? [lo / 2, hi * 2] : [lo / 1.2, hi * 1.2];
  if (lo === hi) {
    const d = lo === 0 ? 1 : Math.abs(lo) * 0.1;
    return [lo - d, hi + d];
  }
  const pad = (hi - lo) * 0.05;
  return [lo - pad, hi + pad];
}
