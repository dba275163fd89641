"use client";

import { useState } from "react";
import { SortHeader } from "@/components/ui/sort-header";
import type { EditablePointField, StoredPoint } from "@/lib/contracts/measurement-sets";
import { extraColumns, type PointSortKey, sortPoints } from "@/lib/measurements/point-table";
import { fmtStored } from "@/lib/workbench/format";

/** The points of a set, sortable by every numeric column, with their text columns, notes and mask. */
export function PointsTable({
  points,
  unit,
  canEdit,
  editing,
  onEdit,
}: {
  points: StoredPoint[];
  unit: string;
  canEdit: boolean;
  editing: number | null;
  onEdit: (ordinal: number) => void;
}) {
  const [sortKey, setSortKey] = useState<PointSortKey>("line");
  const [sortDir, setSortDir] = useState<"asc" | "desc">("asc");
  const onSort = (key: PointSortKey) => {
    setSortDir(key === sortKey && sortDir === "asc" ? "desc" : "asc");
    setSortKey(key);
  };
  const headerProps = { sortKey, sortDir, onSort };
  const texts = extraColumns(points);
  const sorted = sortPoints(points, sortKey, sortDir);
  const num = (p: StoredPoint, field: EditablePointField) => {
    const was = p.original?.[field];
    return (
      <td className="px-3 py-2 whitespace-nowrap tabular-nums">
        {fmtStored(p[field])}
        {was !== undefined ? <span className="block text-xs text-ember">edited, was {fmtStored(was)}</span> : null}
      </td>
    );
  };
  return (
    <div className="relative overflow-x-auto rounded-lg border border-ink/10 bg-paper-raised">
      <table className="w-full text-sm">
        <caption className="sr-only">Points of the set. Column headers with buttons sort the table.</caption>
        <thead className="border-b border-ink/10 bg-paper-sunk/70">
          <tr>
            <SortHeader label="Line" column="line" {...headerProps} />
            <SortHeader label="λ (nm)" column="wavelengthNm" {...headerProps} />
            <SortHeader label={`Value (${unit})`} column="value" {...headerProps} />
            <SortHeader label="σ" column="sigma" {...headerProps} />
            <SortHeader label="T (K)" column="temperatureK" {...headerProps} />
            <SortHeader label="B (T)" column="fieldT" {...headerProps} />
            <SortHeader label="L (m)" column="lengthM" {...headerProps} />
            {texts.map((name) => (
              <th key={name} scope="col" className="px-3 py-2 text-left font-semibold">
                {name}
              </th>
            ))}
            <SortHeader label="Status" column="masked" {...headerProps} />
            <th scope="col" className="px-3 py-2 text-left font-semibold">
              Note
            </th>
            {canEdit ? (
              <th scope="col" className="px-3 py-2 text-left font-semibold">
                <span className="sr-only">Actions</span>
              </th>
            ) : null}
          </tr>
        </thead>
        <tbody className="divide-y divide-ink/10">
          {sorted.map((p) => (
            <tr key={p.ordinal} className={`align-top ${p.masked ? "bg-paper-sunk text-ink-soft" : ""}`} data-testid="point-row">
              <td className="px-3 py-2 tabular-nums">{p.line}</td>
              {num(p, "wavelengthNm")}
              {num(p, "value")}
              {num(p, "sigma")}
              {num(p, "temperatureK")}
              {num(p, "fieldT")}
              {num(p, "lengthM")}
              {texts.map((name) => (
                <td key={name} className="px-3 py-2">
                  {p.extra?.[name] ?? ""}
                </td>
              ))}
              <td className="px-3 py-2">
                {p.masked ? (
                  <>
                    <span className="font-medium text-ember">Masked</span>
                    {p.maskReason ? <span className="block text-xs">{p.maskReason}</span> : null}
                  </>
                ) : (
                  "Used"
                )}
              </td>
              <td className="max-w-56 px-3 py-2 text-xs break-words">{p.note}</td>
              {canEdit ? (
                <td className="px-3 py-2">
                  <button
                    type="button"
                    className="text-lux-dark underline-offset-4 hover:underline disabled:text-ink-faint"
                    onClick={() => onEdit(p.ordinal)}
                    disabled={editing === p.ordinal}
                    aria-label={`Edit the point on line ${p.line}`}
                  >
                    Edit
                  </button>
                </td>
              ) : null}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
