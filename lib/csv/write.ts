/*
 * The one CSV writer of the product (spectrum, plan, lab-run and point exports).
 *   - Quoting per RFC 4180 §2: a field holding a comma, a double quote, CR or LF is enclosed in
 *     double quotes, a quote inside doubled; records end in CRLF.
 *   - Formula cells defused for spreadsheets: a text cell starting with =, +, -, @, tab or CR is
 *     read as a formula by Excel, LibreOffice and Google Sheets (OWASP, "CSV Injection"); such a
 *     cell gets a leading apostrophe. Numbers are written as numbers (a negative value stays -1.5),
 *     so numpy and the csv module read them back unchanged.
 *   - Comment lines ("# …", the product's self-describing header) are one line each: a line break
 *     in a set's name cannot end the comment and start a data row.
 */

export type CsvCell = string | number | boolean | null | undefined;

/** Lines ending a record (RFC 4180 §2.1). */
export const CSV_EOL = "\r\n";

const NEEDS_QUOTES = /[",\r\n]/;
const FORMULA_START = /^[=+\-@\t\r]/;
const PLAIN_NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

/** One field: numbers in their shortest round-trip form (non-finite → empty), text defused and quoted as needed. */
export function csvCell(value: CsvCell): string {
  if (value === null || value === undefined) return "";
  if (typeof value === "number") return Number.isFinite(value) ? String(value) : "";
  if (typeof value === "boolean") return value ? "true" : "false";
  const text = FORMULA_START.test(value) && !PLAIN_NUMBER.test(value) ? `'${value}` : value;
  return NEEDS_QUOTES.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

export function csvRow(cells: readonly CsvCell[]): string {
  return cells.map(csvCell).join(",");
}

/** A comment line: `# ` and the text with its line breaks folded to spaces. */
export function csvComment(text: string): string {
  return `# ${text.replace(/[\r\n]+/g, " ").trim()}`;
}

/** A whole file: optional comment lines, the header row, the data rows; CRLF after every line. */
export function buildCsv(options: { comments?: readonly string[]; header: readonly string[]; rows: Iterable<readonly CsvCell[]> }): string {
  const lines: string[] = (options.comments ?? []).map(csvComment);
  lines.push(csvRow(options.header));
  for (const row of options.rows) lines.push(csvRow(row));
  return `${lines.join(CSV_EOL)}${CSV_EOL}`;
}
