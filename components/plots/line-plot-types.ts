import type { ReactNode, Ref } from "react";
import type { Domain } from "@/lib/workbench/zoom";
import type { ScaleType } from "./scale";

/* What a line plot is given (line-plot.tsx), in groups: the curves, the axes, the marks over them and the interaction. */

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

/** The curves: one x grid (display units) and each curve's values on it. */
export interface PlotData {
  xs: readonly number[];
  curves: readonly PlotSeries[];
  /** Draw the legend below the plot when there is more than one curve; default true. */
  legend?: boolean;
}

export interface PlotAxes {
  x: { type: ScaleType; label: string };
  y: {
    /** Default linear. */
    type?: ScaleType;
    label: string;
    /** A fixed y range; absent, the range fits the curves (and layers). */
    domain?: [number, number];
  };
}

/** Marks drawn over the curves, in the plot's scales. */
export interface PlotMarks {
  /** Labelled vertical lines at x values (display units). */
  markers?: readonly PlotMarker[];
  /** Labelled dashed horizontal lines. */
  hLines?: readonly { y: number; label: string }[];
  /** Labelled points. */
  dots?: readonly { x: number; y: number; label: string }[];
  layers?: readonly PlotLayer[];
}

/** Cursor, picking and zoom; with none of them the plot is static. */
export interface PlotInteraction {
  cursorIndex?: number | null;
  onCursorChange?: (index: number | null) => void;
  /** Click or Enter: the x value (display units) under the pointer. */
  onPick?: (x: number) => void;
  /** The visible x window in display units; null or absent shows all data. */
  xView?: Domain | null;
  /** Enables zoom and pan; called with the new window, or null for the whole range. */
  onXViewChange?: (view: [number, number] | null) => void;
  /** id of the element that describes the plot (e.g. the cursor readout). */
  describedBy?: string;
}

export interface LinePlotProps {
  /** Accessible name of the plot and the title drawn in exports. */
  title: string;
  width: number;
  /** Default 320 px, the legend below not included. */
  height?: number;
  /** A text drawn inside the plot (e.g. the magneticScale label) so exports carry it. */
  banner?: string | null;
  svgRef?: Ref<SVGSVGElement>;
  series: PlotData;
  axes: PlotAxes;
  marks?: PlotMarks;
  interaction?: PlotInteraction;
}
