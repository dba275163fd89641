"use client";

import Link from "next/link";
import { useQueries } from "@tanstack/react-query";
import { memo, useMemo, useState } from "react";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { INPUT_CLASS } from "@/components/ui/text-field";
import { DEFAULT_FREE_KEYS, FREEABLE_KEYS, type FreeParam, type FreeableKey } from "@/lib/analysis/definition";
import type { MeasuredPoint } from "@/lib/measurements/point";
import { PARAM_META } from "@/lib/model/param-meta";
import type { ModelParams } from "@/lib/physics/schema";
import { describeError } from "@/lib/query/fetcher";
import { measurementPointsQuery, useMeasurementSets } from "@/lib/query/measurement-sets";
import { useParameterSet } from "@/lib/query/parameter-sets";
import { fmt } from "@/lib/workbench/format";
import type { WorkbenchPool } from "@/lib/workbench/engine";
import { FitReport } from "./fit-report";
import { ModelLimits } from "./model-limits";
import { useFitRun } from "./use-fit-run";
import { countOf, noun } from "@/lib/text/plural";

/*
 * The fit panel of the workbench: choose measurement sets of the set's lab, the free parameters
 * and their bounds, run the fit in a worker (progress, Cancel), then read the report and save the
 * result as a new version. The fit starts from the workbench's current values.
 */

const META = new Map(PARAM_META.map((m) => [m.key, m]));

interface BoundDraft {
  free: boolean;
  min: string;
  max: string;
}

function initialBounds(): Record<FreeableKey, BoundDraft> {
  return Object.fromEntries(
    FREEABLE_KEYS.map((k) => [k, { free: DEFAULT_FREE_KEYS.includes(k), min: k === "magneticScale" ? "0" : "", max: "" }]),
  ) as Record<FreeableKey, BoundDraft>;
}

function parseBound(text: string): number | undefined | null {
  const t = text.trim();
  if (t === "") return undefined;
  const v = Number(t);
  return Number.isFinite(v) ? v : null;
}

/** Memoized: the workbench re-renders on every progress step of its own runs, which this panel ignores. */
export const FitPanel = memo(function FitPanel({
  setId,
  params,
  pool,
}: {
  setId: string;
  params: ModelParams | null;
  pool: WorkbenchPool | null;
}) {
  const setQuery = useParameterSet(setId);
  const labId = setQuery.data?.labId;
  const sets = useMeasurementSets(labId);
  const [chosen, setChosen] = useState<string[]>([]);
  const [bounds, setBounds] = useState(initialBounds);
  const [scaleByChi2, setScaleByChi2] = useState(false);
  const [showAll, setShowAll] = useState(false);
  const run = useFitRun();
  // The sets of the fit on screen, fixed when it started (the choice may change afterwards).
  const [fittedSets, setFittedSets] = useState<{ id: string; name: string }[]>([]);

  const pointQueries = useQueries({ queries: chosen.map((id) => measurementPointsQuery(id)) });
  const pointsLoading = pointQueries.some((q) => q.isPending);
  const pointsError = pointQueries.find((q) => q.isError)?.error ?? null;
  const points = useMemo<MeasuredPoint[]>(
    () => (pointQueries.every((q) => q.data) ? pointQueries.flatMap((q) => q.data ?? []) : []),
    [pointQueries],
  );

  // The fit computes at every measured point's conditions: the model's limits for those.
  const limitQuery = useMemo(
    () =>
      params && points.length > 0
        ? {
            params,
            temperaturesK: points.map((p) => p.temperatureK),
            fieldsT: points.map((p) => p.fieldT),
            wavelengthsNm: points.map((p) => p.wavelengthNm),
          }
        : null,
    [params, points],
  );

  const { free, boundErrors } = useMemo(() => {
    const list: FreeParam[] = [];
    const errors: Partial<Record<FreeableKey, string>> = {};
    for (const key of FREEABLE_KEYS) {
      const b = bounds[key];
      if (!b.free) continue;
      const min = parseBound(b.min);
      const max = parseBound(b.max);
      const start = params?.[key];
      if (min === null || max === null) errors[key] = "Bounds must be numbers (or empty for none).";
      else if (min !== undefined && max !== undefined && !(min < max)) errors[key] = "The lower bound must be below the upper bound.";
      else if (start !== undefined && ((min !== undefined && start < min) || (max !== undefined && start > max)))
        errors[key] = `The starting value ${fmt(start)} lies outside the bounds.`;
      list.push({ key, ...(min !== undefined && min !== null ? { min } : {}), ...(max !== undefined && max !== null ? { max } : {}) });
    }
    return { free: list, boundErrors: errors };
  }, [bounds, params]);

  const problems: string[] = [];
  if (!params) problems.push("Fix the flagged inputs on the left: the fit starts from the workbench's values.");
  if (chosen.length === 0) problems.push("Choose at least one measurement set.");
  if (free.length === 0) problems.push("Free at least one parameter.");
  if (Object.keys(boundErrors).length > 0) problems.push("Fix the flagged bounds.");
  if (chosen.length > 0 && !pointsLoading && points.length > 0 && points.length <= free.length) {
    problems.push(`${countOf(points.length, noun("point"))} cannot determine ${countOf(free.length, noun("free parameter"))}.`);
  }
  const canRun = problems.length === 0 && !pointsLoading && !pointsError && run.status !== "running";

  const chosenSets = (sets.data ?? []).filter((s) => chosen.includes(s.id)).map((s) => ({ id: s.id, name: s.name }));
  const start = () => {
    if (!params || !canRun) return;
    setFittedSets(chosenSets);
    run.start({ params, free, points, scaleByChi2 });
  };

  const setBound = (key: FreeableKey, patch: Partial<BoundDraft>) => setBounds((b) => ({ ...b, [key]: { ...b[key], ...patch } }));
  const listedKeys = showAll ? FREEABLE_KEYS : FREEABLE_KEYS.filter((k) => DEFAULT_FREE_KEYS.includes(k) || bounds[k].free);

  return (
    <div className="space-y-4">
      <p className="text-sm text-ink-soft">
        Weighted least squares (Levenberg–Marquardt) of the analytic model to measured points, weighted by each point&apos;s σ. The fit
        starts from the values on the left; the parameters not freed are held there.
      </p>

      <fieldset className="space-y-2">
        <legend className="text-sm font-semibold">Measurement sets of this lab</legend>
        {setQuery.isPending || sets.isPending ? (
          <p className="text-sm text-ink-soft" role="status">
            Loading measurement sets…
          </p>
        ) : sets.isError ? (
          <Alert tone="warning" title="Measurement sets could not be loaded">
            {describeError(sets.error)}
          </Alert>
        ) : (sets.data ?? []).length === 0 ? (
          <p className="text-sm text-ink-soft">
            This lab has no measurement sets yet.{" "}
            <Link className="text-lux-dark underline underline-offset-4" href="/measurement-sets">
              Upload one on the Measurements page
            </Link>
            .
          </p>
        ) : (
          <ul className="space-y-1 text-sm">
            {(sets.data ?? []).map((s) => (
              <li key={s.id}>
                <label className="flex flex-wrap items-baseline gap-x-2">
                  <input
                    type="checkbox"
                    checked={chosen.includes(s.id)}
                    onChange={(e) => setChosen((c) => (e.target.checked ? [...c, s.id] : c.filter((id) => id !== s.id)))}
                  />
                  <span className="font-medium">{s.name}</span>
                  <span className="text-ink-soft">
                    {[
                      s.sample,
                      countOf(s.rowCount, noun("point")),
                      `${fmt(s.wavelengthSpanNm.min)}–${fmt(s.wavelengthSpanNm.max)} nm`,
                      s.quantity === "verdet" ? "Verdet constant" : "rotation",
                    ].join(" · ")}
                  </span>
                </label>
              </li>
            ))}
          </ul>
        )}
        {pointsError ? (
          <Alert tone="warning" title="The points of a chosen set could not be loaded">
            {describeError(pointsError)}
          </Alert>
        ) : null}
      </fieldset>

      <fieldset className="space-y-2">
        <legend className="text-sm font-semibold">Free parameters and bounds</legend>
        <div className="relative overflow-x-auto">
          <table className="w-full min-w-[22rem] text-sm">
            <thead>
              <tr className="text-left text-xs text-ink-soft">
                <th className="py-1 pr-2 font-medium">Free</th>
                <th className="py-1 pr-2 font-medium">Parameter</th>
                <th className="py-1 pr-2 font-medium">Start</th>
                <th className="py-1 pr-2 font-medium">Lower bound</th>
                <th className="py-1 font-medium">Upper bound</th>
              </tr>
            </thead>
            <tbody>
              {listedKeys.map((key) => {
                const meta = META.get(key);
                const label = `${meta?.label ?? key}${meta?.unit ? ` (${meta.unit})` : ""}`;
                const b = bounds[key];
                const error = boundErrors[key];
                return (
                  <tr key={key} className="border-t border-ink/10 align-top">
                    <td className="py-1 pr-2">
                      <input
                        type="checkbox"
                        aria-label={`Free ${label}`}
                        checked={b.free}
                        onChange={(e) => setBound(key, { free: e.target.checked })}
                      />
                    </td>
                    <td className="py-1 pr-2">
                      {label}
                      {error ? (
                        <p className="text-xs text-ember" role="alert">
                          {error}
                        </p>
                      ) : null}
                    </td>
                    <td className="py-1 pr-2 tabular-nums">{fmt(params?.[key])}</td>
                    <td className="py-1 pr-2">
                      <input
                        className={`${INPUT_CLASS} w-24 py-1`}
                        aria-label={`Lower bound of ${label}`}
                        aria-invalid={error ? true : undefined}
                        inputMode="decimal"
                        disabled={!b.free}
                        value={b.min}
                        placeholder="none"
                        onChange={(e) => setBound(key, { min: e.target.value })}
                      />
                    </td>
                    <td className="py-1">
                      <input
                        className={`${INPUT_CLASS} w-24 py-1`}
                        aria-label={`Upper bound of ${label}`}
                        aria-invalid={error ? true : undefined}
                        inputMode="decimal"
                        disabled={!b.free}
                        value={b.max}
                        placeholder="none"
                        onChange={(e) => setBound(key, { max: e.target.value })}
                      />
                    </td>
                  </tr>
                );
              })}
            </tbody>
          </table>
        </div>
        <Button variant="quiet" onClick={() => setShowAll((v) => !v)}>
          {showAll ? "Show only the usual free parameters" : "Show every model parameter"}
        </Button>
      </fieldset>

      <fieldset className="space-y-1 text-sm">
        <legend className="text-sm font-semibold">Reported uncertainties</legend>
        <label className="flex items-center gap-2">
          <input type="radio" name="fit-sigma" checked={!scaleByChi2} onChange={() => setScaleByChi2(false)} />σ from the data&apos;s
          uncertainties as given (not scaled)
        </label>
        <label className="flex items-center gap-2">
          <input type="radio" name="fit-sigma" checked={scaleByChi2} onChange={() => setScaleByChi2(true)} />σ scaled by √(χ²/dof) (when the
          data&apos;s σ are only relative)
        </label>
      </fieldset>

      <div className="flex flex-wrap items-center gap-3">
        <Button onClick={start} disabled={!canRun}>
          {run.status === "running" ? "Fitting…" : "Fit"}
        </Button>
        {run.status === "running" ? (
          <Button variant="secondary" onClick={run.cancel}>
            Cancel fit
          </Button>
        ) : null}
        <span className="text-sm text-ink-soft" role="status">
          {pointsLoading ? "Loading points…" : chosen.length > 0 ? `${countOf(points.length, noun("point"))} chosen` : ""}
        </span>
      </div>
      <ModelLimits query={limitQuery} where="the chosen points" />
      {problems.length > 0 && run.status !== "running" ? (
        <ul className="list-disc pl-5 text-sm text-ink-soft">
          {problems.map((p) => (
            <li key={p}>{p}</li>
          ))}
        </ul>
      ) : null}

      {run.status === "running" ? (
        <div className="space-y-1">
          <div
            role="progressbar"
            aria-label="Fit progress"
            aria-valuemin={0}
            aria-valuemax={run.progress?.maxIterations ?? 200}
            aria-valuenow={run.progress?.iteration ?? 0}
            className="h-2 overflow-hidden rounded bg-ink/10"
          >
            {/* A fit has no known length: the bar fills ever more slowly with each iteration. */}
            <div
              className="h-full bg-lux transition-[width]"
              style={{ width: `${(100 * (run.progress?.iteration ?? 0)) / ((run.progress?.iteration ?? 0) + 6)}%` }}
            />
          </div>
          <p className="text-xs text-ink-soft">
            {run.progress ? `Iteration ${run.progress.iteration}, χ² = ${fmt(run.progress.chi2)}` : "Starting the fit worker…"} (the page
            stays usable; Cancel stops it)
          </p>
        </div>
      ) : null}
      {run.status === "cancelled" ? <p className="text-sm text-ink-soft">Fit cancelled. Nothing was changed.</p> : null}
      {run.status === "failed" ? (
        <Alert tone="warning" title="The fit did not finish">
          {run.error}
        </Alert>
      ) : null}

      {run.result && run.request && setQuery.data ? (
        <FitReport
          result={run.result}
          startParams={run.request.params as ModelParams}
          set={setQuery.data}
          measurementSets={fittedSets}
          pool={pool}
        />
      ) : null}
    </div>
  );
});
