import type { PlotMarks, PlotSeries } from "./line-plot-types";
import type { NumScale, ScaleType } from "./scale";

/* The marks a line plot draws over its curves (inside the clip of the plotting area). */

/** Labelled dashed horizontal lines across the plotting area. */
export function HorizontalLines({
  lines,
  yScale,
  left,
  width,
}: {
  lines: NonNullable<PlotMarks["hLines"]>;
  yScale: NumScale;
  left: number;
  width: number;
}) {
  return lines.map((h) => (
    <g key={`h${h.y}`}>
      <line x1={left} x2={left + width} y1={yScale(h.y)} y2={yScale(h.y)} stroke="#8a93a6" strokeDasharray="5 4" />
      <text x={left + 4} y={yScale(h.y) - 4} fontSize={10} fill="#4a5468">
        {h.label}
      </text>
    </g>
  ));
}

/** Labelled points (e.g. where the magnetic share crosses 50 %). */
export function LabelledDots({ dots, xScale, yScale }: { dots: NonNullable<PlotMarks["dots"]>; xScale: NumScale; yScale: NumScale }) {
  return dots.map((d) => (
    <g key={`d${d.x}`}>
      <circle cx={xScale(d.x)} cy={yScale(d.y)} r={5} fill="#ffffff" stroke="#1d2433" strokeWidth={2} />
      <text x={xScale(d.x) + 8} y={yScale(d.y) - 8} fontSize={11} fill="#1d2433">
        {d.label}
      </text>
    </g>
  ));
}

/** The x range being dragged across (drag-to-zoom), px. */
export function BrushRect({ brush, top, height }: { brush: { from: number; to: number }; top: number; height: number }) {
  return (
    <rect
      x={Math.min(brush.from, brush.to)}
      y={top}
      width={Math.abs(brush.to - brush.from)}
      height={height}
      fill="#0f6e6e"
      fillOpacity={0.12}
      stroke="#0f6e6e"
      strokeDasharray="3 2"
    />
  );
}

/** The cursor: a vertical line at px x and a dot on each curve that has a drawable value at `index`. */
export function CursorMark({
  x,
  index,
  curves,
  yScale,
  yType,
  top,
  height,
}: {
  x: number;
  index: number;
  curves: readonly PlotSeries[];
  yScale: NumScale;
  yType: ScaleType;
  top: number;
  height: number;
}) {
  return (
    <g>
      <line x1={x} x2={x} y1={top} y2={top + height} stroke="#1d2433" strokeWidth={1} opacity={0.5} />
      {curves.map((s) => {
        const v = s.values[index];
        return v !== null && v !== undefined && Number.isFinite(v) && (yType !== "log" || v > 0) ? (
          <circle key={s.key} cx={x} cy={yScale(v)} r={3.5} fill={s.color} stroke="#ffffff" strokeWidth={1} />
        ) : null;
      })}
    </g>
  );
}
