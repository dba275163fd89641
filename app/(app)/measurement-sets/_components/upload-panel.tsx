"use client";

import { type DragEvent, useId, useRef, useState } from "react";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { SelectField } from "@/components/ui/select-field";
import { TextField } from "@/components/ui/text-field";
import { MAX_FILE_BYTES, MAX_ROWS } from "@/lib/measurements/parse";
import { describeError } from "@/lib/query/fetcher";
import { uploadProblems, useUploadMeasurementSet } from "@/lib/query/measurement-sets";
import type { LabSummary } from "@/lib/contracts/labs";
import { formatBytes } from "./format";
import { UploadMappingFieldset } from "./upload-mapping-fieldset";
import { UploadFormatFieldset } from "./upload-format-fieldset";
import { UploadPreviewTable } from "./upload-preview-table";
import { UploadSignCheck } from "./upload-sign-check";
import { useSignCheck } from "./use-sign-check";
import { useUploadDraft } from "./use-upload-draft";
import { countOf, noun } from "@/lib/text/plural";

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
  const draft = useUploadDraft(defaultLabId);
  const { loaded, mapping, checked, tried, metaErrors } = draft;
  const upload = useUploadMeasurementSet();
  const rowsValid = checked !== null && checked.result.errors.length === 0;
  const signCheck = useSignCheck({
    labId: draft.labId,
    setId: draft.signCheckSetId,
    points: rowsValid ? checked.result.points : null,
    modelSign: draft.modelSign,
  });

  function accept(file: File | undefined) {
    if (!file) return;
    upload.reset();
    void draft.chooseFile(file);
  }

  const serverProblems = uploadProblems(upload.error);
  const problems = serverProblems.length > 0 ? serverProblems : (checked?.result.errors ?? []);

  const submit = () => {
    const ready = draft.trySubmit(signCheck.signsFrom);
    if (!ready) {
      problemsRef.current?.focus();
      return;
    }
    upload.mutate(ready, { onSuccess: (item) => onDone(item.name) });
  };

  return (
    <section aria-label="Upload measurements" className="mb-6 space-y-5 rounded-lg border border-ink/10 bg-paper-raised p-4 sm:p-5">
      <div className="flex flex-wrap items-start justify-between gap-2">
        <div>
          <h2 className="text-lg font-semibold">Upload measurements</h2>
          <p className="mt-1 text-sm text-ink-soft">
            A CSV, TSV, semicolon- or space-separated file with a header line (or numpy&apos;s <code>#</code> header), at most{" "}
            {formatBytes(MAX_FILE_BYTES)} and {MAX_ROWS.toLocaleString("en")} rows. Other lines starting with # are comments. Nothing is
            stored until every row is valid.
          </p>
        </div>
        <Button variant="secondary" onClick={onCancel} disabled={upload.isPending}>
          Cancel upload
        </Button>
      </div>

      <FileDropZone
        inputId={`${id}-file`}
        summary={
          loaded
            ? `${loaded.file.name} · ${formatBytes(loaded.file.size)} · ${loaded.table.rows.length} data rows`
            : "CSV (comma or semicolon, decimal point or comma), TSV, or space-separated text"
        }
        onFile={accept}
      />
      {draft.fileError ? (
        <p role="alert" className="text-sm text-ember">
          {draft.fileError}
        </p>
      ) : null}

      {loaded && mapping ? (
        <>
          <UploadFormatFieldset id={id} table={loaded.table} format={draft.format} onFormat={draft.patchFormat} />
          <UploadPreviewTable table={loaded.table} mapping={mapping} />

          <UploadMappingFieldset
            id={id}
            columns={loaded.table.headers}
            mapping={mapping}
            drafts={draft.drafts}
            errors={checked?.fieldErrors}
            onMapping={draft.patchMapping}
            onDefault={draft.setDefault}
          />

          <div className="grid gap-4 sm:grid-cols-3">
            <TextField
              id={`${id}-name`}
              label="Name"
              value={draft.name}
              onChange={(event) => draft.setText("name", event.target.value)}
              error={tried ? metaErrors.name : undefined}
            />
            <TextField
              id={`${id}-sample`}
              label="Sample"
              value={draft.sample}
              onChange={(event) => draft.setText("sample", event.target.value)}
              error={tried ? metaErrors.sample : undefined}
            />
            <SelectField id={`${id}-lab`} label="Lab" value={draft.labId} onChange={(event) => draft.setText("labId", event.target.value)}>
              {labs.map((lab) => (
                <option key={lab.id} value={lab.id}>
                  {lab.name}
                </option>
              ))}
            </SelectField>
          </div>

          <UploadSignCheck
            id={id}
            check={signCheck}
            setId={draft.signCheckSetId}
            modelSign={draft.modelSign}
            unit={mapping.quantity === "verdet" ? "rad/(T·m)" : "rad"}
            rowsValid={rowsValid}
            onChooseSet={draft.chooseSignCheckSet}
            onModelSign={draft.setModelSign}
          />

          <div ref={problemsRef} tabIndex={-1} className="outline-none">
            {problems.length > 0 ? (
              <UploadProblems problems={problems} fromServer={serverProblems.length > 0} />
            ) : checked ? (
              <Alert tone="success">
                All {checked.result.points.length} rows are valid ({mapping.quantity === "verdet" ? "Verdet constants" : "rotations"}{" "}
                converted to {mapping.quantity === "verdet" ? "rad/(T·m)" : "rad"}
                {signCheck.signsFrom ? ", with the model's sign" : ""}).
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

/** The file input, inside a label that also takes a dropped file. */
function FileDropZone({ inputId, summary, onFile }: { inputId: string; summary: string; onFile: (file: File | undefined) => void }) {
  const [dragging, setDragging] = useState(false);
  const onDrop = (event: DragEvent<HTMLLabelElement>) => {
    event.preventDefault();
    setDragging(false);
    onFile(event.dataTransfer.files[0]);
  };
  return (
    <label
      htmlFor={inputId}
      onDragOver={(event) => {
        event.preventDefault();
        setDragging(true);
      }}
      onDragLeave={() => setDragging(false)}
      onDrop={onDrop}
      className={
        "block cursor-pointer rounded-lg border-2 border-dashed px-4 py-6 " +
        `text-center text-sm ${dragging ? "border-lux bg-lux-light/50" : "border-ink/25"}`
      }
    >
      <span className="font-medium">Drop a file here, or choose one</span>
      <span className="mt-1 block text-ink-soft">{summary}</span>
      <input
        id={inputId}
        type="file"
        accept=".csv,.tsv,.txt,text/csv,text/tab-separated-values,text/plain"
        aria-label="Measurement file"
        className="mx-auto mt-3 block text-sm"
        onChange={(event) => onFile(event.target.files?.[0])}
      />
    </label>
  );
}

/** What stands between the draft and the upload: the parser's problems, or the server's refusal. */
function UploadProblems({ problems, fromServer }: { problems: string[]; fromServer: boolean }) {
  return (
    <div data-testid="upload-problems">
      <Alert
        tone="warning"
        title={
          fromServer
            ? "The server refused the file; nothing was stored."
            : `${countOf(problems.length, noun("problem"))} to fix before the upload:`
        }
      >
        <ul className="max-h-60 list-disc overflow-y-auto pl-5">
          {problems.map((p) => (
            <li key={p}>{p}</li>
          ))}
        </ul>
      </Alert>
    </div>
  );
}
