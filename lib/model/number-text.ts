/*
 * Numbers as people type and read them in the forms and the workbench panel. One parser and one
 * formatter, so every number box accepts the same text and shows values the same way.
 */

export type ParsedNumber = { kind: "empty" } | { kind: "invalid" } | { kind: "number"; value: number };

const PLAIN = /^[-+]?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?$/;

/**
 * Reads "1.27e28", " 293.15 ", "−8" (typographic minus), "1,5" (a decimal comma, as many European
 * keyboards and locales write it) and "1 000" (thin or plain spaces between digit groups). A comma
 * counts as the decimal separator only when it is the only separator, so "1,000.5" is refused
 * rather than guessed.
 */
export function parseDecimal(text: string): ParsedNumber {
  let t = text.trim().replace(/\u2212/g, "-");
  if (t === "") return { kind: "empty" };
  t = t.replace(/(\d)[\s\u202f\u2009]+(?=\d)/g, "$1");
  const commas = (t.match(/,/g) ?? []).length;
  if (commas === 1 && !t.includes(".")) t = t.replace(",", ".");
  if (!PLAIN.test(t)) return { kind: "invalid" };
  const value = Number(t);
  return Number.isFinite(value) ? { kind: "number", value } : { kind: "invalid" };
}

/** The value of `text`, or null when it is empty or not a number. */
export function parseDecimalOrNull(text: string): number | null {
  const parsed = parseDecimal(text);
  return parsed.kind === "number" ? parsed.value : null;
}

/**
 * A value as a number box shows it: plain in the everyday range, otherwise scientific with "e"
 * (1.2726e28, 1e14, 2.5e-5), never rounded, so the box round-trips the stored value exactly.
 */
export function formatNumberInput(value: number | undefined | null): string {
  if (value === undefined || value === null || Number.isNaN(value)) return "";
  const magnitude = Math.abs(value);
  if (value !== 0 && (magnitude >= 1e6 || magnitude < 1e-3)) return value.toExponential().replace("e+", "e");
  return String(value);
}

/** Significant digits a value is shown with where it is read, not edited (a fit's κE, a scale). */
export const DISPLAY_SIGNIFICANT_DIGITS = 5;

/**
 * A value as read-only views (and a number box not being edited) show it: at most five
 * significant digits, trailing zeros dropped, scientific outside 1e-3…1e6 — 0.0064186413614499525
 * reads 0.0064186, 1.9431431724417974 reads 1.9431, 1.2726e28 stays 1.2726e28. The stored value is
 * untouched; a box shows it in full (formatNumberInput) while it is edited.
 */
export function formatNumberDisplay(value: number | undefined | null, significant = DISPLAY_SIGNIFICANT_DIGITS): string {
  if (value === undefined || value === null || Number.isNaN(value)) return "";
  if (!Number.isFinite(value)) return String(value);
  return formatNumberInput(Number(value.toPrecision(significant)));
}

/**
 * What a number box shows: while focused, the text as typed; otherwise, when the text is just the
 * full form of a value (nothing typed over it), that value at display precision.
 */
export function numberBoxText(text: string, focused: boolean): string {
  if (focused) return text;
  const parsed = parseDecimal(text);
  if (parsed.kind !== "number" || formatNumberInput(parsed.value) !== text.trim()) return text;
  return formatNumberDisplay(parsed.value);
}
