import { schemaRows } from "@/lib/api-docs/schema-rows";

/** The fields of one body or answer schema as a table (one per shape when it has several). */
export function FieldTable({ schema, caption }: { schema: Record<string, unknown>; caption: string }) {
  const groups = schemaRows(schema);
  if (groups.every((g) => g.rows.length === 0)) return <p className="text-sm text-ink-soft">{caption}: no fields.</p>;
  return (
    <div className="space-y-3">
      {groups.map((group) => (
        <div key={group.label ?? "only"} className="overflow-x-auto rounded-md border border-ink/10">
          <table className="w-full min-w-[36rem] text-left text-sm">
            <caption className="bg-paper-sunk px-3 py-1.5 text-left text-xs font-semibold text-ink-soft">
              {caption}
              {group.label ? ` when ${group.label}` : ""}
            </caption>
            <thead className="text-xs text-ink-soft">
              <tr>
                <th scope="col" className="px-3 py-1.5 font-medium">
                  Field
                </th>
                <th scope="col" className="px-3 py-1.5 font-medium">
                  Type
                </th>
                <th scope="col" className="px-3 py-1.5 font-medium">
                  Rules
                </th>
              </tr>
            </thead>
            <tbody>
              {group.rows.map((row) => (
                <tr key={row.path} className="border-t border-ink/5 align-top">
                  <td className="px-3 py-1.5 font-mono text-xs whitespace-nowrap" style={{ paddingLeft: `${0.75 + row.depth}rem` }}>
                    {row.path.split(".").at(-1)}
                    {row.required ? null : <span className="ml-1 font-sans text-ink-faint">(optional)</span>}
                  </td>
                  <td className="px-3 py-1.5 font-mono text-xs break-words">{row.type}</td>
                  <td className="px-3 py-1.5 text-xs text-ink-soft">{[...row.rules, row.description].filter(Boolean).join("; ") || "—"}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      ))}
    </div>
  );
}
