import type { ModelParams } from "@/lib/physics/schema";
import type { SpectrumResult } from "@/lib/physics/types";
import { magneticScaleLabel } from "./format";

/*
 * Export builders: pure functions from a result to text, so the bytes a user downloads are the
 * bytes the unit tests check. Downloading (Blob URL + <a download>) lives in the components.
 */

export const MODEL_DESCRIPTION =
  "Gyrolux model: one gyrotropic oscillator + LLG spins, physics-model §3 (Brillouin M0), §4 (magnetic-dipole part), §5 (electric-dipole part), §6 (split)";

export const CSV_COLUMNS = [
  "wavelength_nm",
  "theta_rad",
  "theta_electric_rad",
  "theta_magnetic_rad",
  "theta_cross_rad",
  "ellipticity_rad",
  "magnetic_share",
  "verdet_rad_per_T_m",
] as const;

/** Meaning and unit of each CSV column, written into the header so the file explains itself. */
export const CSV_COLUMN_MEANING: Record<(typeof CSV_COLUMNS)[number], string> = {
  wavelength_nm: "vacuum wavelength (nm)",
  theta_rad: "total Faraday rotation θ over the sample length L at the field B0 (rad)",
  theta_electric_rad: "electric-dipole part θe (rad)",
  theta_magnetic_rad: "magnetic-dipole part θm (rad)",
  theta_cross_rad: "cross term θx = θ − θe − θm (rad)",
  ellipticity_rad: "ellipticity η (rad)",
  magnetic_share: "|θm| / (|θe| + |θm|) (fraction 0…1; empty when both parts are 0)",
  verdet_rad_per_T_m: "Verdet constant θ / (B0 L) (rad/(T·m); empty when B0 = 0)",
};

export interface ExportMeta {
  setName: string;
  setId: string | null;
  version: number | null;
  method: "analytic" | "llg";
  /** ISO time of the export; passed in so tests are deterministic. */
  exportedAt: string;
}

/** One header-line-safe string: no line breaks can escape the "#" comment. */
function oneLine(s: string): string {
  return s.replace(/[\r\n]+/g, " ").trim();
}

function cell(value: number | null | undefined): string {
  // Shortest round-trip form keeps full precision; null (e.g. share without spins) is an empty cell.
  return value === null || value === undefined || !Number.isFinite(value) ? "" : String(value);
}

export function csvHeaderLines(meta: ExportMeta, params: ModelParams, result: SpectrumResult): string[] {
  const lines = [
    `# Gyrolux spectrum export`,
    `# parameter set: ${oneLine(meta.setName)}${meta.setId ? ` (id ${oneLine(meta.setId)})` : ""}`,
    `# version: ${meta.version ?? "unsaved scratch"}`,
    `# model: ${MODEL_DESCRIPTION}`,
    `# method: ${
      meta.method === "llg"
        ? `llg (numerical LLG, §7)${
            result.maxRelDeviationFromAnalytic !== undefined
              ? `, max deviation from linear response ${result.maxRelDeviationFromAnalytic.toExponential(1)}`
              : ""
          }`
        : "analytic (Polder linear response, §4.2)"
    }`,
    `# exported: ${meta.exportedAt}`,
    `# magnetization_A_per_m: ${cell(result.magnetizationAPerM)}`,
    `# parameters: ${Object.entries(params)
      .map(([k, v]) => `${k}=${String(v)}`)
      .join("; ")}`,
  ];
  const scale = magneticScaleLabel(params.magneticScale);
  if (scale) lines.push(`# label: ${scale}`);
  lines.push(`# geometry: L = ${cell(params.lengthM)} m, B0 = ${cell(params.fieldT)} T`);
  for (const column of CSV_COLUMNS) {
    // Every column but the wavelength and the electric-dipole part (μ = 1, §6.1) depends on χ±.
    const scaled = scale && column !== "wavelength_nm" && column !== "theta_electric_rad";
    lines.push(`# column ${column}: ${CSV_COLUMN_MEANING[column]}${scaled ? `; ${scale}` : ""}`);
  }
  for (const w of result.warnings ?? []) lines.push(`# warning: ${oneLine(w)}`);
  return lines;
}

export function buildSpectrumCsv(meta: ExportMeta, params: ModelParams, result: SpectrumResult): string {
  const lines = csvHeaderLines(meta, params, result);
  lines.push(CSV_COLUMNS.join(","));
  for (const p of result.points) {
    lines.push(
      [
        cell(p.wavelengthNm),
        cell(p.thetaRad),
        cell(p.thetaElectricRad),
        cell(p.thetaMagneticRad),
        cell(p.thetaCrossRad),
        cell(p.ellipticityRad),
        cell(p.magneticShare),
        cell(p.verdetRadPerTm),
      ].join(","),
    );
  }
  return lines.join("\n") + "\n";
}

export function buildSpectrumJson(meta: ExportMeta, params: ModelParams, result: SpectrumResult): string {
  return (
    JSON.stringify(
      {
        generator: "Gyrolux workbench",
        model: MODEL_DESCRIPTION,
        parameterSet: { id: meta.setId, name: meta.setName, version: meta.version },
        method: meta.method,
        exportedAt: meta.exportedAt,
        label: magneticScaleLabel(params.magneticScale),
        params,
        result,
      },
      null,
      2,
    ) + "\n"
  );
}

/** A file name without characters that browsers or shells dislike. */
export function exportFileName(setName: string, suffix: string, ext: string): string {
  const base = setName.normalize("NFKD").replace(/[^\w.-]+/g, "-").replace(/^-+|-+$/g, "").slice(0, 60) || "gyrolux";
  return `${base}-${suffix}.${ext}`;
}
