import type { ModelParams } from "@/lib/physics/schema";
import { parseNumber } from "./validate";
import { wavelengthGrid } from "./units";
import type { WavelengthRange } from "./view-state";

/*
 * The pure part of the share maps: which grid a map covers for a method, what is out of range for
 * that method (said at the control that can fix it), and the cell under a pointer or a key press.
 * Nothing here talks to a worker; the maps panel sends only the row requests a plan holds.
 */

export type MapKind = "temperature" | "field";
export type MapMethod = "analytic" | "llg";

export const MAP_METHOD_LABEL: Record<MapMethod, string> = {
  analytic: "Analytic (linear response)",
  llg: "Numerical LLG",
};

export const MAP_COLS = 64;
export const MAP_ROWS = 32;

/** Where the numerical path is specified (physics-model.md §2 and §7). */
export const NUMERICAL_LIMITS = {
  wavelengthNm: [200, 20_000],
  absFieldT: [0.01, 10],
  temperatureK: [1, 400],
  gilbertDamping: [1e-4, 0.5],
} as const;

export interface FieldAxisDrafts {
  fromT: string;
  toT: string;
}

export const DEFAULT_FIELD_AXIS: FieldAxisDrafts = { fromT: "0.01", toT: "10" };

/** Which control a problem belongs to, so the message is shown there. */
export type MapControl = "method" | "fieldAxis";

export interface MapProblem {
  control: MapControl;
  message: string;
}

export interface MapPlan {
  kind: MapKind;
  method: MapMethod;
  /** Wavelengths of the columns (nm), log-spaced. */
  xs: number[];
  /** Row values: temperature (K) or signed field (T, same sign as the set's field). */
  ys: number[];
  yType: "log" | "linear";
  /** What was adjusted to stay in range (shown with the map). */
  notes: string[];
}

const fmt = (x: number) => String(Number(x.toPrecision(4)));

function inside(x: number, [lo, hi]: readonly [number, number]): boolean {
  return x >= lo && x <= hi;
}

/**
 * Problems with the method itself for this set (the damping, and the set's own temperature or
 * field, which the other map keeps fixed). Empty for the analytic method.
 */
export function methodProblems(kind: MapKind, method: MapMethod, params: ModelParams, range: WavelengthRange): string[] {
  if (method === "analytic") return [];
  const out: string[] = [];
  const [aLo, aHi] = NUMERICAL_LIMITS.gilbertDamping;
  if (!inside(params.gilbertDamping, NUMERICAL_LIMITS.gilbertDamping)) {
    out.push(`Numerical LLG needs Gilbert damping α between ${aLo} and ${aHi}; this set has α = ${fmt(params.gilbertDamping)}. Use the analytic method.`);
  }
  const [wLo, wHi] = NUMERICAL_LIMITS.wavelengthNm;
  if (range.toNm < wLo || range.fromNm > wHi) {
    out.push(`Numerical LLG covers ${wLo} nm–${wHi / 1000} µm; the wavelength range ${fmt(range.fromNm)}–${fmt(range.toNm)} nm lies outside it.`);
  }
  if (kind === "temperature" && !inside(Math.abs(params.fieldT), NUMERICAL_LIMITS.absFieldT)) {
    const [bLo, bHi] = NUMERICAL_LIMITS.absFieldT;
    out.push(`Numerical LLG needs |B0| between ${bLo} and ${bHi} T; the temperature map uses the set's field, ${fmt(params.fieldT)} T.`);
  }
  if (kind === "field" && !inside(params.temperatureK, NUMERICAL_LIMITS.temperatureK)) {
    const [tLo, tHi] = NUMERICAL_LIMITS.temperatureK;
    out.push(`Numerical LLG needs T between ${tLo} and ${tHi} K; the field map uses the set's temperature, ${fmt(params.temperatureK)} K.`);
  }
  return out;
}

/** The map's columns: the current range, log-spaced; for the numerical method cut to 200 nm–20 µm. */
export function mapColumns(range: WavelengthRange, method: MapMethod, cols = MAP_COLS): { xs: number[]; note: string | null } | null {
  let from = range.fromNm;
  let to = range.toNm;
  let note: string | null = null;
  if (method === "llg") {
    const [lo, hi] = NUMERICAL_LIMITS.wavelengthNm;
    if (to < lo || from > hi) return null;
    if (from < lo || to > hi) {
      from = Math.max(from, lo);
      to = Math.min(to, hi);
      note = `Wavelengths limited to ${fmt(from)}–${fmt(to)} nm, where numerical LLG is specified (200 nm–20 µm).`;
    }
  }
  return { xs: wavelengthGrid(from, to, from === to ? 1 : cols, "log"), note };
}

/**
 * Temperature rows: from just above the Curie–Weiss temperature (the ordered phase is not
 * modelled), at least 1 K, to 400 K. Null when that leaves nothing for the numerical method.
 */
export function temperatureRows(params: ModelParams, method: MapMethod, rows = MAP_ROWS): number[] | null {
  const lo = Math.max(NUMERICAL_LIMITS.temperatureK[0], params.curieWeissK + 1);
  const hi = Math.max(lo + 1, NUMERICAL_LIMITS.temperatureK[1]);
  if (method === "llg" && hi > NUMERICAL_LIMITS.temperatureK[1]) return null;
  return wavelengthGrid(lo, hi, rows, "linear");
}

/** Parses and checks the |B0| axis of the field map; the message names the rule broken. */
export function parseFieldAxis(drafts: FieldAxisDrafts, method: MapMethod): { fromT: number; toT: number } | { error: string } {
  const from = parseNumber(drafts.fromT);
  const to = parseNumber(drafts.toT);
  if (from === null || to === null) return { error: "|B0| from and to must be numbers (in T)." };
  if (!(from > 0)) return { error: "|B0| from must be > 0 T (the field axis is logarithmic)." };
  if (!(to > from)) return { error: "|B0| to must be above |B0| from." };
  if (to > 100) return { error: "|B0| to must be ≤ 100 T." };
  if (method === "llg") {
    const [lo, hi] = NUMERICAL_LIMITS.absFieldT;
    if (from < lo || to > hi) return { error: `Numerical LLG is specified for |B0| from ${lo} to ${hi} T; set the field axis within ${lo}–${hi} T or use the analytic method.` };
  }
  return { fromT: from, toT: to };
}

/** The grid of one map for a method, or the problems that stop it (each tied to its control). */
export function planMap(
  kind: MapKind,
  method: MapMethod,
  params: ModelParams,
  range: WavelengthRange,
  fieldAxis: FieldAxisDrafts,
): { plan: MapPlan; problems: [] } | { plan: null; problems: MapProblem[] } {
  const problems: MapProblem[] = methodProblems(kind, method, params, range).map((message) => ({ control: "method" as const, message }));
  let ys: number[] | null = null;
  let yType: "log" | "linear" = "linear";
  if (kind === "temperature") {
    ys = temperatureRows(params, method);
    if (!ys) {
      problems.push({
        control: "method",
        message: `Numerical LLG covers 1–400 K, but this set's Curie–Weiss temperature (${fmt(params.curieWeissK)} K) leaves no temperatures there. Use the analytic method.`,
      });
    }
  } else {
    const axis = parseFieldAxis(fieldAxis, method);
    if ("error" in axis) problems.push({ control: "fieldAxis", message: axis.error });
    else {
      // Same sign as the set's field.
      const sign = params.fieldT < 0 ? -1 : 1;
      ys = wavelengthGrid(axis.fromT, axis.toT, MAP_ROWS, "log").map((b) => b * sign);
      yType = "log";
    }
  }
  const cols = mapColumns(range, method);
  if (problems.length > 0 || !ys || !cols) return { plan: null, problems };
  return { plan: { kind, method, xs: cols.xs, ys, yType, notes: cols.note ? [cols.note] : [] }, problems: [] };
}

/** The parameters of row j of a plan. */
export function rowParams(plan: MapPlan, params: ModelParams, j: number): ModelParams {
  const y = plan.ys[j]!;
  return plan.kind === "temperature" ? { ...params, temperatureK: y } : { ...params, fieldT: y };
}

/** Progress over the whole map: rows done plus the fraction of the running row. */
export function mapProgress(rowIndex: number, rowFraction: number, rows: number): number {
  if (rows <= 0) return 1;
  const f = Math.min(1, Math.max(0, Number.isFinite(rowFraction) ? rowFraction : 0));
  return Math.min(1, (rowIndex + f) / rows);
}

/** Largest of the per-row deviations from linear response (undefined when no row reported one). */
export function maxDeviation(deviations: readonly (number | undefined)[]): number | undefined {
  let best: number | undefined;
  for (const d of deviations) if (d !== undefined && Number.isFinite(d) && (best === undefined || d > best)) best = d;
  return best;
}

/** The caption under a map: which method, and for numerical maps the largest deviation over all rows. */
export function methodCaption(method: MapMethod, rows: number, deviation: number | undefined): string {
  if (method === "analytic") return "Computed with the analytic method (Polder linear response).";
  const dev = deviation === undefined ? "not reported" : deviation.toExponential(1);
  return `Computed with numerical LLG; largest deviation from linear response over all ${rows} rows: ${dev}.`;
}

/* ---------- cell lookup ---------- */

export interface CellGeometry {
  /** Left and top edge of the plotting area, in SVG user units. */
  left: number;
  top: number;
  width: number;
  height: number;
  nx: number;
  ny: number;
}

export interface Cell {
  /** Column (along x, left to right). */
  i: number;
  /** Row (along y, bottom to top: row 0 is drawn at the bottom). */
  j: number;
}

/** The cell under a point in SVG user units, or null outside the plotting area. */
export function cellAt(px: number, py: number, g: CellGeometry): Cell | null {
  if (g.nx < 1 || g.ny < 1 || !(g.width > 0) || !(g.height > 0)) return null;
  const u = (px - g.left) / g.width;
  const v = (g.top + g.height - py) / g.height;
  if (!(u >= 0 && u <= 1 && v >= 0 && v <= 1)) return null;
  return { i: Math.min(g.nx - 1, Math.floor(u * g.nx)), j: Math.min(g.ny - 1, Math.floor(v * g.ny)) };
}

/**
 * The cell after a key press on the focused map: arrows move one cell (ten with Shift), Up goes
 * to higher rows (up the y axis), Home/End jump to the row's ends, PageUp/PageDown to the
 * column's ends. Returns undefined for keys the map does not use; null for Escape (clear).
 */
export function moveCell(cell: Cell | null, key: string, nx: number, ny: number, shift = false): Cell | null | undefined {
  if (key === "Escape") return null;
  if (nx < 1 || ny < 1) return undefined;
  const step = shift ? 10 : 1;
  const clampI = (i: number) => Math.min(nx - 1, Math.max(0, i));
  const clampJ = (j: number) => Math.min(ny - 1, Math.max(0, j));
  // The first key press lands on the middle of the map.
  const c = cell ?? { i: Math.floor(nx / 2), j: Math.floor(ny / 2) };
  switch (key) {
    case "ArrowLeft":
      return cell ? { i: clampI(c.i - step), j: c.j } : c;
    case "ArrowRight":
      return cell ? { i: clampI(c.i + step), j: c.j } : c;
    case "ArrowUp":
      return cell ? { i: c.i, j: clampJ(c.j + step) } : c;
    case "ArrowDown":
      return cell ? { i: c.i, j: clampJ(c.j - step) } : c;
    case "Home":
      return { i: 0, j: c.j };
    case "End":
      return { i: nx - 1, j: c.j };
    case "PageUp":
      return { i: c.i, j: ny - 1 };
    case "PageDown":
      return { i: c.i, j: 0 };
    default:
      return undefined;
  }
}

/** A share as the readout says it. */
export function formatShare(v: number | null | undefined): string {
  if (v === null || v === undefined || !Number.isFinite(v)) return "undefined (no magnetic or electric rotation)";
  return `${(v * 100).toFixed(1)} %`;
}
