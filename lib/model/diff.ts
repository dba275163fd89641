import type { ModelFlagKey, ModelParamKey, ModelParams, NumericModelParamKey } from "@/lib/physics/schema";
import { formatNumberInput } from "./number-text";
import { FLAG_META, PARAM_META } from "./param-meta";

/*
 * Field-by-field comparison of two snapshots of a parameter set, for the history page and the
 * "someone else saved" conflict banner. Pure, so it is unit-tested without a browser.
 */

/** The parts of a parameter set a person edits; params may be partial while a form is half filled. */
export interface SetSnapshot {
  name: string;
  description: string;
  tags: readonly string[];
  params: Partial<
    Record<NumericModelParamKey, number> &
      Record<ModelFlagKey, boolean> &
      Pick<ModelParams, "diamagneticAnomaly" | "diamagneticDispersion" | "absorptionTable">
  >;
}

export type DiffFieldKey = "name" | "description" | "tags" | ModelParamKey;

export interface FieldDiff {
  key: DiffFieldKey;
  label: string;
  /** Unit as shown to the user; empty for dimensionless values and text fields. */
  unit: string;
  before: string;
  after: string;
  changed: boolean;
  /** For a changed number: "+12.5 %", "−73.7 %", "×1000", "sign reversed", "from 0"; else null. */
  relative: string | null;
}

/**
 * Numbers as a scientist writes them: plain in the everyday range, otherwise scientific with "e"
 * (1.2726e28, 1e14, 2.5e-5), and never rounded, so two different stored values never print alike.
 */
export function formatValue(value: number | undefined): string {
  if (value === undefined || Number.isNaN(value)) return "—";
  return formatNumberInput(value);
}

const MINUS = "\u2212";

function signed(text: string, negative: boolean): string {
  return `${negative ? MINUS : "+"}${text}`;
}

/**
 * How much a number changed, relative to where it was: a percentage for ordinary changes (three
 * significant digits), a factor once the value grows or shrinks tenfold or more, and words where a
 * ratio means nothing (from or to 0, or a change of sign).
 */
export function describeRelativeChange(before: number | undefined, after: number | undefined): string | null {
  if (before === undefined || after === undefined || Number.isNaN(before) || Number.isNaN(after) || before === after) return null;
  if (before === 0) return "from 0";
  if (after === 0) return "to 0";
  if (Math.sign(before) !== Math.sign(after)) return "sign reversed";
  const ratio = after / before;
  // For negative values the ratio speaks of the size: −8 → −7.5 is 6.25 % smaller in size but a
  // rise in value, so both are said ("size −6.25 %, value up"); for positive values they agree.
  const way = before < 0 ? `, value ${after > before ? "up" : "down"}` : "";
  const size = before < 0 ? "size " : "";
  if (ratio >= 10 || ratio <= 0.1) return `${size}×${formatNumberInput(Number(ratio.toPrecision(3)))}${way}`;
  const percent = (ratio - 1) * 100;
  const shown =
    Math.abs(percent) >= 0.01 ? String(Number(Math.abs(percent).toPrecision(3))) : Math.abs(percent).toExponential(1).replace("e+", "e");
  return `${size}${signed(shown, percent < 0)} %${way}`;
}

function normaliseTags(tags: readonly string[]): string[] {
  return [...new Set(tags.map((t) => t.trim()).filter(Boolean))].sort((a, b) => a.localeCompare(b));
}

function sameNumber(a: number | undefined, b: number | undefined): boolean {
  if (a === undefined || b === undefined) return a === b;
  return a === b || (Number.isNaN(a) && Number.isNaN(b));
}

/** Every field in display order (name, description, tags, then the model parameters as in PARAM_META). */
export function diffSnapshots(before: SetSnapshot, after: SetSnapshot): FieldDiff[] {
  const beforeTags = normaliseTags(before.tags);
  const afterTags = normaliseTags(after.tags);
  const rows: FieldDiff[] = [
    { key: "name", label: "Name", unit: "", before: before.name, after: after.name, changed: before.name !== after.name, relative: null },
    {
      key: "description",
      label: "Description",
      unit: "",
      before: before.description,
      after: after.description,
      changed: before.description !== after.description,
      relative: null,
    },
    {
      key: "tags",
      label: "Tags",
      unit: "",
      before: beforeTags.join(", "),
      after: afterTags.join(", "),
      changed: beforeTags.join("\u0000") !== afterTags.join("\u0000"),
      relative: null,
    },
  ];
  for (const meta of PARAM_META) {
    const a = before.params[meta.key];
    const b = after.params[meta.key];
    rows.push({
      key: meta.key,
      label: meta.label,
      unit: meta.unit,
      before: formatValue(a),
      after: formatValue(b),
      changed: !sameNumber(a, b),
      relative: describeRelativeChange(a, b),
    });
  }
  // A switch that was never stored is off (its default), so old versions do not show a change.
  for (const meta of FLAG_META) {
    const a = before.params[meta.key] === true;
    const b = after.params[meta.key] === true;
    rows.push({
      key: meta.key,
      label: meta.label,
      unit: "",
      before: formatFlag(a),
      after: formatFlag(b),
      changed: a !== b,
      relative: null,
    });
  }
  // The diamagnetic refinements and the absorption table: absent means the default, so an old version shows no change.
  for (const option of OPTION_ROWS) {
    const a = option.show(before.params);
    const b = option.show(after.params);
    rows.push({ key: option.key, label: option.label, unit: option.unit, before: a, after: b, changed: a !== b, relative: null });
  }
  return rows;
}

const OPTION_ROWS: { key: DiffFieldKey; label: string; unit: string; show: (p: SetSnapshot["params"]) => string }[] = [
  {
    key: "diamagneticAnomaly",
    label: "Diamagnetic anomaly factor γ",
    unit: "",
    show: (p) => (p.diamagneticAnomaly === undefined ? "1 (default)" : formatValue(p.diamagneticAnomaly)),
  },
  {
    key: "diamagneticDispersion",
    label: "Diamagnetic dispersion",
    unit: "",
    show: (p) => (p.diamagneticDispersion === undefined ? "whole (default)" : p.diamagneticDispersion),
  },
  { key: "absorptionTable", label: "Measured absorption table", unit: "", show: (p) => describeAbsorptionTable(p.absorptionTable) },
];

/** "25 rows, 461.604–1620.02 nm" or "none", with a fingerprint of the values so any edit shows as a change. */
export function describeAbsorptionTable(table: ModelParams["absorptionTable"]): string {
  if (!table || table.length === 0) return "none";
  const sum = table.reduce((s, r) => s + r.absorptionPerM * (1 + r.wavelengthNm), 0);
  const span = `${formatValue(table[0]!.wavelengthNm)}–${formatValue(table[table.length - 1]!.wavelengthNm)} nm`;
  return `${table.length} rows, ${span} (Σ ${sum.toPrecision(6)})`;
}

/** A model switch as the diff and the read-only view say it. */
export function formatFlag(on: boolean | undefined): string {
  return on === true ? "on" : "off";
}

export function changedFields(before: SetSnapshot, after: SetSnapshot): FieldDiff[] {
  return diffSnapshots(before, after).filter((row) => row.changed);
}

export interface StaleQuote {
  key: string;
  label: string;
  /** The number as the description writes it. */
  quoted: string;
}

/** Numbers as people write them in a description: 0.005395, 5.395e-3, 6,218e-3, −134. */
const NUMBER_IN_TEXT = /[-−]?\d+(?:[.,]\d+)?(?:[eE][-−+]?\d+)?/g;

/**
 * The model parameters whose old value the (unchanged) description still quotes, when the save
 * changed them: a description written for the old values has gone stale. A quote matches a value
 * when they agree to the digits written (5.395e-3 quotes 0.0053951…), at least three significant.
 */
export function staleDescriptionValues(description: string, before: ModelParams, after: ModelParams): StaleQuote[] {
  const quotes = (description.match(NUMBER_IN_TEXT) ?? []).map((text) => {
    const value = Number(text.replace("−", "-").replace(",", "."));
    const digits = text.replace(/^[-−]/, "").split(/[eE]/)[0]!.replace(/[.,]/, "").replace(/^0+/, "").length;
    return { text, value, digits };
  });
  const out: StaleQuote[] = [];
  for (const meta of PARAM_META) {
    const was = before[meta.key];
    const now = after[meta.key];
    if (typeof was !== "number" || typeof now !== "number" || was === now || was === 0) continue;
    const quote = quotes.find(
      (q) => q.digits >= 3 && Number.isFinite(q.value) && Number(was.toPrecision(q.digits)) === Number(q.value.toPrecision(q.digits)),
    );
    if (quote && Number(now.toPrecision(quote.digits)) !== Number(quote.value.toPrecision(quote.digits))) {
      out.push({ key: meta.key, label: meta.label, quoted: quote.text });
    }
  }
  return out;
}
