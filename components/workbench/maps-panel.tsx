"use client";

import { useCallback, useEffect, useId, useMemo, useRef, useState } from "react";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { HeatMap } from "@/components/plots/heat-map";
import { LinePlot } from "@/components/plots/line-plot";
import { PlotExportButtons } from "@/components/plots/plot-export-buttons";
import { useElementWidth } from "@/components/plots/use-element-size";
import { MAX_MAP_COLUMNS, MAX_MAP_ROWS } from "@/lib/lab-runs/kinds";
import type { ModelParams } from "@/lib/physics/schema";
import { isAbortError, type WorkbenchPool } from "@/lib/workbench/engine";
import { fmt as fmtNum, magneticScaleLabel } from "@/lib/workbench/format";
import { SERIES_STYLE } from "@/lib/workbench/palette";
import {
  axisIndependence,
  DEFAULT_FIELD_AXIS,
  formatQuantity,
  MAP_QUANTITIES,
  MAP_QUANTITY_VIEW,
  maxColumnChange,
  quantityDomain,
  quantityLevels,
  type MapQuantity,
  DEFAULT_MAP_RESOLUTION,
  expectedMapTime,
  MAP_METHOD_LABEL,
  MAP_RESOLUTIONS,
  mapValues,
  maxDeviation,
  methodCaption,
  parseResolution,
  planMap,
  resolutionKey,
  rowParams,
  type FieldAxisDrafts,
  type MapKind,
  type MapMethod,
  type MapProblem,
} from "@/lib/workbench/maps";
import { checkedSpectrumRequest } from "@/lib/workbench/validate";
import type { WavelengthRange } from "@/lib/workbench/view-state";
import type { LimitQuery } from "@/lib/materials/limits";
import { ModelLimits } from "./model-limits";

/*
 * The magnetic share, θ, θe, θm or the Verdet constant over wavelength × temperature and
 * wavelength × field (a select per map; one computation serves them all), at a resolution the
 * user picks (32 × 16 … 256 × 128) with the expected time said before the run. The whole map goes
 * to the pool as one job, computed in blocks of rows by warm workers and returned as typed arrays;
 * progress reaches React at most PROGRESS_EVERY_MS apart. lib/workbench/maps.ts builds the grid
 * and keeps everything out of the numerical path's range away from the workers.
 */

/** Fewest milliseconds between two progress renders: a few a second is enough to read. */
const PROGRESS_EVERY_MS = 200;

const INPUT =
  "block w-24 rounded-md border border-ink/25 bg-paper-raised px-2.5 py-1.5 text-sm tabular-nums " +
  "focus:border-lux aria-[invalid=true]:border-ember";

interface MapData {
  kind: MapKind;
  method: MapMethod;
  xs: number[];
  ys: number[];
  /** Row-major values of every quantity, from the same row runs. */
  values: Record<MapQuantity, (number | null)[]>;
  yType: "log" | "linear";
  /** The model knows the share is independent of T and B without it (§6.4, §5.5). */
  diamagneticTerm: boolean;
  /** The set's own temperature or |field|: the row a curve is drawn from when the axis does not matter. */
  ownY: number;
  /** Sample length and field the rotations are for (shown with θ). */
  lengthM: number;
  fieldT: number;
  /** The magneticScale label of the parameters this map was computed from (physics-model §4.3). */
  banner: string | null;
  /** Numerical maps: the largest deviation from linear response over all rows. */
  deviation: number | undefined;
  notes: string[];
  warnings: string[];
  /** What the map computed at, for the model's validity warnings (lib/materials/limits.ts). */
  limits: LimitQuery;
}

/** What differs between the two maps; everything else is drawn the same way. */
const MAP_VIEW: Record<MapKind, { title: string; yLabel: string; yName: string; yUnit: string; file: string; plotName: string }> = {
  temperature: {
    title: "over wavelength × temperature",
    yLabel: "Temperature (K)",
    yName: "temperature",
    yUnit: "K",
    file: "map-temperature",
    plotName: "temperature map",
  },
  field: { title: "over wavelength × |field|", yLabel: "|B0| (T)", yName: "|B0|", yUnit: "T", file: "map-field", plotName: "field map" },
};
const MAP_KINDS: MapKind[] = ["temperature", "field"];
const METHOD_SHORT: Record<MapMethod, string> = { analytic: "analytic", llg: "numerical LLG" };

const fmt = (v: number) => String(Number(v.toPrecision(4)));

export function MapsPanel({
  pool,
  params,
  range,
  fileBase,
}: {
  pool: WorkbenchPool | null;
  params: ModelParams | null;
  range: WavelengthRange | null;
  fileBase: string;
}) {
  const id = useId().replace(/[^\w-]/g, "");
  const [wrapRef, width] = useElementWidth<HTMLDivElement>();
  const [maps, setMaps] = useState<Partial<Record<MapKind, MapData>>>({});
  const [method, setMethod] = useState<MapMethod>("analytic");
  const [fieldAxis, setFieldAxis] = useState<FieldAxisDrafts>(DEFAULT_FIELD_AXIS);
  const [resolution, setResolution] = useState(DEFAULT_MAP_RESOLUTION);
  // The pool's measured rate, for the expected time; known once its warm-up has finished.
  const [cellsPerSecond, setCellsPerSecond] = useState<number | null>(null);
  const [running, setRunning] = useState<{ kind: MapKind; method: MapMethod } | null>(null);
  const [progress, setProgress] = useState(0);
  const [error, setError] = useState<string | null>(null);
  const abort = useRef<AbortController | null>(null);

  useEffect(() => () => abort.current?.abort(), []);
  useEffect(() => {
    if (!pool) return;
    let live = true;
    void pool.warmUp().then(() => {
      if (live) setCellsPerSecond(pool.numericalCellsPerSecond());
    });
    return () => {
      live = false;
    };
  }, [pool]);

  const plans =
    params && range
      ? {
          temperature: planMap("temperature", method, params, range, fieldAxis, resolution),
          field: planMap("field", method, params, range, fieldAxis, resolution),
        }
      : null;
  const problemsAt = (control: MapProblem["control"]) => {
    if (!plans) return [];
    const all = [...plans.temperature.problems, ...plans.field.problems].filter((p) => p.control === control).map((p) => p.message);
    return [...new Set(all)];
  };
  const methodProblems = problemsAt("method");
  const fieldAxisProblems = problemsAt("fieldAxis");

  const run = async (kind: MapKind) => {
    if (!pool || !params || !range || !plans) return;
    const { plan } = plans[kind];
    if (!plan) return;
    abort.current?.abort();
    const ac = new AbortController();
    abort.current = ac;
    setRunning({ kind, method: plan.method });
    setProgress(0);
    setError(null);
    let lastRender = 0;
    try {
      const base = checkedSpectrumRequest({ ...rowParams(plan, params, 0), wavelengthsNm: plan.xs, method: plan.method });
      const arrays = await pool.map(
        { base, axis: kind, rowValues: plan.ys },
        {
          signal: ac.signal,
          onProgress: (f) => {
            const now = performance.now();
            if (ac.signal.aborted || now - lastRender < PROGRESS_EVERY_MS) return;
            lastRender = now;
            setProgress(f);
          },
        },
      );
      const values = mapValues(arrays.values);
      const deviations = Array.from(arrays.deviation, (d) => (Number.isNaN(d) ? undefined : d));
      setCellsPerSecond(pool.numericalCellsPerSecond());
      setMaps((m) => ({
        ...m,
        [kind]: {
          kind,
          method: plan.method,
          xs: plan.xs,
          ys: kind === "field" ? plan.ys.map(Math.abs) : plan.ys,
          values,
          yType: plan.yType,
          diamagneticTerm: params.diamagneticTerm === true,
          ownY: kind === "temperature" ? params.temperatureK : Math.abs(params.fieldT),
          lengthM: params.lengthM,
          fieldT: params.fieldT,
          banner: magneticScaleLabel(params.magneticScale),
          deviation: plan.method === "llg" ? maxDeviation(deviations) : undefined,
          notes: plan.notes,
          warnings: arrays.warnings,
          limits: {
            params,
            temperaturesK: kind === "temperature" ? plan.ys : [params.temperatureK],
            fieldsT: kind === "field" ? plan.ys : [params.fieldT],
            wavelengthsNm: plan.xs,
          },
        },
      }));
    } catch (e) {
      if (!isAbortError(e)) setError(e instanceof Error ? e.message : String(e));
    } finally {
      if (abort.current === ac) setRunning(null);
    }
  };

  const anyMap = maps.temperature !== undefined || maps.field !== undefined;
  const canRun = (kind: MapKind) => Boolean(pool && plans?.[kind].plan) && running === null;
  const methodErrorId = `${id}-method-error`;
  const axisErrorId = `${id}-axis-error`;

  return (
    <div ref={wrapRef} className="space-y-4">
      <p className="text-sm text-ink-soft">
        The magnetic share |θm| / (|θe| + |θm|), θ, θe, θm or the Verdet constant, computed in the worker pool over log-spaced wavelengths
        in the current range × temperatures or fields, at the resolution chosen below; choose the quantity under each map. Dashed lines: the
        50 % contour of the share, or where a signed quantity changes sign. Colours: cividis (colour-blind safe, lightness rises with the
        value, so it also reads in grey). Where the quantity does not depend on the map&apos;s second axis, the map says so and shows a
        curve against wavelength instead of stripes.
      </p>
      <div className="flex flex-wrap items-start gap-6">
        <fieldset className="space-y-1 text-sm" aria-describedby={methodProblems.length > 0 ? methodErrorId : undefined}>
          <legend className="mb-1 text-xs font-semibold tracking-wide text-ink-soft uppercase">Map method</legend>
          {(Object.keys(MAP_METHOD_LABEL) as MapMethod[]).map((m) => (
            <label key={m} className="flex items-center gap-1.5">
              <input
                type="radio"
                name={`${id}-method`}
                value={m}
                checked={method === m}
                disabled={running !== null}
                onChange={() => setMethod(m)}
              />
              {MAP_METHOD_LABEL[m]}
            </label>
          ))}
          {methodProblems.length > 0 ? (
            <div id={methodErrorId} role="alert" className="max-w-md space-y-1 text-xs text-ember">
              {methodProblems.map((p) => (
                <p key={p}>{p}</p>
              ))}
            </div>
          ) : null}
        </fieldset>
        <fieldset className="space-y-1 text-sm">
          <legend className="mb-1 text-xs font-semibold tracking-wide text-ink-soft uppercase">Field map axis, |B0| (T)</legend>
          <div className="flex items-end gap-2">
            {(["fromT", "toT"] as const).map((k) => (
              <div key={k}>
                <label htmlFor={`${id}-${k}`} className="text-xs font-medium">
                  {k === "fromT" ? "From" : "To"}
                </label>
                <input
                  id={`${id}-${k}`}
                  type="text"
                  inputMode="decimal"
                  autoComplete="off"
                  className={`mt-1 ${INPUT}`}
                  value={fieldAxis[k]}
                  disabled={running !== null}
                  aria-invalid={fieldAxisProblems.length > 0 ? true : undefined}
                  aria-describedby={fieldAxisProblems.length > 0 ? axisErrorId : `${id}-axis-hint`}
                  onChange={(e) => setFieldAxis((a) => ({ ...a, [k]: e.target.value }))}
                />
              </div>
            ))}
          </div>
          {fieldAxisProblems.length > 0 ? (
            <p id={axisErrorId} role="alert" className="max-w-md text-xs text-ember">
              {fieldAxisProblems.join(" ")}
            </p>
          ) : (
            <p id={`${id}-axis-hint`} className="max-w-md text-xs text-ink-soft">
              Log-spaced, with the sign of the set&apos;s field. Numerical LLG: 0.01–10 T.
            </p>
          )}
        </fieldset>
      </div>
      <div className="space-y-1 text-sm">
        <label htmlFor={`${id}-resolution`} className="flex flex-wrap items-center gap-2">
          <span className="font-medium">Map resolution</span>
          <select
            id={`${id}-resolution`}
            className="rounded-md border border-ink/25 bg-paper-raised px-2 py-1 text-sm focus:border-lux"
            value={resolutionKey(resolution)}
            disabled={running !== null}
            aria-describedby={`${id}-expected`}
            onChange={(e) => setResolution(parseResolution(e.target.value))}
          >
            {MAP_RESOLUTIONS.map((r) => (
              <option key={resolutionKey(r)} value={resolutionKey(r)}>
                {`${r.cols} wavelengths × ${r.rows} rows (${(r.cols * r.rows).toLocaleString("en")} cells)`}
              </option>
            ))}
          </select>
        </label>
        <p id={`${id}-expected`} className="text-xs text-ink-soft" data-testid="map-expected-time">
          {expectedMapTime(resolution.cols * resolution.rows, method, cellsPerSecond)} Finer maps (up to {MAX_MAP_COLUMNS} × {MAX_MAP_ROWS})
          run on the lab&apos;s machines.
        </p>
      </div>
      <div className="flex flex-wrap items-center gap-2">
        <Button onClick={() => void run("temperature")} disabled={!canRun("temperature")}>
          Compute wavelength × temperature map
        </Button>
        <Button variant="secondary" onClick={() => void run("field")} disabled={!canRun("field")}>
          Compute wavelength × field map
        </Button>
        {running ? (
          <>
            <progress
              aria-label={`Map progress (${running.kind}, ${METHOD_SHORT[running.method]})`}
              value={progress}
              max={1}
              className="w-40"
            />
            <span className="text-xs tabular-nums text-ink-soft">{Math.round(progress * 100)} %</span>
            <Button variant="quiet" onClick={() => abort.current?.abort()}>
              Cancel map
            </Button>
          </>
        ) : null}
      </div>
      {!params || !range ? <p className="text-sm text-ember">Fix the flagged inputs first.</p> : null}
      {error ? (
        <Alert tone="warning" title="Map failed">
          {error}
        </Alert>
      ) : null}
      {anyMap ? (
        <p className="text-xs text-ink-soft">Maps are computed on request; recompute after changing parameters or the method.</p>
      ) : null}
      {MAP_KINDS.map((kind) => {
        const map = maps[kind];
        return map ? <MapPlot key={kind} map={map} width={width} fileBase={fileBase} /> : null;
      })}
    </div>
  );
}

function MapPlot({ map, width, fileBase }: { map: MapData; width: number; fileBase: string }) {
  const svg = useRef<SVGSVGElement>(null);
  const selectId = useId();
  const [quantity, setQuantity] = useState<MapQuantity>("share");
  const view = MAP_VIEW[map.kind];
  const qView = MAP_QUANTITY_VIEW[quantity];
  const values = map.values[quantity];
  const nx = map.xs.length;
  const ny = map.ys.length;
  const change = useMemo(() => maxColumnChange(values, nx, ny), [values, nx, ny]);
  const independence = axisIndependence(quantity, map.kind, map.diamagneticTerm, change);
  const domain = useMemo(() => quantityDomain(values, quantity), [values, quantity]);
  const levels = useMemo(() => quantityLevels(domain, quantity), [domain, quantity]);
  // The row at the set's own temperature or field, for the curve drawn instead of stripes.
  const ownRow = useMemo(() => {
    let best = 0;
    map.ys.forEach((y, j) => {
      if (Math.abs(y - map.ownY) < Math.abs(map.ys[best]! - map.ownY)) best = j;
    });
    return best;
  }, [map.ys, map.ownY]);
  const curve = useMemo(() => {
    const row = values.slice(ownRow * nx, ownRow * nx + nx).map((v) => (v === null ? null : quantity === "share" ? v * 100 : v));
    return [{ key: quantity, label: qView.label, color: SERIES_STYLE.total.color, dash: undefined, width: 2.2, values: row }];
  }, [values, ownRow, nx, quantity, qView.label]);
  // Stable, so the memoized heat map does not redraw while a new map's progress ticks.
  const describeCell = useCallback(
    (x: number, y: number, v: number | null) =>
      `Wavelength ${fmt(x)} nm, ${view.yName} ${fmt(y)} ${view.yUnit}: ${qView.short} ${formatQuantity(v, quantity)}`,
    [view, qView, quantity],
  );
  const formatLegend = useCallback((v: number) => (quantity === "share" ? `${Math.round(v * 100)} %` : fmtNum(v, 3)), [quantity]);
  const unitNote =
    quantity === "verdet"
      ? ""
      : quantity === "share"
        ? ""
        : ` for L = ${fmt(map.lengthM * 1000)} mm${map.kind === "temperature" ? ` at ${fmt(map.fieldT)} T` : ""}`;
  const title = `${qView.label}${quantity === "share" ? "" : ` (${qView.unit})`} ${view.title} (${METHOD_SHORT[map.method]})`;
  const noLevelText = quantity === "share" ? undefined : `${qView.short} keeps one sign over this map`;
  return (
    <figure className="space-y-1" data-testid={`share-map-${map.kind}`} data-grid={`${nx}x${ny}`}>
      <ModelLimits query={map.limits} where={`the ${map.kind} map`} />
      <label htmlFor={selectId} className="flex flex-wrap items-center gap-2 text-sm">
        <span className="font-medium">Show on the {view.plotName}</span>
        <select
          id={selectId}
          className="rounded-md border border-ink/25 bg-paper-raised px-2 py-1 text-sm focus:border-lux"
          value={quantity}
          onChange={(e) => setQuantity(e.target.value as MapQuantity)}
        >
          {MAP_QUANTITIES.map((q) => (
            <option key={q} value={q}>
              {MAP_QUANTITY_VIEW[q].label}
            </option>
          ))}
        </select>
      </label>
      {independence.independent ? (
        <>
          <p
            role="note"
            data-testid={`map-${map.kind}-independent`}
            className="max-w-3xl rounded-md border border-ink/15 bg-paper-sunk px-3 py-2 text-sm text-ink"
          >
            {independence.reason}
          </p>
          {change !== null ? (
            <LinePlot
              title={
                `${qView.label}${quantity === "share" ? "" : ` (${qView.unit})`} against wavelength ` +
                `at ${view.yName} ${fmt(map.ys[ownRow]!)} ${view.yUnit} (${METHOD_SHORT[map.method]})`
              }
              width={width}
              height={240}
              banner={map.banner}
              svgRef={svg}
              series={{ xs: map.xs, curves: curve, legend: false }}
              axes={{
                x: { type: "log", label: "Wavelength (nm)" },
                y: { label: quantity === "share" ? "Magnetic share (%)" : `${qView.short} (${qView.unit})${unitNote}` },
              }}
            />
          ) : null}
        </>
      ) : (
        <HeatMap
          title={title}
          xs={map.xs}
          ys={map.ys}
          xType="log"
          yType={map.yType}
          values={values}
          levels={levels}
          xLabel="Wavelength (nm)"
          yLabel={view.yLabel}
          width={width}
          height={300}
          banner={map.banner}
          svgRef={svg}
          describeCell={describeCell}
          domain={domain}
          formatLegend={formatLegend}
          noLevelText={noLevelText}
        />
      )}
      <figcaption className="space-y-0.5 text-xs text-ink-soft">
        {!independence.independent && change !== null ? (
          <span className="block" data-testid={`map-${map.kind}-change`}>
            {`Along the ${view.yName} axis ${qView.short} changes by up to ${(change.relative * 100).toPrecision(3)} % ` +
              `of its largest value at one wavelength (${fmt(map.xs[change.column]!)} nm)${unitNote ? `; rotations${unitNote}` : ""}.`}
          </span>
        ) : null}
        <span className="block" data-testid={`share-map-${map.kind}-method`}>
          {methodCaption(map.method, map.ys.length, map.deviation)}
        </span>
        {map.notes.map((n) => (
          <span key={n} className="block">
            {n}
          </span>
        ))}
        {map.warnings.map((w) => (
          <span key={w} className="block text-ember">
            {w}
          </span>
        ))}
      </figcaption>
      <PlotExportButtons svgRef={svg} fileBase={`${fileBase}-${qView.file}-${view.file}`} plotName={view.plotName} />
    </figure>
  );
}
