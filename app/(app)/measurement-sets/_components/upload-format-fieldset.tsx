import { SelectField } from "@/components/ui/select-field";
import { describeFormat, type Table, type TableFormat } from "@/lib/measurements/parse";

const DELIMITER_CHOICES: [TableFormat["delimiter"], string][] = [
  ["auto", "Detect"],
  [",", "Commas"],
  ["\t", "Tabs"],
  [";", "Semicolons"],
  ["whitespace", "Spaces (any run)"],
];

const DECIMAL_CHOICES: [TableFormat["decimal"], string][] = [
  ["auto", "Detect"],
  [".", "Point (632.8)"],
  [",", "Comma (632,8)"],
];

/** What the reader detected in the file, in words, with the two choices the user can override. */
export function UploadFormatFieldset({
  id,
  table,
  format,
  onFormat,
}: {
  id: string;
  table: Table;
  format: TableFormat;
  onFormat: (patch: Partial<TableFormat>) => void;
}) {
  return (
    <fieldset className="rounded-md border border-ink/10 p-3">
      <legend className="px-1 text-sm font-semibold">How the file is read</legend>
      <p className="text-sm text-ink-soft" aria-live="polite">
        Read with {describeFormat(table)}.
      </p>
      <div className="mt-2 grid gap-3 sm:grid-cols-2">
        <SelectField
          id={`${id}-delimiter`}
          label="Columns separated by"
          value={format.delimiter}
          onChange={(event) => onFormat({ delimiter: event.target.value as TableFormat["delimiter"] })}
        >
          {DELIMITER_CHOICES.map(([value, label]) => (
            <option key={value} value={value}>
              {label}
            </option>
          ))}
        </SelectField>
        <SelectField
          id={`${id}-decimal`}
          label="Decimal mark"
          value={format.decimal}
          onChange={(event) => onFormat({ decimal: event.target.value as TableFormat["decimal"] })}
        >
          {DECIMAL_CHOICES.map(([value, label]) => (
            <option key={value} value={value}>
              {label}
            </option>
          ))}
        </SelectField>
      </div>
    </fieldset>
  );
}
