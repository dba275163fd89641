"use client";

import { useState } from "react";
import type { FieldDiff } from "@/lib/model/diff";
import { agree, countOf, noun } from "@/lib/text/plural";

function withUnit(value: string, unit: string): string {
  return unit && value !== "—" && value !== "" ? `${value} ${unit}` : value || "—";
}

/**
 * One row per field. A changed field reads as a sentence: old value → new value, each with its
 * unit, and beside it how much a number moved relative to where it was. The arrow and the words
 * carry the change; the tint of the row only repeats it.
 */
export function DiffTable({
  rows,
  beforeLabel,
  afterLabel,
  caption,
}: {
  rows: FieldDiff[];
  beforeLabel: string;
  afterLabel: string;
  caption: string;
}) {
  const [onlyChanged, setOnlyChanged] = useState(true);
  const changedCount = rows.filter((r) => r.changed).length;
  const shown = onlyChanged ? rows.filter((r) => r.changed) : rows;

  return (
    <div>
      <div className="mb-2 flex flex-wrap items-center justify-between gap-2 text-sm">
        <p>
          {changedCount === 0 ? "No differences." : `${countOf(changedCount, noun("field"))} ${agree(changedCount, "differs", "differ")}.`}
        </p>
        <label className="inline-flex items-center gap-2">
          <input type="checkbox" checked={onlyChanged} onChange={(event) => setOnlyChanged(event.target.checked)} className="accent-lux" />
          Only changed fields
        </label>
      </div>
      {shown.length > 0 ? (
        <div className="relative overflow-x-auto rounded-lg border border-ink/10 bg-paper-raised">
          <table className="w-full text-sm">
            <caption className="sr-only">{caption}</caption>
            <thead className="border-b border-ink/10 bg-paper-sunk/70">
              <tr>
                <th scope="col" className="px-3 py-2 text-left font-semibold">
                  Field
                </th>
                <th scope="col" className="px-3 py-2 text-left font-semibold">
                  {beforeLabel} <span aria-hidden="true">→</span>
                  <span className="sr-only">to</span> {afterLabel}
                </th>
                <th scope="col" className="px-3 py-2 text-right font-semibold">
                  Relative change
                </th>
              </tr>
            </thead>
            <tbody className="divide-y divide-ink/10">
              {shown.map((row) => (
                <tr key={row.key} className={row.changed ? "bg-lux-light/40" : ""}>
                  <th
                    scope="row"
                    className={`border-l-4 px-3 py-2 text-left align-top font-medium ${row.changed ? "border-lux" : "border-transparent"}`}
                  >
                    {row.label}
                  </th>
                  <td className="px-3 py-2 break-words tabular-nums [overflow-wrap:anywhere]">
                    {row.changed ? (
                      <>
                        <span className="text-ink-soft">{withUnit(row.before, row.unit)}</span>
                        <span aria-hidden="true" className="px-1.5 text-lux-dark">
                          →
                        </span>
                        <span className="sr-only"> changed to </span>
                        <span>{withUnit(row.after, row.unit)}</span>
                      </>
                    ) : (
                      <>
                        {withUnit(row.after, row.unit)}
                        <span className="sr-only"> (unchanged)</span>
                      </>
                    )}
                  </td>
                  <td className="px-3 py-2 text-right whitespace-nowrap tabular-nums text-ink-soft">
                    {row.relative ?? (row.changed ? "edited" : "")}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      ) : null}
    </div>
  );
}
