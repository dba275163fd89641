import type { ModelParamKey } from "@/lib/physics/schema";
import { formatNumberInput } from "./number-text";
import { PARAM_META } from "./param-meta";

/*
 * Field-by-field comparison of two snapshots of a parameter set, for the history page and the
 * "someone else saved" conflict banner. Pure, so it is unit-tested without a browser.
 */

/** The parts of a parameter set a person edits; params may be partial while a form is half filled. */
export interface SetSnapshot {
  name: string;
  description: string;
  tags: readonly string[];
  params: Partial<Record<ModelParamKey, number>>;
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
}

/**
 * Numbers as a scientist writes them: plain in the everyday range, otherwise scientific with "e"
 * (1.2726e28, 1e14, 2.5e-5), and never rounded, so two different stored values never print alike.
 */
export function formatValue(value: number | undefined): string {
  if (value === undefined || Number.isNaN(value)) return "—";
  return formatNumberInput(value);
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
    { key: "name", label: "Name", unit: "", before: before.name, after: after.name, changed: before.name !== after.name },
    {
      key: "description",
      label: "Description",
      unit: "",
      before: before.description,
      after: after.description,
      changed: before.description !== after.description,
    },
    {
      key: "tags",
      label: "Tags",
      unit: "",
      before: beforeTags.join(", "),
      after: afterTags.join(", "),
      changed: beforeTags.join("\u0000") !== afterTags.join("\u0000"),
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
    });
  }
  return rows;
}

export function changedFields(before: SetSnapshot, after: SetSnapshot): FieldDiff[] {
  return diffSnapshots(before, after).filter((row) => row.changed);
}
