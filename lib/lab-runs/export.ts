import { buildCsv, type CsvCell } from "@/lib/csv/write";

/*
 * Exports of a finished lab run that the workbench has no exporter for: a map as CSV, one row per
 * cell, with the same header style as the spectrum export (a comment block saying what it is).
 */

export interface MapExportInput {
  title: string;
  axis: "temperature" | "field";
  method: string;
  wavelengthNm: ArrayLike<number>;
  rowValue: ArrayLike<number>;
  magneticShare: ArrayLike<number | null>;
  thetaRad: ArrayLike<number | null>;
  thetaMagneticRad: ArrayLike<number | null>;
  setLabel: string;
  runId: string;
}

function* mapRows(m: MapExportInput): Generator<CsvCell[]> {
  const nx = m.wavelengthNm.length;
  for (let j = 0; j < m.rowValue.length; j++) {
    for (let i = 0; i < nx; i++) {
      const k = j * nx + i;
      yield [m.wavelengthNm[i], m.rowValue[j], m.magneticShare[k], m.thetaRad[k], m.thetaMagneticRad[k]];
    }
  }
}

export function buildMapCsv(m: MapExportInput): string {
  return buildCsv({
    comments: [
      `Gyrolux lab run ${m.runId}: ${m.title}`,
      `parameters: ${m.setLabel}; method: ${m.method}`,
      "magnetic_share = |theta_m| / (|theta_e| + |theta_m|); empty where undefined",
    ],
    header: ["wavelength_nm", m.axis === "temperature" ? "temperature_K" : "field_T", "magnetic_share", "theta_rad", "theta_magnetic_rad"],
    rows: mapRows(m),
  });
}
