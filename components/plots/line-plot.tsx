"use client";

import { line } from "d3";
import { memo, useId, useMemo, type KeyboardEvent, type MouseEvent, type ReactNode, type Ref } from "react";
import { XAxis, YAxis } from "./axes";
import { frameTop, PlotFrame } from "./plot-frame";
import { makeScale, paddedExtent, type ScaleType } from "./scale";

/*
 * A line plot: d3 computes scales and path strings, React renders the SVG. Path strings are
 * memoized on (data, size), so moving the cursor over 5000 points re-renders only the cursor.
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
  layers?: readonly PlotLayer[];
}

const MARGIN = { right: 18, bottom: 50, left: 76 };
const NO_LAYERS: readonly PlotLayer[] = [];

function LinePlotImpl(props: LinePlotProps) {
  const { title, xs, xType, yType = "linear", xLabel, yLabel, series, width, height = 320, yDomain, cursorIndex = null, onCursorChange, onPick, markers = [], hLines = [], dots = [], banner, svgRef, describedBy, legend = true, layers = NO_LAYERS } = props;
  const M = { ...MARGIN, top: frameTop(banner) };
  const clipId = `clip-${useId().replace(/[^\w-]/g, "")}`;
  const innerW = Math.max(40, width - M.left - M.right);
  const legendRows = useMemo(() => (legend && series.length > 1 ? layoutLegend(series, innerW) : []), [legend, series, innerW]);
  const legendH = legendRows.length > 0 ? legendRows.length * 18 + 6 : 0;
  const innerH = Math.max(40, height - M.top - M.bottom);
  const totalH = height + legendH;

  const xScale = useMemo(() => {
    const ext = paddedExtent([xs], xType === "log") ?? [1, 10];
    // No padding on x: the range the user asked for is the frame.
    let lo = Infinity;
    let hi = -Infinity;
    for (const x of xs) if (Number.isFinite(x) && (xType !== "log" || x > 0)) { lo = Math.min(lo, x); hi = Math.max(hi, x); }
    const dom: [number, number] = Number.isFinite(lo) && lo < hi ? [lo, hi] : ext;
    return makeScale(xType, dom, [M.left, M.left + innerW], false);
  }, [xs, xType, innerW, M.left]);

  const yScale = useMemo(() => {
    const dom = yDomain ?? paddedExtent([...series.map((s) => s.values), ...layers.map((l) => l.yExtent)], yType === "log") ?? (yType === "log" ? [1, 10] : [-1, 1]);
    return makeScale(yType, dom as [number, number], [M.top + innerH, M.top], yDomain === undefined);
  }, [series, layers, yDomain, yType, innerH, M.top]);

  const paths = useMemo(() => {
    return series.map((s) => {
      const gen = line<number>()
        .defined((i) => {
          const v = s.values[i];
          const x = xs[i];
          return v !== null && v !== undefined && Number.isFinite(v) && x !== undefined && Number.isFinite(x) && (yType !== "log" || v > 0) && (xType !== "log" || x > 0);
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
      const d = Math.abs(xPx[i]! - px);
      if (d < bestD) {
        bestD = d;
        best = i;
      }
    }
    return best < 0 ? null : best;
  };

  const localX = (e: MouseEvent<SVGRectElement>) => {
    const rect = e.currentTarget.ownerSVGElement?.getBoundingClientRect();
    return rect ? e.clientX - rect.left : 0;
  };

  const onKeyDown = (e: KeyboardEvent<HTMLDivElement>) => {
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
      onCursorChange(Math.min(xs.length - 1, Math.max(0, next)));
    }
  };

  const cx = cursorIndex !== null && xs[cursorIndex] !== undefined ? xScale(xs[cursorIndex]!) : null;
  const [xmin, xmax] = [M.left, M.left + innerW];
  const inX = (px: number) => px >= xmin - 0.5 && px <= xmax + 0.5;

  return (
    <div
      tabIndex={0}
      role="group"
      aria-label={`${title}. Arrow keys move the cursor${onPick ? ", Enter adds a marker" : ""}.`}
      aria-describedby={describedBy}
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
          {markers.filter((m) => inX(xScale(m.x))).map((m) => (
            <g key={`m${m.x}`}>
              <line x1={xScale(m.x)} x2={xScale(m.x)} y1={M.top} y2={M.top + innerH} stroke="#0f6e6e" strokeWidth={1} strokeDasharray="1 3" />
              <text x={xScale(m.x) + 3} y={M.top + 10} fontSize={10} fill="#0a4f4f">
                {m.label}
              </text>
            </g>
          ))}
          {paths.map((p, i) => {
            const s = series[i]!;
            return <path key={p.key} d={p.d} fill="none" stroke={s.color} strokeWidth={s.width} strokeDasharray={s.dash} strokeLinejoin="round" />;
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
            x={M.left}
            y={M.top}
            width={innerW}
            height={innerH}
            fill="transparent"
            style={{ cursor: onPick ? "crosshair" : "default" }}
            onPointerMove={(e) => onCursorChange(nearest(localX(e)))}
            onPointerLeave={() => onCursorChange(null)}
            onClick={(e) => onPick?.(xScale.invert(localX(e)))}
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
