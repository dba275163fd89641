"use client";

import { useState } from "react";
import type { FieldDiff } from "@/lib/model/diff";

function withUnit(value: string, unit: string): string {
  return unit && value !== "—" && value !== "" ? `${value} ${unit}` : value || "—";
}

/** Both snapshots side by side; changed rows are tinted and labelled, so colour is not the only cue. */
export function DiffTable({ rows, beforeLabel, afterLabel, caption }: { rows: FieldDiff[]; beforeLabel: string; afterLabel: string; caption: string }) {
  const [onlyChanged, setOnlyChanged] = useState(true);
  const changedCount = rows.filter((r) => r.changed).length;
  const shown = onlyChanged ? rows.filter((r) => r.changed) : rows;

  return (
    <div>
      <div className="mb-2 flex flex-wrap items-center justify-between gap-2 text-sm">
        <p>
          {changedCount === 0 ? "No differences." : `${changedCount} field${changedCount === 1 ? "" : "s"} differ.`}
        </p>
        <label className="inline-flex items-center gap-2">
          <input type="checkbox" checked={onlyChanged} onChange={(event) => setOnlyChanged(event.target.checked)} className="accent-lux" />
          Only changed fields
        </label>
      </div>
      {shown.length > 0 ? (
        <div className="overflow-x-auto rounded-lg border border-ink/10 bg-paper-raised">
          <table className="w-full text-sm">
            <caption className="sr-only">{caption}</caption>
            <thead className="border-b border-ink/10 bg-paper-sunk/70">
              <tr>
                <th scope="col" className="px-3 py-2 text-left font-semibold">
                  Field
                </th>
                <th scope="col" className="px-3 py-2 text-left font-semibold">
                  {beforeLabel}
                </th>
                <th scope="col" className="px-3 py-2 text-left font-semibold">
                  {afterLabel}
                </th>
              </tr>
            </thead>
            <tbody className="divide-y divide-ink/10">
              {shown.map((row) => (
                <tr key={row.key} className={row.changed ? "bg-ember-light/60" : ""}>
                  <th scope="row" className="px-3 py-2 text-left font-medium">
                    {row.label}
                    {row.changed ? <span className="ml-2 rounded bg-ember px-1.5 py-0.5 text-xs font-semibold text-white">changed</span> : null}
                  </th>
                  <td className="px-3 py-2 break-words tabular-nums">{withUnit(row.before, row.unit)}</td>
                  <td className={`px-3 py-2 break-words tabular-nums ${row.changed ? "font-semibold" : ""}`}>{withUnit(row.after, row.unit)}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      ) : null}
    </div>
  );
}
