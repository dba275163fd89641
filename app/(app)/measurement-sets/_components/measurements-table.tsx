"use client";

import Link from "next/link";
import { DateTime } from "@/components/ui/date-time";
import { originalFileUrl } from "@/lib/query/measurement-sets";
import type { MeasurementSetSummary } from "@/lib/contracts/measurement-sets";
import { roleAtLeast } from "@/lib/contracts/roles";
import { formatBytes, formatSpan, formatValues, type SortDir, type SortKey } from "./format";
import { SortHeader } from "@/components/ui/sort-header";

interface TableProps {
  items: MeasurementSetSummary[];
  sortKey: SortKey;
  sortDir: SortDir;
  onSort: (key: SortKey) => void;
  onDelete: (set: MeasurementSetSummary) => void;
}

export function MeasurementsTable({ items, sortKey, sortDir, onSort, onDelete }: TableProps) {
  const headerProps = { sortKey, sortDir, onSort };
  return (
    <div className="relative overflow-x-auto rounded-lg border border-ink/10 bg-paper-raised">
      <table className="w-full text-sm">
        <caption className="sr-only">Measurement sets. Column headers with buttons sort the table.</caption>
        <thead className="border-b border-ink/10 bg-paper-sunk/70 text-ink">
          <tr>
            <SortHeader label="Name" column="name" {...headerProps} />
            <SortHeader label="Rows" column="rows" {...headerProps} />
            <SortHeader label="Wavelength span" column="span" {...headerProps} />
            <th scope="col" className="px-3 py-2 text-left font-semibold">
              Temperatures
            </th>
            <th scope="col" className="px-3 py-2 text-left font-semibold">
              Fields
            </th>
            <SortHeader label="Uploaded" column="uploaded" {...headerProps} />
            <th scope="col" className="px-3 py-2 text-left font-semibold">
              <span className="sr-only">Actions</span>
            </th>
          </tr>
        </thead>
        <tbody className="divide-y divide-ink/10">
          {items.map((set) => (
            <tr key={set.id} className="align-top hover:bg-paper">
              <td className="px-3 py-2.5">
                <Link href={`/measurement-sets/${set.id}`} className="font-medium text-lux-dark underline-offset-4 hover:underline">
                  {set.name}
                </Link>
                <span className="mt-0.5 block text-xs text-ink-soft">
                  {set.sample ? `${set.sample} · ` : ""}
                  {set.quantity === "verdet" ? "Verdet constant" : "rotation"} · {set.labName}
                  {set.maskedCount > 0 ? ` · ${set.maskedCount} masked` : ""}
                  {set.revision > 1 ? ` · revision ${set.revision}` : ""}
                </span>
              </td>
              <td className="px-3 py-2.5 tabular-nums">{set.rowCount.toLocaleString("en")}</td>
              <td className="px-3 py-2.5 whitespace-nowrap tabular-nums">{formatSpan(set)}</td>
              <td className="px-3 py-2.5 tabular-nums">{formatValues(set.temperaturesK, "K")}</td>
              <td className="px-3 py-2.5 tabular-nums">{formatValues(set.fieldsT, "T")}</td>
              <td className="px-3 py-2.5 whitespace-nowrap">
                <DateTime iso={set.createdAt} />
                <span className="block text-xs text-ink-soft">by {set.uploadedBy.name}</span>
              </td>
              <td className="px-3 py-2.5 whitespace-nowrap">
                <a
                  href={originalFileUrl(set.id)}
                  download={set.fileName}
                  className="text-sm text-lux-dark underline-offset-4 hover:underline"
                >
                  Download original<span className="sr-only">: {set.fileName}</span>
                </a>
                <span className="block text-xs text-ink-soft">
                  {set.fileName} · {formatBytes(set.fileBytes)}
                </span>
                {roleAtLeast(set.role, "editor") ? (
                  <button
                    type="button"
                    onClick={() => onDelete(set)}
                    className="mt-1 text-sm text-ember underline-offset-4 hover:underline"
                  >
                    Delete<span className="sr-only"> {set.name}</span>
                  </button>
                ) : null}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
