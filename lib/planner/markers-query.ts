/*
 * Plan → workbench hand-over: a plan's wavelengths travel as `?markers=632.8,1064` in the
 * workbench URL. Parsing is forgiving (bad items are dropped), since the link may be edited by hand.
 */

export const MARKERS_QUERY_KEY = "markers";

export function markersQueryValue(wavelengthsNm: readonly number[]): string {
  return [...new Set(wavelengthsNm)]
    .sort((a, b) => a - b)
    .map((w) => String(w))
    .join(",");
}

/** Positive finite wavelengths (nm), sorted, distinct, at most `max`. */
export function parseMarkersQuery(value: string | null, max: number): number[] {
  if (!value) return [];
  const out = value
    .split(",")
    .map((s) => Number(s.trim()))
    .filter((x) => Number.isFinite(x) && x > 0 && x <= 1e7);
  return [...new Set(out)].sort((a, b) => a - b).slice(0, max);
}
