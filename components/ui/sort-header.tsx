/** A sortable column header: the whole label is a button, and aria-sort tells the current order. */
export function SortHeader<K extends string>({
  label,
  column,
  sortKey,
  sortDir,
  onSort,
}: {
  label: string;
  column: K;
  sortKey: K;
  sortDir: "asc" | "desc";
  onSort: (column: K) => void;
}) {
  const active = column === sortKey;
  return (
    <th
      scope="col"
      aria-sort={active ? (sortDir === "asc" ? "ascending" : "descending") : "none"}
      className="px-3 py-2 text-left font-semibold"
    >
      <button type="button" onClick={() => onSort(column)} className="inline-flex items-center gap-1 rounded hover:text-lux-dark">
        {label}
        <span aria-hidden="true" className={active ? "text-lux" : "text-ink-faint"}>
          {active ? (sortDir === "asc" ? "▲" : "▼") : "↕"}
        </span>
      </button>
    </th>
  );
}
