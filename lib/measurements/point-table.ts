import type { EditablePointField, PointChange, StoredPoint } from "@/lib/contracts/measurement-sets";
import { fmtStored } from "@/lib/workbench/format";
import { EDITABLE_POINT_FIELDS } from "./point";

/*
 * The measurement-set page's table logic, pure so it is tested without a browser: sorting, the
 * text columns a set carries, turning an edited row into the change the API takes, and the words
 * for a revision's changes.
 */

export const POINT_SORT_KEYS = ["line", ...EDITABLE_POINT_FIELDS, "masked"] as const;
export type PointSortKey = (typeof POINT_SORT_KEYS)[number];

export function sortPoints(points: readonly StoredPoint[], key: PointSortKey, dir: "asc" | "desc"): StoredPoint[] {
  const sign = dir === "asc" ? 1 : -1;
  const value = (p: StoredPoint) => (key === "masked" ? Number(p.masked) : p[key]);
  return [...points].sort((a, b) => sign * (value(a) - value(b)) || a.ordinal - b.ordinal);
}

/** The names of the file's extra text columns, in first-seen order. */
export function extraColumns(points: readonly StoredPoint[]): string[] {
  const seen = new Set<string>();
  for (const p of points) for (const key of Object.keys(p.extra ?? {})) seen.add(key);
  return [...seen];
}

export const FIELD_LABELS: Record<EditablePointField, string> = {
  wavelengthNm: "wavelength (nm)",
  value: "value",
  sigma: "σ",
  temperatureK: "temperature (K)",
  fieldT: "field (T)",
  lengthM: "length (m)",
};

export interface PointDraft {
  masked: boolean;
  maskReason: string;
  note: string;
  values: Record<EditablePointField, string>;
}

export function draftOf(point: StoredPoint): PointDraft {
  return {
    masked: point.masked,
    maskReason: point.maskReason ?? "",
    note: point.note,
    values: Object.fromEntries(EDITABLE_POINT_FIELDS.map((f) => [f, fmtStored(point[f])])) as Record<EditablePointField, string>,
  };
}

/**
 * The change that turns `point` into `draft`, or the field messages that stop it (a value that is
 * not a number, a mask without a reason). Null change: the draft equals the point.
 */
export function changeFromDraft(
  point: StoredPoint,
  draft: PointDraft,
): { change: PointChange | null; errors: Partial<Record<EditablePointField | "maskReason", string>> } {
  const errors: Partial<Record<EditablePointField | "maskReason", string>> = {};
  const change: PointChange = { ordinal: point.ordinal };
  if (draft.masked !== point.masked) change.masked = draft.masked;
  if (draft.masked) {
    const reason = draft.maskReason.trim();
    if (reason === "") errors.maskReason = "Say why the point is masked.";
    else if (reason !== (point.maskReason ?? "")) change.maskReason = reason;
  }
  if (draft.note.trim() !== point.note) change.note = draft.note.trim();
  const values: Partial<Record<EditablePointField, number>> = {};
  for (const field of EDITABLE_POINT_FIELDS) {
    const text = draft.values[field].trim().replace(",", ".");
    const number = Number(text);
    if (text === "" || !Number.isFinite(number)) {
      errors[field] = "Enter a number.";
      continue;
    }
    // Shown rounded (fmtStored), so an untouched box must not count as a change of the last bits.
    if (text !== fmtStored(point[field]) && number !== point[field]) values[field] = number;
  }
  if (Object.keys(values).length > 0) change.values = values;
  if (Object.keys(errors).length > 0) return { change: null, errors };
  return { change: Object.keys(change).length > 1 ? change : null, errors };
}

/** The change that undoes `change` on the point as it was before it. */
export function undoOf(before: StoredPoint, change: PointChange): PointChange {
  const undo: PointChange = { ordinal: before.ordinal };
  if (change.masked !== undefined || change.maskReason !== undefined) {
    undo.masked = before.masked;
    if (before.masked && before.maskReason) undo.maskReason = before.maskReason;
  }
  if (change.note !== undefined) undo.note = before.note;
  if (change.values) {
    undo.values = Object.fromEntries(Object.keys(change.values).map((f) => [f, before[f as EditablePointField]]));
  }
  return undo;
}

const show = (v: unknown) => (v === null || v === "" ? "—" : typeof v === "number" ? fmtStored(v) : String(v));

/** The order a revision's changes are told in (the stored JSON keeps no key order: PostgreSQL's jsonb sorts them). */
const CHANGE_ORDER: string[] = ["masked", "maskReason", "note", ...EDITABLE_POINT_FIELDS];
const rank = (field: string) => (CHANGE_ORDER.includes(field) ? CHANGE_ORDER.indexOf(field) : CHANGE_ORDER.length);

/** "masked; reason “laser drift”; σ 2 → 3" */
export function describeChanges(changes: Record<string, { from: unknown; to: unknown }>): string {
  const parts: string[] = [];
  const fields = Object.keys(changes).sort((a, b) => rank(a) - rank(b));
  for (const field of fields) {
    const { from, to } = changes[field]!;
    if (field === "masked") parts.push(to ? "masked" : "unmasked");
    else if (field === "maskReason") {
      if (to !== null) parts.push(`reason “${show(to)}”`);
    } else if (field === "note") parts.push(to === "" ? "note removed" : `note “${show(to)}”`);
    else parts.push(`${FIELD_LABELS[field as EditablePointField] ?? field} ${show(from)} → ${show(to)}`);
  }
  return parts.join("; ");
}
