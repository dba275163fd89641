import Papa from "papaparse";
import { z } from "zod";
import { finiteNumber, positiveNumber, safeString } from "@/lib/contracts/validation";
import { measuredQuantitySchema, type MeasuredPoint, type MeasuredQuantity, pointLimitProblem } from "./point";
import {
  quantityOfUnit,
  valueToSi,
  valueUnitSchema,
  wavelengthToNm,
  wavelengthUnitSchema,
  type ValueUnit,
  type WavelengthUnit,
} from "./units";

/*
 * Reading a measurement table (CSV or TSV): pure, so the upload form, the API and the fit's
 * command line read files the same way and give the same line numbers. The parser is papaparse;
 * this module adds header detection, column mapping, unit conversion to SI and row-by-row
 * validation whose messages name the line of the original file.
 */

/** Largest file the product accepts (bytes). */
export const MAX_FILE_BYTES = 5 * 1024 * 1024;
/** Most data rows in one measurement set. */
export const MAX_ROWS = 20_000;
/** Columns kept per point besides the mapped ones (a `source`, a `run` label, a comment). */
export const MAX_EXTRA_COLUMNS = 20;
/** Longest text kept in such a column. */
export const MAX_EXTRA_CHARS = 200;
/** Messages listed before the rest are summarised in one line. */
export const MAX_ERRORS = 200;

/** The column names proposed by default; also the header the fit's command line reads. */
export const DEFAULT_COLUMNS = {
  wavelength: "wavelength_nm",
  verdet: "verdet_rad_per_T_m",
  rotation: "rotation_rad",
  sigma: "sigma",
  temperature: "temperature_K",
  field: "field_T",
  length: "length_m",
} as const;

const column = safeString().trim().min(1).max(200).nullable();

/** Which column holds what, and in which unit. A null column means "not in the file". */
export const columnMappingSchema = z.object({
  wavelengthColumn: column,
  wavelengthUnit: wavelengthUnitSchema,
  quantity: measuredQuantitySchema,
  valueColumn: column,
  valueUnit: valueUnitSchema,
  /** σ in the unit of the values; null → the file's relative σ (fileDefaults.relativeSigma). */
  sigmaColumn: column,
  temperatureColumn: column,
  fieldColumn: column,
  lengthColumn: column,
});
export type ColumnMapping = z.infer<typeof columnMappingSchema>;

/** Values entered once in the form for every row of the file. */
export const fileDefaultsSchema = z.object({
  /** σ as a fraction of |value| (0.02 = 2 %), used when no σ column is mapped. */
  relativeSigma: positiveNumber("The relative σ").optional(),
  temperatureK: positiveNumber("The temperature").optional(),
  fieldT: finiteNumber("The field").optional(),
  lengthM: positiveNumber("The sample length").optional(),
});
export type FileDefaults = z.infer<typeof fileDefaultsSchema>;

export interface TableRow {
  /** 1-based line of the original file where the row starts. */
  line: number;
  cells: string[];
}

/** How fields are separated: a character, or any run of spaces and tabs (numpy.savetxt's default). */
export const DELIMITERS = [",", "\t", ";", "whitespace"] as const;
export type Delimiter = (typeof DELIMITERS)[number];

/** How a file is read: each choice "auto" (detected) or forced by the user in the upload form. */
export const tableFormatSchema = z.object({
  delimiter: z.enum(["auto", ...DELIMITERS], { error: "Choose how the columns are separated." }).default("auto"),
  decimal: z.enum(["auto", ".", ","], { error: "Choose the decimal mark." }).default("auto"),
});
export type TableFormat = z.infer<typeof tableFormatSchema>;
export const AUTO_FORMAT: TableFormat = { delimiter: "auto", decimal: "auto" };

export interface Table {
  headers: string[];
  /** Line of the header row. */
  headerLine: number;
  /** Where the header came from: its own line, or the last `#` comment line before the data (numpy.savetxt's `# a b c`). */
  headerSource: "line" | "comment";
  delimiter: Delimiter;
  /** The decimal mark of the numbers (a comma only with `;`, tab or whitespace separators). */
  decimal: "." | ",";
  rows: TableRow[];
}

const isComment = (cells: string[]) => (cells[0] ?? "").trimStart().startsWith("#");
const isBlank = (cells: string[]) => cells.every((c) => c.trim() === "");

const NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;
const DECIMAL_COMMA_NUMBER = /^[+-]?(\d+,?\d*|,\d+)([eE][+-]?\d+)?$/;

/** The cell as a number in JavaScript's notation, or null when it is not one. */
export function numberText(raw: string, decimal: "." | ","): string | null {
  const text = raw.trim();
  if (NUMBER.test(text)) return text;
  return decimal === "," && DECIMAL_COMMA_NUMBER.test(text) ? text.replace(",", ".") : null;
}

function detectDelimiter(line: string): Delimiter {
  if (line.includes("\t")) return "\t";
  // A semicolon file may hold decimal commas, so a semicolon wins over a comma.
  if (line.includes(";")) return ";";
  if (line.includes(",")) return ",";
  return /\S\s+\S/.test(line) ? "whitespace" : ",";
}

function splitLines(normalized: string, delimiter: Delimiter): string[][] {
  if (delimiter === "whitespace") {
    return normalized.split("\n").map((l) => {
      const trimmed = l.trim();
      return trimmed === "" ? [""] : trimmed.split(/\s+/);
    });
  }
  // One parse of the whole text (papaparse's per-row callback is several times slower).
  return Papa.parse<string[]>(normalized, { delimiter, newline: "\n", skipEmptyLines: false }).data;
}

/** A header names its columns; a row with a number in it is data (numpy.savetxt may add text columns with fmt="%s"). */
const looksLikeData = (cells: string[], decimal: "." | ",") => cells.some((c) => numberText(c, decimal) !== null);

/**
 * Splits the text into a header and data rows with their line numbers. Lines starting with `#`
 * and blank lines are skipped. The header is the first other line, unless that line holds a
 * number: then the last comment line before it, without its `#`, when it has as many fields
 * (what numpy.savetxt writes with `header=`). The delimiter is the first data line's (tab, else
 * semicolon, else comma, else runs of spaces); decimal commas are recognised with a semicolon, tab
 * or whitespace delimiter. `format` overrides either detection.
 */
export function readTable(text: string, format: TableFormat = AUTO_FORMAT): Table {
  // One line ending throughout so line numbers count what an editor shows; a leading BOM is not data.
  const normalized = text.replace(/^\uFEFF/, "").replace(/\r\n?/g, "\n");
  const firstDataLine = normalized.split("\n").find((l) => l.trim() !== "" && !l.trimStart().startsWith("#")) ?? "";
  const delimiter = format.delimiter === "auto" ? detectDelimiter(firstDataLine) : format.delimiter;

  const parsed = splitLines(normalized, delimiter);
  const entries: { line: number; cells: string[] }[] = [];
  let line = 1;
  for (const cells of parsed) {
    entries.push({ line, cells });
    line += 1;
    // Every row ends at one newline, and the only other newlines are inside quoted fields.
    for (const cell of cells) if (cell.includes("\n")) line += cell.split("\n").length - 1;
  }
  const data = entries.filter((e) => !isBlank(e.cells) && !isComment(e.cells));
  const decimal: "." | "," =
    format.decimal !== "auto"
      ? format.decimal
      : delimiter !== "," && data.slice(0, 50).some((e) => e.cells.some((c) => /^[+-]?\d*,\d+([eE][+-]?\d+)?$/.test(c.trim())))
        ? ","
        : ".";

  const table: Table = { headers: [], headerLine: 0, headerSource: "line", delimiter, decimal, rows: [] };
  const first = data[0];
  if (!first) return table;
  let rows = data;
  if (looksLikeData(first.cells, decimal)) {
    const comment = entries.filter((e) => e.line < first.line && isComment(e.cells) && !isBlank(e.cells)).at(-1);
    const headerText = comment ? comment.cells.join(delimiter === "whitespace" ? " " : delimiter).replace(/^\s*#\s*/, "") : "";
    const headerCells = headerText === "" ? [] : splitLines(headerText, delimiter)[0]!;
    if (comment && headerCells.length === first.cells.length) {
      table.headers = headerCells.map((c) => c.trim());
      table.headerLine = comment.line;
      table.headerSource = "comment";
    }
  }
  if (table.headerLine === 0) {
    table.headers = first.cells.map((c) => c.trim());
    table.headerLine = first.line;
    rows = data.slice(1);
  }
  table.rows = rows.map((e) => ({ line: e.line, cells: e.cells }));
  return table;
}

/** Words for the preview: "semicolons, decimal commas, header from the `#` line 3". */
export function describeFormat(table: Pick<Table, "delimiter" | "decimal" | "headerSource" | "headerLine">): string {
  const names: Record<Delimiter, string> = { ",": "commas", "\t": "tabs", ";": "semicolons", whitespace: "spaces" };
  const header =
    table.headerSource === "comment" ? `header from the # comment on line ${table.headerLine}` : `header on line ${table.headerLine}`;
  return `columns separated by ${names[table.delimiter]}, decimal ${table.decimal === "," ? "commas" : "points"}, ${header}`;
}

const norm = (header: string) => header.toLowerCase().replace(/[^a-z0-9µ]+/g, "");

interface Guess<U> {
  column: string;
  unit: U;
}

function findColumn(headers: string[], patterns: RegExp[]): string | null {
  for (const pattern of patterns) {
    const hit = headers.find((h) => pattern.test(norm(h)));
    if (hit !== undefined) return hit;
  }
  return null;
}

function guessWavelength(headers: string[]): Guess<WavelengthUnit> | null {
  const tries: [RegExp[], WavelengthUnit][] = [
    [[/^wavelengthnm$/, /^(wavelength|lambda|wl)nm/, /^(wavelength|lambda|wl)$/], "nm"],
    [[/^(wavelength|lambda|wl)(um|µm|micron)/], "um"],
    [[/^(energy|photonenergy|e)ev$/, /ev$/], "eV"],
    [[/^(wavenumber|nu)cm1?$/, /cm1$/], "cm-1"],
    [[/^(frequency|freq|f|nu)thz$/, /thz$/], "THz"],
  ];
  for (const [patterns, unit] of tries) {
    const hit = findColumn(headers, patterns);
    if (hit) return { column: hit, unit };
  }
  return null;
}

function guessValue(headers: string[]): (Guess<ValueUnit> & { quantity: MeasuredQuantity }) | null {
  const tries: [RegExp[], ValueUnit][] = [
    [[/^verdetradpertm$/, /^verdetrad/, /^verdet$/], "rad/(T·m)"],
    [[/^verdet(deg|degree)/], "deg/(T·m)"],
    [[/^verdetmin/], "min/(Oe·cm)"],
    [[/^rotationrad$/, /^(rotation|theta|faraday)rad$/, /^(rotation|theta)$/], "rad"],
    [[/^(rotation|theta|faraday)mrad$/], "mrad"],
    [[/^(rotation|theta|faraday)(deg|degree)/], "deg"],
  ];
  for (const [patterns, unit] of tries) {
    const hit = findColumn(headers, patterns);
    if (hit) return { column: hit, unit, quantity: quantityOfUnit(unit) };
  }
  return null;
}

/**
 * The mapping the upload form starts from. The default names (DEFAULT_COLUMNS) map exactly; other
 * common spellings with a unit suffix ("energy_eV", "rotation_mrad", "verdet_min_per_Oe_cm") are
 * recognised too. Anything not found is null and left to the user.
 */
export function proposeMapping(headers: readonly string[]): ColumnMapping {
  const list = [...headers];
  const wavelength = guessWavelength(list);
  const value = guessValue(list);
  return {
    wavelengthColumn: wavelength?.column ?? null,
    wavelengthUnit: wavelength?.unit ?? "nm",
    quantity: value?.quantity ?? "verdet",
    valueColumn: value?.column ?? null,
    valueUnit: value?.unit ?? "rad/(T·m)",
    sigmaColumn: findColumn(list, [/^sigma$/, /^(sigma|σ|uncertainty|err|error|stderr)/, /^u$/]),
    temperatureColumn: findColumn(list, [/^temperaturek$/, /^(temperature|temp|t)k?$/]),
    fieldColumn: findColumn(list, [/^fieldt$/, /^(field|b|b0)t?$/]),
    lengthColumn: findColumn(list, [/^lengthm$/, /^(length|l|thickness)m?$/]),
  };
}

export interface ParseResult {
  points: MeasuredPoint[];
  /** "line 14: wavelength is empty", in file order; empty when every row is good. */
  errors: string[];
  /** Data rows seen (good and bad). */
  rowCount: number;
}

/**
 * Maps, converts and validates every row; collects every problem (with the line of the original
 * file) instead of stopping at the first. Points are returned only when there are no errors, so
 * a caller can never store half a file by mistake.
 */
export function parseMeasurementTable(
  text: string,
  mapping: ColumnMapping,
  fileDefaults: FileDefaults = {},
  format: TableFormat = AUTO_FORMAT,
): ParseResult {
  const errors: string[] = [];
  const table = readTable(text, format);
  if (table.headerLine === 0)
    return { points: [], errors: ["The file is empty: it needs a header line and at least one data row."], rowCount: 0 };
  if (table.rows.length === 0)
    return { points: [], errors: [`The file has a header (line ${table.headerLine}) but no data rows.`], rowCount: 0 };
  if (table.rows.length > MAX_ROWS) {
    return {
      points: [],
      errors: [`The file has ${table.rows.length.toLocaleString("en")} data rows; at most ${MAX_ROWS.toLocaleString("en")} are allowed.`],
      rowCount: table.rows.length,
    };
  }
  if (quantityOfUnit(mapping.valueUnit) !== mapping.quantity) {
    errors.push(`The unit ${mapping.valueUnit} does not fit a ${mapping.quantity === "verdet" ? "Verdet constant" : "rotation"}.`);
  }

  const index = (name: string | null, what: string, required: boolean): number | null => {
    if (name === null) {
      if (required) errors.push(`${what}: choose the column that holds it.`);
      return null;
    }
    const i = table.headers.indexOf(name);
    if (i < 0) errors.push(`${what}: the file has no column “${name}”.`);
    return i < 0 ? null : i;
  };
  const needDefault = (name: string | null, value: number | undefined, what: string) => {
    if (name === null && value === undefined) errors.push(`${what}: choose a column or enter one value for the whole file.`);
  };
  const wavelengthAt = index(mapping.wavelengthColumn, "Wavelength", true);
  const valueAt = index(mapping.valueColumn, mapping.quantity === "verdet" ? "Verdet constant" : "Rotation", true);
  const sigmaAt = index(mapping.sigmaColumn, "σ", false);
  const temperatureAt = index(mapping.temperatureColumn, "Temperature", false);
  const fieldAt = index(mapping.fieldColumn, "Field", false);
  const lengthAt = index(mapping.lengthColumn, "Sample length", false);
  if (mapping.sigmaColumn === null && fileDefaults.relativeSigma === undefined)
    errors.push("σ: choose a column or enter one relative σ for the whole file.");
  needDefault(mapping.temperatureColumn, fileDefaults.temperatureK, "Temperature");
  needDefault(mapping.fieldColumn, fileDefaults.fieldT, "Field");
  needDefault(mapping.lengthColumn, fileDefaults.lengthM, "Sample length");
  const mapped = new Set([wavelengthAt, valueAt, sigmaAt, temperatureAt, fieldAt, lengthAt]);
  const extraColumns = table.headers.map((name, at) => ({ name, at })).filter((c) => !mapped.has(c.at) && c.name !== "");
  if (extraColumns.length > MAX_EXTRA_COLUMNS)
    errors.push(`The file has ${extraColumns.length} columns besides the mapped ones; at most ${MAX_EXTRA_COLUMNS} are kept.`);
  if (errors.length > 0) return { points: [], errors, rowCount: table.rows.length };

  const points: MeasuredPoint[] = [];
  let total = 0;
  const report = (line: number, message: string) => {
    total++;
    if (errors.length < MAX_ERRORS) errors.push(`line ${line}: ${message}`);
  };

  for (const row of table.rows) {
    const rowErrors = total;
    if (row.cells.length !== table.headers.length) {
      report(row.line, `has ${row.cells.length} field${row.cells.length === 1 ? "" : "s"}, the header has ${table.headers.length}`);
      continue;
    }
    const read = (at: number | null, what: string, fallback?: number): number | null => {
      if (at === null) return fallback ?? null;
      const raw = (row.cells[at] ?? "").trim();
      if (raw === "") {
        report(row.line, `${what} is empty`);
        return null;
      }
      const number = numberText(raw, table.decimal);
      if (number === null) {
        report(row.line, `${what} “${raw.length > 24 ? `${raw.slice(0, 24)}…` : raw}” is not a number`);
        return null;
      }
      const value = Number(number);
      if (!Number.isFinite(value)) report(row.line, `${what} is too large`);
      return Number.isFinite(value) ? value : null;
    };
    const wavelength = read(wavelengthAt, "wavelength");
    const value = read(valueAt, mapping.quantity === "verdet" ? "Verdet constant" : "rotation");
    const sigma = read(sigmaAt, "σ");
    const temperatureK = read(temperatureAt, "temperature", fileDefaults.temperatureK);
    const fieldT = read(fieldAt, "field", fileDefaults.fieldT);
    const lengthM = read(lengthAt, "sample length", fileDefaults.lengthM);
    if (total > rowErrors) continue;

    const wavelengthNm = wavelength! > 0 ? wavelengthToNm(wavelength!, mapping.wavelengthUnit) : Number.NaN;
    if (!(wavelengthNm > 0) || !Number.isFinite(wavelengthNm)) report(row.line, "wavelength must be > 0");
    const valueSi = valueToSi(value!, mapping.valueUnit);
    const sigmaSi = sigmaAt !== null ? valueToSi(sigma!, mapping.valueUnit) : Math.abs(valueSi) * fileDefaults.relativeSigma!;
    if (sigmaAt !== null && !(sigma! > 0)) report(row.line, "σ must be > 0");
    else if (sigmaAt === null && !(sigmaSi > 0)) report(row.line, "σ is 0 (a relative σ of a zero value); give σ in a column");
    if (!(temperatureK! > 0)) report(row.line, "temperature must be > 0 K");
    if (!(lengthM! > 0)) report(row.line, "sample length must be > 0 m");
    const extra: Record<string, string> = {};
    for (const c of extraColumns) {
      const cellText = (row.cells[c.at] ?? "").trim();
      if (cellText.length > MAX_EXTRA_CHARS) report(row.line, `${c.name} is longer than ${MAX_EXTRA_CHARS} characters`);
      else if (cellText !== "") extra[c.name] = cellText;
    }
    if (total > rowErrors) continue;

    if (!Number.isFinite(valueSi) || !Number.isFinite(sigmaSi)) {
      report(row.line, "value or σ is out of range after conversion");
      continue;
    }
    const outside = pointLimitProblem({
      wavelengthNm,
      value: valueSi,
      sigma: sigmaSi,
      temperatureK: temperatureK!,
      fieldT: fieldT!,
      lengthM: lengthM!,
    });
    if (outside) {
      report(row.line, outside);
      continue;
    }
    // Every rule of measuredPointSchema was checked above, field by field with its own message;
    // a schema parse per row on top would triple the time for a 20,000-row file.
    points.push({
      line: row.line,
      wavelengthNm,
      quantity: mapping.quantity,
      value: valueSi,
      sigma: sigmaSi,
      temperatureK: temperatureK!,
      fieldT: fieldT!,
      lengthM: lengthM!,
      ...(Object.keys(extra).length > 0 ? { extra } : {}),
    });
  }
  if (total > errors.length) errors.push(`… and ${total - errors.length} more problems.`);
  return errors.length > 0 ? { points: [], errors, rowCount: table.rows.length } : { points, errors, rowCount: table.rows.length };
}
