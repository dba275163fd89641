"use client";

import Link from "next/link";
import { memo, useId, useMemo, useState } from "react";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { RequestError, describeError } from "@/lib/query/fetcher";
import { useParameterSet } from "@/lib/query/parameter-sets";
import { useSubmitRun } from "@/lib/query/lab-runs";
import { roleAtLeast } from "@/lib/contracts/roles";
import { zodIssueFields } from "@/lib/contracts/validation";
import type { ModelParams } from "@/lib/physics/schema";
import { MAX_MAP_COLUMNS, MAX_MAP_ROWS, MAX_RUN_WAVELENGTHS, runSpecSchema, type RunSpec } from "@/lib/lab-runs/kinds";
import { parseNumber } from "@/lib/workbench/validate";
import type { WavelengthRange } from "@/lib/workbench/view-state";

/*
 * "Run on the lab's machines": sends a fine map or a long spectrum of the workbench's current
 * parameters to the lab's job queue instead of this tab. The grid is checked here with the same
 * schema the server uses; what the server still refuses is shown at the field it names.
 */

type Choice = "map-temperature" | "map-field" | "spectrum";
const CHOICES: { value: Choice; label: string }[] = [
  { value: "map-temperature", label: "Map: wavelength × temperature" },
  { value: "map-field", label: "Map: wavelength × field" },
  { value: "spectrum", label: "Long spectrum" },
];

const INPUT =
  "mt-1 block w-28 rounded-md border border-ink/25 bg-paper-raised px-2.5 py-1.5 text-sm tabular-nums " +
  "focus:border-lux aria-[invalid=true]:border-ember";

interface Drafts {
  fromNm: string;
  toNm: string;
  columns: string;
  rowFrom: string;
  rowTo: string;
  rows: string;
}

function defaults(choice: Choice, params: ModelParams | null, range: WavelengthRange | null): Drafts {
  const fromNm = String(Math.max(200, range?.fromNm ?? 300));
  const toNm = String(Math.min(20_000, range?.toNm ?? 3000));
  if (choice === "spectrum") return { fromNm, toNm, columns: "4000", rowFrom: "", rowTo: "", rows: "" };
  if (choice === "map-field") return { fromNm, toNm, columns: "128", rowFrom: "0.01", rowTo: "10", rows: "64" };
  const lo = Math.max(1, Math.ceil((params?.curieWeissK ?? 0) + 1));
  return { fromNm, toNm, columns: "128", rowFrom: String(lo), rowTo: "400", rows: "64" };
}

function buildSpec(choice: Choice, method: "llg" | "analytic", params: ModelParams, d: Drafts) {
  const n = (s: string) => parseNumber(s) ?? Number.NaN;
  const wavelengths = { fromNm: n(d.fromNm), toNm: n(d.toNm), count: n(d.columns), spacing: "log" as const };
  if (choice === "spectrum") return { kind: "spectrum", payload: { params, method, wavelengths } };
  const field = choice === "map-field";
  // The field axis carries the sign of the set's field (as the maps panel does).
  const sign = field && params.fieldT < 0 ? -1 : 1;
  return {
    kind: "map",
    payload: {
      params,
      method,
      axis: field ? "field" : "temperature",
      wavelengths,
      rows: { from: sign * n(d.rowFrom), to: sign * n(d.rowTo), count: n(d.rows), spacing: field ? "log" : "linear" },
    },
  };
}

type Errors = Partial<Record<keyof Drafts | "other", string>>;

const FIELD_OF: Record<string, keyof Drafts> = {
  "payload.wavelengths.fromNm": "fromNm",
  "payload.wavelengths.toNm": "toNm",
  "payload.wavelengths.count": "columns",
  "payload.rows.from": "rowFrom",
  "payload.rows.to": "rowTo",
  "payload.rows.count": "rows",
};

/** Memoized: the workbench re-renders on every progress tick of its own run; this panel need not. */
export const LabRunPanel = memo(function LabRunPanel({
  setId,
  params,
  range,
}: {
  setId: string;
  params: ModelParams | null;
  range: WavelengthRange | null;
}) {
  const id = useId().replace(/[^\w-]/g, "");
  const set = useParameterSet(setId);
  const submit = useSubmitRun();
  const [choice, setChoice] = useState<Choice>("map-temperature");
  const [method, setMethod] = useState<"llg" | "analytic">("llg");
  const [drafts, setDrafts] = useState<Drafts>(() => defaults("map-temperature", params, range));
  const [submitted, setSubmitted] = useState<{ id: string; title: string } | null>(null);

  const checked = useMemo((): { spec: RunSpec | null; errors: Errors } => {
    if (!params) return { spec: null, errors: {} };
    const parsed = runSpecSchema.safeParse(buildSpec(choice, method, params, drafts));
    if (parsed.success) return { spec: parsed.data as RunSpec, errors: {} };
    const errors: Errors = {};
    for (const [path, message] of Object.entries(zodIssueFields(parsed.error.issues))) errors[FIELD_OF[path] ?? "other"] ??= message;
    return { spec: null, errors };
  }, [choice, method, params, drafts]);

  const serverFields = submit.error instanceof RequestError ? (submit.error.fields ?? {}) : {};
  const errorOf = (k: keyof Drafts) => checked.errors[k] ?? Object.entries(serverFields).find(([path]) => FIELD_OF[path] === k)?.[1];
  const canSubmit = set.data && roleAtLeast(set.data.role, "editor");
  const isSpectrum = choice === "spectrum";

  const onChoice = (next: Choice) => {
    setChoice(next);
    setDrafts(defaults(next, params, range));
    submit.reset();
  };

  const send = () => {
    if (!checked.spec || !set.data) return;
    submit.mutate(
      { labId: set.data.labId, parameterSetId: set.data.id, ...checked.spec },
      { onSuccess: (run) => setSubmitted({ id: run.id, title: run.title }) },
    );
  };

  const field = (k: keyof Drafts, label: string) => {
    const error = errorOf(k);
    return (
      <div key={k}>
        <label htmlFor={`${id}-${k}`} className="text-xs font-medium">
          {label}
        </label>
        <input
          id={`${id}-${k}`}
          type="text"
          inputMode="decimal"
          autoComplete="off"
          className={INPUT}
          value={drafts[k]}
          aria-invalid={error ? true : undefined}
          aria-describedby={error ? `${id}-${k}-error` : undefined}
          onChange={(e) => setDrafts((d) => ({ ...d, [k]: e.target.value }))}
        />
        {error ? (
          <p id={`${id}-${k}-error`} className="mt-1 max-w-[14rem] text-xs text-ember">
            {error}
          </p>
        ) : null}
      </div>
    );
  };

  return (
    <section aria-label="Run on the lab's machines" className="space-y-3 rounded-lg border border-ink/10 bg-paper-raised p-4">
      <h2 className="text-lg font-semibold">Run on the lab’s machines</h2>
      <p className="text-sm text-ink-soft">
        Fine maps (up to {MAX_MAP_COLUMNS} × {MAX_MAP_ROWS}) and long spectra (up to {MAX_RUN_WAVELENGTHS.toLocaleString("en")} wavelengths)
        are computed by the lab’s workers and kept on the{" "}
        <Link href="/lab-runs" className="text-lux-dark underline underline-offset-4">
          Lab runs
        </Link>{" "}
        page for everyone in the lab. They use the parameters as they are on the left now.
      </p>
      {set.data && !canSubmit ? (
        <p className="text-sm text-ink-soft">Viewers can open the lab’s runs but not submit them; ask an editor of {set.data.labName}.</p>
      ) : null}
      {!params ? <p className="text-sm text-ember">Fix the flagged inputs on the left first.</p> : null}
      <div className="flex flex-wrap items-start gap-6">
        <label className="text-sm">
          <span className="block text-xs font-medium">What to compute</span>
          <select
            className="mt-1 rounded-md border border-ink/25 bg-paper-raised px-2 py-1.5 text-sm"
            value={choice}
            onChange={(e) => onChoice(e.target.value as Choice)}
          >
            {CHOICES.map((c) => (
              <option key={c.value} value={c.value}>
                {c.label}
              </option>
            ))}
          </select>
        </label>
        <label className="text-sm">
          <span className="block text-xs font-medium">Method</span>
          <select
            className="mt-1 rounded-md border border-ink/25 bg-paper-raised px-2 py-1.5 text-sm"
            value={method}
            onChange={(e) => setMethod(e.target.value as "llg" | "analytic")}
          >
            <option value="llg">Numerical LLG</option>
            <option value="analytic">Analytic (linear response)</option>
          </select>
        </label>
      </div>
      <div className="flex flex-wrap gap-3">
        {field("fromNm", "Wavelength from (nm)")}
        {field("toNm", "Wavelength to (nm)")}
        {field("columns", isSpectrum ? "Wavelengths" : "Wavelengths (columns)")}
        {!isSpectrum ? field("rowFrom", choice === "map-field" ? "|B0| from (T)" : "Temperature from (K)") : null}
        {!isSpectrum ? field("rowTo", choice === "map-field" ? "|B0| to (T)" : "Temperature to (K)") : null}
        {!isSpectrum ? field("rows", "Rows") : null}
      </div>
      {checked.errors.other ? <p className="text-xs text-ember">{checked.errors.other}</p> : null}
      <div className="flex flex-wrap items-center gap-3">
        <Button onClick={send} disabled={!canSubmit || !checked.spec || submit.isPending}>
          {submit.isPending ? "Submitting…" : "Submit to the lab’s machines"}
        </Button>
        {checked.spec ? (
          <span className="text-xs text-ink-soft tabular-nums">
            {(isSpectrum ? Number(drafts.columns) : Number(drafts.columns) * Number(drafts.rows)).toLocaleString("en")} cells
          </span>
        ) : null}
      </div>
      {submit.isError && Object.keys(serverFields).length === 0 ? (
        <Alert tone="warning" title="Not submitted">
          {describeError(submit.error)}
        </Alert>
      ) : null}
      {submitted ? (
        <p role="status" className="text-sm">
          Submitted: {submitted.title}.{" "}
          <Link href={`/lab-runs/${submitted.id}`} className="font-medium text-lux-dark underline-offset-4 hover:underline">
            Follow it on the Lab runs page
          </Link>
        </p>
      ) : null}
    </section>
  );
});
