import type { ColumnMapping, Table } from "@/lib/measurements/parse";

const PREVIEW_ROWS = 8;

/** The first rows of the chosen file as read, with their line numbers, so a wrong mapping shows at a glance. */
export function UploadPreviewTable({ table, mapping }: { table: Table; mapping: ColumnMapping }) {
  const mapped = new Set(
    [
      mapping.wavelengthColumn,
      mapping.valueColumn,
      mapping.sigmaColumn,
      mapping.temperatureColumn,
      mapping.fieldColumn,
      mapping.lengthColumn,
    ].filter((c) => c !== null),
  );
  const kept = table.headers.filter((h) => h !== "" && !mapped.has(h));
  return (
    // A region the keyboard can reach, so a preview wider than a phone can be scrolled without a pointer.
    <div role="region" aria-label="Preview of the file" tabIndex={0} className="relative overflow-x-auto rounded-md border border-ink/10">
      <table className="w-full text-xs tabular-nums">
        <caption className="px-2 py-1 text-left text-xs text-ink-soft">
          Preview: the first {Math.min(PREVIEW_ROWS, table.rows.length)} of {table.rows.length} data rows (header on line {table.headerLine}
          ).{kept.length > 0 ? ` Kept with each point as text: ${kept.join(", ")}.` : ""}
        </caption>
        <thead className="bg-paper-sunk/70">
          <tr>
            <th scope="col" className="px-2 py-1 text-left font-semibold">
              line
            </th>
            {table.headers.map((h, i) => (
              <th key={`${h}-${i}`} scope="col" className="px-2 py-1 text-left font-semibold">
                {h || `(column ${i + 1})`}
              </th>
            ))}
          </tr>
        </thead>
        <tbody className="divide-y divide-ink/10">
          {table.rows.slice(0, PREVIEW_ROWS).map((row) => (
            <tr key={row.line}>
              <td className="px-2 py-1 text-ink-soft">{row.line}</td>
              {table.headers.map((_, i) => (
                <td key={i} className="px-2 py-1">
                  {row.cells[i] ?? ""}
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
