"use client";

import { line } from "d3";
import { memo, useId, useMemo, type KeyboardEvent } from "react";
import { visibleYExtent } from "@/lib/workbench/zoom";
import { XAxis, YAxis } from "./axes";
import type { LinePlotProps, PlotLayer, PlotSeries } from "./line-plot-types";
import { BrushRect, CursorMark, HorizontalLines, LabelledDots } from "./line-plot-marks";
import { MarkerLabels } from "./marker-labels";
import { frameTop, PlotFrame } from "./plot-frame";
import { layoutLegend, legendHeightPx, PlotLegend } from "./plot-legend";
import { makeScale, type NumScale, paddedExtent, type ScaleType } from "./scale";
import { localX, type PlotZoom, usePlotZoom } from "./use-plot-zoom";

/*
 * A line plot: d3 computes scales and path strings, React renders the SVG. Path strings are
 * memoized on (data, size, window), so moving the cursor over 5000 points re-renders only the
 * cursor. With interaction.onXViewChange the x window can be zoomed and panned (use-plot-zoom.ts:
 * drag across the plot to zoom into a range, Ctrl/⌘ + wheel, and + / − / 0 on the focused plot;
 * the arrow keys move the cursor and the window follows it); the y range then fits what the
 * window shows.
 */

export type {
  LinePlotProps,
  PlotAxes,
  PlotData,
  PlotInteraction,
  PlotLayer,
  PlotMarker,
  PlotMarks,
  PlotSeries,
} from "./line-plot-types";

const MARGIN = { right: 18, bottom: 50, left: 76 };
const NO_LAYERS: readonly PlotLayer[] = [];
const NONE: readonly never[] = [];

function LinePlotImpl({ title, width, height = 320, banner, svgRef, series, axes, marks = {}, interaction = {} }: LinePlotProps) {
  const { xs, curves, legend = true } = series;
  const xType = axes.x.type;
  const yType = axes.y.type ?? "linear";
  const yDomain = axes.y.domain;
  const { markers = NONE, hLines = NONE, dots = NONE, layers = NO_LAYERS } = marks;
  const { cursorIndex = null, onCursorChange, onPick, xView = null, onXViewChange, describedBy } = interaction;
  const M = { ...MARGIN, top: frameTop(banner, { title, width, left: MARGIN.left }) };
  const clipId = `clip-${useId().replace(/[^\w-]/g, "")}`;
  const innerW = Math.max(40, width - M.left - M.right);
  const legendRows = useMemo(() => (legend && curves.length > 1 ? layoutLegend(curves, innerW) : []), [legend, curves, innerW]);
  const innerH = Math.max(40, height - M.top - M.bottom);
  const totalH = height + legendHeightPx(legendRows);

  const zoom = usePlotZoom({ xs, xType, xView, onXViewChange, leftPx: M.left, widthPx: innerW });
  const { xScale, windowX, shownX } = zoom;

  const yScale = useMemo(() => {
    const dom = yDomain ?? fitYDomain(xs, curves, layers, windowX, yType === "log");
    return makeScale(yType, dom, [M.top + innerH, M.top], yDomain === undefined);
  }, [xs, curves, layers, windowX, yDomain, yType, innerH, M.top]);

  const paths = useMemo(() => curvePaths(curves, xs, xScale, yScale, xType, yType), [curves, xs, xScale, yScale, xType, yType]);
  const xPx = useMemo(() => xs.map((x) => xScale(x)), [xs, xScale]);

  const onKeyDown = (e: KeyboardEvent<HTMLDivElement>) => {
    const centre = cursorIndex !== null && xs[cursorIndex] !== undefined ? xs[cursorIndex]! : null;
    if (zoom.onZoomKey(e, centre)) return;
    if (!onCursorChange || xs.length === 0) return;
    if (e.key === "Escape") {
      onCursorChange(null);
      return;
    }
    if (e.key === "Enter" && onPick && cursorIndex !== null) {
      e.preventDefault();
      onPick(xs[cursorIndex]!);
      return;
    }
    // Arrow keys move along the screen, whichever way the unit runs (eV decreases with nm).
    const screenDir = xPx.length > 1 && xPx[xPx.length - 1]! < xPx[0]! ? -1 : 1;
    const next = cursorKeyTarget(e.key, e.shiftKey ? 10 : 1, cursorIndex, xs.length, screenDir);
    if (next !== null) {
      e.preventDefault();
      const index = Math.min(xs.length - 1, Math.max(0, next));
      onCursorChange(index);
      // When zoomed, the window follows the cursor, so the arrow keys also pan.
      const x = xs[index];
      if (x !== undefined) zoom.follow(x);
    }
  };

  const cx = cursorIndex !== null && xs[cursorIndex] !== undefined ? xScale(xs[cursorIndex]!) : null;

  return (
    <div
      tabIndex={0}
      role="group"
      aria-label={
        `${title}. Arrow keys move the cursor${onPick ? ", Enter adds a marker" : ""}` +
        `${onXViewChange ? "; + and − zoom, 0 shows the whole range" : ""}.`
      }
      aria-describedby={describedBy}
      // The drawn domains, for tests and tools that read the page (the axes show them rounded).
      data-x-domain={`${shownX[0]},${shownX[1]}`}
      data-y-domain={yScale.domain().join(",")}
      onKeyDown={onKeyDown}
      className="rounded-md focus-visible:outline-2"
    >
      <PlotFrame title={title} banner={banner} width={width} height={totalH} left={M.left} svgRef={svgRef}>
        <YAxis scale={yScale} type={yType} x={M.left} width={innerW} label={axes.y.label} />
        <XAxis scale={xScale} type={xType} y={M.top + innerH} height={innerH} label={axes.x.label} />
        <defs>
          <clipPath id={clipId}>
            <rect x={M.left} y={M.top} width={innerW} height={innerH} />
          </clipPath>
        </defs>
        <g clipPath={`url(#${clipId})`}>
          <HorizontalLines lines={hLines} yScale={yScale} left={M.left} width={innerW} />
          <MarkerLabels markers={markers} xScale={xScale} left={M.left} right={M.left + innerW} top={M.top} height={innerH} />
          {paths.map((p, i) => {
            const s = curves[i]!;
            return (
              <path
                key={p.key}
                d={p.d}
                fill="none"
                stroke={s.color}
                strokeWidth={s.width}
                strokeDasharray={s.dash}
                strokeLinejoin="round"
              />
            );
          })}
          {layers.map((l) => (
            <g key={`layer-${l.key}`}>{l.render({ x: xScale, y: yScale })}</g>
          ))}
          <LabelledDots dots={dots} xScale={xScale} yScale={yScale} />
          {zoom.brush ? <BrushRect brush={zoom.brush} top={M.top} height={innerH} /> : null}
          {cx !== null ? (
            <CursorMark x={cx} index={cursorIndex!} curves={curves} yScale={yScale} yType={yType} top={M.top} height={innerH} />
          ) : null}
        </g>
        <PlotLegend rows={legendRows} left={M.left} top={height} />
        {onCursorChange ? (
          <PointerOverlay
            zoom={zoom}
            left={M.left}
            top={M.top}
            width={innerW}
            height={innerH}
            onPointerAt={(px) => onCursorChange(nearestIndex(xs, xPx, windowX, px))}
            onLeave={() => onCursorChange(null)}
            onPick={onPick}
          />
        ) : null}
      </PlotFrame>
    </div>
  );
}

/** The pointer layer over the plotting area: the cursor follows the pointer, a click picks, a drag zooms (use-plot-zoom.ts). */
function PointerOverlay({
  zoom,
  left,
  top,
  width,
  height,
  onPointerAt,
  onLeave,
  onPick,
}: {
  zoom: PlotZoom;
  left: number;
  top: number;
  width: number;
  height: number;
  /** The pointer is at px (x in the SVG). */
  onPointerAt: (px: number) => void;
  onLeave: () => void;
  onPick: ((x: number) => void) | undefined;
}) {
  return (
    <rect
      ref={zoom.overlayRef}
      data-plot-overlay=""
      x={left}
      y={top}
      width={width}
      height={height}
      fill="transparent"
      style={{ cursor: onPick ? "crosshair" : "default", touchAction: zoom.zoomable ? "pan-y" : undefined }}
      onPointerDown={zoom.onPointerDown}
      onPointerMove={(e) => {
        const px = localX(e);
        onPointerAt(px);
        zoom.onPointerMove(px);
      }}
      onPointerUp={zoom.onPointerUp}
      onPointerCancel={zoom.onPointerCancel}
      onPointerLeave={() => {
        if (!zoom.isPressed()) onLeave();
      }}
      onClick={(e) => {
        if (zoom.takeDragClick()) return;
        onPick?.(zoom.xScale.invert(localX(e)));
      }}
    />
  );
}

/** The y range that fits the data: zoomed, the curves inside the window; whole range, the curves and any overlaid layers. */
function fitYDomain(
  xs: readonly number[],
  curves: readonly PlotSeries[],
  layers: readonly PlotLayer[],
  windowX: [number, number] | null,
  log: boolean,
): [number, number] {
  return (
    (windowX
      ? visibleYExtent(
          xs,
          curves.map((s) => s.values),
          windowX,
          log,
        )
      : paddedExtent([...curves.map((s) => s.values), ...layers.map((l) => l.yExtent)], log)) ?? (log ? [1, 10] : [-1, 1])
  );
}

/** Index of the point nearest to px on screen, among those inside the window; null when there is none. */
function nearestIndex(xs: readonly number[], xPx: readonly number[], windowX: [number, number] | null, px: number): number | null {
  let best = -1;
  let bestD = Infinity;
  for (let i = 0; i < xPx.length; i++) {
    if (windowX && !(xs[i]! >= windowX[0] && xs[i]! <= windowX[1])) continue;
    const d = Math.abs(xPx[i]! - px);
    if (d < bestD) {
      bestD = d;
      best = i;
    }
  }
  return best < 0 ? null : best;
}

/** The SVG path of each curve; points that are missing, non-finite or off a log axis break the line. */
function curvePaths(
  curves: readonly PlotSeries[],
  xs: readonly number[],
  xScale: NumScale,
  yScale: NumScale,
  xType: ScaleType,
  yType: ScaleType,
): { key: string; d: string }[] {
  return curves.map((s) => {
    const gen = line<number>()
      .defined((i) => {
        const v = s.values[i];
        const x = xs[i];
        return (
          v !== null &&
          v !== undefined &&
          Number.isFinite(v) &&
          x !== undefined &&
          Number.isFinite(x) &&
          (yType !== "log" || v > 0) &&
          (xType !== "log" || x > 0)
        );
      })
      .x((i) => xScale(xs[i]!))
      .y((i) => yScale(s.values[i] as number));
    return { key: s.key, d: gen(Array.from(xs.keys())) ?? "" };
  });
}

/** The cursor index a navigation key asks for (before clamping), or null for other keys. */
function cursorKeyTarget(key: string, step: number, cursorIndex: number | null, count: number, screenDir: number): number | null {
  const cur = cursorIndex ?? (key === "ArrowLeft" ? count - 1 : 0);
  if (key === "ArrowRight") return cur + step * screenDir;
  if (key === "ArrowLeft") return cur - step * screenDir;
  if (key === "Home") return screenDir > 0 ? 0 : count - 1;
  if (key === "End") return screenDir > 0 ? count - 1 : 0;
  return null;
}

/** Shallow equality of two values: the same value, or plain objects with the same members. */
function shallowSame(a: unknown, b: unknown): boolean {
  if (Object.is(a, b)) return true;
  if (typeof a !== "object" || typeof b !== "object" || a === null || b === null || Array.isArray(a) || Array.isArray(b)) return false;
  const ka = Object.keys(a);
  if (ka.length !== Object.keys(b).length) return false;
  return ka.every((k) => Object.hasOwn(b, k) && Object.is((a as Record<string, unknown>)[k], (b as Record<string, unknown>)[k]));
}

/**
 * memo's comparison. Callers write the groups inline, so a group compares by its members (the
 * axes by each axis): a plot whose data, scales and handlers are unchanged does not re-render.
 */
function sameLinePlotProps(a: LinePlotProps, b: LinePlotProps): boolean {
  const { series: sa, axes: aa, marks: ma, interaction: ia, ...restA } = a;
  const { series: sb, axes: ab, marks: mb, interaction: ib, ...restB } = b;
  return (
    shallowSame(restA, restB) &&
    shallowSame(sa, sb) &&
    shallowSame(aa.x, ab.x) &&
    shallowSame(aa.y, ab.y) &&
    shallowSame(ma, mb) &&
    shallowSame(ia, ib)
  );
}

export const LinePlot = memo(LinePlotImpl, sameLinePlotProps);
