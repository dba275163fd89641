import type { ReactNode } from "react";
import { SelectField } from "@/components/ui/select-field";
import { TextField } from "@/components/ui/text-field";
import type { ColumnMapping } from "@/lib/measurements/parse";
import { unitsOf, VALUE_UNIT_LABEL, WAVELENGTH_UNIT_LABEL, type ValueUnit, type WavelengthUnit } from "@/lib/measurements/units";
import { X_UNITS } from "@/lib/workbench/units";
import type { DefaultDrafts, DefaultErrors } from "./use-upload-draft";

const NONE = "";

/** The quantities a file may hold in a column or have typed once for every row, in the order shown. */
const PER_FILE: {
  idSuffix: string;
  column: "sigmaColumn" | "temperatureColumn" | "fieldColumn" | "lengthColumn";
  draft: keyof DefaultDrafts;
  columnLabel: string;
  noneLabel?: string;
  valueLabel: string;
}[] = [
  {
    idSuffix: "sigma",
    column: "sigmaColumn",
    draft: "relativeSigmaPercent",
    columnLabel: "σ column (same unit as the values)",
    noneLabel: "— one relative σ for the file —",
    valueLabel: "Relative σ for the whole file (%)",
  },
  {
    idSuffix: "temperature",
    column: "temperatureColumn",
    draft: "temperatureK",
    columnLabel: "Temperature column (K)",
    valueLabel: "Temperature for the whole file (K)",
  },
  {
    idSuffix: "field",
    column: "fieldColumn",
    draft: "fieldT",
    columnLabel: "Field column (T)",
    valueLabel: "Field for the whole file (T)",
  },
  {
    idSuffix: "length",
    column: "lengthColumn",
    draft: "lengthM",
    columnLabel: "Sample length column (m)",
    valueLabel: "Sample length for the whole file (m)",
  },
];

/** Which column holds what, in which unit, and the values typed once for columns the file lacks. */
export function UploadMappingFieldset({
  id,
  columns,
  mapping,
  drafts,
  errors,
  onMapping,
  onDefault,
}: {
  /** Prefix of the controls' ids. */
  id: string;
  columns: string[];
  mapping: ColumnMapping;
  drafts: DefaultDrafts;
  errors: DefaultErrors | undefined;
  onMapping: (patch: Partial<ColumnMapping>) => void;
  onDefault: (key: keyof DefaultDrafts, value: string) => void;
}) {
  return (
    <fieldset className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
      <legend className="mb-2 text-sm font-semibold">Column mapping (proposed from the header; change what is wrong)</legend>
      <Pair>
        <SelectField
          id={`${id}-wl-col`}
          label="Wavelength column"
          value={mapping.wavelengthColumn ?? NONE}
          onChange={(e) => onMapping({ wavelengthColumn: e.target.value || null })}
        >
          <option value={NONE}>— choose —</option>
          <ColumnOptions columns={columns} />
        </SelectField>
        <SelectField
          id={`${id}-wl-unit`}
          label="Wavelength unit"
          value={mapping.wavelengthUnit}
          onChange={(e) => onMapping({ wavelengthUnit: e.target.value as WavelengthUnit })}
        >
          {X_UNITS.map((u) => (
            <option key={u} value={u}>
              {WAVELENGTH_UNIT_LABEL[u]}
            </option>
          ))}
        </SelectField>
      </Pair>
      <Pair>
        <SelectField
          id={`${id}-quantity`}
          label="Measured quantity"
          value={mapping.quantity}
          onChange={(e) => {
            const quantity = e.target.value === "rotation" ? "rotation" : "verdet";
            onMapping({ quantity, valueUnit: unitsOf(quantity).includes(mapping.valueUnit) ? mapping.valueUnit : unitsOf(quantity)[0]! });
          }}
        >
          <option value="verdet">Verdet constant</option>
          <option value="rotation">Rotation θ</option>
        </SelectField>
        <SelectField
          id={`${id}-value-unit`}
          label="Value unit"
          value={mapping.valueUnit}
          onChange={(e) => onMapping({ valueUnit: e.target.value as ValueUnit })}
        >
          {unitsOf(mapping.quantity).map((u) => (
            <option key={u} value={u}>
              {VALUE_UNIT_LABEL[u]}
            </option>
          ))}
        </SelectField>
      </Pair>
      <SelectField
        id={`${id}-value-col`}
        label="Value column"
        value={mapping.valueColumn ?? NONE}
        onChange={(e) => onMapping({ valueColumn: e.target.value || null })}
      >
        <option value={NONE}>— choose —</option>
        <ColumnOptions columns={columns} />
      </SelectField>
      {PER_FILE.map((row) => (
        <ColumnOrValue
          key={row.idSuffix}
          id={`${id}-${row.idSuffix}`}
          columnLabel={row.columnLabel}
          noneLabel={row.noneLabel}
          valueLabel={row.valueLabel}
          columns={columns}
          column={mapping[row.column]}
          onColumn={(c) => onMapping({ [row.column]: c })}
          value={drafts[row.draft]}
          onValue={(v) => onDefault(row.draft, v)}
          error={errors?.[row.draft]}
        />
      ))}
    </fieldset>
  );
}

function Pair({ children }: { children: ReactNode }) {
  return <div className="grid grid-cols-[minmax(0,3fr)_minmax(0,2fr)] gap-2">{children}</div>;
}

function ColumnOptions({ columns }: { columns: string[] }) {
  return columns.map((h) => (
    <option key={h} value={h}>
      {h}
    </option>
  ));
}

/** A column of the file, or (when none is chosen) one value typed once for every row. */
function ColumnOrValue(props: {
  id: string;
  columnLabel: string;
  noneLabel?: string;
  valueLabel: string;
  columns: string[];
  column: string | null;
  onColumn: (column: string | null) => void;
  value: string;
  onValue: (value: string) => void;
  error?: string;
}) {
  return (
    <div className="space-y-2">
      <SelectField
        id={`${props.id}-col`}
        label={props.columnLabel}
        value={props.column ?? NONE}
        onChange={(e) => props.onColumn(e.target.value || null)}
      >
        <option value={NONE}>{props.noneLabel ?? "— not in the file: enter one value —"}</option>
        <ColumnOptions columns={props.columns} />
      </SelectField>
      {props.column === null ? (
        <TextField
          id={`${props.id}-value`}
          label={props.valueLabel}
          inputMode="decimal"
          value={props.value}
          onChange={(e) => props.onValue(e.target.value)}
          error={props.error}
        />
      ) : null}
    </div>
  );
}
