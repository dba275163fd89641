"use client";

import { memo, useMemo, useRef, useState } from "react";
import { LinePlot, type PlotSeries } from "@/components/plots/line-plot";
import { PlotExportButtons } from "@/components/plots/plot-export-buttons";
import { useElementWidth } from "@/components/plots/use-element-size";
import { useMeasurementLayers } from "./measurement-overlay";
import type { SpectrumPoint } from "@/lib/physics/types";
import { describeCrossing, shareCrossingsNm } from "@/lib/workbench/crossing";
import { fmt, fmtPercent } from "@/lib/workbench/format";
import { SERIES_STYLE, type SeriesKey } from "@/lib/workbench/palette";
import {
  fromNm,
  rotationTo,
  toNm,
  X_AXIS_TITLE,
  X_UNIT_LABEL,
  X_UNITS,
  Y_MODE_LABEL,
  Y_MODES,
  Y_UNIT_SHORT,
  type Geometry,
  type YMode,
} from "@/lib/workbench/units";
import type { ViewState } from "@/lib/workbench/view-state";

const SELECT = "rounded-md border border-ink/25 bg-paper-raised px-2 py-1 text-sm focus:border-lux";

const NO_IDS: readonly string[] = [];

type SeriesToggle = "total" | "electric" | "magnetic" | "cross";
const TOGGLES: SeriesToggle[] = ["total", "electric", "magnetic", "cross"];

function seriesValues(points: readonly SpectrumPoint[], key: SeriesKey, yMode: YMode, g: Geometry): (number | null)[] {
  const pick: Record<SeriesKey, (p: SpectrumPoint) => number> = {
    total: (p) => p.thetaRad,
    electric: (p) => p.thetaElectricRad,
    magnetic: (p) => p.thetaMagneticRad,
    cross: (p) => p.thetaCrossRad,
    ellipticity: (p) => p.ellipticityRad,
  };
  return points.map((p) => rotationTo(pick[key](p), yMode, g));
}

function SpectrumPanelsImpl({
  points,
  geometry,
  view,
  onView,
  onAddMarker,
  banner,
  fileBase,
  methodLabel,
  overlaySetIds = NO_IDS,
}: {
  points: readonly SpectrumPoint[];
  geometry: Geometry;
  view: ViewState;
  onView: (patch: Partial<ViewState>) => void;
  onAddMarker: (nm: number) => void;
  banner: string | null;
  fileBase: string;
  methodLabel: string;
  /** Measurement sets drawn as points with error bars over the spectrum. */
  overlaySetIds?: readonly string[];
}) {
  const [wrapRef, width] = useElementWidth<HTMLDivElement>();
  const [cursor, setCursor] = useState<number | null>(null);
  const spectrumSvg = useRef<SVGSVGElement>(null);
  const shareSvg = useRef<SVGSVGElement>(null);
  const { xUnit, xScale, yMode, series: on, showEllipticity } = view;

  const xs = useMemo(() => points.map((p) => fromNm(p.wavelengthNm, xUnit)), [points, xUnit]);

  const series = useMemo<PlotSeries[]>(() => {
    const keys: SeriesKey[] = [...TOGGLES.filter((k) => on[k]), ...(showEllipticity ? (["ellipticity"] as const) : [])];
    return keys.map((k) => {
      const s = SERIES_STYLE[k];
      return { key: k, label: s.label, color: s.color, dash: s.dash, width: s.width, values: seriesValues(points, k, yMode, geometry) };
    });
  }, [points, on, showEllipticity, yMode, geometry]);

  const shareSeries = useMemo<PlotSeries[]>(
    () => [{ key: "share", label: "Magnetic share", color: SERIES_STYLE.magnetic.color, dash: undefined, width: 2.2, values: points.map((p) => (p.magneticShare === null ? null : p.magneticShare * 100)) }],
    [points],
  );

  const crossings = useMemo(() => shareCrossingsNm(points), [points]);
  const crossingText = describeCrossing(crossings);
  const markers = useMemo(() => view.markersNm.map((nm) => ({ x: fromNm(nm, xUnit), label: `${nm}` })), [view.markersNm, xUnit]);
  const dots = useMemo(() => crossings.map((nm) => ({ x: fromNm(nm, xUnit), y: 50, label: `${Math.round(nm)} nm` })), [crossings, xUnit]);
  const hLines = useMemo(() => [{ y: 50, label: "50 %" }], []);
  const shareDomain = useMemo<[number, number]>(() => [0, 100], []);

  const rangeNm = useMemo(() => (points.length > 0 ? ([points[0]!.wavelengthNm, points[points.length - 1]!.wavelengthNm] as const) : null), [points]);
  const layers = useMeasurementLayers({ setIds: overlaySetIds, xUnit, yMode, yUnit: Y_UNIT_SHORT[yMode], geometry, rangeNm });
  const pick = (x: number) => onAddMarker(Number(toNm(x, xUnit).toPrecision(5)));
  const cp = cursor !== null ? points[cursor] : undefined;
  const yUnit = Y_UNIT_SHORT[yMode];
  const yLabel = yMode === "verdet" ? Y_MODE_LABEL.verdet : `Rotation (${yUnit}) at ${geometry.fieldT} T, ${geometry.lengthM * 1000} mm`;
  // Both plots share the x axis, the cursor, the markers and the readout below them.
  const shared = {
    xs,
    xType: xScale,
    xLabel: X_AXIS_TITLE[xUnit],
    width,
    cursorIndex: cursor,
    onCursorChange: setCursor,
    onPick: pick,
    markers,
    banner,
    describedBy: "spectrum-readout",
  };

  return (
    <section aria-label="Spectrum" className="space-y-3">
      <div className="flex flex-wrap items-end gap-x-4 gap-y-2 text-sm">
        <AxisSelect label="x axis" value={xUnit} options={X_UNITS.map((u) => [u, X_AXIS_TITLE[u]])} onChange={(u) => onView({ xUnit: u })} />
        <AxisSelect
          label="x scale"
          value={xScale}
          options={[
            ["log", "log"],
            ["linear", "linear"],
          ]}
          onChange={(scale) => onView({ xScale: scale })}
        />
        <AxisSelect label="y axis" value={yMode} options={Y_MODES.map((m) => [m, Y_MODE_LABEL[m]])} onChange={(m) => onView({ yMode: m })} />
        <fieldset className="flex flex-wrap items-center gap-3">
          <legend className="sr-only">Curves</legend>
          {TOGGLES.map((k) => (
            <label key={k} className="flex items-center gap-1.5">
              <input type="checkbox" checked={on[k]} onChange={(e) => onView({ series: { ...on, [k]: e.target.checked } })} />
              <svg width="26" height="8" aria-hidden="true">
                <line x1="1" x2="25" y1="4" y2="4" stroke={SERIES_STYLE[k].color} strokeWidth={SERIES_STYLE[k].width} strokeDasharray={SERIES_STYLE[k].dash} />
              </svg>
              {SERIES_STYLE[k].label}
            </label>
          ))}
          <label className="flex items-center gap-1.5">
            <input type="checkbox" checked={showEllipticity} onChange={(e) => onView({ showEllipticity: e.target.checked })} />
            Ellipticity
          </label>
        </fieldset>
      </div>

      <div ref={wrapRef} className="space-y-2">
        <LinePlot {...shared} title={`Faraday rotation and its parts (${methodLabel})`} yLabel={yLabel} series={series} height={340} svgRef={spectrumSvg} layers={layers} />
        <PlotExportButtons svgRef={spectrumSvg} fileBase={`${fileBase}-spectrum`} plotName="spectrum plot" />

        <div id="spectrum-readout" aria-live="polite" className="min-h-12 rounded-md bg-paper-sunk px-3 py-2 text-xs tabular-nums text-ink">
          {cp ? (
            <dl className="grid grid-cols-2 gap-x-4 gap-y-0.5 sm:grid-cols-4">
              <Readout term="λ" value={`${fmt(cp.wavelengthNm, 5)} nm (${fmt(fromNm(cp.wavelengthNm, xUnit), 5)} ${X_UNIT_LABEL[xUnit]})`} />
              <Readout term="θ" value={`${fmt(rotationTo(cp.thetaRad, yMode, geometry))} ${yUnit}`} />
              <Readout term="θe" value={`${fmt(rotationTo(cp.thetaElectricRad, yMode, geometry))} ${yUnit}`} />
              <Readout term="θm" value={`${fmt(rotationTo(cp.thetaMagneticRad, yMode, geometry))} ${yUnit}`} />
              <Readout term="θx" value={`${fmt(rotationTo(cp.thetaCrossRad, yMode, geometry))} ${yUnit}`} />
              <Readout term="η" value={`${fmt(rotationTo(cp.ellipticityRad, yMode, geometry))} ${yUnit}`} />
              <Readout term="Magnetic share" value={fmtPercent(cp.magneticShare)} />
              <Readout term="V" value={`${fmt(cp.verdetRadPerTm)} rad/(T·m)`} />
            </dl>
          ) : (
            <p className="text-ink-soft">Point at a plot, or focus it and use the arrow keys, to read all values; click or press Enter to add a marker there.</p>
          )}
        </div>

        {view.panels.share ? (
          <>
            <LinePlot
              {...shared}
              title={`Magnetic share |θm| / (|θe| + |θm|) — ${crossingText}`}
              yLabel="Magnetic share (%)"
              series={shareSeries}
              height={240}
              yDomain={shareDomain}
              hLines={hLines}
              dots={dots}
              svgRef={shareSvg}
              legend={false}
            />
            <p data-testid="share-crossing" className="text-sm">
              Magnetic share {crossingText}.
            </p>
            <PlotExportButtons svgRef={shareSvg} fileBase={`${fileBase}-share`} plotName="magnetic share plot" />
          </>
        ) : null}
      </div>
    </section>
  );
}

/** A labelled select of the plot controls; the visible text is the control's accessible name. */
function AxisSelect<T extends string>({ label, value, options, onChange }: { label: string; value: T; options: readonly (readonly [T, string])[]; onChange: (value: T) => void }) {
  return (
    <label className="flex flex-col gap-1">
      <span className="text-xs font-medium text-ink-soft">{label}</span>
      <select className={SELECT} value={value} onChange={(e) => onChange(options.find(([v]) => v === e.target.value)?.[0] ?? value)}>
        {options.map(([v, text]) => (
          <option key={v} value={v}>
            {text}
          </option>
        ))}
      </select>
    </label>
  );
}

function Readout({ term, value }: { term: string; value: string }) {
  return (
    <div className="flex gap-1.5">
      <dt className="text-ink-soft">{term}</dt>
      <dd>{value}</dd>
    </div>
  );
}

export const SpectrumPanels = memo(SpectrumPanelsImpl);
