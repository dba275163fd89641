import { useMemo } from "react";
import { layoutMarkerLabels } from "@/lib/workbench/label-layout";
import type { PlotMarker } from "./line-plot-types";

/* The markers of a line plot: a dotted vertical line at each x and its label, in rows that do not overlap. */

/** Row pitch of marker labels: a 10 px label's box is about 12 px tall, so rows must not overlap. */
const MARKER_ROW_PX = 13;

export function MarkerLabels({
  markers,
  xScale,
  left,
  right,
  top,
  height,
}: {
  markers: readonly PlotMarker[];
  /** Display-unit x → px. */
  xScale: (x: number) => number;
  /** The plotting area, px: markers outside [left, right] are not drawn. */
  left: number;
  right: number;
  top: number;
  height: number;
}) {
  const labels = useMemo(() => {
    const inX = (px: number) => px >= left - 0.5 && px <= right + 0.5;
    return layoutMarkerLabels(
      markers.map((m) => ({ x: xScale(m.x), text: m.label })).filter((m) => inX(m.x)),
      { left, right },
    );
  }, [markers, xScale, left, right]);
  return labels.map((m) => (
    <g key={`m${m.x}`} data-marker-label={m.text}>
      <line x1={m.x} x2={m.x} y1={top} y2={top + height} stroke="#0f6e6e" strokeWidth={1} strokeDasharray="1 3" />
      <text x={m.textX} y={top + 10 + m.row * MARKER_ROW_PX} textAnchor={m.anchor} fontSize={10} fill="#0a4f4f">
        {m.text}
      </text>
    </g>
  ));
}
