"use client";

import { line } from "d3";
import {
  memo,
  useEffect,
  useId,
  useMemo,
  useRef,
  useState,
  type KeyboardEvent,
  type MouseEvent,
  type PointerEvent,
  type ReactNode,
  type Ref,
} from "react";
import { layoutMarkerLabels } from "@/lib/workbench/label-layout";
import { clampDomain, panToInclude, visibleYExtent, zoomDomain, type Domain } from "@/lib/workbench/zoom";
import { XAxis, YAxis } from "./axes";
import { frameTop, PlotFrame } from "./plot-frame";
import { makeScale, paddedExtent, type ScaleType } from "./scale";

/*
 * A line plot: d3 computes scales and path strings, React renders the SVG. Path strings are
 * memoized on (data, size, window), so moving the cursor over 5000 points re-renders only the
 * cursor. With onXViewChange the x window can be zoomed and panned (drag across the plot to zoom
 * into a range, Ctrl/⌘ + wheel, and + / − / 0 on the focused plot; the arrow keys move the
 * cursor and the window follows it); the y range then fits what the window shows.
 */

export interface PlotSeries {
  key: string;
  label: string;
  color: string;
  dash: string | undefined;
  width: number;
  values: readonly (number | null)[];
}

export interface PlotMarker {
  x: number;
  label: string;
}

/** Extra marks drawn in the plot's scales (e.g. measured points); yExtent joins the y domain. */
export interface PlotLayer {
  key: string;
  yExtent: readonly number[];
  render: (scales: { x: (v: number) => number; y: (v: number) => number }) => ReactNode;
}

export interface LinePlotProps {
  /** Accessible name of the plot and the title drawn in exports. */
  title: string;
  xs: readonly number[];
  xType: ScaleType;
  yType?: ScaleType;
  xLabel: string;
  yLabel: string;
  series: readonly PlotSeries[];
  width: number;
  height?: number;
  yDomain?: [number, number];
  cursorIndex?: number | null;
  onCursorChange?: (index: number | null) => void;
  /** Click or Enter: the x value (display units) under the pointer. */
  onPick?: (x: number) => void;
  markers?: readonly PlotMarker[];
  hLines?: readonly { y: number; label: string }[];
  dots?: readonly { x: number; y: number; label: string }[];
  /** A text drawn inside the plot (e.g. the magneticScale label) so exports carry it. */
  banner?: string | null;
  svgRef?: Ref<SVGSVGElement>;
  describedBy?: string;
  legend?: boolean;
  /** The visible x window in display units; null or absent shows all data. */
  xView?: Domain | null;
  /** Enables zoom and pan; called with the new window, or null for the whole range. */
  onXViewChange?: (view: [number, number] | null) => void;
  layers?: readonly PlotLayer[];
}

/** Pointer travel (px) that turns a press into a drag-to-zoom rather than a click. */
const DRAG_PX = 5;
const ZOOM_STEP = 0.5;
/** Row pitch of marker labels: a 10 px label's box is about 12 px tall, so rows must not overlap. */
const MARKER_ROW_PX = 13;

const MARGIN = { right: 18, bottom: 50, left: 76 };
const NO_LAYERS: readonly PlotLayer[] = [];

function LinePlotImpl(props: LinePlotProps) {
  const {
    title,
    xs,
    xType,
    yType = "linear",
    xLabel,
    yLabel,
    series,
    width,
    height = 320,
    yDomain,
    cursorIndex = null,
    onCursorChange,
    onPick,
    markers = [],
    hLines = [],
    dots = [],
    banner,
    svgRef,
    describedBy,
    legend = true,
    xView = null,
    onXViewChange,
    layers = NO_LAYERS,
  } = props;
  const M = { ...MARGIN, top: frameTop(banner, { title, width, left: MARGIN.left }) };
  const clipId = `clip-${useId().replace(/[^\w-]/g, "")}`;
  const innerW = Math.max(40, width - M.left - M.right);
  const legendRows = useMemo(() => (legend && series.length > 1 ? layoutLegend(series, innerW) : []), [legend, series, innerW]);
  const legendH = legendRows.length > 0 ? legendRows.length * 18 + 6 : 0;
  const innerH = Math.max(40, height - M.top - M.bottom);
  const totalH = height + legendH;

  const fullX = useMemo<[number, number]>(() => {
    const ext = paddedExtent([xs], xType === "log") ?? [1, 10];
    // No padding on x: the range the user asked for is the frame.
    let lo = Infinity;
    let hi = -Infinity;
    for (const x of xs)
      if (Number.isFinite(x) && (xType !== "log" || x > 0)) {
        lo = Math.min(lo, x);
        hi = Math.max(hi, x);
      }
    return Number.isFinite(lo) && lo < hi ? [lo, hi] : ext;
  }, [xs, xType]);
  const viewLo = xView?.[0];
  const viewHi = xView?.[1];
  const windowX = useMemo<[number, number] | null>(
    () => (viewLo !== undefined && viewHi !== undefined ? clampDomain([viewLo, viewHi], fullX, xType) : null),
    [viewLo, viewHi, fullX, xType],
  );
  const shownX = windowX ?? fullX;

  const xScale = useMemo(() => makeScale(xType, shownX, [M.left, M.left + innerW], false), [xType, shownX, innerW, M.left]);

  const yScale = useMemo(() => {
    const log = yType === "log";
    // Zoomed: fit the curves inside the window. Whole range: the curves and any overlaid layers.
    const dom =
      yDomain ??
      (windowX
        ? visibleYExtent(
            xs,
            series.map((s) => s.values),
            windowX,
            log,
          )
        : paddedExtent([...series.map((s) => s.values), ...layers.map((l) => l.yExtent)], log)) ??
      (log ? [1, 10] : [-1, 1]);
    return makeScale(yType, dom as [number, number], [M.top + innerH, M.top], yDomain === undefined);
  }, [xs, series, layers, windowX, yDomain, yType, innerH, M.top]);

  const paths = useMemo(() => {
    return series.map((s) => {
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
  }, [series, xs, xScale, yScale, xType, yType]);

  const xPx = useMemo(() => xs.map((x) => xScale(x)), [xs, xScale]);

  const nearest = (px: number): number | null => {
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
  };

  const localX = (e: { clientX: number; currentTarget: SVGRectElement }) => {
    const rect = e.currentTarget.ownerSVGElement?.getBoundingClientRect();
    return rect ? e.clientX - rect.left : 0;
  };

  // Zoom about a display-unit x (the cursor, the pointer or the window's middle).
  const zoomAbout = (factor: number, centre: number | null) => {
    if (!onXViewChange) return;
    const mid = centre ?? xScale.invert(M.left + innerW / 2);
    onXViewChange(zoomDomain(shownX, factor, mid, fullX, xType));
  };

  // Drag across the plot to zoom into that x range; a press without travel stays a click.
  const [brush, setBrush] = useState<{ from: number; to: number } | null>(null);
  const press = useRef<{ from: number; dragged: boolean } | null>(null);
  const swallowClick = useRef(false);
  const onPointerDown = (e: PointerEvent<SVGRectElement>) => {
    if (!onXViewChange || e.button !== 0) return;
    press.current = { from: localX(e), dragged: false };
    swallowClick.current = false;
    e.currentTarget.setPointerCapture?.(e.pointerId);
  };
  const onPointerMove = (e: PointerEvent<SVGRectElement>) => {
    const px = localX(e);
    onCursorChange?.(nearest(px));
    const p = press.current;
    if (!p) return;
    if (!p.dragged && Math.abs(px - p.from) >= DRAG_PX) p.dragged = true;
    if (p.dragged) setBrush({ from: p.from, to: Math.min(M.left + innerW, Math.max(M.left, px)) });
  };
  const onPointerUp = (e: PointerEvent<SVGRectElement>) => {
    const p = press.current;
    press.current = null;
    setBrush(null);
    if (!p?.dragged || !onXViewChange) return;
    swallowClick.current = true;
    const a = xScale.invert(Math.min(p.from, localX(e)));
    const b = xScale.invert(Math.max(p.from, localX(e)));
    onXViewChange(clampDomain([Math.min(a, b), Math.max(a, b)], fullX, xType));
  };

  // Ctrl/⌘ + wheel zooms about the pointer. A plain wheel keeps scrolling the page. React's wheel
  // listeners are passive, so this one is attached by hand to be allowed to preventDefault.
  const overlay = useRef<SVGRectElement>(null);
  const wheelZoom = useRef<(e: WheelEvent) => void>(() => undefined);
  wheelZoom.current = (e: WheelEvent) => {
    if (!onXViewChange || !(e.ctrlKey || e.metaKey) || e.deltaY === 0) return;
    e.preventDefault();
    const rect = overlay.current?.ownerSVGElement?.getBoundingClientRect();
    const centre = rect ? xScale.invert(e.clientX - rect.left) : null;
    zoomAbout(e.deltaY < 0 ? 0.8 : 1.25, centre);
  };
  const zoomable = onXViewChange !== undefined;
  useEffect(() => {
    const el = overlay.current;
    if (!el || !zoomable) return;
    const listener = (e: WheelEvent) => wheelZoom.current(e);
    el.addEventListener("wheel", listener, { passive: false });
    return () => el.removeEventListener("wheel", listener);
  }, [zoomable]);

  const onKeyDown = (e: KeyboardEvent<HTMLDivElement>) => {
    if (onXViewChange && !e.ctrlKey && !e.metaKey && !e.altKey) {
      const centre = cursorIndex !== null && xs[cursorIndex] !== undefined ? xs[cursorIndex]! : null;
      if (e.key === "+" || e.key === "=") {
        e.preventDefault();
        zoomAbout(ZOOM_STEP, centre);
        return;
      }
      if (e.key === "-" || e.key === "_") {
        e.preventDefault();
        zoomAbout(1 / ZOOM_STEP, centre);
        return;
      }
      if (e.key === "0") {
        e.preventDefault();
        onXViewChange(null);
        return;
      }
    }
    if (!onCursorChange || xs.length === 0) return;
    const step = e.shiftKey ? 10 : 1;
    // Arrow keys move along the screen, whichever way the unit runs (eV decreases with nm).
    const screenDir = xPx.length > 1 && xPx[xPx.length - 1]! < xPx[0]! ? -1 : 1;
    const cur = cursorIndex ?? (e.key === "ArrowLeft" ? xs.length - 1 : 0);
    let next: number | null = null;
    if (e.key === "ArrowRight") next = cur + step * screenDir;
    else if (e.key === "ArrowLeft") next = cur - step * screenDir;
    else if (e.key === "Home") next = screenDir > 0 ? 0 : xs.length - 1;
    else if (e.key === "End") next = screenDir > 0 ? xs.length - 1 : 0;
    else if (e.key === "Escape") {
      onCursorChange(null);
      return;
    } else if (e.key === "Enter" && onPick && cursorIndex !== null) {
      e.preventDefault();
      onPick(xs[cursorIndex]!);
      return;
    }
    if (next !== null) {
      e.preventDefault();
      const index = Math.min(xs.length - 1, Math.max(0, next));
      onCursorChange(index);
      // When zoomed, the window follows the cursor, so the arrow keys also pan.
      const x = xs[index];
      if (onXViewChange && windowX && x !== undefined && !(x >= windowX[0] && x <= windowX[1]))
        onXViewChange(panToInclude(windowX, x, fullX, xType));
    }
  };

  const cx = cursorIndex !== null && xs[cursorIndex] !== undefined ? xScale(xs[cursorIndex]!) : null;
  const [xmin, xmax] = [M.left, M.left + innerW];
  const inX = (px: number) => px >= xmin - 0.5 && px <= xmax + 0.5;
  const markerLabels = useMemo(
    () =>
      layoutMarkerLabels(
        markers.map((m) => ({ x: xScale(m.x), text: m.label })).filter((m) => inX(m.x)),
        { left: xmin, right: xmax },
      ),
    // inX depends only on xmin and xmax.
    [markers, xScale, xmin, xmax],
  );

  return (
    <div
      tabIndex={0}
      role="group"
      aria-label={`${title}. Arrow keys move the cursor${onPick ? ", Enter adds a marker" : ""}${onXViewChange ? "; + and − zoom, 0 shows the whole range" : ""}.`}
      aria-describedby={describedBy}
      // The drawn domains, for tests and tools that read the page (the axes show them rounded).
      data-x-domain={`${shownX[0]},${shownX[1]}`}
      data-y-domain={yScale.domain().join(",")}
      onKeyDown={onKeyDown}
      className="rounded-md focus-visible:outline-2"
    >
      <PlotFrame title={title} banner={banner} width={width} height={totalH} left={M.left} svgRef={svgRef}>
        <YAxis scale={yScale} type={yType} x={M.left} width={innerW} label={yLabel} />
        <XAxis scale={xScale} type={xType} y={M.top + innerH} height={innerH} label={xLabel} />
        <defs>
          <clipPath id={clipId}>
            <rect x={M.left} y={M.top} width={innerW} height={innerH} />
          </clipPath>
        </defs>
        <g clipPath={`url(#${clipId})`}>
          {hLines.map((h) => (
            <g key={`h${h.y}`}>
              <line x1={M.left} x2={M.left + innerW} y1={yScale(h.y)} y2={yScale(h.y)} stroke="#8a93a6" strokeDasharray="5 4" />
              <text x={M.left + 4} y={yScale(h.y) - 4} fontSize={10} fill="#4a5468">
                {h.label}
              </text>
            </g>
          ))}
          {markerLabels.map((m) => (
            <g key={`m${m.x}`} data-marker-label={m.text}>
              <line x1={m.x} x2={m.x} y1={M.top} y2={M.top + innerH} stroke="#0f6e6e" strokeWidth={1} strokeDasharray="1 3" />
              <text x={m.textX} y={M.top + 10 + m.row * MARKER_ROW_PX} textAnchor={m.anchor} fontSize={10} fill="#0a4f4f">
                {m.text}
              </text>
            </g>
          ))}
          {paths.map((p, i) => {
            const s = series[i]!;
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
          {dots.map((d) => (
            <g key={`d${d.x}`}>
              <circle cx={xScale(d.x)} cy={yScale(d.y)} r={5} fill="#ffffff" stroke="#1d2433" strokeWidth={2} />
              <text x={xScale(d.x) + 8} y={yScale(d.y) - 8} fontSize={11} fill="#1d2433">
                {d.label}
              </text>
            </g>
          ))}
          {brush ? (
            <rect
              x={Math.min(brush.from, brush.to)}
              y={M.top}
              width={Math.abs(brush.to - brush.from)}
              height={innerH}
              fill="#0f6e6e"
              fillOpacity={0.12}
              stroke="#0f6e6e"
              strokeDasharray="3 2"
            />
          ) : null}
          {cx !== null ? (
            <g>
              <line x1={cx} x2={cx} y1={M.top} y2={M.top + innerH} stroke="#1d2433" strokeWidth={1} opacity={0.5} />
              {series.map((s) => {
                const v = s.values[cursorIndex!];
                return v !== null && v !== undefined && Number.isFinite(v) && (yType !== "log" || v > 0) ? (
                  <circle key={s.key} cx={cx} cy={yScale(v)} r={3.5} fill={s.color} stroke="#ffffff" strokeWidth={1} />
                ) : null;
              })}
            </g>
          ) : null}
        </g>
        {legendRows.map((row, r) => (
          <g key={`legend${r}`} transform={`translate(${M.left},${height + r * 18 + 4})`}>
            {row.map(({ s, x }) => (
              <g key={s.key} transform={`translate(${x},0)`}>
                <line x1={0} x2={30} y1={0} y2={0} stroke={s.color} strokeWidth={s.width} strokeDasharray={s.dash} />
                <text x={38} dy="0.32em" fontSize={11} fill="#1d2433">
                  {s.label}
                </text>
              </g>
            ))}
          </g>
        ))}
        {onCursorChange ? (
          <rect
            ref={overlay}
            data-plot-overlay=""
            x={M.left}
            y={M.top}
            width={innerW}
            height={innerH}
            fill="transparent"
            style={{ cursor: onPick ? "crosshair" : "default", touchAction: zoomable ? "pan-y" : undefined }}
            onPointerDown={onPointerDown}
            onPointerMove={onPointerMove}
            onPointerUp={onPointerUp}
            onPointerCancel={() => {
              press.current = null;
              setBrush(null);
            }}
            onPointerLeave={() => {
              if (!press.current) onCursorChange(null);
            }}
            onClick={(e) => {
              if (swallowClick.current) {
                swallowClick.current = false;
                return;
              }
              onPick?.(xScale.invert(localX(e)));
            }}
          />
        ) : null}
      </PlotFrame>
    </div>
  );
}

/** Legend entries flowing left to right in rows no wider than the plot (text width estimated). */
function layoutLegend(series: readonly PlotSeries[], maxW: number): { s: PlotSeries; x: number }[][] {
  const rows: { s: PlotSeries; x: number }[][] = [[]];
  let x = 0;
  for (const s of series) {
    const w = 44 + s.label.length * 6.3;
    if (x > 0 && x + w > maxW) {
      rows.push([]);
      x = 0;
    }
    rows[rows.length - 1]!.push({ s, x });
    x += w + 12;
  }
  return rows;
}

export const LinePlot = memo(LinePlotImpl);
