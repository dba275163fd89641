"use client";

import Link from "next/link";
import { useQueryClient } from "@tanstack/react-query";
import { useEffect, useMemo, useState } from "react";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { XAxis, YAxis } from "@/components/plots/axes";
import { PlotFrame, frameTop } from "@/components/plots/plot-frame";
import { makeScale, paddedExtent } from "@/components/plots/scale";
import { useElementWidth } from "@/components/plots/use-element-size";
import type { FitResult } from "@/lib/fit/fit";
import { fitNameLabel, fitNameUnit } from "@/lib/fit/labels";
import { type FitReport as FitReportData, type ShareProfile, UNDETERMINED_SHARE_WIDTH } from "@/lib/fit/report";
import { AssumptionsTable, ComparisonTable, GoodnessOfFit, ScaleProfile } from "./fit-inference";
import { downloadText } from "@/components/plots/export-image";
import { fitPointsCsv, fitReportJson } from "@/lib/fit/export";
import { saveFitBody } from "@/lib/fit/provenance";
import { type ModelParams, modelParamsSchema } from "@/lib/physics/schema";
import { RequestError, describeError } from "@/lib/query/fetcher";
import { useSaveFit } from "@/lib/query/fits";
import { parameterSetKeys } from "@/lib/query/parameter-sets";
import type { ParameterSet } from "@/lib/contracts/parameter-sets";
import { isAbortError, type WorkbenchPool } from "@/lib/workbench/engine";
import { fmt, fmtPercent, magneticScaleLabel } from "@/lib/workbench/format";
import { numericalBadgeText } from "./run-status";

/*
 * The report of a finished fit: values ± σ (as given and χ²-scaled, the reported one named),
 * correlation, χ², the normalized residuals against wavelength, the magnetic share at every point
 * ± σ, the plain-words verdict on separating the parts, one numerical LLG run at the fitted values,
 * and saving the result as a new version.
 */

const labelOf = fitNameLabel;
const unitOf = fitNameUnit;

export function FitReport({
  result,
  startParams,
  set,
  measurementSets,
  pool,
  onFitAsMagnitudes,
}: {
  result: FitReportData;
  startParams: ModelParams;
  set: ParameterSet;
  measurementSets: { id: string; name: string }[];
  pool: WorkbenchPool | null;
  /** Fit the same data again as magnitudes with the model's sign (offered when every value has the opposite sign). */
  onFitAsMagnitudes: (() => void) | null;
}) {
  const scaleLabel = magneticScaleLabel(result.params.magneticScale);
  const chi2Factor = Math.sqrt(result.reducedChi2);
  const signWarning = result.signCheck.allOpposite && !result.signCheck.tookModelSign;
  return (
    <section aria-label="Fit result" className="space-y-4 border-t border-ink/10 pt-4">
      <h3 className="text-base font-semibold">Fit result</h3>
      {scaleLabel ? (
        <p
          data-testid="fit-magnetic-scale-label"
          className="inline-block rounded-full border border-ember bg-ember-light px-2.5 py-1 text-xs font-semibold text-ember"
        >
          {scaleLabel}
        </p>
      ) : null}
      {result.signCheck.tookModelSign ? (
        <p className="text-sm text-ink-soft">The measured values were fitted as magnitudes, each with the model&apos;s sign.</p>
      ) : null}
      {signWarning ? (
        <Alert tone="warning" title="Every value has the sign opposite to the model's">
          <p>
            All {result.signCheck.total} measured values have the sign opposite to what the model predicts for this material at the starting
            values. Vendor sheets often quote |V|; fitted as they are, the electric gyration flips to the other sign.
          </p>
          {onFitAsMagnitudes ? (
            <Button variant="secondary" className="mt-2" onClick={onFitAsMagnitudes}>
              These are magnitudes: fit again with the model&apos;s sign
            </Button>
          ) : null}
        </Alert>
      ) : null}
      <Verdict result={result} />
      {result.notes.filter((n) => !signWarning || !n.startsWith("Every measured value")).length > 0 ? (
        <ul className="list-disc space-y-1 pl-5 text-sm text-ember" aria-label="Fit notes">
          {result.notes
            .filter((n) => !signWarning || !n.startsWith("Every measured value"))
            .map((n) => (
              <li key={n}>{n}</li>
            ))}
        </ul>
      ) : null}

      <div className="relative overflow-x-auto">
        <table className="w-full min-w-[24rem] text-sm" aria-label="Fitted values">
          <caption className="pb-1 text-left text-xs text-ink-soft">
            Reported σ:{" "}
            {result.sigmaScaledByChi2 ? `scaled by √(χ²/dof) = ${fmt(chi2Factor, 3)}` : "from the data's σ as given, not scaled"}. Both are
            listed. Parameters with a prior are fitted with it; their σ include it.
          </caption>
          <thead>
            <tr className="text-left text-xs text-ink-soft">
              <th className="py-1 pr-3 font-medium">Parameter</th>
              <th className="py-1 pr-3 font-medium">Start</th>
              <th className="py-1 pr-3 font-medium">Fitted ± σ (reported)</th>
              <th className="py-1 pr-3 font-medium">68 % interval</th>
              <th className="py-1 pr-3 font-medium">σ as given</th>
              <th className="py-1 font-medium">σ scaled by √(χ²/dof)</th>
            </tr>
          </thead>
          <tbody>
            {result.names.map((key) => (
              <ValueRow key={key} name={key} result={result} startParams={startParams} />
            ))}
          </tbody>
        </table>
      </div>

      <p className="text-sm" data-testid="fit-chi2">
        χ² = {fmt(result.chi2)} with {result.dof} degrees of freedom; reduced χ² = {fmt(result.reducedChi2, 3)} ({result.points.length}{" "}
        points, {result.names.length} fitted parameters, {result.iterations} iterations, best of {result.startChi2.length}{" "}
        {result.startChi2.length === 1 ? "start" : "starts"}).
      </p>
      <GoodnessOfFit report={result} />
      {result.sets.length > 1 || result.sets.some((s) => s.scaleSigma > 0 || s.relativeFloor > 0 || s.temperatureSigmaK > 0) ? (
        <SetTable result={result} />
      ) : null}

      <h4 className="text-sm font-semibold">Does the data need a magnetic-dipole part?</h4>
      <ComparisonTable report={result} />
      <ScaleProfile report={result} />
      <h4 className="text-sm font-semibold">Assumptions</h4>
      <AssumptionsTable report={result} />

      {result.names.length > 1 ? <CorrelationTable result={result} /> : null}
      <ResidualPlot result={result} />
      <ShareTable result={result} />
      <ExtraShares result={result} />
      <LlgCheck result={result} pool={pool} />
      <FitExports result={result} setName={set.name} />
      <SaveFit result={result} startParams={startParams} set={set} measurementSets={measurementSets} />
    </section>
  );
}

/** The report as JSON (as the command line prints it, with the share covariance) and the points as CSV. */
function FitExports({ result, setName }: { result: FitReportData; setName: string }) {
  const [fittedAt] = useState(() => new Date().toISOString());
  const base = `${setName.replace(/[^\w.-]+/g, "-").replace(/^-+|-+$/g, "") || "fit"}-fit`;
  const meta = { setName, fittedAt };
  return (
    <div className="flex flex-wrap items-center gap-2 text-sm">
      <span className="font-semibold">Export the fit</span>
      <Button variant="secondary" onClick={() => downloadText(fitReportJson(result, meta), `${base}.json`, "application/json")}>
        Report (JSON)
      </Button>
      <Button variant="secondary" onClick={() => downloadText(fitPointsCsv(result, meta), `${base}-points.csv`, "text/csv")}>
        Points with shares (CSV)
      </Button>
    </div>
  );
}

/** The verdict on the split, with every reason that speaks against calling the parts separated. */
function Verdict({ result }: { result: FitReportData }) {
  if (!result.verdict.separable) {
    return (
      <Alert tone="warning" title="The data do not separate the two parts">
        {result.verdict.reasons.map((r) => (
          <p key={r}>{r}</p>
        ))}
        <p className="mt-1">
          The split below is therefore not a measurement. The{" "}
          <Link className="font-medium text-lux-dark underline underline-offset-4" href="/planner">
            planner
          </Link>{" "}
          suggests wavelengths, temperatures and fields that would tell the parts apart.
        </p>
      </Alert>
    );
  }
  const held = result.assumptions.filter((a) => a.key === "oscillatorWavelengthNm" || a.key === "sellmeierWavelengthNm");
  return (
    <p className="text-sm" data-testid="fit-verdict">
      In this model{held.length > 0 ? `, with ${held.map((a) => `${labelOf(a.key)} held at ${a.value}`).join(" and ")},` : ""} the data
      separate the electric-dipole and magnetic-dipole parts: the comparison, the intervals and the held values are below.
    </p>
  );
}

function ValueRow({ name, result, startParams }: { name: string; result: FitReportData; startParams: ModelParams }) {
  const atBound = result.atBound.includes(name);
  const prior = result.priors.find((p) => p.key === name);
  const isModelKey = name in startParams;
  const g = result.gaussianIntervals[name];
  const profile = name === "magneticScale" ? result.profile.magneticScale : undefined;
  const interval = profile ? profile.interval68 : (g?.interval68 ?? null);
  return (
    <tr className="border-t border-ink/10">
      <th scope="row" className="py-1 pr-3 text-left font-normal">
        {labelOf(name)} {unitOf(name) ? <span className="text-ink-soft">({unitOf(name)})</span> : null}
        {prior ? (
          <span className="block text-xs text-ink-soft">
            prior {fmt(prior.mean)} ± {fmt(prior.sigma, 2)}
          </span>
        ) : null}
        {atBound ? <span className="block text-xs text-ember">ended on a bound: no σ is given there</span> : null}
      </th>
      <td className="py-1 pr-3 tabular-nums">{isModelKey ? fmt(startParams[name as keyof ModelParams] as number) : "1"}</td>
      <td className="py-1 pr-3 font-medium tabular-nums" data-testid={`fit-value-${name}`}>
        {atBound ? `${fmt(result.values[name], 5)} (at a bound)` : `${fmt(result.values[name], 5)} ± ${fmt(result.sigmas[name], 2)}`}
      </td>
      <td className="py-1 pr-3 tabular-nums">
        {interval ? `[${fmt(interval[0])}, ${fmt(interval[1])}]` : "–"}
        <span className="block text-xs text-ink-soft">
          {profile ? "profile likelihood" : g?.interval68 ? `Gaussian (${g.quantile})` : ""}
        </span>
      </td>
      <td className="py-1 pr-3 tabular-nums">{atBound ? "–" : fmt(result.sigmasUnscaled[name], 2)}</td>
      <td className="py-1 tabular-nums">{atBound ? "–" : fmt(result.sigmasScaled[name], 2)}</td>
    </tr>
  );
}

function SetTable({ result }: { result: FitReportData }) {
  return (
    <div className="relative overflow-x-auto">
      <table className="w-full min-w-[26rem] text-sm" aria-label="Measurement sets of the fit">
        <caption className="pb-1 text-left text-xs text-ink-soft">
          One global fit: shared material parameters, each point at its own temperature, field and length; each set&apos;s calibration as
          fitted.
        </caption>
        <thead>
          <tr className="text-left text-xs text-ink-soft">
            <th className="py-1 pr-3 font-medium">Set</th>
            <th className="py-1 pr-3 font-medium">Points</th>
            <th className="py-1 pr-3 font-medium">χ² of its points</th>
            <th className="py-1 pr-3 font-medium">Field × length σ</th>
            <th className="py-1 pr-3 font-medium">Error floor</th>
            <th className="py-1 font-medium">Temperature σ</th>
          </tr>
        </thead>
        <tbody className="tabular-nums">
          {result.sets.map((s) => (
            <tr key={s.name} className="border-t border-ink/10">
              <th scope="row" className="py-1 pr-3 text-left font-normal">
                {s.name}
              </th>
              <td className="py-1 pr-3">{s.pointCount}</td>
              <td className="py-1 pr-3">{fmt(s.chi2)}</td>
              <td className="py-1 pr-3">{s.scaleSigma > 0 ? fmtPercent(s.scaleSigma, 2) : "none"}</td>
              <td className="py-1 pr-3">{s.relativeFloor > 0 ? fmtPercent(s.relativeFloor, 2) : "none"}</td>
              <td className="py-1">{s.temperatureSigmaK > 0 ? `${fmt(s.temperatureSigmaK)} K` : "none"}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

function CorrelationTable({ result }: { result: FitResult }) {
  return (
    <div className="relative overflow-x-auto">
      <table className="text-sm" aria-label="Correlation matrix">
        <caption className="pb-1 text-left text-xs text-ink-soft">
          Correlation of the fitted values (|r| near 1: the data trade one for the other)
        </caption>
        <thead>
          <tr>
            <td />
            {result.names.map((k) => (
              <th key={k} scope="col" className="px-2 py-1 text-xs font-medium text-ink-soft">
                {labelOf(k)}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {result.names.map((row, i) => (
            <tr key={row} className="border-t border-ink/10">
              <th scope="row" className="py-1 pr-2 text-left text-xs font-medium text-ink-soft">
                {labelOf(row)}
              </th>
              {result.names.map((col, j) => {
                const r = result.correlation[i]![j]!;
                return (
                  <td
                    key={col}
                    className={`px-2 py-1 text-right tabular-nums ${i !== j && Math.abs(r) > 0.95 ? "font-semibold text-ember" : ""}`}
                  >
                    {r.toFixed(3)}
                  </td>
                );
              })}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

function ResidualPlot({ result }: { result: FitResult }) {
  const [ref, width] = useElementWidth<HTMLDivElement>(640);
  const height = 220;
  const M = { left: 56, right: 16, bottom: 44, top: frameTop(null) };
  const xs = result.points.map((p) => p.wavelengthNm);
  const rs = result.points.map((p) => p.normalizedResidual);
  const x = useMemo(() => makeScale("linear", paddedExtent([xs]) ?? [0, 1], [M.left, width - M.right]), [xs, width, M.left, M.right]);
  const yMax = Math.max(3, ...rs.map((r) => Math.abs(r)));
  const y = useMemo(() => makeScale("linear", [-yMax, yMax], [height - M.bottom, M.top]), [yMax, M.bottom, M.top]);
  return (
    <div ref={ref} className="w-full">
      <PlotFrame title="Normalized residuals (measured − model) / σ" width={width} height={height} left={M.left}>
        <XAxis scale={x} type="linear" y={height - M.bottom} height={height - M.bottom - M.top} label="Wavelength (nm)" />
        <YAxis scale={y} type="linear" x={M.left} width={width - M.left - M.right} label="Residual / σ" />
        {[-2, 0, 2].map((level) => (
          <line
            key={level}
            x1={M.left}
            x2={width - M.right}
            y1={y(level)}
            y2={y(level)}
            stroke={level === 0 ? "#1d2433" : "#8a94a6"}
            strokeDasharray={level === 0 ? undefined : "4 3"}
          />
        ))}
        {result.points.map((p, i) => (
          <circle key={i} cx={x(p.wavelengthNm)} cy={y(p.normalizedResidual)} r={3} fill="#1f5fa8">
            <title>{`${fmt(p.wavelengthNm)} nm: ${p.normalizedResidual.toFixed(2)} σ`}</title>
          </circle>
        ))}
      </PlotFrame>
    </div>
  );
}

/** A Gaussian share ± σ whose ±σ spans most of [0, 1] says nothing: it is named so rather than printed as "0.0 % ± 319 %". */
function gaussianShareText(share: number | null, sigma: number | null): string {
  if (share === null) return "–";
  if (sigma === null || !Number.isFinite(sigma)) return fmtPercent(share);
  return 2 * sigma > UNDETERMINED_SHARE_WIDTH
    ? `undetermined (σ ${fmtPercent(sigma, 0)})`
    : `${fmtPercent(share)} ± ${fmtPercent(sigma, 2)}`;
}

function profileShareText(p: ShareProfile | undefined): string {
  if (!p) return "not profiled";
  const range = `${fmtPercent(p.interval68[0])} – ${fmtPercent(p.interval68[1])}`;
  return p.status === "undetermined" ? `undetermined (${range})` : range;
}

function ShareTable({ result }: { result: FitReportData }) {
  const unit = (q: string) => (q === "verdet" ? "rad/(T·m)" : "rad");
  const profiled = result.shareProfiles.length > 0;
  return (
    <div className="max-h-80 overflow-auto rounded border border-ink/10">
      <table className="w-full min-w-[34rem] text-sm" aria-label="Magnetic share at every point">
        <caption className="px-2 py-1 text-left text-xs text-ink-soft">
          Magnetic-dipole share |θm| / (|θe| + |θm|) at the fitted values, in this model: ± its standard error propagated from the
          covariance through the model&apos;s Jacobian
          {profiled
            ? ", and its 68 % profile interval (Δχ² = 1 with every parameter refitted, within [0, 1]); " +
              "an interval over most of [0, 1] reads undetermined."
            : "; share intervals were not profiled for this fit."}
        </caption>
        <thead className="sticky top-0 bg-paper-raised">
          <tr className="text-left text-xs text-ink-soft">
            {result.sets.length > 1 ? <th className="px-2 py-1 font-medium">Set</th> : null}
            <th className="px-2 py-1 font-medium">λ (nm)</th>
            <th className="px-2 py-1 font-medium">T (K)</th>
            <th className="px-2 py-1 font-medium">B (T)</th>
            <th className="px-2 py-1 font-medium">Measured ± σ</th>
            <th className="px-2 py-1 font-medium">Model</th>
            <th className="px-2 py-1 font-medium">Magnetic share ± σ</th>
            <th className="px-2 py-1 font-medium">68 % profile interval</th>
          </tr>
        </thead>
        <tbody>
          {result.points.map((p, i) => (
            <tr key={i} className="border-t border-ink/10 tabular-nums">
              {result.sets.length > 1 ? <td className="px-2 py-1">{p.set}</td> : null}
              <td className="px-2 py-1">{fmt(p.wavelengthNm)}</td>
              <td className="px-2 py-1">{fmt(p.temperatureK)}</td>
              <td className="px-2 py-1">{fmt(p.fieldT)}</td>
              <td className="px-2 py-1">
                {fmt(p.measured)} ± {fmt(p.sigma, 2)} {unit(p.quantity)}
              </td>
              <td className="px-2 py-1">{fmt(p.model)}</td>
              <td className="px-2 py-1" data-testid="fit-share">
                {gaussianShareText(p.magneticShare, p.magneticShareSigma)}
              </td>
              <td className="px-2 py-1" data-testid="fit-share-interval">
                {profileShareText(result.shareProfiles[result.pointShareProfile[i] ?? -1])}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

/** The share profiled at wavelengths the user asked for (at the first point's temperature and field). */
function ExtraShares({ result }: { result: FitReportData }) {
  const profiled = new Set(result.pointShareProfile);
  const extra = result.shareProfiles.filter((_, i) => !profiled.has(i));
  if (extra.length === 0) return null;
  return (
    <div className="relative overflow-x-auto">
      <table className="w-full min-w-[22rem] text-sm" aria-label="Magnetic share at chosen wavelengths">
        <caption className="pb-1 text-left text-xs text-ink-soft">
          The magnetic share at the wavelengths asked for, in this model, at {fmt(extra[0]!.temperatureK)} K and {fmt(extra[0]!.fieldT)} T:
          profile intervals.
        </caption>
        <thead>
          <tr className="text-left text-xs text-ink-soft">
            <th className="py-1 pr-3 font-medium">λ (nm)</th>
            <th className="py-1 pr-3 font-medium">Share</th>
            <th className="py-1 pr-3 font-medium">68 % interval</th>
            <th className="py-1 font-medium">95 % interval</th>
          </tr>
        </thead>
        <tbody className="tabular-nums">
          {extra.map((p) => (
            <tr key={p.wavelengthNm} className="border-t border-ink/10">
              <td className="py-1 pr-3">{fmt(p.wavelengthNm)}</td>
              <td className="py-1 pr-3">{fmtPercent(p.value)}</td>
              <td className="py-1 pr-3">{profileShareText(p)}</td>
              <td className="py-1">{`${fmtPercent(p.interval95[0])} – ${fmtPercent(p.interval95[1])}`}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

/**
 * One numerical LLG run at the fitted values, at the wavelengths of the first group of
 * conditions, to confirm the analytic path the fit used (physics-model.md §7).
 */
function LlgCheck({ result, pool }: { result: FitResult; pool: WorkbenchPool | null }) {
  const [state, setState] = useState<{
    status: "running" | "done" | "failed";
    deviation?: number;
    worst?: number;
    error?: string;
    count?: number;
  }>({ status: "running" });
  useEffect(() => {
    if (!pool) return;
    const first = result.points[0]!;
    const group = result.points.filter(
      (p) => p.temperatureK === first.temperatureK && p.fieldT === first.fieldT && p.lengthM === first.lengthM,
    );
    const wavelengthsNm = [...new Set(group.map((p) => p.wavelengthNm))].sort((a, b) => a - b);
    const controller = new AbortController();
    setState({ status: "running" });
    pool
      .spectrum(
        { ...result.params, temperatureK: first.temperatureK, fieldT: first.fieldT, lengthM: first.lengthM, wavelengthsNm, method: "llg" },
        { signal: controller.signal },
      )
      .then((llg) => {
        // Largest |numerical − fitted model| in units of each point's σ.
        let worst = 0;
        for (const p of group) {
          const at = llg.points.find((q) => q.wavelengthNm === p.wavelengthNm);
          const v = at ? (p.quantity === "verdet" ? at.verdetRadPerTm : at.thetaRad) : null;
          if (v !== null && v !== undefined) worst = Math.max(worst, Math.abs(v - p.model) / p.sigma);
        }
        setState({ status: "done", deviation: llg.maxRelDeviationFromAnalytic, worst, count: wavelengthsNm.length });
      })
      .catch((err: unknown) => {
        if (!isAbortError(err)) setState({ status: "failed", error: err instanceof Error ? err.message : String(err) });
      });
    return () => controller.abort();
  }, [pool, result]);

  return (
    <div className="space-y-1 text-sm">
      <p className="font-semibold">Numerical check at the fitted values</p>
      {state.status === "running" ? (
        <p role="status" className="text-ink-soft">
          Running the numerical LLG at the fitted values…
        </p>
      ) : state.status === "failed" ? (
        <p className="text-ember">The numerical run failed: {state.error}</p>
      ) : (
        <div className="flex flex-wrap items-center gap-2">
          <span
            data-testid="fit-llg-badge"
            className="rounded-full border border-lux bg-lux-light px-2.5 py-1 text-xs font-medium text-lux-dark"
          >
            {numericalBadgeText(state.deviation)}
          </span>
          <span className="text-ink-soft">
            At {state.count} wavelengths the numerical result stays within {fmt(state.worst, 2)} σ of the fitted analytic model.
          </span>
        </div>
      )}
    </div>
  );
}

function SaveFit({
  result,
  startParams,
  set,
  measurementSets,
}: {
  result: FitReportData;
  startParams: ModelParams;
  set: ParameterSet;
  measurementSets: { id: string; name: string }[];
}) {
  const save = useSaveFit(set.id);
  const queryClient = useQueryClient();
  const canEdit = set.role === "owner" || set.role === "editor";
  // The saved version is the stored set with the fitted values; the fit must not have used other what-ifs.
  const stored = modelParamsSchema.safeParse(set.params).data ?? (set.params as ModelParams);
  // A switch that was never stored is off (physics-model §5.5), so undefined and false agree.
  const sameValue = (a: unknown, b: unknown) =>
    typeof a === "boolean" || typeof b === "boolean" ? (a === true) === (b === true) : a === b;
  const whatIfs = (Object.keys(startParams) as (keyof ModelParams)[]).filter(
    (k) => !result.free.includes(k as never) && !sameValue(startParams[k], stored[k]),
  );
  const nuisances = result.names.filter((n) => !result.free.includes(n as never));
  if (!canEdit) return <p className="text-sm text-ink-soft">Viewers cannot save a fit; an editor of the lab can.</p>;
  if (save.isSuccess) {
    return (
      <Alert tone="success" title={`Saved as version ${save.data.version}`}>
        The fitted values and the fit&apos;s provenance are stored.{" "}
        <Link
          className="font-medium text-lux-dark underline underline-offset-4"
          href={`/parameter-sets/${encodeURIComponent(set.id)}/history`}
        >
          See the version history
        </Link>{" "}
        or{" "}
        <Button variant="quiet" onClick={() => void queryClient.invalidateQueries({ queryKey: parameterSetKeys.detail(set.id) })}>
          open version {save.data.version} in the workbench
        </Button>
        .
      </Alert>
    );
  }
  const stale = save.error instanceof RequestError && save.error.code === "stale_version";
  return (
    <div className="space-y-2">
      {nuisances.length > 0 ? (
        <p className="text-sm text-ink-soft">
          Saving stores the free parameters&apos; fitted values. {nuisances.map(labelOf).join(", ")}{" "}
          {nuisances.length === 1 ? "was" : "were"} fitted only within a prior or calibration and{" "}
          {nuisances.length === 1 ? "keeps its" : "keep their"} stored value; the fitted values go into the version&apos;s provenance.
        </p>
      ) : null}
      {whatIfs.length > 0 ? (
        <p className="text-sm text-ember">
          The fit started from what-if values that differ from the stored set ({whatIfs.map(labelOf).join(", ")}). Saving would store the
          fitted values with the stored ones instead; reset those inputs to the stored values and fit again, or save the workbench as a new
          set.
        </p>
      ) : null}
      <Button
        onClick={() => save.mutate(saveFitBody({ version: set.version, result, measurementSets, fittedAt: new Date() }))}
        disabled={save.isPending || whatIfs.length > 0}
      >
        {save.isPending ? "Saving…" : `Save as version ${set.version + 1}`}
      </Button>
      {save.isError ? (
        <Alert tone="warning" title={stale ? "The set changed since this fit started" : "The fit was not saved"}>
          {describeError(save.error)}
        </Alert>
      ) : null}
    </div>
  );
}
