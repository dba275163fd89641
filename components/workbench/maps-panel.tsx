"use client";

import { useEffect, useRef, useState } from "react";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { HeatMap } from "@/components/plots/heat-map";
import { PlotExportButtons } from "@/components/plots/plot-export-buttons";
import { useElementWidth } from "@/components/plots/use-element-size";
import type { ModelParams } from "@/lib/physics/schema";
import { isAbortError, type WorkbenchPool } from "@/lib/workbench/engine";
import { magneticScaleLabel } from "@/lib/workbench/format";
import { wavelengthGrid } from "@/lib/workbench/units";
import { checkedSpectrumRequest } from "@/lib/workbench/validate";
import type { WavelengthRange } from "@/lib/workbench/view-state";

/*
 * Magnetic share over wavelength × temperature and wavelength × field. Each row is one spectrum
 * request to the worker pool. The maps use the analytic (Polder) method: a 64 × 32 map would be
 * 2048 numerical LLG wavelengths (~10 s), and the numerical run agrees with it to ~1e-5 anyway.
 */

type MapKind = "temperature" | "field";
const COLS = 64;
const ROWS = 32;
const LEVELS = [0.5];

interface MapData {
  kind: MapKind;
  xs: number[];
  ys: number[];
  values: (number | null)[];
  yType: "log" | "linear";
  /** The magneticScale label of the parameters this map was computed from (physics-model §4.3). */
  banner: string | null;
}

/** What differs between the two maps; everything else is drawn the same way. */
const MAP_VIEW: Record<MapKind, { title: string; yLabel: string; file: string; plotName: string }> = {
  temperature: { title: "Magnetic share over wavelength × temperature (analytic)", yLabel: "Temperature (K)", file: "share-map-temperature", plotName: "temperature map" },
  field: { title: "Magnetic share over wavelength × |field| (analytic)", yLabel: "|B0| (T)", file: "share-map-field", plotName: "field map" },
};
const MAP_KINDS: MapKind[] = ["temperature", "field"];

function rowsFor(kind: MapKind, params: ModelParams): { ys: number[]; yType: "log" | "linear" } {
  if (kind === "temperature") {
    // Above the Curie–Weiss temperature (the ordered phase is not modelled) and within the 1–400 K of the numerical path.
    const lo = Math.max(1, params.curieWeissK + 1);
    return { ys: wavelengthGrid(lo, Math.max(lo + 1, 400), ROWS, "linear"), yType: "linear" };
  }
  // Same sign as the set's field; 0.01–10 T, log-spaced.
  const sign = params.fieldT < 0 ? -1 : 1;
  return { ys: wavelengthGrid(0.01, 10, ROWS, "log").map((b) => b * sign), yType: "log" };
}

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
  const [wrapRef, width] = useElementWidth<HTMLDivElement>();
  const [maps, setMaps] = useState<Partial<Record<MapKind, MapData>>>({});
  const [running, setRunning] = useState<MapKind | null>(null);
  const [progress, setProgress] = useState(0);
  const [error, setError] = useState<string | null>(null);
  const abort = useRef<AbortController | null>(null);

  useEffect(() => () => abort.current?.abort(), []);

  const run = async (kind: MapKind) => {
    if (!pool || !params || !range) return;
    abort.current?.abort();
    const ac = new AbortController();
    abort.current = ac;
    setRunning(kind);
    setProgress(0);
    setError(null);
    const xs = wavelengthGrid(range.fromNm, range.toNm, COLS, "log");
    const { ys, yType } = rowsFor(kind, params);
    const values: (number | null)[] = [];
    try {
      for (let j = 0; j < ys.length; j++) {
        const y = ys[j]!;
        const rowParams = kind === "temperature" ? { ...params, temperatureK: y } : { ...params, fieldT: y };
        const res = await pool.spectrum(checkedSpectrumRequest({ ...rowParams, wavelengthsNm: xs, method: "analytic" }), { signal: ac.signal });
        for (const p of res.points) values.push(p.magneticShare);
        setProgress((j + 1) / ys.length);
      }
      setMaps((m) => ({ ...m, [kind]: { kind, xs, ys: kind === "field" ? ys.map(Math.abs) : ys, values, yType, banner: magneticScaleLabel(params.magneticScale) } }));
    } catch (e) {
      if (!isAbortError(e)) setError(e instanceof Error ? e.message : String(e));
    } finally {
      if (abort.current === ac) setRunning(null);
    }
  };

  const anyMap = maps.temperature !== undefined || maps.field !== undefined;

  return (
    <div ref={wrapRef} className="space-y-4">
      <p className="text-sm text-ink-soft">
        Magnetic share |θm| / (|θe| + |θm|) computed in a worker, {COLS} log-spaced wavelengths over the current range × {ROWS} rows.
        Method: <strong>analytic (Polder linear response)</strong>. The dashed line is the 50 % contour. Colours: cividis (colour-blind safe,
        lightness rises with the share, so it also reads in grey).
      </p>
      <div className="flex flex-wrap items-center gap-2">
        <Button onClick={() => void run("temperature")} disabled={!pool || !params || !range || running !== null}>
          Compute wavelength × temperature map
        </Button>
        <Button variant="secondary" onClick={() => void run("field")} disabled={!pool || !params || !range || running !== null}>
          Compute wavelength × field map
        </Button>
        {running ? (
          <>
            <progress aria-label={`Map progress (${running})`} value={progress} max={1} className="w-40" />
            <span className="text-xs tabular-nums text-ink-soft">{Math.round(progress * 100)} %</span>
            <Button variant="quiet" onClick={() => abort.current?.abort()}>
              Cancel map
            </Button>
          </>
        ) : null}
      </div>
      {!params || !range ? <p className="text-sm text-ember">Fix the flagged inputs first.</p> : null}
      {error ? <Alert tone="warning" title="Map failed">{error}</Alert> : null}
      {anyMap ? <p className="text-xs text-ink-soft">Maps are computed on request; recompute after changing parameters.</p> : null}
      {MAP_KINDS.map((kind) => {
        const map = maps[kind];
        return map ? <MapPlot key={kind} map={map} width={width} fileBase={fileBase} /> : null;
      })}
    </div>
  );
}

function MapPlot({ map, width, fileBase }: { map: MapData; width: number; fileBase: string }) {
  const svg = useRef<SVGSVGElement>(null);
  const view = MAP_VIEW[map.kind];
  return (
    <>
      <HeatMap
        title={view.title}
        xs={map.xs}
        ys={map.ys}
        xType="log"
        yType={map.yType}
        values={map.values}
        levels={LEVELS}
        xLabel="Wavelength (nm)"
        yLabel={view.yLabel}
        width={width}
        height={300}
        banner={map.banner}
        svgRef={svg}
      />
      <PlotExportButtons svgRef={svg} fileBase={`${fileBase}-${view.file}`} plotName={view.plotName} />
    </>
  );
}
