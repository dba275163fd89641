"use client";

import Link from "next/link";
import { useQueries } from "@tanstack/react-query";
import { memo, useMemo, useState } from "react";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { INPUT_CLASS } from "@/components/ui/text-field";
import { type Calibration, DEFAULT_FREE_KEYS, FREEABLE_KEYS, type FreeableKey } from "@/lib/analysis/definition";
import type { FitSet } from "@/lib/fit/schema";
import type { ModelParams } from "@/lib/physics/schema";
import { describeError } from "@/lib/query/fetcher";
import { measurementPointsQuery, useMeasurementSets } from "@/lib/query/measurement-sets";
import { useParameterSet } from "@/lib/query/parameter-sets";
import { fmt } from "@/lib/workbench/format";
import type { WorkbenchPool } from "@/lib/workbench/engine";
import {
  type CalibrationDraft,
  EMPTY_CALIBRATION,
  type ParamDraft,
  initialParamDrafts,
  readCalibration,
  readParamDrafts,
  readStarts,
  readWavelengths,
} from "@/lib/workbench/fit-draft";
import { fitProgressView } from "@/lib/workbench/fit-progress";
import { FitCalibration } from "./fit-calibration";
import { FitParameterTable } from "./fit-parameter-table";
import { FitReport } from "./fit-report";
import { ModelLimits } from "./model-limits";
import { useFitRun } from "./use-fit-run";
import { countOf, noun } from "@/lib/text/plural";

/*
 * The fit panel of the workbench: choose measurement sets of the set's lab (several make one global
 * fit, each with its own calibration), the free parameters, their bounds and priors, run the fit and
 * its report in a worker (progress, Cancel), then read the report and save the result as a new
 * version. The fit starts from the workbench's current values.
 */

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
  const [drafts, setDrafts] = useState(initialParamDrafts);
  const [calibrations, setCalibrations] = useState<Record<string, CalibrationDraft>>({});
  const [startsText, setStartsText] = useState("4");
  const [magnitudes, setMagnitudes] = useState(false);
  const [profileShares, setProfileShares] = useState(true);
  const [shareWavelengthsText, setShareWavelengthsText] = useState("");
  const [scaleByChi2, setScaleByChi2] = useState(false);
  const [showAll, setShowAll] = useState(false);
  const run = useFitRun();
  // The sets of the fit on screen, fixed when it started (the choice may change afterwards).
  const [fittedSets, setFittedSets] = useState<{ id: string; name: string }[]>([]);

  const pointQueries = useQueries({ queries: chosen.map((id) => measurementPointsQuery(id)) });
  const pointsLoading = pointQueries.some((q) => q.isPending);
  const pointsError = pointQueries.find((q) => q.isError)?.error ?? null;
  const loaded = pointQueries.every((q) => q.data);
  const points = useMemo(() => (loaded ? pointQueries.flatMap((q) => q.data ?? []) : []), [loaded, pointQueries]);

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

  const { free, priors, errors: paramErrors } = useMemo(() => readParamDrafts(drafts, params), [drafts, params]);
  const calibrationReadings = chosen.map((id) => readCalibration(calibrations[id] ?? EMPTY_CALIBRATION));
  const calibrationErrors = Object.fromEntries(
    chosen.flatMap((id, i) => {
      const r = calibrationReadings[i]!;
      return "error" in r ? [[id, r.error]] : [];
    }),
  );
  const starts = readStarts(startsText);
  const shareWavelengths = readWavelengths(shareWavelengthsText);

  const problems: string[] = [];
  if (!params) problems.push("Fix the flagged inputs on the left: the fit starts from the workbench's values.");
  if (chosen.length === 0) problems.push("Choose at least one measurement set.");
  if (free.length === 0) problems.push("Free at least one parameter.");
  if (Object.keys(paramErrors).length > 0) problems.push("Fix the flagged bounds and priors.");
  if (Object.keys(calibrationErrors).length > 0) problems.push("Fix the flagged calibration entries.");
  if ("error" in starts) problems.push(starts.error);
  if ("error" in shareWavelengths) problems.push(`Share wavelengths: ${shareWavelengths.error}`);
  // A prior adds an observation, so a parameter carrying one does not use up a point (as the request schema counts).
  const unconstrained = free.filter((f) => !priors.some((p) => p.key === f.key)).length;
  if (chosen.length > 0 && !pointsLoading && points.length > 0 && points.length <= unconstrained) {
    problems.push(`${countOf(points.length, noun("point"))} cannot determine ${countOf(unconstrained, noun("free parameter"))}.`);
  }
  // Degrees of freedom the fit will have: a prior on a free key adds a row; a prior-only key or a set's scale adds a row and a parameter.
  const dof = points.length + priors.filter((p) => free.some((f) => f.key === p.key)).length - free.length;
  const scalingOffered = points.length === 0 || dof >= 3;
  if (scaleByChi2 && !scalingOffered) problems.push("σ scaled by √(χ²/dof) needs at least 3 degrees of freedom; these points give fewer.");
  const canRun = problems.length === 0 && !pointsLoading && !pointsError && run.status !== "running";

  const chosenSets = chosen.flatMap((id) => {
    const meta = (sets.data ?? []).find((s) => s.id === id);
    return meta ? [{ id, name: meta.name }] : [];
  });
  const start = () => {
    if (!params || !canRun || "error" in starts || "error" in shareWavelengths) return;
    // Set names label the results and must differ; two sets of one lab may share a name.
    const used = new Map<string, number>();
    const fitSets: FitSet[] = chosen.map((id, i) => {
      const base = chosenSets.find((s) => s.id === id)?.name ?? `set ${i + 1}`;
      const n = (used.get(base) ?? 0) + 1;
      used.set(base, n);
      const reading = calibrationReadings[i]!;
      const calibration: Calibration =
        "calibration" in reading ? reading.calibration : { scaleSigma: 0, relativeFloor: 0, temperatureSigmaK: 0 };
      return { name: n > 1 ? `${base} (${n})` : base, points: pointQueries[i]?.data ?? [], calibration };
    });
    setFittedSets(chosenSets);
    run.start(
      { params, free, priors, sets: fitSets, scaleByChi2, starts: starts.starts, takeModelSign: magnitudes },
      { shareProfiles: profileShares, shareWavelengthsNm: shareWavelengths.wavelengthsNm },
    );
  };

  // The same data and settings as the fit on screen, as magnitudes with the model's sign.
  const refitAsMagnitudes = () => {
    if (!run.request || !run.options) return;
    setMagnitudes(true);
    run.start({ ...run.request, takeModelSign: true }, run.options);
  };

  const setDraft = (key: FreeableKey, patch: Partial<ParamDraft>) => setDrafts((d) => ({ ...d, [key]: { ...d[key], ...patch } }));
  const setCalibration = (id: string, patch: Partial<CalibrationDraft>) =>
    setCalibrations((c) => ({ ...c, [id]: { ...(c[id] ?? EMPTY_CALIBRATION), ...patch } }));
  const listedKeys = showAll
    ? FREEABLE_KEYS
    : FREEABLE_KEYS.filter((k) => DEFAULT_FREE_KEYS.includes(k) || drafts[k].free || drafts[k].priorSigma.trim() !== "");
  const progress = fitProgressView(run.progress);

  return (
    <div className="space-y-4">
      <p className="text-sm text-ink-soft">
        Weighted least squares (Levenberg–Marquardt) of the analytic model to measured points, weighted by each point&apos;s σ. The fit
        starts from the values on the left; the parameters not freed are held there.
      </p>

      <fieldset className="min-w-0 space-y-2">
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

      <fieldset className="min-w-0 space-y-2">
        <legend className="text-sm font-semibold">Free parameters, bounds and priors</legend>
        <FitParameterTable keys={listedKeys} drafts={drafts} params={params} errors={paramErrors} onChange={setDraft} />
        <Button variant="quiet" onClick={() => setShowAll((v) => !v)}>
          {showAll ? "Show only the usual free parameters" : "Show every model parameter"}
        </Button>
      </fieldset>

      <fieldset className="min-w-0 space-y-1 text-sm">
        <legend className="text-sm font-semibold">Reported uncertainties</legend>
        <label className="flex items-center gap-2">
          <input type="radio" name="fit-sigma" checked={!scaleByChi2} onChange={() => setScaleByChi2(false)} />σ from the data&apos;s
          uncertainties as given (not scaled)
        </label>
        <label className="flex items-center gap-2">
          <input
            type="radio"
            name="fit-sigma"
            checked={scaleByChi2}
            disabled={!scalingOffered && !scaleByChi2}
            onChange={() => setScaleByChi2(true)}
          />
          σ scaled by √(χ²/dof) (when the data&apos;s σ are only relative; never below 1, refused below 3 degrees of freedom)
        </label>
      </fieldset>

      <FitCalibration sets={chosenSets} drafts={calibrations} errors={calibrationErrors} onChange={setCalibration} />

      <fieldset className="min-w-0 space-y-2 text-sm">
        <legend className="text-sm font-semibold">Fit options</legend>
        <label className="flex flex-wrap items-center gap-2">
          Starts of the optimiser (seeded, spread over the bounds)
          <input
            className={`${INPUT_CLASS} w-20 py-1`}
            inputMode="numeric"
            value={startsText}
            aria-invalid={"error" in starts ? true : undefined}
            onChange={(e) => setStartsText(e.target.value)}
          />
        </label>
        <label className="flex items-center gap-2">
          <input type="checkbox" checked={magnitudes} onChange={(e) => setMagnitudes(e.target.checked)} />
          The values are magnitudes (|V| from a vendor sheet): give each the model&apos;s sign
        </label>
        <label className="flex items-center gap-2">
          <input type="checkbox" checked={profileShares} onChange={(e) => setProfileShares(e.target.checked)} />
          Profile the magnetic share at every measured condition (a few dozen refits each; up to 40 conditions)
        </label>
        <label className="flex flex-wrap items-center gap-2">
          Also profile the share at these wavelengths (nm)
          <input
            className={`${INPUT_CLASS} w-40 py-1`}
            value={shareWavelengthsText}
            placeholder="e.g. 1064, 1550"
            aria-invalid={"error" in shareWavelengths ? true : undefined}
            onChange={(e) => setShareWavelengthsText(e.target.value)}
          />
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
            aria-valuemax={100}
            aria-valuenow={Math.round(100 * progress.fraction)}
            aria-valuetext={progress.text}
            className="h-2 overflow-hidden rounded bg-ink/10"
          >
            <div className="h-full bg-lux transition-[width]" style={{ width: `${100 * progress.fraction}%` }} />
          </div>
          <p className="text-xs text-ink-soft">{progress.text} (the page stays usable; Cancel stops it)</p>
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
          onFitAsMagnitudes={run.status === "done" && run.options ? refitAsMagnitudes : null}
        />
      ) : null}
    </div>
  );
});
