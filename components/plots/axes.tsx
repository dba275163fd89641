import type { NumScale, ScaleType } from "./scale";
import { ticksOf } from "./scale";

/*
 * Axes drawn by React from d3 scales (no DOM-touching d3). Styling is by SVG attributes, not CSS
 * classes, so an exported SVG looks the same outside the page.
 */

export const AXIS_FONT = "Inter Variable, Inter, system-ui, sans-serif";
const INK = "#1d2433";
const SOFT = "#4a5468";
const GRID = "#e3e0d8";

export function XAxis({ scale, type, y, height, label, count = 8 }: { scale: NumScale; type: ScaleType; y: number; height: number; label: string; count?: number }) {
  const [r0, r1] = scale.range() as [number, number];
  const ticks = ticksOf(scale, type, count);
  return (
    <g aria-hidden="true">
      {ticks.map((t) => {
        const x = scale(t.value);
        return (
          <g key={`x${t.value}`} transform={`translate(${x},0)`}>
            {t.major ? <line y1={y - height} y2={y} stroke={GRID} strokeWidth={1} /> : null}
            <line y1={y} y2={y + (t.major ? 6 : 3)} stroke={SOFT} />
            {t.label ? (
              <text y={y + 18} textAnchor="middle" fontSize={11} fill={SOFT} fontFamily={AXIS_FONT}>
                {t.label}
              </text>
            ) : null}
          </g>
        );
      })}
      <line x1={Math.min(r0, r1)} x2={Math.max(r0, r1)} y1={y} y2={y} stroke={SOFT} />
      <text x={(r0 + r1) / 2} y={y + 36} textAnchor="middle" fontSize={12} fill={INK} fontFamily={AXIS_FONT}>
        {label}
      </text>
    </g>
  );
}

export function YAxis({ scale, type, x, width, label, count = 6 }: { scale: NumScale; type: ScaleType; x: number; width: number; label: string; count?: number }) {
  const [r0, r1] = scale.range() as [number, number];
  const ticks = ticksOf(scale, type, count);
  return (
    <g aria-hidden="true">
      {ticks.map((t) => {
        const y = scale(t.value);
        return (
          <g key={`y${t.value}`} transform={`translate(0,${y})`}>
            {t.major ? <line x1={x} x2={x + width} stroke={GRID} strokeWidth={1} /> : null}
            <line x1={x - (t.major ? 6 : 3)} x2={x} stroke={SOFT} />
            {t.label ? (
              <text x={x - 9} dy="0.32em" textAnchor="end" fontSize={11} fill={SOFT} fontFamily={AXIS_FONT}>
                {t.label}
              </text>
            ) : null}
          </g>
        );
      })}
      <line x1={x} x2={x} y1={Math.min(r0, r1)} y2={Math.max(r0, r1)} stroke={SOFT} />
      <text
        transform={`translate(${x - 54},${(r0 + r1) / 2}) rotate(-90)`}
        textAnchor="middle"
        fontSize={12}
        fill={INK}
        fontFamily={AXIS_FONT}
      >
        {label}
      </text>
    </g>
  );
}
