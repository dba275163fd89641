"use client";

import Link from "next/link";
import { useCallback, useMemo, useRef, useState } from "react";
import { downloadText } from "@/components/plots/export-image";
import { HeatMap } from "@/components/plots/heat-map";
import { PlotExportButtons } from "@/components/plots/plot-export-buttons";
import { useElementWidth } from "@/components/plots/use-element-size";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { DateTime } from "@/components/ui/date-time";
import { ErrorPanel } from "@/components/ui/error-panel";
import { PageHeader } from "@/components/ui/page-header";
import { SkeletonRows } from "@/components/ui/skeleton";
import { ExportBar } from "@/components/workbench/export-bar";
import { SpectrumPanels } from "@/components/workbench/spectrum-panels";
import type { ComputedSpectrum } from "@/components/workbench/use-spectrum-run";
import type { SpectrumPoint } from "@/lib/physics/types";
import { useRun, useRunResult } from "@/lib/query/lab-runs";
import type { LabRunDetail, LabRunResultBody } from "@/lib/contracts/lab-runs";
import { buildMapCsv } from "@/lib/lab-runs/export";
import { mapPayloadSchema, spectrumPayloadSchema } from "@/lib/lab-runs/kinds";
import { figureCaption, figureFileBase } from "@/lib/workbench/export";
import { magneticScaleLabel } from "@/lib/workbench/format";
import { formatShare } from "@/lib/workbench/maps";
import { DEFAULT_VIEW_STATE, type ViewState } from "@/lib/workbench/view-state";
import { CancelRun } from "./cancel-run";
import { RunState } from "./run-state";

const fmt = (v: number) => String(Number(v.toPrecision(4)));

/** /lab-runs/{id}: one run's state, and once done its result in the workbench's plots and exports. */
export function RunView({ id }: { id: string }) {
  const run = useRun(id);
  const done = run.data?.state === "done";
  const result = useRunResult(id, done);

  if (run.isPending) return <SkeletonRows rows={6} label="Loading the run…" />;
  if (run.isError) return <ErrorPanel error={run.error} retry={() => void run.refetch()} />;
  const item = run.data;
  const setLabel = item.parameterSet
    ? `${item.parameterSet.name} v${item.parameterSet.version}${item.parameterSet.edited ? " with what-if edits" : ""}`
    : "parameters given with the run";

  return (
    <div className="space-y-5">
      <PageHeader
        title={item.title}
        lead={
          <>
            {item.labName} · submitted by {item.submittedBy.name} · <DateTime iso={item.createdAt} /> · {setLabel}
            {item.workerId ? ` · worker ${item.workerId}` : ""} ·{" "}
            <Link href="/lab-runs" className="text-lux-dark underline underline-offset-4">
              all runs
            </Link>
          </>
        }
        actions={<CancelRun run={item} />}
      />
      <RunState run={item} />
      {done ? (
        result.isPending ? (
          <SkeletonRows rows={6} label="Loading the result…" />
        ) : result.isError ? (
          <ErrorPanel error={result.error} retry={() => void result.refetch()} />
        ) : (
          <RunResult run={item} result={result.data} setLabel={setLabel} />
        )
      ) : item.state === "queued" ? (
        <p className="text-sm text-ink-soft">
          Waiting for a worker. If nothing happens for long, check that a worker is running (`npm run worker`).
        </p>
      ) : null}
    </div>
  );
}

function RunResult({ run, result, setLabel }: { run: LabRunDetail; result: LabRunResultBody; setLabel: string }) {
  const computed =
    `Computed by ${result.workerId} in ${(result.computeMs / 1000).toFixed(1)} s` +
    `${result.attempt > 1 ? ` (attempt ${result.attempt})` : ""}.`;
  const warnings = (result.meta.warnings as string[] | undefined) ?? [];
  return (
    <div className="space-y-4">
      <p className="text-xs text-ink-soft">{computed}</p>
      {warnings.map((w) => (
        <Alert key={w} tone="warning">
          {w}
        </Alert>
      ))}
      {run.kind === "map" ? <MapResult run={run} result={result} setLabel={setLabel} /> : null}
      {run.kind === "spectrum" ? <SpectrumResultView run={run} result={result} setLabel={setLabel} /> : null}
    </div>
  );
}

function MapResult({ run, result, setLabel }: { run: LabRunDetail; result: LabRunResultBody; setLabel: string }) {
  const payload = mapPayloadSchema.parse(run.payload);
  const [wrapRef, width] = useElementWidth<HTMLDivElement>();
  const svg = useRef<SVGSVGElement>(null);
  const c = result.columns;
  const field = payload.axis === "field";
  const xs = c.wavelengthNm as number[];
  const ys = useMemo(() => (c.rowValue as number[]).map((v) => (field ? Math.abs(v) : v)), [c.rowValue, field]);
  const yName = field ? "|B0|" : "temperature";
  const yUnit = field ? "T" : "K";
  const describeCell = useCallback(
    (x: number, y: number, v: number | null) => `Wavelength ${fmt(x)} nm, ${yName} ${fmt(y)} ${yUnit}: magnetic share ${formatShare(v)}`,
    [yName, yUnit],
  );
  const figureId = {
    setName: run.parameterSet?.name ?? "run parameters",
    version: run.parameterSet?.version ?? null,
    edited: run.parameterSet?.edited ?? false,
    temperatureK: payload.params.temperatureK,
    fieldT: payload.params.fieldT,
  };
  const fileBase = `${figureFileBase(figureId)}-run-${run.id.slice(0, 8)}`;
  const deviation = result.meta.maxRelDeviationFromAnalytic as number | null | undefined;
  return (
    <figure ref={wrapRef} className="space-y-2" data-testid="run-map">
      <HeatMap
        title={
          `Magnetic share over wavelength × ${field ? "|field|" : "temperature"} ` +
          `(${payload.method === "llg" ? "numerical LLG" : "analytic"})`
        }
        xs={xs}
        ys={ys}
        xType={payload.wavelengths.spacing === "log" ? "log" : "linear"}
        yType={payload.rows.spacing === "log" ? "log" : "linear"}
        values={c.magneticShare!}
        levels={[0.5]}
        xLabel="Wavelength (nm)"
        yLabel={field ? "|B0| (T)" : "Temperature (K)"}
        width={width}
        height={360}
        banner={magneticScaleLabel(payload.params.magneticScale)}
        svgRef={svg}
        describeCell={describeCell}
      />
      <figcaption className="text-xs text-ink-soft">
        {xs.length} × {ys.length} cells.
        {deviation !== null && deviation !== undefined
          ? ` Largest deviation of numerical LLG from linear response: ${deviation.toExponential(1)}.`
          : ""}
      </figcaption>
      <div className="flex flex-wrap items-center gap-2">
        <PlotExportButtons svgRef={svg} fileBase={fileBase} plotName="map" />
        <Button
          variant="secondary"
          onClick={() =>
            downloadText(
              buildMapCsv({
                title: run.title,
                axis: payload.axis,
                method: payload.method,
                wavelengthNm: xs,
                rowValue: c.rowValue as number[],
                magneticShare: c.magneticShare!,
                thetaRad: c.thetaRad!,
                thetaMagneticRad: c.thetaMagneticRad!,
                setLabel,
                runId: run.id,
              }),
              `${fileBase}-map.csv`,
              "text/csv",
            )
          }
        >
          Export map CSV
        </Button>
      </div>
    </figure>
  );
}

function SpectrumResultView({ run, result, setLabel }: { run: LabRunDetail; result: LabRunResultBody; setLabel: string }) {
  const payload = spectrumPayloadSchema.parse(run.payload);
  const [view, setView] = useState<ViewState>(DEFAULT_VIEW_STATE);
  const shown = useMemo<ComputedSpectrum>(() => {
    const c = result.columns;
    const points: SpectrumPoint[] = (c.wavelengthNm as number[]).map((wavelengthNm, i) => ({
      wavelengthNm,
      thetaRad: c.thetaRad![i]!,
      thetaElectricRad: c.thetaElectricRad![i]!,
      thetaMagneticRad: c.thetaMagneticRad![i]!,
      thetaCrossRad: c.thetaCrossRad![i]!,
      ellipticityRad: c.ellipticityRad![i]!,
      magneticShare: c.magneticShare![i] ?? null,
      verdetRadPerTm: c.verdetRadPerTm![i] ?? null,
    }));
    const deviation = result.meta.maxRelDeviationFromAnalytic as number | null | undefined;
    const warnings = (result.meta.warnings as string[] | undefined) ?? [];
    return {
      key: run.id,
      method: payload.method,
      result: {
        magnetizationAPerM: result.meta.magnetizationAPerM as number,
        points,
        ...(deviation !== null && deviation !== undefined ? { maxRelDeviationFromAnalytic: deviation } : {}),
        ...(warnings.length > 0 ? { warnings } : {}),
      },
      params: payload.params,
      requestedPoints: points.length,
    };
  }, [result, run.id, payload.method, payload.params]);
  const onView = useCallback((patch: Partial<ViewState>) => setView((v) => ({ ...v, ...patch })), []);
  const figureId = {
    setName: run.parameterSet?.name ?? "run parameters",
    version: run.parameterSet?.version ?? null,
    edited: run.parameterSet?.edited ?? false,
    temperatureK: payload.params.temperatureK,
    fieldT: payload.params.fieldT,
  };
  const fileBase = `${figureFileBase(figureId)}-run-${run.id.slice(0, 8)}`;
  return (
    <div className="space-y-4" data-testid="run-spectrum">
      <SpectrumPanels
        points={shown.result.points}
        geometry={{ fieldT: payload.params.fieldT, lengthM: payload.params.lengthM }}
        view={view}
        onView={onView}
        onAddMarker={() => undefined}
        banner={magneticScaleLabel(payload.params.magneticScale)}
        fileBase={fileBase}
        caption={figureCaption(figureId)}
        methodLabel={payload.method === "llg" ? "numerical LLG" : "analytic"}
      />
      <ExportBar
        shown={shown}
        setName={setLabel}
        setId={run.parameterSet?.id ?? null}
        version={run.parameterSet?.version ?? null}
        fileBase={fileBase}
        display={view}
      />
    </div>
  );
}
