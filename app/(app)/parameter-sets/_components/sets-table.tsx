"use client";

import Link from "next/link";
import { DateTime } from "@/components/ui/date-time";
import type { ParameterSetSummary } from "@/lib/contracts/parameter-sets";
import type { SortDir, SortKey } from "./sort";
import { SortHeader } from "@/components/ui/sort-header";

interface SetsTableProps {
  items: ParameterSetSummary[];
  sortKey: SortKey;
  sortDir: SortDir;
  onSort: (key: SortKey) => void;
  activeTag: string;
  onTag: (tag: string) => void;
}

export function SetsTable({ items, sortKey, sortDir, onSort, activeTag, onTag }: SetsTableProps) {
  const headerProps = { sortKey, sortDir, onSort };
  return (
    <div className="relative overflow-x-auto rounded-lg border border-ink/10 bg-paper-raised">
      <table className="w-full text-sm">
        <caption className="sr-only">Parameter sets. Column headers with buttons sort the table.</caption>
        <thead className="border-b border-ink/10 bg-paper-sunk/70 text-ink">
          <tr>
            <SortHeader label="Name" column="name" {...headerProps} />
            <SortHeader label="Lab" column="lab" {...headerProps} />
            <th scope="col" className="px-3 py-2 text-left font-semibold">
              Tags
            </th>
            <SortHeader label="Version" column="version" {...headerProps} />
            <SortHeader label="Updated" column="updated" {...headerProps} />
            <th scope="col" className="px-3 py-2 text-left font-semibold">
              <span className="sr-only">Actions</span>
            </th>
          </tr>
        </thead>
        <tbody className="divide-y divide-ink/10">
          {items.map((set) => (
            <tr key={set.id} className="align-top hover:bg-paper">
              <td className="px-3 py-2.5">
                <Link href={`/parameter-sets/${set.id}`} className="font-medium text-lux-dark underline-offset-4 hover:underline">
                  {set.name}
                </Link>
                {set.description ? <p className="mt-0.5 line-clamp-1 max-w-md text-xs text-ink-soft">{set.description}</p> : null}
              </td>
              <td className="px-3 py-2.5 text-ink-soft">{set.labName}</td>
              <td className="px-3 py-2.5">
                <ul className="flex flex-wrap gap-1" aria-label={`Tags of ${set.name}`}>
                  {set.tags.map((tag) => (
                    <li key={tag}>
                      <button
                        type="button"
                        onClick={() => onTag(tag)}
                        aria-pressed={tag === activeTag}
                        aria-label={tag === activeTag ? `Tag ${tag}, filtering; remove filter` : `Show only sets tagged ${tag}`}
                        className={`rounded-full border px-2 py-0.5 text-xs ${
                          tag === activeTag
                            ? "border-lux bg-lux text-white"
                            : "border-lux/40 bg-lux-light/50 text-lux-dark hover:border-lux"
                        }`}
                      >
                        {tag}
                      </button>
                    </li>
                  ))}
                </ul>
              </td>
              <td className="px-3 py-2.5 tabular-nums">v{set.version}</td>
              <td className="px-3 py-2.5 whitespace-nowrap">
                <DateTime iso={set.updatedAt} />
                <span className="block text-xs text-ink-soft">by {set.updatedBy.name}</span>
              </td>
              <td className="px-3 py-2.5 whitespace-nowrap">
                <Link href={`/workbench/${set.id}`} className="text-sm text-lux-dark underline-offset-4 hover:underline">
                  Open in workbench<span className="sr-only">: {set.name}</span>
                </Link>
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
