import { buildCsv, type CsvCell } from "@/lib/csv/write";
import { exportFileName, shortNumber } from "@/lib/workbench/export";
import type { MapPayload } from "./kinds";

/*
 * Exports of a finished lab run that the workbench has no exporter for: a map as CSV, one row per
 * cell with every condition of that cell (wavelength, temperature, field, length) and every
 * quantity the run computed, under a comment block saying what it is. The file name states the
 * range the map spans (a temperature map is not named after one temperature).
 */

/** The map's quantities as CSV columns: header name and result column. */
const CSV_QUANTITIES = [
  ["magnetic_share", "magneticShare"],
  ["theta_rad", "thetaRad"],
  ["theta_electric_rad", "thetaElectricRad"],
  ["theta_magnetic_rad", "thetaMagneticRad"],
  ["verdet_rad_per_T_m", "verdetRadPerTm"],
] as const;

export interface MapRunIdentity {
  runId: string;
  setName: string;
  /** Null when the parameters came with the run, not from a saved version. */
  version: number | null;
  edited: boolean;
}

/** "Terbium-gallium-garnet-v3-map-20-300K-1T-run-1a2b3c4d": set, version, the map's span, the run. */
export function mapFileBase(id: MapRunIdentity, p: MapPayload): string {
  const version = id.version === null ? "run-params" : `v${id.version}${id.edited ? "-edited" : ""}`;
  const span = (from: number, to: number, unit: string) =>
    from === to ? `${shortNumber(from)}${unit}` : `${shortNumber(from)}-${shortNumber(to)}${unit}`;
  const conditions =
    p.axis === "temperature"
      ? `${span(p.rows.from, p.rows.to, "K")}-${shortNumber(p.params.fieldT)}T`
      : `${shortNumber(p.params.temperatureK)}K-${span(p.rows.from, p.rows.to, "T")}`;
  return exportFileName(id.setName, `${version}-map-${conditions}-run-${id.runId.slice(0, 8)}`, "x").replace(/\.x$/, "");
}

export interface MapExportInput {
  title: string;
  payload: MapPayload;
  /** The result's columns (GET /api/runs/{id}/result): wavelengthNm, rowValue and the cell quantities. */
  columns: Record<string, readonly (number | null)[]>;
  setLabel: string;
  runId: string;
}

const cell = (v: number | null | undefined): CsvCell => (v === null || v === undefined || Number.isNaN(v) ? null : v);

function* mapRows(m: MapExportInput, present: (typeof CSV_QUANTITIES)[number][]): Generator<CsvCell[]> {
  const p = m.payload;
  const xs = m.columns.wavelengthNm ?? [];
  const ys = m.columns.rowValue ?? [];
  const nx = xs.length;
  for (let j = 0; j < ys.length; j++) {
    const y = ys[j] ?? null;
    const t = p.axis === "temperature" ? cell(y) : p.params.temperatureK;
    const b = p.axis === "field" ? cell(y) : p.params.fieldT;
    for (let i = 0; i < nx; i++) {
      const k = j * nx + i;
      yield [cell(xs[i]), t, b, p.params.lengthM, ...present.map(([, column]) => cell(m.columns[column]![k]))];
    }
  }
}

export function buildMapCsv(m: MapExportInput): string {
  const p = m.payload;
  const varied =
    p.axis === "temperature"
      ? `temperature varies by row (${p.rows.from}–${p.rows.to} K); field ${p.params.fieldT} T for every cell`
      : `field varies by row (${p.rows.from}–${p.rows.to} T); temperature ${p.params.temperatureK} K for every cell`;
  const present = CSV_QUANTITIES.filter(([, column]) => m.columns[column] !== undefined);
  return buildCsv({
    comments: [
      `Gyrolux lab run ${m.runId}: ${m.title}`,
      `parameters: ${m.setLabel}; method: ${p.method === "llg" ? "numerical LLG" : "analytic"}`,
      `${varied}; sample length ${p.params.lengthM} m`,
      "theta = rotation over the sample length in this model; theta_electric, theta_magnetic: its electric- and magnetic-dipole parts",
      "magnetic_share = |theta_magnetic| / (|theta_electric| + |theta_magnetic|); empty where undefined",
    ],
    header: ["wavelength_nm", "temperature_K", "field_T", "length_m", ...present.map(([header]) => header)],
    rows: mapRows(m, present),
  });
}
