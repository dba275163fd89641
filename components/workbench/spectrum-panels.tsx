"use client";

import { memo, useCallback, useMemo, useRef, useState } from "react";
import { Button } from "@/components/ui/button";
import { LinePlot, type PlotSeries } from "@/components/plots/line-plot";
import { PlotExportButtons } from "@/components/plots/plot-export-buttons";
import { useElementWidth } from "@/components/plots/use-element-size";
import { useMeasurementLayers } from "./measurement-overlay";
import type { SpectrumPoint } from "@/lib/physics/types";
import { formatTransmission } from "@/lib/workbench/absorption-view";
import { describeCrossing, shareCrossingsNm } from "@/lib/workbench/crossing";
import { fmt, fmtPercent } from "@/lib/workbench/format";
import { DIAMAGNETIC_STYLE, SERIES_STYLE, type SeriesKey } from "@/lib/workbench/palette";
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
  curveLabel,
  curveSymbol,
  type Geometry,
  type YMode,
} from "@/lib/workbench/units";
import { MAX_MARKERS, type ViewState } from "@/lib/workbench/view-state";
import { checkMarkerNm } from "@/lib/workbench/markers";
import { isFullDomain, panDomain, zoomDomain, type Domain } from "@/lib/workbench/zoom";

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
    // The transmitted ellipticity angle atan(tanh η) (§1), never η beyond the small-dichroism form.
    ellipticity: (p) => p.ellipticityAngleRad ?? p.ellipticityRad,
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
  caption,
  methodLabel,
  overlaySetIds = NO_IDS,
  curveTemperatureK = Number.NaN,
}: {
  points: readonly SpectrumPoint[];
  geometry: Geometry;
  view: ViewState;
  onView: (patch: Partial<ViewState>) => void;
  onAddMarker: (nm: number) => void;
  banner: string | null;
  fileBase: string;
  /** Set, version, temperature and field (figureCaption): drawn in the titles, so exports carry them. */
  caption: string;
  methodLabel: string;
  /** Measurement sets drawn as points with error bars over the spectrum. */
  overlaySetIds?: readonly string[];
  /** The temperature the curves were computed at: overlay points at other conditions are drawn hollow. */
  curveTemperatureK?: number;
}) {
  const [wrapRef, width] = useElementWidth<HTMLDivElement>();
  const [cursor, setCursor] = useState<number | null>(null);
  const spectrumSvg = useRef<SVGSVGElement>(null);
  const shareSvg = useRef<SVGSVGElement>(null);
  const { xUnit, xScale, yMode, series: on, showEllipticity } = view;

  const xs = useMemo(() => points.map((p) => fromNm(p.wavelengthNm, xUnit)), [points, xUnit]);

  const withDiamagnetic = points.some((p) => p.thetaDiamagneticRad !== undefined);
  const series = useMemo<PlotSeries[]>(() => {
    const keys: SeriesKey[] = [...TOGGLES.filter((k) => on[k]), ...(showEllipticity ? (["ellipticity"] as const) : [])];
    const curves: PlotSeries[] = keys.map((k) => {
      const s = SERIES_STYLE[k];
      return {
        key: k,
        label: curveLabel(k, yMode),
        color: s.color,
        dash: s.dash,
        width: s.width,
        values: seriesValues(points, k, yMode, geometry),
      };
    });
    if (withDiamagnetic && on.diamagnetic !== false) {
      curves.push({ ...DIAMAGNETIC_STYLE, values: points.map((p) => rotationTo(p.thetaDiamagneticRad ?? 0, yMode, geometry)) });
    }
    return curves;
  }, [points, on, showEllipticity, yMode, geometry, withDiamagnetic]);

  const shareSeries = useMemo<PlotSeries[]>(
    () => [
      {
        key: "share",
        label: "Magnetic share",
        color: SERIES_STYLE.magnetic.color,
        dash: undefined,
        width: 2.2,
        values: points.map((p) => (p.magneticShare === null ? null : p.magneticShare * 100)),
      },
    ],
    [points],
  );

  const crossings = useMemo(() => shareCrossingsNm(points), [points]);
  const crossingText = describeCrossing(crossings);
  const markers = useMemo(() => view.markersNm.map((nm) => ({ x: fromNm(nm, xUnit), label: `${nm}` })), [view.markersNm, xUnit]);
  const dots = useMemo(() => crossings.map((nm) => ({ x: fromNm(nm, xUnit), y: 50, label: `${Math.round(nm)} nm` })), [crossings, xUnit]);
  const hLines = useMemo(() => [{ y: 50, label: "50 %" }], []);
  const shareDomain = useMemo<[number, number]>(() => [0, 100], []);

  // Zoom lives here, in nm, so both plots share it and it survives a change of x unit.
  const [zoomNm, setZoomNm] = useState<[number, number] | null>(null);
  const fullNm = useMemo<Domain | null>(() => {
    const first = points[0]?.wavelengthNm;
    const last = points[points.length - 1]?.wavelengthNm;
    return first !== undefined && last !== undefined && last > first ? [first, last] : null;
  }, [points]);
  const toDisplay = useCallback(
    (d: Domain): [number, number] => {
      const a = fromNm(d[0], xUnit);
      const b = fromNm(d[1], xUnit);
      return a <= b ? [a, b] : [b, a];
    },
    [xUnit],
  );
  const fullX = useMemo(() => (fullNm ? toDisplay(fullNm) : null), [fullNm, toDisplay]);
  const xView = useMemo(() => (zoomNm ? toDisplay(zoomNm) : null), [zoomNm, toDisplay]);
  const onXViewChange = useCallback(
    (d: [number, number] | null) => {
      if (!d || !fullX || isFullDomain(d, fullX)) {
        setZoomNm(null);
        return;
      }
      const a = toNm(d[0], xUnit);
      const b = toNm(d[1], xUnit);
      setZoomNm(a <= b ? [a, b] : [b, a]);
    },
    [fullX, xUnit],
  );
  const zoomBy = (factor: number) => fullX && onXViewChange(zoomDomain(xView ?? fullX, factor, NaN, fullX, xScale));
  const panBy = (fraction: number) => fullX && xView && onXViewChange(panDomain(xView, fraction, fullX, xScale));
  const zoomed = zoomNm !== null;

  const [pickError, setPickError] = useState<string | null>(null);
  const pick = (x: number) => {
    const nm = Number(toNm(x, xUnit).toPrecision(5));
    const checked = checkMarkerNm(nm, view.markersNm, MAX_MARKERS);
    setPickError(checked.error);
    if (checked.error === null) onAddMarker(nm);
  };
  const rangeNm = useMemo(
    () => (points.length > 0 ? ([points[0]!.wavelengthNm, points[points.length - 1]!.wavelengthNm] as const) : null),
    [points],
  );
  const layers = useMeasurementLayers({
    setIds: overlaySetIds,
    xUnit,
    yMode,
    yUnit: Y_UNIT_SHORT[yMode],
    geometry,
    rangeNm,
    curveTemperatureK,
  });
  const cp = cursor !== null ? points[cursor] : undefined;
  const yUnit = Y_UNIT_SHORT[yMode];
  const yLabel = yMode === "verdet" ? Y_MODE_LABEL.verdet : `Rotation (${yUnit}) at ${geometry.fieldT} T, ${geometry.lengthM * 1000} mm`;
  // Both plots share the x axis, the cursor, the markers and the readout below them.
  const shared = { width, banner };
  const xAxis = { type: xScale, label: X_AXIS_TITLE[xUnit] };
  const interaction = {
    cursorIndex: cursor,
    onCursorChange: setCursor,
    onPick: pick,
    describedBy: "spectrum-readout",
    xView,
    onXViewChange,
  };

  return (
    // On a narrow screen the plots come first and their controls follow (CSS order; wide screens keep the source order).
    <section aria-label="Spectrum" className="flex flex-col gap-3">
      <div className="flex flex-wrap items-end gap-x-4 gap-y-2 text-sm">
        <AxisSelect
          label="x axis"
          value={xUnit}
          options={X_UNITS.map((u) => [u, X_AXIS_TITLE[u]])}
          onChange={(u) => onView({ xUnit: u })}
        />
        <AxisSelect
          label="x scale"
          value={xScale}
          options={[
            ["log", "log"],
            ["linear", "linear"],
          ]}
          onChange={(scale) => onView({ xScale: scale })}
        />
        <AxisSelect
          label="y axis"
          value={yMode}
          options={Y_MODES.map((m) => [m, Y_MODE_LABEL[m]])}
          onChange={(m) => onView({ yMode: m })}
        />
        <fieldset className="flex flex-wrap items-center gap-3">
          <legend className="sr-only">Curves</legend>
          {TOGGLES.map((k) => (
            <label key={k} className="flex items-center gap-1.5">
              <input type="checkbox" checked={on[k]} onChange={(e) => onView({ series: { ...on, [k]: e.target.checked } })} />
              <Swatch style={SERIES_STYLE[k]} />
              {curveLabel(k, yMode)}
            </label>
          ))}
          {withDiamagnetic ? (
            <label className="flex items-center gap-1.5">
              <input
                type="checkbox"
                checked={on.diamagnetic !== false}
                onChange={(e) => onView({ series: { ...on, diamagnetic: e.target.checked } })}
              />
              <Swatch style={DIAMAGNETIC_STYLE} />
              {DIAMAGNETIC_STYLE.label}
            </label>
          ) : null}
          <label className="flex items-center gap-1.5">
            <input type="checkbox" checked={showEllipticity} onChange={(e) => onView({ showEllipticity: e.target.checked })} />
            Ellipticity
          </label>
        </fieldset>
      </div>

      <div role="toolbar" aria-label="Zoom" className="flex flex-wrap items-center gap-1.5 text-xs">
        <Button variant="secondary" className="px-2 py-1 text-xs" onClick={() => zoomBy(0.5)} disabled={!fullX}>
          Zoom in
        </Button>
        <Button variant="secondary" className="px-2 py-1 text-xs" onClick={() => zoomBy(2)} disabled={!zoomed}>
          Zoom out
        </Button>
        <Button variant="secondary" className="px-2 py-1 text-xs" aria-label="Pan left" onClick={() => panBy(-0.5)} disabled={!zoomed}>
          ◀ Pan
        </Button>
        <Button variant="secondary" className="px-2 py-1 text-xs" aria-label="Pan right" onClick={() => panBy(0.5)} disabled={!zoomed}>
          Pan ▶
        </Button>
        <Button variant="secondary" className="px-2 py-1 text-xs" onClick={() => setZoomNm(null)} disabled={!zoomed}>
          Reset zoom
        </Button>
        <span data-testid="zoom-window" className="text-ink-soft">
          {zoomNm
            ? `Showing ${fmt(zoomNm[0], 5)}–${fmt(zoomNm[1], 5)} nm; the y axis fits this window.`
            : "Drag across a plot to zoom into a range; Ctrl/⌘ + wheel, or + and − on a focused plot, also zoom."}
        </span>
      </div>

      <div ref={wrapRef} className="order-first space-y-2 lg:order-none">
        <LinePlot
          {...shared}
          title={`Faraday rotation and its parts (${methodLabel}) · ${caption}`}
          height={340}
          svgRef={spectrumSvg}
          series={{ xs, curves: series }}
          axes={{ x: xAxis, y: { label: yLabel } }}
          marks={{ markers, layers }}
          interaction={interaction}
        />
        <PlotExportButtons svgRef={spectrumSvg} fileBase={`${fileBase}-spectrum`} plotName="spectrum plot" />

        <div id="spectrum-readout" aria-live="polite" className="min-h-12 rounded-md bg-paper-sunk px-3 py-2 text-xs tabular-nums text-ink">
          {cp ? (
            <dl className="grid grid-cols-2 gap-x-4 gap-y-0.5 sm:grid-cols-4">
              <Readout
                term="λ"
                value={`${fmt(cp.wavelengthNm, 5)} nm (${fmt(fromNm(cp.wavelengthNm, xUnit), 5)} ${X_UNIT_LABEL[xUnit]})`}
              />
              <Readout term={curveSymbol("total", yMode)} value={`${fmt(rotationTo(cp.thetaRad, yMode, geometry))} ${yUnit}`} />
              <Readout term={curveSymbol("electric", yMode)} value={`${fmt(rotationTo(cp.thetaElectricRad, yMode, geometry))} ${yUnit}`} />
              <Readout term={curveSymbol("magnetic", yMode)} value={`${fmt(rotationTo(cp.thetaMagneticRad, yMode, geometry))} ${yUnit}`} />
              <Readout term={curveSymbol("cross", yMode)} value={`${fmt(rotationTo(cp.thetaCrossRad, yMode, geometry))} ${yUnit}`} />
              {cp.thetaDiamagneticRad !== undefined ? (
                <Readout
                  term={curveSymbol("diamagnetic", yMode)}
                  value={`${fmt(rotationTo(cp.thetaDiamagneticRad, yMode, geometry))} ${yUnit}`}
                />
              ) : null}
              <Readout
                term={curveSymbol("ellipticity", yMode)}
                value={
                  `${fmt(rotationTo(cp.ellipticityAngleRad ?? cp.ellipticityRad, yMode, geometry))} ${yUnit}` +
                  `${Math.abs(cp.ellipticityRad) > 0.1 ? " (η large)" : ""}`
                }
              />
              <Readout
                term="T+ / T−"
                value={`${formatTransmission(cp.transmissionPlus ?? null)} / ${formatTransmission(cp.transmissionMinus ?? null)}`}
              />
              <Readout term="Magnetic share" value={fmtPercent(cp.magneticShare)} />
              {yMode === "verdet" ? null : <Readout term="V" value={`${fmt(cp.verdetRadPerTm)} rad/(T·m)`} />}
            </dl>
          ) : (
            <p className="text-ink-soft">
              Point at a plot, or focus it and use the arrow keys, to read all values; click or press Enter to add a marker there.
            </p>
          )}
          {pickError ? (
            <p role="alert" className="mt-1 text-ember">
              {pickError}
            </p>
          ) : null}
        </div>

        {view.panels.share ? (
          <>
            <LinePlot
              {...shared}
              title={`Magnetic share |θm| / (|θe| + |θm|) — ${crossingText} · ${caption}`}
              height={240}
              svgRef={shareSvg}
              series={{ xs, curves: shareSeries, legend: false }}
              axes={{ x: xAxis, y: { label: "Magnetic share (%)", domain: shareDomain } }}
              marks={{ markers, hLines, dots }}
              interaction={interaction}
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
function AxisSelect<T extends string>({
  label,
  value,
  options,
  onChange,
}: {
  label: string;
  value: T;
  options: readonly (readonly [T, string])[];
  onChange: (value: T) => void;
}) {
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

/** A curve's line style beside its checkbox. */
function Swatch({ style }: { style: { color: string; width: number; dash: string | undefined } }) {
  return (
    <svg width="26" height="8" aria-hidden="true">
      <line x1="1" x2="25" y1="4" y2="4" stroke={style.color} strokeWidth={style.width} strokeDasharray={style.dash} />
    </svg>
  );
}
