import type { PlotSeries } from "./line-plot-types";

/* The legend below a line plot: one sample line and label per curve, flowing in rows. */

export type LegendRows = { s: PlotSeries; x: number }[][];

/** Row pitch of the legend, px. */
const LEGEND_ROW_PX = 18;

/** Legend entries flowing left to right in rows no wider than the plot (text width estimated). */
export function layoutLegend(series: readonly PlotSeries[], maxW: number): LegendRows {
  const rows: LegendRows = [[]];
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

/** Height the legend adds below the plot, px (0 without rows). */
export function legendHeightPx(rows: LegendRows): number {
  return rows.length > 0 ? rows.length * LEGEND_ROW_PX + 6 : 0;
}

/** The rows, the first one centred on y = top + 4. */
export function PlotLegend({ rows, left, top }: { rows: LegendRows; left: number; top: number }) {
  return rows.map((row, r) => (
    <g key={`legend${r}`} transform={`translate(${left},${top + r * LEGEND_ROW_PX + 4})`}>
      {row.map(({ s, x }) => (
        <g key={s.key} transform={`translate(${x},0)`}>
          <line x1={0} x2={30} y1={0} y2={0} stroke={s.color} strokeWidth={s.width} strokeDasharray={s.dash} />
          <text x={38} dy="0.32em" fontSize={11} fill="#1d2433">
            {s.label}
          </text>
        </g>
      ))}
    </g>
  ));
}
