import type { ModelParams } from "@/lib/physics/schema";
import type { SpectrumPoint, SpectrumResult } from "@/lib/physics/types";
import { buildCsv, csvCell } from "@/lib/csv/write";
import { magneticScaleLabel } from "./format";
import { fromNm, rotationTo, type Geometry, type XUnit, type YMode } from "./units";

/*
 * Export builders: pure functions from a result to text, so the bytes a user downloads are the
 * bytes the unit tests check. Downloading (Blob URL + <a download>) lives in the components.
 */

export const MODEL_DESCRIPTION =
  "Gyrolux model: one gyrotropic oscillator + LLG spins, " +
  "physics-model §3 (Brillouin M0), §4 (magnetic-dipole part), §5 (electric-dipole part), §6 (split)";

export const CSV_COLUMNS = [
  "wavelength_nm",
  "theta_rad",
  "theta_electric_rad",
  "theta_magnetic_rad",
  "theta_cross_rad",
  "ellipticity_rad",
  "magnetic_share",
  "verdet_rad_per_T_m",
  "theta_diamagnetic_rad",
  "absorption_plus_per_m",
  "absorption_minus_per_m",
  "transmission_plus",
  "transmission_minus",
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
  theta_diamagnetic_rad: "diamagnetic (bound-electron) part, a sub-part of θe (rad; empty when the term is off)",
  absorption_plus_per_m: "intensity absorption coefficient α+ of the + circular mode (1/m; from the measured table where the set has one)",
  absorption_minus_per_m: "intensity absorption coefficient α− of the − circular mode (1/m)",
  transmission_plus: "internal one-pass transmission exp(−α+ L) of the + mode (fraction; surface reflections excluded)",
  transmission_minus: "internal one-pass transmission exp(−α− L) of the − mode (fraction)",
};

export interface ExportMeta {
  setName: string;
  setId: string | null;
  version: number | null;
  method: "analytic" | "llg";
  /** ISO time of the export; passed in so tests are deterministic. */
  exportedAt: string;
  /** The plot's chosen units: columns in these units follow the SI ones (none when they are nm and rad). */
  display?: { xUnit: XUnit; yMode: YMode };
}

export interface ChosenUnitColumn {
  name: string;
  meaning: string;
  /** Depends on χ± (every rotation but the electric-dipole part), so it carries the magneticScale label. */
  scaled: boolean;
  value: (p: SpectrumPoint, g: Geometry) => number | null;
}

const X_COLUMN: Record<Exclude<XUnit, "nm">, { name: string; meaning: string }> = {
  um: { name: "wavelength_um", meaning: "vacuum wavelength (µm)" },
  eV: { name: "photon_energy_eV", meaning: "photon energy hc/λ (eV)" },
  "cm-1": { name: "wavenumber_per_cm", meaning: "wavenumber 1/λ (cm⁻¹)" },
  THz: { name: "frequency_THz", meaning: "frequency c/λ (THz)" },
};

const ROTATION_PARTS = [
  { key: "theta", label: "total Faraday rotation θ", pick: (p: SpectrumPoint) => p.thetaRad },
  { key: "theta_electric", label: "electric-dipole part θe", pick: (p: SpectrumPoint) => p.thetaElectricRad },
  { key: "theta_magnetic", label: "magnetic-dipole part θm", pick: (p: SpectrumPoint) => p.thetaMagneticRad },
  { key: "theta_cross", label: "cross term θx", pick: (p: SpectrumPoint) => p.thetaCrossRad },
  { key: "ellipticity", label: "ellipticity η", pick: (p: SpectrumPoint) => p.ellipticityRad },
] as const;

/**
 * The extra CSV columns for the plot's chosen units, after the SI ones: the x value in the chosen
 * unit, and every rotation in mrad or degrees, or per tesla and metre in Verdet mode.
 */
export function chosenUnitColumns(display: { xUnit: XUnit; yMode: YMode } | undefined): ChosenUnitColumn[] {
  if (!display) return [];
  const out: ChosenUnitColumn[] = [];
  const { xUnit, yMode } = display;
  if (xUnit !== "nm")
    out.push({
      ...X_COLUMN[xUnit],
      meaning: `${X_COLUMN[xUnit].meaning}, the plot's x unit`,
      scaled: false,
      value: (p) => fromNm(p.wavelengthNm, xUnit),
    });
  if (yMode === "mrad" || yMode === "deg") {
    const unit = yMode === "mrad" ? "mrad" : "deg";
    for (const part of ROTATION_PARTS) {
      out.push({
        name: `${part.key}_${unit}`,
        meaning: `${part.label} (${unit === "deg" ? "degrees" : "mrad"}), the plot's y unit`,
        scaled: part.key !== "theta_electric",
        value: (p, g) => rotationTo(part.pick(p), yMode, g),
      });
    }
  } else if (yMode === "verdet") {
    // The total is the SI column verdet_rad_per_T_m already; its parts are added.
    for (const part of ROTATION_PARTS.slice(1)) {
      const name = part.key === "ellipticity" ? "ellipticity_per_B0_L_rad_per_T_m" : `verdet_${part.key.replace("theta_", "")}_rad_per_T_m`;
      out.push({
        name,
        meaning: `${part.label} / (B0 L) (rad/(T·m)), the plot's y unit`,
        scaled: part.key !== "theta_electric",
        value: (p, g) => rotationTo(part.pick(p), yMode, g),
      });
    }
  }
  return out;
}

/** One header-line-safe string: no line breaks can escape the "#" comment. */
function oneLine(s: string): string {
  return s.replace(/[\r\n]+/g, " ").trim();
}

// Shortest round-trip form keeps full precision; null (e.g. share without spins) is an empty cell.
const cell = csvCell;

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
      .map(([k, v]) => `${k}=${typeof v === "object" ? JSON.stringify(v) : String(v)}`)
      .join("; ")}`,
  ];
  const scale = magneticScaleLabel(params.magneticScale);
  if (scale) lines.push(`# label: ${scale}`);
  lines.push(`# geometry: L = ${cell(params.lengthM)} m, B0 = ${cell(params.fieldT)} T`);
  for (const column of CSV_COLUMNS) {
    // Every column but the wavelength and the electric-dipole part and its diamagnetic sub-part (μ = 1, §6.1) depends on χ±.
    const scaled = scale && column !== "wavelength_nm" && column !== "theta_electric_rad" && column !== "theta_diamagnetic_rad";
    lines.push(`# column ${column}: ${CSV_COLUMN_MEANING[column]}${scaled ? `; ${scale}` : ""}`);
  }
  for (const column of chosenUnitColumns(meta.display)) {
    lines.push(`# column ${column.name}: ${column.meaning}${scale && column.scaled ? `; ${scale}` : ""}`);
  }
  for (const w of result.warnings ?? []) lines.push(`# warning: ${oneLine(w)}`);
  return lines;
}

/**
 * "commented": the self-describing file (what, which set and version, every column's meaning in `#`
 * lines above the header). "plain": the header row and the data only, for numpy.genfromtxt(names=True),
 * pandas or a spreadsheet; its column names are the same.
 */
export type CsvHeaderStyle = "commented" | "plain";

export function buildSpectrumCsv(
  meta: ExportMeta,
  params: ModelParams,
  result: SpectrumResult,
  style: CsvHeaderStyle = "commented",
): string {
  const extra = chosenUnitColumns(meta.display);
  const geometry: Geometry = { fieldT: params.fieldT, lengthM: params.lengthM };
  return buildCsv({
    // The header lines start with "# " already; buildCsv adds it again.
    comments: style === "commented" ? csvHeaderLines(meta, params, result).map((l) => l.replace(/^# /, "")) : [],
    header: [...CSV_COLUMNS, ...extra.map((c) => c.name)],
    rows: result.points.map((p) => [
      p.wavelengthNm,
      p.thetaRad,
      p.thetaElectricRad,
      p.thetaMagneticRad,
      p.thetaCrossRad,
      p.ellipticityRad,
      p.magneticShare,
      p.verdetRadPerTm,
      p.thetaDiamagneticRad,
      p.absorptionPlusPerM,
      p.absorptionMinusPerM,
      p.transmissionPlus,
      p.transmissionMinus,
      ...extra.map((c) => c.value(p, geometry)),
    ]),
  });
}

export function buildSpectrumJson(meta: ExportMeta, params: ModelParams, result: SpectrumResult): string {
  return `${JSON.stringify(
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
  )}\n`;
}

/** A file name without characters that browsers or shells dislike. */
export function exportFileName(setName: string, suffix: string, ext: string): string {
  const base =
    setName
      .normalize("NFKD")
      .replace(/[^\w.-]+/g, "-")
      .replace(/^-+|-+$/g, "")
      .slice(0, 60) || "gyrolux";
  return `${base}-${suffix}.${ext}`;
}

export interface FigureIdentity {
  setName: string;
  /** Stored version, or null for the unsaved scratch workbench. */
  version: number | null;
  temperatureK: number;
  fieldT: number;
  /** True when the parameters on screen differ from the stored version (what-if edits). */
  edited?: boolean;
}

export function shortNumber(v: number): string {
  return String(Number(v.toPrecision(6)));
}

/** "Terbium gallium garnet · v3 · 293.15 K · 1 T": drawn in exported figure titles. */
export function figureCaption(id: FigureIdentity): string {
  const version = id.version === null ? "unsaved scratch" : `v${id.version}${id.edited ? " (edited)" : ""}`;
  return `${oneLine(id.setName)} · ${version} · ${shortNumber(id.temperatureK)} K · ${shortNumber(id.fieldT)} T`;
}

/** "Terbium-gallium-garnet-v3-293.15K-1T": the start of every exported file's name. */
export function figureFileBase(id: FigureIdentity): string {
  const version = id.version === null ? "scratch" : `v${id.version}${id.edited ? "-edited" : ""}`;
  const t = `${shortNumber(id.temperatureK)}K`;
  const b = `${shortNumber(id.fieldT)}T`;
  return exportFileName(id.setName, `${version}-${t}-${b}`, "x").replace(/\.x$/, "");
}
