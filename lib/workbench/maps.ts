import { NUMERICAL_RANGE, insideNumericalRange } from "@/lib/physics/numerical-range";
import type { ModelParams } from "@/lib/physics/schema";
import type { MapBlockQuantity } from "@/lib/compute/protocol";
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

/** The default grid (wavelengths × rows). */
export const MAP_COLS = 64;
export const MAP_ROWS = 32;

/** A map's grid: columns (wavelengths) × rows (temperatures or fields). */
export interface MapResolution {
  cols: number;
  rows: number;
}

/** The grids the browser offers, 32 × 16 to 256 × 128 (larger maps run on the lab's machines). */
export const MAP_RESOLUTIONS: readonly MapResolution[] = [
  { cols: 32, rows: 16 },
  { cols: MAP_COLS, rows: MAP_ROWS },
  { cols: 128, rows: 64 },
  { cols: 256, rows: 128 },
];

export const DEFAULT_MAP_RESOLUTION: MapResolution = { cols: MAP_COLS, rows: MAP_ROWS };

/** "128x64", the value of a resolution in the picker. */
export const resolutionKey = (r: MapResolution) => `${r.cols}x${r.rows}`;

/** The offered resolution for a picker value (the default for anything else). */
export function parseResolution(key: string): MapResolution {
  return MAP_RESOLUTIONS.find((r) => resolutionKey(r) === key) ?? DEFAULT_MAP_RESOLUTION;
}

/**
 * Seconds per cell of the analytic method: 0.82 ms for 256 wavelengths (the README's `npm run
 * bench` figure) is 3.2 µs a cell, so even 256 × 128 takes about 0.1 s.
 */
const ANALYTIC_S_PER_CELL = 0.82e-3 / 256;

/**
 * What a map of `cells` cells should take, said before the run: for the numerical method from
 * the rate this page's workers measured (null until their warm-up has finished).
 */
export function expectedMapTime(cells: number, method: MapMethod, cellsPerSecond: number | null): string {
  const say = (s: number) => (s < 1 ? "under 1 s" : `about ${s < 10 ? s.toFixed(1) : Math.round(s)} s`);
  if (method === "analytic") return `Expected time: ${say(cells * ANALYTIC_S_PER_CELL)} (analytic).`;
  if (cellsPerSecond === null || !(cellsPerSecond > 0))
    return "Expected time: shown once this browser's speed is measured (a few seconds after the page opens).";
  const rate = Math.round(cellsPerSecond / 100) * 100;
  return `Expected time: ${say(cells / cellsPerSecond)} at the ${rate.toLocaleString("en")} cells/s this browser measured.`;
}

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

/**
 * Problems with the method itself for this set (the damping, and the set's own temperature or
 * field, which the other map keeps fixed). Empty for the analytic method.
 */
export function methodProblems(kind: MapKind, method: MapMethod, params: ModelParams, range: WavelengthRange): string[] {
  if (method === "analytic") return [];
  const out: string[] = [];
  const [aLo, aHi] = NUMERICAL_RANGE.gilbertDamping;
  if (!insideNumericalRange("gilbertDamping", params.gilbertDamping)) {
    out.push(
      `Numerical LLG needs Gilbert damping α between ${aLo} and ${aHi}; ` +
        `this set has α = ${fmt(params.gilbertDamping)}. Use the analytic method.`,
    );
  }
  const [wLo, wHi] = NUMERICAL_RANGE.wavelengthNm;
  if (range.toNm < wLo || range.fromNm > wHi) {
    out.push(
      `Numerical LLG covers ${wLo} nm–${wHi / 1000} µm; the wavelength range ${fmt(range.fromNm)}–${fmt(range.toNm)} nm lies outside it.`,
    );
  }
  if (kind === "temperature" && !insideNumericalRange("absFieldT", params.fieldT)) {
    const [bLo, bHi] = NUMERICAL_RANGE.absFieldT;
    out.push(`Numerical LLG needs |B0| between ${bLo} and ${bHi} T; the temperature map uses the set's field, ${fmt(params.fieldT)} T.`);
  }
  if (kind === "field" && !insideNumericalRange("temperatureK", params.temperatureK)) {
    const [tLo, tHi] = NUMERICAL_RANGE.temperatureK;
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
    const [lo, hi] = NUMERICAL_RANGE.wavelengthNm;
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
  const lo = Math.max(NUMERICAL_RANGE.temperatureK[0], params.curieWeissK + 1);
  const hi = Math.max(lo + 1, NUMERICAL_RANGE.temperatureK[1]);
  if (method === "llg" && hi > NUMERICAL_RANGE.temperatureK[1]) return null;
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
    const [lo, hi] = NUMERICAL_RANGE.absFieldT;
    if (from < lo || to > hi)
      return {
        error:
          `Numerical LLG is specified for |B0| from ${lo} to ${hi} T; ` +
          `set the field axis within ${lo}–${hi} T or use the analytic method.`,
      };
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
  resolution: MapResolution = DEFAULT_MAP_RESOLUTION,
): { plan: MapPlan; problems: [] } | { plan: null; problems: MapProblem[] } {
  const problems: MapProblem[] = methodProblems(kind, method, params, range).map((message) => ({ control: "method" as const, message }));
  let ys: number[] | null = null;
  let yType: "log" | "linear" = "linear";
  if (kind === "temperature") {
    ys = temperatureRows(params, method, resolution.rows);
    if (!ys) {
      problems.push({
        control: "method",
        message:
          `Numerical LLG covers 1–400 K, but this set's Curie–Weiss temperature (${fmt(params.curieWeissK)} K) ` +
          "leaves no temperatures there. Use the analytic method.",
      });
    }
  } else {
    const axis = parseFieldAxis(fieldAxis, method);
    if ("error" in axis) problems.push({ control: "fieldAxis", message: axis.error });
    else {
      // Same sign as the set's field.
      const sign = params.fieldT < 0 ? -1 : 1;
      ys = wavelengthGrid(axis.fromT, axis.toT, resolution.rows, "log").map((b) => b * sign);
      yType = "log";
    }
  }
  const cols = mapColumns(range, method, resolution.cols);
  if (problems.length > 0 || !ys || !cols) return { plan: null, problems };
  return { plan: { kind, method, xs: cols.xs, ys, yType, notes: cols.note ? [cols.note] : [] }, problems: [] };
}

/** The parameters of row j of a plan. */
export function rowParams(plan: MapPlan, params: ModelParams, j: number): ModelParams {
  const y = plan.ys[j]!;
  return plan.kind === "temperature" ? { ...params, temperatureK: y } : { ...params, fieldT: y };
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

/* ---------- what a map shows ---------- */

/** The quantities a map can show; all come from the same row runs. */
export type MapQuantity = "share" | "theta" | "thetaElectric" | "thetaMagnetic" | "verdet";

export const MAP_QUANTITIES: readonly MapQuantity[] = ["share", "theta", "thetaElectric", "thetaMagnetic", "verdet"];

export const MAP_QUANTITY_VIEW: Record<MapQuantity, { label: string; short: string; unit: string; file: string }> = {
  share: { label: "Magnetic share |θm| / (|θe| + |θm|)", short: "magnetic share", unit: "%", file: "share" },
  theta: { label: "Rotation θ", short: "θ", unit: "rad", file: "theta" },
  thetaElectric: { label: "Electric-dipole part θe", short: "θe", unit: "rad", file: "theta-electric" },
  thetaMagnetic: { label: "Magnetic-dipole part θm", short: "θm", unit: "rad", file: "theta-magnetic" },
  verdet: { label: "Verdet constant V", short: "V", unit: "rad/(T·m)", file: "verdet" },
};

/** The column of a worker's map block that holds each quantity. */
export const MAP_QUANTITY_COLUMN: Record<MapQuantity, MapBlockQuantity> = {
  share: "magneticShare",
  theta: "thetaRad",
  thetaElectric: "thetaElectricRad",
  thetaMagnetic: "thetaMagneticRad",
  verdet: "verdetRadPerTm",
};

/** Every quantity of a computed map as plotted values (NaN, an undefined share or V, becomes null). */
export function mapValues(columns: Record<MapBlockQuantity, Float64Array>): Record<MapQuantity, (number | null)[]> {
  const out = {} as Record<MapQuantity, (number | null)[]>;
  for (const q of MAP_QUANTITIES) out[q] = Array.from(columns[MAP_QUANTITY_COLUMN[q]], (v) => (Number.isNaN(v) ? null : v));
  return out;
}

/** A value of a quantity with its unit, as the readout and the legend say it. */
export function formatQuantity(v: number | null | undefined, q: MapQuantity): string {
  if (q === "share") return formatShare(v);
  if (v === null || v === undefined || !Number.isFinite(v)) return "undefined";
  const abs = Math.abs(v);
  const text = v === 0 ? "0" : abs >= 1e5 || abs < 1e-3 ? v.toExponential(2).replace("e+", "e") : String(Number(v.toPrecision(4)));
  return `${text} ${MAP_QUANTITY_VIEW[q].unit}`;
}

/**
 * The largest change along the second axis within one wavelength column, relative to the largest
 * |value| in that column, over all columns; null when no column has two defined values. A column
 * of zeros counts as constant (0).
 */
export function maxColumnChange(values: readonly (number | null)[], nx: number, ny: number): { relative: number; column: number } | null {
  let best: { relative: number; column: number } | null = null;
  for (let i = 0; i < nx; i++) {
    let lo = Infinity;
    let hi = -Infinity;
    let big = 0;
    let count = 0;
    for (let j = 0; j < ny; j++) {
      const v = values[j * nx + i];
      if (v === null || v === undefined || !Number.isFinite(v)) continue;
      lo = Math.min(lo, v);
      hi = Math.max(hi, v);
      big = Math.max(big, Math.abs(v));
      count++;
    }
    if (count < 2) continue;
    const relative = big === 0 ? 0 : (hi - lo) / big;
    if (!best || relative > best.relative) best = { relative, column: i };
  }
  return best;
}

/** Relative change below which a column counts as constant along the second axis (round-off level). */
export const CONSTANT_REL_TOL = 1e-9;

export interface AxisIndependence {
  /** True: the map would be vertical stripes; show the words and a curve against wavelength instead. */
  independent: boolean;
  /** Why, in words, for above the map; null when the quantity does depend on the axis. */
  reason: string | null;
}

const AXIS_NAME: Record<MapKind, string> = { temperature: "temperature", field: "field" };

/**
 * Whether a map's quantity depends on its second axis, from the model and from the data:
 * - the model: without the diamagnetic term both parts scale with M0 (physics-model §6.4), so the
 *   magnetic share depends on wavelength only, to first order in G and χ;
 * - the data: every column constant to CONSTANT_REL_TOL (e.g. no spins, or B0 = 0).
 */
export function axisIndependence(
  q: MapQuantity,
  kind: MapKind,
  diamagneticTerm: boolean,
  change: { relative: number } | null,
): AxisIndependence {
  const axis = AXIS_NAME[kind];
  const what = MAP_QUANTITY_VIEW[q].short;
  const measured =
    change === null
      ? ""
      : ` Largest relative change along the ${axis} axis in this map: ${change.relative === 0 ? "0" : change.relative.toExponential(1)}.`;
  if (change === null) {
    return {
      independent: true,
      reason: `The ${what} is undefined on this whole map (for example, no field or no rotation), so there is nothing to draw.`,
    };
  }
  if (change.relative <= CONSTANT_REL_TOL) {
    return {
      independent: true,
      reason:
        `The ${what} does not depend on ${axis} here: every wavelength column is constant to 1e-9.` +
        `${measured} Shown against wavelength only.`,
    };
  }
  if (q === "share" && !diamagneticTerm) {
    return {
      independent: true,
      reason:
        `In this model the magnetic share does not depend on ${axis}: ` +
        "without the diamagnetic term both parts scale with the static magnetization M0, " +
        "so only wavelength separates them (to first order in the gyration and χ)." +
        `${measured} Shown against wavelength only; switch on the diamagnetic term for a part that does not follow M0.`,
    };
  }
  return { independent: false, reason: null };
}

/** The colour range of a map: the share on 0…1, other quantities on their own finite range. */
export function quantityDomain(values: readonly (number | null)[], q: MapQuantity): [number, number] {
  if (q === "share") return [0, 1];
  let lo = Infinity;
  let hi = -Infinity;
  for (const v of values) {
    if (v === null || !Number.isFinite(v)) continue;
    lo = Math.min(lo, v);
    hi = Math.max(hi, v);
  }
  if (!Number.isFinite(lo)) return [0, 1];
  if (lo === hi) return lo === 0 ? [-1, 1] : [lo - Math.abs(lo) * 0.5, hi + Math.abs(hi) * 0.5];
  return [lo, hi];
}

/** Contour levels: 50 % for the share; the sign change (0) where a signed quantity crosses it. */
export function quantityLevels(domain: [number, number], q: MapQuantity): number[] {
  if (q === "share") return [0.5];
  return domain[0] < 0 && domain[1] > 0 ? [0] : [];
}
