"use client";

import Link from "next/link";
import { useCallback, useId, useMemo, useRef, useState } from "react";
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
import { buildMapCsv, mapFileBase } from "@/lib/lab-runs/export";
import { workbenchHrefOfRun } from "@/lib/lab-runs/open-in-workbench";
import { mapPayloadSchema, spectrumPayloadSchema } from "@/lib/lab-runs/kinds";
import { figureCaption, figureFileBase } from "@/lib/workbench/export";
import { magneticScaleLabel } from "@/lib/workbench/format";
import { formatQuantity, MAP_QUANTITIES, MAP_QUANTITY_VIEW, type MapQuantity, quantityDomain, quantityLevels } from "@/lib/workbench/maps";
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
            {item.labName} · submitted by {item.submittedBy.name} · <DateTime iso={item.createdAt} /> ·{" "}
            {item.parameterSet?.id ? (
              <Link href={`/parameter-sets/${item.parameterSet.id}`} className="text-lux-dark underline-offset-4 hover:underline">
                {setLabel}
              </Link>
            ) : (
              setLabel
            )}
            {item.workerId ? ` · worker ${item.workerId}` : ""} ·{" "}
            <Link href="/lab-runs" className="text-lux-dark underline underline-offset-4">
              all runs
            </Link>
          </>
        }
        actions={
          <div className="flex flex-wrap items-center gap-2">
            {done ? (
              <Link
                href={workbenchHrefOfRun(item)}
                className="rounded-md border border-ink/25 px-3 py-1.5 text-sm font-medium text-lux-dark hover:border-lux"
              >
                Open in the workbench
              </Link>
            ) : null}
            <CancelRun run={item} />
          </div>
        }
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
    `Computed by ${result.workerId} with engine ${result.engineVersion} in ${(result.computeMs / 1000).toFixed(1)} s` +
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

/** The result column of each map quantity (older results lack θe and V: the picker offers what is there). */
const MAP_QUANTITY_COLUMN: Record<MapQuantity, string> = {
  share: "magneticShare",
  theta: "thetaRad",
  thetaElectric: "thetaElectricRad",
  thetaMagnetic: "thetaMagneticRad",
  verdet: "verdetRadPerTm",
};

function MapResult({ run, result, setLabel }: { run: LabRunDetail; result: LabRunResultBody; setLabel: string }) {
  const payload = mapPayloadSchema.parse(run.payload);
  const [wrapRef, width] = useElementWidth<HTMLDivElement>();
  const svg = useRef<SVGSVGElement>(null);
  const pickerId = useId();
  const c = result.columns;
  const field = payload.axis === "field";
  const xs = c.wavelengthNm as number[];
  const ys = useMemo(() => (c.rowValue as number[]).map((v) => (field ? Math.abs(v) : v)), [c.rowValue, field]);
  const available = MAP_QUANTITIES.filter((q) => c[MAP_QUANTITY_COLUMN[q]] !== undefined);
  const [quantity, setQuantity] = useState<MapQuantity>("share");
  const values = c[MAP_QUANTITY_COLUMN[quantity]] ?? [];
  const qView = MAP_QUANTITY_VIEW[quantity];
  const domain = useMemo(() => quantityDomain(values, quantity), [values, quantity]);
  const levels = useMemo(() => quantityLevels(domain, quantity), [domain, quantity]);
  const yName = field ? "|B0|" : "temperature";
  const yUnit = field ? "T" : "K";
  const describeCell = useCallback(
    (x: number, y: number, v: number | null) =>
      `Wavelength ${fmt(x)} nm, ${yName} ${fmt(y)} ${yUnit}: ${qView.short} ${formatQuantity(v, quantity)}`,
    [yName, yUnit, qView.short, quantity],
  );
  const formatLegend = useCallback((v: number) => (quantity === "share" ? `${Math.round(v * 100)} %` : fmt(v)), [quantity]);
  const identity = {
    runId: run.id,
    setName: run.parameterSet?.name ?? "run parameters",
    version: run.parameterSet?.version ?? null,
    edited: run.parameterSet?.edited ?? false,
  };
  const fileBase = mapFileBase(identity, payload);
  const deviation = result.meta.maxRelDeviationFromAnalytic as number | null | undefined;
  const conditions = field ? `at ${fmt(payload.params.temperatureK)} K` : `at ${fmt(payload.params.fieldT)} T`;
  const lengthNote = quantity === "share" || quantity === "verdet" ? "" : `, L = ${fmt(payload.params.lengthM * 1000)} mm`;
  return (
    <figure ref={wrapRef} className="space-y-2" data-testid="run-map">
      <label htmlFor={pickerId} className="flex flex-wrap items-center gap-2 text-sm">
        <span className="font-medium">Show on the map</span>
        <select
          id={pickerId}
          className="rounded-md border border-ink/25 bg-paper-raised px-2 py-1 text-sm focus:border-lux"
          value={quantity}
          onChange={(e) => setQuantity(e.target.value as MapQuantity)}
        >
          {available.map((q) => (
            <option key={q} value={q}>
              {MAP_QUANTITY_VIEW[q].label}
            </option>
          ))}
        </select>
      </label>
      <HeatMap
        title={
          `${qView.label}${quantity === "share" ? "" : ` (${qView.unit})`} over wavelength × ${field ? "|field|" : "temperature"} ` +
          `${conditions}${lengthNote} (${payload.method === "llg" ? "numerical LLG" : "analytic"})`
        }
        xs={xs}
        ys={ys}
        xType={payload.wavelengths.spacing === "log" ? "log" : "linear"}
        yType={payload.rows.spacing === "log" ? "log" : "linear"}
        values={values}
        levels={levels}
        domain={domain}
        formatLegend={formatLegend}
        noLevelText={quantity === "share" ? undefined : `${qView.short} keeps one sign over this map`}
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
        <PlotExportButtons svgRef={svg} fileBase={`${fileBase}-${qView.file}`} plotName="map" />
        <Button
          variant="secondary"
          onClick={() =>
            downloadText(buildMapCsv({ title: run.title, payload, columns: c, setLabel, runId: run.id }), `${fileBase}.csv`, "text/csv")
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
