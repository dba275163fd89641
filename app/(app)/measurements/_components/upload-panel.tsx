"use client";

import { useId, useMemo, useRef, useState, type DragEvent, type ReactNode } from "react";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { INPUT_CLASS } from "@/components/ui/text-field";
import { uploadMeasurementMetaSchema } from "@/lib/contracts/measurement-sets";
import { zodIssueFields } from "@/lib/contracts/validation";
import {
  MAX_FILE_BYTES,
  MAX_ROWS,
  parseMeasurementTable,
  proposeMapping,
  readTable,
  type ColumnMapping,
  type FileDefaults,
  type Table,
} from "@/lib/measurements/parse";
import { unitsOf, VALUE_UNIT_LABEL, WAVELENGTH_UNIT_LABEL, type ValueUnit, type WavelengthUnit } from "@/lib/measurements/units";
import { X_UNITS } from "@/lib/workbench/units";
import { describeError } from "@/lib/query/fetcher";
import type { LabSummary } from "@/lib/contracts/labs";
import { uploadProblems, useUploadMeasurementSet } from "@/lib/query/measurements";
import { formatBytes } from "./format";

const PREVIEW_ROWS = 8;
const NONE = "";

interface Loaded {
  file: File;
  text: string;
  table: Table;
}

interface DefaultDrafts {
  relativeSigmaPercent: string;
  temperatureK: string;
  fieldT: string;
  lengthM: string;
}

const EMPTY_DEFAULTS: DefaultDrafts = { relativeSigmaPercent: "", temperatureK: "", fieldT: "", lengthM: "" };

/** Empty text → not given; anything else must be a number (the parser and the server check ranges). */
function readDefaults(
  drafts: DefaultDrafts,
  mapping: ColumnMapping,
): { defaults: FileDefaults; errors: Partial<Record<keyof DefaultDrafts, string>> } {
  const errors: Partial<Record<keyof DefaultDrafts, string>> = {};
  const num = (key: keyof DefaultDrafts, used: boolean): number | undefined => {
    const text = drafts[key].trim();
    if (!used || text === "") return undefined;
    const value = Number(text);
    if (!Number.isFinite(value)) errors[key] = "Enter a number.";
    return Number.isFinite(value) ? value : undefined;
  };
  const percent = num("relativeSigmaPercent", mapping.sigmaColumn === null);
  const defaults: FileDefaults = {
    relativeSigma: percent === undefined ? undefined : percent / 100,
    temperatureK: num("temperatureK", mapping.temperatureColumn === null),
    fieldT: num("fieldT", mapping.fieldColumn === null),
    lengthM: num("lengthM", mapping.lengthColumn === null),
  };
  return { defaults: Object.fromEntries(Object.entries(defaults).filter(([, v]) => v !== undefined)) as FileDefaults, errors };
}

const baseName = (fileName: string) =>
  fileName
    .replace(/\.[^.]+$/, "")
    .replace(/[_-]+/g, " ")
    .trim();

export function UploadPanel({
  labs,
  defaultLabId,
  onDone,
  onCancel,
}: {
  labs: LabSummary[];
  defaultLabId: string;
  onDone: (name: string) => void;
  onCancel: () => void;
}) {
  const id = useId();
  const problemsRef = useRef<HTMLDivElement>(null);
  const [loaded, setLoaded] = useState<Loaded | null>(null);
  const [fileError, setFileError] = useState<string | null>(null);
  const [dragging, setDragging] = useState(false);
  const [mapping, setMapping] = useState<ColumnMapping | null>(null);
  const [drafts, setDrafts] = useState<DefaultDrafts>(EMPTY_DEFAULTS);
  const [labId, setLabId] = useState(defaultLabId);
  const [name, setName] = useState("");
  const [sample, setSample] = useState("");
  const [tried, setTried] = useState(false);
  const upload = useUploadMeasurementSet();

  async function accept(file: File | undefined) {
    if (!file) return;
    upload.reset();
    setTried(false);
    if (file.size > MAX_FILE_BYTES) {
      setFileError(`“${file.name}” is ${formatBytes(file.size)}; a measurement file may be at most ${formatBytes(MAX_FILE_BYTES)}.`);
      return;
    }
    let text: string;
    try {
      text = new TextDecoder("utf-8", { fatal: true }).decode(await file.arrayBuffer());
    } catch {
      setFileError(`“${file.name}” is not UTF-8 text. Save it as CSV or TSV in UTF-8 and choose it again.`);
      return;
    }
    const table = readTable(text);
    if (table.headerLine === 0) {
      setFileError(`“${file.name}” is empty: it needs a header line and data rows.`);
      return;
    }
    setFileError(null);
    setLoaded({ file, text, table });
    setMapping(proposeMapping(table.headers));
    setDrafts(EMPTY_DEFAULTS);
    if (name.trim() === "") setName(baseName(file.name));
  }

  const checked = useMemo(() => {
    if (!loaded || !mapping) return null;
    const { defaults, errors } = readDefaults(drafts, mapping);
    return { defaults, fieldErrors: errors, result: parseMeasurementTable(loaded.text, mapping, defaults) };
  }, [loaded, mapping, drafts]);

  const meta = useMemo(
    () => (mapping && checked ? uploadMeasurementMetaSchema.safeParse({ labId, name, sample, mapping, defaults: checked.defaults }) : null),
    [labId, name, sample, mapping, checked],
  );
  const metaErrors = meta && !meta.success ? zodIssueFields(meta.error.issues) : {};

  const serverProblems = uploadProblems(upload.error);
  const problems = serverProblems.length > 0 ? serverProblems : (checked?.result.errors ?? []);
  const patch = (next: Partial<ColumnMapping>) => setMapping((m) => (m ? { ...m, ...next } : m));

  const submit = () => {
    setTried(true);
    if (!loaded || !checked || !meta?.success || checked.result.errors.length > 0 || Object.keys(checked.fieldErrors).length > 0) {
      problemsRef.current?.focus();
      return;
    }
    upload.mutate({ file: loaded.file, meta: meta.data }, { onSuccess: (item) => onDone(item.name) });
  };

  const onDrop = (event: DragEvent<HTMLLabelElement>) => {
    event.preventDefault();
    setDragging(false);
    void accept(event.dataTransfer.files[0]);
  };

  const columnOptions = loaded?.table.headers ?? [];
  const selectClass = `mt-1 ${INPUT_CLASS}`;

  return (
    <section aria-label="Upload measurements" className="mb-6 space-y-5 rounded-lg border border-ink/10 bg-paper-raised p-4 sm:p-5">
      <div className="flex flex-wrap items-start justify-between gap-2">
        <div>
          <h2 className="text-lg font-semibold">Upload measurements</h2>
          <p className="mt-1 text-sm text-ink-soft">
            A CSV or TSV file with a header line, at most {formatBytes(MAX_FILE_BYTES)} and {MAX_ROWS.toLocaleString("en")} rows. Lines
            starting with # are comments. Nothing is stored until every row is valid.
          </p>
        </div>
        <Button variant="secondary" onClick={onCancel} disabled={upload.isPending}>
          Cancel upload
        </Button>
      </div>

      <label
        htmlFor={`${id}-file`}
        onDragOver={(event) => {
          event.preventDefault();
          setDragging(true);
        }}
        onDragLeave={() => setDragging(false)}
        onDrop={onDrop}
        className={`block cursor-pointer rounded-lg border-2 border-dashed px-4 py-6 text-center text-sm ${dragging ? "border-lux bg-lux-light/50" : "border-ink/25"}`}
      >
        <span className="font-medium">Drop a file here, or choose one</span>
        <span className="mt-1 block text-ink-soft">
          {loaded
            ? `${loaded.file.name} · ${formatBytes(loaded.file.size)} · ${loaded.table.rows.length} data rows`
            : "CSV (comma or semicolon) or TSV (tab)"}
        </span>
        <input
          id={`${id}-file`}
          type="file"
          accept=".csv,.tsv,.txt,text/csv,text/tab-separated-values,text/plain"
          aria-label="Measurement file"
          className="mx-auto mt-3 block text-sm"
          onChange={(event) => void accept(event.target.files?.[0])}
        />
      </label>
      {fileError ? (
        <p role="alert" className="text-sm text-ember">
          {fileError}
        </p>
      ) : null}

      {loaded && mapping ? (
        <>
          <div className="overflow-x-auto rounded-md border border-ink/10">
            <table className="w-full text-xs tabular-nums">
              <caption className="px-2 py-1 text-left text-xs text-ink-soft">
                Preview: the first {Math.min(PREVIEW_ROWS, loaded.table.rows.length)} of {loaded.table.rows.length} data rows (header on
                line {loaded.table.headerLine})
              </caption>
              <thead className="bg-paper-sunk/70">
                <tr>
                  <th scope="col" className="px-2 py-1 text-left font-semibold">
                    line
                  </th>
                  {loaded.table.headers.map((h, i) => (
                    <th key={`${h}-${i}`} scope="col" className="px-2 py-1 text-left font-semibold">
                      {h || `(column ${i + 1})`}
                    </th>
                  ))}
                </tr>
              </thead>
              <tbody className="divide-y divide-ink/10">
                {loaded.table.rows.slice(0, PREVIEW_ROWS).map((row) => (
                  <tr key={row.line}>
                    <td className="px-2 py-1 text-ink-soft">{row.line}</td>
                    {loaded.table.headers.map((_, i) => (
                      <td key={i} className="px-2 py-1">
                        {row.cells[i] ?? ""}
                      </td>
                    ))}
                  </tr>
                ))}
              </tbody>
            </table>
          </div>

          <fieldset className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
            <legend className="mb-2 text-sm font-semibold">Column mapping (proposed from the header; change what is wrong)</legend>
            <Pair>
              <Select
                id={`${id}-wl-col`}
                label="Wavelength column"
                value={mapping.wavelengthColumn ?? NONE}
                onChange={(v) => patch({ wavelengthColumn: v || null })}
                className={selectClass}
              >
                <option value={NONE}>— choose —</option>
                {columnOptions.map((h) => (
                  <option key={h} value={h}>
                    {h}
                  </option>
                ))}
              </Select>
              <Select
                id={`${id}-wl-unit`}
                label="Wavelength unit"
                value={mapping.wavelengthUnit}
                onChange={(v) => patch({ wavelengthUnit: v as WavelengthUnit })}
                className={selectClass}
              >
                {X_UNITS.map((u) => (
                  <option key={u} value={u}>
                    {WAVELENGTH_UNIT_LABEL[u]}
                  </option>
                ))}
              </Select>
            </Pair>
            <Pair>
              <Select
                id={`${id}-quantity`}
                label="Measured quantity"
                value={mapping.quantity}
                onChange={(v) => {
                  const quantity = v === "rotation" ? "rotation" : "verdet";
                  patch({ quantity, valueUnit: unitsOf(quantity).includes(mapping.valueUnit) ? mapping.valueUnit : unitsOf(quantity)[0]! });
                }}
                className={selectClass}
              >
                <option value="verdet">Verdet constant</option>
                <option value="rotation">Rotation θ</option>
              </Select>
              <Select
                id={`${id}-value-unit`}
                label="Value unit"
                value={mapping.valueUnit}
                onChange={(v) => patch({ valueUnit: v as ValueUnit })}
                className={selectClass}
              >
                {unitsOf(mapping.quantity).map((u) => (
                  <option key={u} value={u}>
                    {VALUE_UNIT_LABEL[u]}
                  </option>
                ))}
              </Select>
            </Pair>
            <Select
              id={`${id}-value-col`}
              label="Value column"
              value={mapping.valueColumn ?? NONE}
              onChange={(v) => patch({ valueColumn: v || null })}
              className={selectClass}
            >
              <option value={NONE}>— choose —</option>
              {columnOptions.map((h) => (
                <option key={h} value={h}>
                  {h}
                </option>
              ))}
            </Select>
            <ColumnOrValue
              id={`${id}-sigma`}
              columnLabel="σ column (same unit as the values)"
              noneLabel="— one relative σ for the file —"
              valueLabel="Relative σ for the whole file (%)"
              columns={columnOptions}
              column={mapping.sigmaColumn}
              onColumn={(c) => patch({ sigmaColumn: c })}
              value={drafts.relativeSigmaPercent}
              onValue={(v) => setDrafts((d) => ({ ...d, relativeSigmaPercent: v }))}
              error={checked?.fieldErrors.relativeSigmaPercent}
              selectClass={selectClass}
            />
            <ColumnOrValue
              id={`${id}-temperature`}
              columnLabel="Temperature column (K)"
              valueLabel="Temperature for the whole file (K)"
              columns={columnOptions}
              column={mapping.temperatureColumn}
              onColumn={(c) => patch({ temperatureColumn: c })}
              value={drafts.temperatureK}
              onValue={(v) => setDrafts((d) => ({ ...d, temperatureK: v }))}
              error={checked?.fieldErrors.temperatureK}
              selectClass={selectClass}
            />
            <ColumnOrValue
              id={`${id}-field`}
              columnLabel="Field column (T)"
              valueLabel="Field for the whole file (T)"
              columns={columnOptions}
              column={mapping.fieldColumn}
              onColumn={(c) => patch({ fieldColumn: c })}
              value={drafts.fieldT}
              onValue={(v) => setDrafts((d) => ({ ...d, fieldT: v }))}
              error={checked?.fieldErrors.fieldT}
              selectClass={selectClass}
            />
            <ColumnOrValue
              id={`${id}-length`}
              columnLabel="Sample length column (m)"
              valueLabel="Sample length for the whole file (m)"
              columns={columnOptions}
              column={mapping.lengthColumn}
              onColumn={(c) => patch({ lengthColumn: c })}
              value={drafts.lengthM}
              onValue={(v) => setDrafts((d) => ({ ...d, lengthM: v }))}
              error={checked?.fieldErrors.lengthM}
              selectClass={selectClass}
            />
          </fieldset>

          <div className="grid gap-4 sm:grid-cols-3">
            <TextInput id={`${id}-name`} label="Name" value={name} onChange={setName} error={tried ? metaErrors.name : undefined} />
            <TextInput
              id={`${id}-sample`}
              label="Sample"
              value={sample}
              onChange={setSample}
              error={tried ? metaErrors.sample : undefined}
            />
            <Select id={`${id}-lab`} label="Lab" value={labId} onChange={setLabId} className={selectClass}>
              {labs.map((lab) => (
                <option key={lab.id} value={lab.id}>
                  {lab.name}
                </option>
              ))}
            </Select>
          </div>

          <div ref={problemsRef} tabIndex={-1} className="outline-none">
            {problems.length > 0 ? (
              <div role="alert" className="rounded-md border border-ember bg-ember-light px-4 py-3 text-sm" data-testid="upload-problems">
                <p className="font-semibold">
                  {serverProblems.length > 0
                    ? "The server refused the file; nothing was stored."
                    : `${problems.length === 1 ? "One problem" : `${problems.length} problems`} to fix before the upload:`}
                </p>
                <ul className="mt-1 max-h-60 list-disc overflow-y-auto pl-5">
                  {problems.map((p) => (
                    <li key={p}>{p}</li>
                  ))}
                </ul>
              </div>
            ) : checked ? (
              <Alert tone="success">
                All {checked.result.points.length} rows are valid ({mapping.quantity === "verdet" ? "Verdet constants" : "rotations"}{" "}
                converted to {mapping.quantity === "verdet" ? "rad/(T·m)" : "rad"}).
              </Alert>
            ) : null}
            {upload.isError && serverProblems.length === 0 ? (
              <p role="alert" className="mt-2 text-sm text-ember">
                {describeError(upload.error)} Your choices are kept; try again.
              </p>
            ) : null}
          </div>

          <div className="flex flex-wrap gap-2">
            <Button onClick={submit} disabled={upload.isPending}>
              {upload.isPending ? "Storing…" : "Store measurement set"}
            </Button>
          </div>
        </>
      ) : null}
    </section>
  );
}

function Pair({ children }: { children: ReactNode }) {
  return <div className="grid grid-cols-[minmax(0,3fr)_minmax(0,2fr)] gap-2">{children}</div>;
}

function Select({
  id,
  label,
  value,
  onChange,
  className,
  children,
}: {
  id: string;
  label: string;
  value: string;
  onChange: (value: string) => void;
  className: string;
  children: ReactNode;
}) {
  return (
    <div>
      <label htmlFor={id} className="block text-sm font-medium">
        {label}
      </label>
      <select id={id} value={value} onChange={(event) => onChange(event.target.value)} className={className}>
        {children}
      </select>
    </div>
  );
}

function TextInput({
  id,
  label,
  value,
  onChange,
  error,
}: {
  id: string;
  label: string;
  value: string;
  onChange: (value: string) => void;
  error?: string;
}) {
  return (
    <div>
      <label htmlFor={id} className="block text-sm font-medium">
        {label}
      </label>
      <input
        id={id}
        value={value}
        onChange={(event) => onChange(event.target.value)}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? `${id}-error` : undefined}
        className={`mt-1 ${INPUT_CLASS}`}
      />
      {error ? (
        <p id={`${id}-error`} className="mt-1 text-sm text-ember">
          {error}
        </p>
      ) : null}
    </div>
  );
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
  selectClass: string;
}) {
  return (
    <div className="space-y-2">
      <Select
        id={`${props.id}-col`}
        label={props.columnLabel}
        value={props.column ?? NONE}
        onChange={(v) => props.onColumn(v || null)}
        className={props.selectClass}
      >
        <option value={NONE}>{props.noneLabel ?? "— not in the file: enter one value —"}</option>
        {props.columns.map((h) => (
          <option key={h} value={h}>
            {h}
          </option>
        ))}
      </Select>
      {props.column === null ? (
        <div>
          <label htmlFor={`${props.id}-value`} className="block text-sm font-medium">
            {props.valueLabel}
          </label>
          <input
            id={`${props.id}-value`}
            inputMode="decimal"
            value={props.value}
            onChange={(event) => props.onValue(event.target.value)}
            aria-invalid={props.error ? true : undefined}
            aria-describedby={props.error ? `${props.id}-value-error` : undefined}
            className={`mt-1 ${INPUT_CLASS}`}
          />
          {props.error ? (
            <p id={`${props.id}-value-error`} className="mt-1 text-sm text-ember">
              {props.error}
            </p>
          ) : null}
        </div>
      ) : null}
    </div>
  );
}
