import type { ParameterSetSummary } from "@/lib/contracts/parameter-sets";

export type SortKey = "name" | "lab" | "version" | "updated";
export type SortDir = "asc" | "desc";

export const SORT_KEYS: readonly SortKey[] = ["name", "lab", "version", "updated"];

export function parseSort(key: string | null, dir: string | null): { key: SortKey; dir: SortDir } {
  const k = SORT_KEYS.find((s) => s === key) ?? "updated";
  const d: SortDir = dir === "asc" || dir === "desc" ? dir : k === "updated" ? "desc" : "asc";
  return { key: k, dir: d };
}

const collator = new Intl.Collator("en", { sensitivity: "base", numeric: true });

function compare(a: ParameterSetSummary, b: ParameterSetSummary, key: SortKey): number {
  switch (key) {
    case "name":
      return collator.compare(a.name, b.name);
    case "lab":
      return collator.compare(a.labName, b.labName) || collator.compare(a.name, b.name);
    case "version":
      return a.version - b.version;
    case "updated":
      return a.updatedAt.localeCompare(b.updatedAt);
  }
}

export function sortSets(items: readonly ParameterSetSummary[], key: SortKey, dir: SortDir): ParameterSetSummary[] {
  const sign = dir === "asc" ? 1 : -1;
  return [...items].sort((a, b) => sign * compare(a, b, key));
}
