import type { MeasurementSetSummary } from "@/lib/contracts/measurement-sets";
import { fmt } from "@/lib/workbench/format";

/** "77, 293.15 K"; long lists are shortened to their ends and a count. */
export function formatValues(values: readonly number[], unit: string): string {
  if (values.length === 0) return "—";
  if (values.length > 4) return `${values.length} values, ${fmt(values[0], 4)}–${fmt(values[values.length - 1], 4)} ${unit}`;
  return `${values.map((v) => fmt(v, 5)).join(", ")} ${unit}`;
}

export function formatSpan(set: MeasurementSetSummary): string {
  const { min, max } = set.wavelengthSpanNm;
  return min === max ? `${fmt(min, 5)} nm` : `${fmt(min, 5)}–${fmt(max, 5)} nm`;
}

export function formatBytes(bytes: number): string {
  if (bytes < 1024) return `${bytes} B`;
  if (bytes < 1024 * 1024) return `${(bytes / 1024).toFixed(1)} KiB`;
  return `${(bytes / 1024 / 1024).toFixed(2)} MiB`;
}

export type SortKey = "name" | "rows" | "span" | "uploaded";
export type SortDir = "asc" | "desc";

export function parseSort(key: string | null, dir: string | null): { key: SortKey; dir: SortDir } {
  const k: SortKey = key === "name" || key === "rows" || key === "span" || key === "uploaded" ? key : "uploaded";
  const d: SortDir = dir === "asc" || dir === "desc" ? dir : k === "uploaded" ? "desc" : "asc";
  return { key: k, dir: d };
}

export function sortSets(items: readonly MeasurementSetSummary[], key: SortKey, dir: SortDir): MeasurementSetSummary[] {
  const by: Record<SortKey, (a: MeasurementSetSummary, b: MeasurementSetSummary) => number> = {
    name: (a, b) => a.name.localeCompare(b.name, "en", { sensitivity: "base", numeric: true }),
    rows: (a, b) => a.rowCount - b.rowCount,
    span: (a, b) => a.wavelengthSpanNm.min - b.wavelengthSpanNm.min || a.wavelengthSpanNm.max - b.wavelengthSpanNm.max,
    uploaded: (a, b) => a.createdAt.localeCompare(b.createdAt),
  };
  const sign = dir === "asc" ? 1 : -1;
  return [...items].sort((a, b) => sign * by[key](a, b) || a.id.localeCompare(b.id));
}
