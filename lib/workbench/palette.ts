/*
 * Plot palette. Colours are our own pick from the Okabe–Ito family (chosen to stay apart for
 * colour-blind readers; checked in tests/unit/workbench-palette.test.ts with the Machado 2009
 * simulation), and every series also has its own dash pattern and width so a grey print still
 * separates them.
 */

export type SeriesKey = "total" | "electric" | "magnetic" | "cross" | "ellipticity";

export interface SeriesStyle {
  key: SeriesKey;
  label: string;
  color: string;
  /** SVG stroke-dasharray; undefined = solid. */
  dash: string | undefined;
  width: number;
}

export const SERIES_STYLE: Record<SeriesKey, SeriesStyle> = {
  total: { key: "total", label: "Total θ", color: "#1d2433", dash: undefined, width: 2.4 },
  electric: { key: "electric", label: "Electric-dipole θe", color: "#0072b2", dash: "8 4", width: 2 },
  magnetic: { key: "magnetic", label: "Magnetic-dipole θm", color: "#d55e00", dash: "2 3", width: 2.2 },
  cross: { key: "cross", label: "Cross term θx", color: "#cc79a7", dash: "10 3 2 3", width: 1.6 },
  ellipticity: { key: "ellipticity", label: "Ellipticity η", color: "#009e73", dash: "4 2 1 2 1 2", width: 1.6 },
};

export const SERIES_ORDER: readonly SeriesKey[] = ["total", "electric", "magnetic", "cross", "ellipticity"];

/** Overlay colours for comparing parameter sets (same family, ordered for maximum contrast). */
export const COMPARE_COLORS = ["#1d2433", "#e69f00", "#0072b2", "#d55e00", "#009e73", "#cc79a7"] as const;
export const COMPARE_DASHES = [undefined, "8 4", "2 3", "10 3 2 3", "4 2 1 2 1 2", "12 4"] as const;

/** Spin-trace components. */
export const COMPONENT_COLORS = { ux: "#0072b2", uy: "#d55e00", uz: "#1d2433" } as const;
