"use client";

import { contours, geoPath, geoTransform, interpolateCividis } from "d3";
import { memo, useCallback, useId, useMemo, useState, type KeyboardEvent, type PointerEvent, type Ref } from "react";
import { cellAt, formatShare, moveCell, type Cell, type CellGeometry } from "@/lib/workbench/maps";
import { XAxis, YAxis } from "./axes";
import { cellPixels } from "./heat-map-pixels";
import { frameTop, PlotFrame } from "./plot-frame";
import { makeScale, type ScaleType } from "./scale";

/*
 * A heat map of a quantity (by default a 0…1 share; any range with `domain`) on a grid that is uniform in its axis scales (log-spaced
 * wavelengths on a log axis, etc.), with d3-contour lines at chosen levels. Cividis is
 * colour-blind safe and its lightness rises monotonically, so the map also reads in grey.
 * Hovering, or the arrow keys while the map has focus, reads out the cell under the cursor in a
 * live region beside the SVG (not in it, so exports stay clean).
 */

export interface HeatMapProps {
  title: string;
  xs: readonly number[];
  ys: readonly number[];
  xType: ScaleType;
  yType: ScaleType;
  /** Row-major: values[j * xs.length + i] at (xs[i], ys[j]); null = undefined there. */
  values: readonly (number | null)[];
  levels: readonly number[];
  xLabel: string;
  yLabel: string;
  width: number;
  height?: number;
  banner?: string | null;
  svgRef?: Ref<SVGSVGElement>;
  /** The readout of one cell; the default names the axes by their labels. */
  describeCell?: (x: number, y: number, value: number | null) => string;
  /** Values mapped onto the colour scale's ends (default 0…1, a share). */
  domain?: readonly [number, number];
  /** Legend tick text (default: a share in %). */
  formatLegend?: (value: number) => string;
  /** Said inside the map when no contour level is reached (default names the levels in %). */
  noLevelText?: string;
}

const MARGIN = { right: 112, bottom: 50, left: 76 };
const SHARE_DOMAIN: readonly [number, number] = [0, 1];
const sharePercent = (v: number) => `${Math.round(v * 100)} %`;

/** Cell edges around uniformly spaced centres (geometric for log axes). */
function edges(centres: readonly number[], type: ScaleType): [number, number] {
  const n = centres.length;
  const a = centres[0]!;
  const b = centres[n - 1]!;
  if (n < 2) return type === "log" ? [a / 1.1, a * 1.1] : [a - 0.5, a + 0.5];
  if (type === "log") {
    const r = Math.sqrt(centres[1]! / a);
    return [a / r, b * r];
  }
  const h = (centres[1]! - a) / 2;
  return [a - h, b + h];
}

const fmtAxis = (v: number) => String(Number(v.toPrecision(4)));

function defaultDescribe(xLabel: string, yLabel: string) {
  return (x: number, y: number, value: number | null) => `${xLabel} ${fmtAxis(x)}, ${yLabel} ${fmtAxis(y)}: ${formatShare(value)}`;
}

/** Sets a ref of either kind. */
function assignRef<T>(ref: Ref<T> | undefined, value: T | null) {
  if (typeof ref === "function") ref(value);
  else if (ref) (ref as { current: T | null }).current = value;
}

/** A PNG data URL of the cells (cellPixels), one pixel a cell; null where there is no canvas (server). */
function cellBitmap(values: readonly (number | null)[], nx: number, ny: number, lo: number, span: number): string | null {
  if (typeof document === "undefined" || nx < 1 || ny < 1) return null;
  const canvas = document.createElement("canvas");
  canvas.width = nx;
  canvas.height = ny;
  const ctx = canvas.getContext("2d");
  if (!ctx) return null;
  const image = ctx.createImageData(nx, ny);
  image.data.set(cellPixels(values, nx, ny, lo, span));
  ctx.putImageData(image, 0, 0);
  return canvas.toDataURL("image/png");
}

function HeatMapImpl({
  title,
  xs,
  ys,
  xType,
  yType,
  values,
  levels,
  xLabel,
  yLabel,
  width,
  height = 300,
  banner,
  svgRef,
  describeCell,
  domain = SHARE_DOMAIN,
  formatLegend = sharePercent,
  noLevelText,
}: HeatMapProps) {
  const [lo, hi] = domain;
  const span = hi - lo || 1;
  const toUnit = (v: number) => Math.min(1, Math.max(0, (v - lo) / span));
  const M = { ...MARGIN, top: frameTop(banner, { title, width, left: MARGIN.left }) };
  const uid = useId().replace(/[^\w-]/g, "");
  const legendId = `heat-legend-${uid}`;
  const hintId = `heat-hint-${uid}`;
  const readoutId = `heat-readout-${uid}`;
  const [cell, setCell] = useState<Cell | null>(null);
  const innerW = Math.max(40, width - M.left - M.right);
  const innerH = Math.max(40, height - M.top - M.bottom);
  const nx = xs.length;
  const ny = ys.length;

  const xScale = useMemo(() => makeScale(xType, edges(xs, xType), [M.left, M.left + innerW], false), [xs, xType, innerW, M.left]);
  const yScale = useMemo(() => makeScale(yType, edges(ys, yType), [M.top + innerH, M.top], false), [ys, yType, innerH, M.top]);

  const geometry: CellGeometry = { left: M.left, top: M.top, width: innerW, height: innerH, nx, ny };
  // A cell from an older, larger grid must not index past the new one.
  const shownCell = cell && cell.i < nx && cell.j < ny ? cell : null;

  // The cells as one bitmap, one pixel a cell, stretched over the plotting area: the grid is
  // uniform in the axis scales, so pixel i of row j covers exactly cell (i, j). One <image> instead
  // of a <rect> per cell keeps the redraw of a 256 × 128 map short (32,768 rects took seconds of
  // the page's thread); the data URL also travels with the SVG and PNG exports.
  const cellImage = useMemo(() => cellBitmap(values, nx, ny, lo, span), [values, nx, ny, lo, span]);

  const contourPaths = useMemo(() => {
    if (nx < 2 || ny < 2) return [];
    // Undefined cells sit below the whole range, so they never reach a level.
    const grid = values.map((v) => (v === null || !Number.isFinite(v) ? lo - span : v));
    const project = geoTransform({
      point(x, y) {
        // Contour coordinates run over cell edges 0…nx, 0…ny; the value of cell i sits at i + 0.5.
        this.stream.point(M.left + (x / nx) * innerW, M.top + innerH - (y / ny) * innerH);
      },
    });
    const path = geoPath(project);
    return contours()
      .size([nx, ny])
      .thresholds([...levels])(grid)
      .map((c) => ({ level: c.value, d: path(c) ?? "" }));
  }, [values, nx, ny, levels, innerW, innerH, M.left, M.top, lo, span]);

  // Memoized elements: moving the readout re-renders only the highlight, not the cells.
  const cellLayer = useMemo(
    () =>
      cellImage ? (
        <image
          href={cellImage}
          x={M.left}
          y={M.top}
          width={innerW}
          height={innerH}
          preserveAspectRatio="none"
          imageRendering="optimizeSpeed"
          style={{ imageRendering: "pixelated" }}
        />
      ) : null,
    [cellImage, M.left, M.top, innerW, innerH],
  );
  const contourLayer = useMemo(
    () =>
      contourPaths.map((c) => (
        <g key={c.level}>
          <path d={c.d} fill="none" stroke="#ffffff" strokeWidth={4} opacity={0.9} />
          <path d={c.d} fill="none" stroke="#1d2433" strokeWidth={2} strokeDasharray="6 3" />
        </g>
      )),
    [contourPaths],
  );

  // The SVG root belongs to PlotFrame; make it focusable and point it at the keyboard hint.
  const frameRef = useCallback(
    (el: SVGSVGElement | null) => {
      if (el) {
        el.setAttribute("tabindex", "0");
        el.setAttribute("aria-describedby", `${hintId} ${readoutId}`);
        el.setAttribute("class", "rounded-md focus-visible:outline-2 focus-visible:outline-offset-2 focus-visible:outline-lux");
      }
      assignRef(svgRef, el);
    },
    [svgRef, hintId, readoutId],
  );

  const onPointerMove = (e: PointerEvent<SVGRectElement>) => {
    const svg = e.currentTarget.ownerSVGElement;
    const rect = svg?.getBoundingClientRect();
    if (!rect || rect.width === 0 || rect.height === 0) return;
    // SVG user units per CSS pixel (1 unless the SVG is scaled by CSS).
    const px = ((e.clientX - rect.left) * width) / rect.width;
    const py = ((e.clientY - rect.top) * height) / rect.height;
    const next = cellAt(px, py, geometry);
    setCell((prev) => (prev && next && prev.i === next.i && prev.j === next.j ? prev : next));
  };

  const onKeyDown = (e: KeyboardEvent<HTMLDivElement>) => {
    const next = moveCell(shownCell, e.key, nx, ny, e.shiftKey);
    if (next === undefined) return;
    e.preventDefault();
    setCell(next);
  };

  const describe = describeCell ?? defaultDescribe(xLabel, yLabel);
  const readout = shownCell
    ? describe(xs[shownCell.i]!, ys[shownCell.j]!, values[shownCell.j * nx + shownCell.i] ?? null)
    : "Point at the map, or focus it and use the arrow keys, to read a cell.";
  const cw = innerW / Math.max(1, nx);
  const ch = innerH / Math.max(1, ny);

  const noContour = contourPaths.every((c) => c.d === "");
  const legendStops = useMemo(() => Array.from({ length: 11 }, (_, k) => k / 10), []);
  const lx = M.left + innerW + 24;

  return (
    // Key presses on the focused SVG bubble to this wrapper (PlotFrame owns the SVG element).
    <div onKeyDown={onKeyDown} onBlur={() => setCell(null)}>
      <PlotFrame title={title} banner={banner} width={width} height={height} left={M.left} svgRef={frameRef}>
        {cellLayer}
        {contourLayer}
        {noContour && levels.length > 0 ? (
          <text x={M.left + 8} y={M.top + 16} fontSize={11} fill="#ffffff" fontWeight={600}>
            {noLevelText ?? `The ${levels.map(formatLegend).join(", ")} level is not reached in this map`}
          </text>
        ) : null}
        <YAxis scale={yScale} type={yType} x={M.left} width={0} label={yLabel} />
        <XAxis scale={xScale} type={xType} y={M.top + innerH} height={0} label={xLabel} />
        <g aria-hidden="true">
          <defs>
            <linearGradient id={legendId} x1="0" x2="0" y1="1" y2="0">
              {legendStops.map((t) => (
                <stop key={t} offset={t} stopColor={interpolateCividis(t)} />
              ))}
            </linearGradient>
          </defs>
          <rect x={lx} y={M.top} width={14} height={innerH} fill={`url(#${legendId})`} stroke="#4a5468" strokeWidth={0.5} />
          {[0, 0.25, 0.5, 0.75, 1].map((t) => (
            <text key={t} x={lx + 20} y={M.top + innerH - t * innerH} dy="0.32em" fontSize={10} fill="#4a5468">
              {formatLegend(lo + t * span)}
            </text>
          ))}
          {levels.map((l) => (
            <line
              key={l}
              x1={lx - 3}
              x2={lx + 17}
              y1={M.top + innerH - toUnit(l) * innerH}
              y2={M.top + innerH - toUnit(l) * innerH}
              stroke="#1d2433"
              strokeWidth={2}
              strokeDasharray="6 3"
            />
          ))}
        </g>
        {shownCell ? (
          <rect
            x={M.left + shownCell.i * cw}
            y={M.top + innerH - (shownCell.j + 1) * ch}
            width={cw}
            height={ch}
            fill="none"
            stroke="#ffffff"
            strokeWidth={2}
            pointerEvents="none"
          />
        ) : null}
        <rect
          x={M.left}
          y={M.top}
          width={innerW}
          height={innerH}
          fill="transparent"
          style={{ cursor: "crosshair" }}
          onPointerMove={onPointerMove}
          onPointerLeave={() => setCell(null)}
        />
      </PlotFrame>
      <p id={hintId} className="sr-only">
        Arrow keys move between cells (Shift: ten cells), Home and End go to the ends of a row, Page Up and Page Down to the ends of a
        column, Escape clears.
      </p>
      <p id={readoutId} aria-live="polite" data-testid="heat-map-readout" className="mt-1 min-h-5 text-xs tabular-nums text-ink">
        {readout}
      </p>
    </div>
  );
}

export const HeatMap = memo(HeatMapImpl);
