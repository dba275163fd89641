/*
 * Plot palette, our own. Each part of the rotation takes the colour of the end of the spectrum where
 * it has its say: the electric-dipole part comes from an oscillator in the ultraviolet and grows
 * toward short wavelengths, so it is violet; the magnetic-dipole part is flat in wavelength and
 * matters most in the infrared, so it is a deep red. The total is the page's ink; the cross term
 * is gold and the ellipticity a grey-teal. Violet and red differ in lightness and on the blue–yellow
 * axis, which every common colour-vision deficiency keeps, so they stay apart for colour-blind
 * readers (checked in tests/unit/workbench/palette.test.ts with the Machado 2009 simulation); every
 * series also has its own dash pattern and width, so a grey print still separates them.
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
  electric: { key: "electric", label: "Electric-dipole θe", color: "#7048c8", dash: "8 4", width: 2 },
  magnetic: { key: "magnetic", label: "Magnetic-dipole θm", color: "#c43a3a", dash: "2 3", width: 2.2 },
  cross: { key: "cross", label: "Cross term θx", color: "#d4a017", dash: "10 3 2 3", width: 1.6 },
  ellipticity: { key: "ellipticity", label: "Ellipticity η", color: "#5a9e9a", dash: "4 2 1 2 1 2", width: 1.6 },
};

export const SERIES_ORDER: readonly SeriesKey[] = ["total", "electric", "magnetic", "cross", "ellipticity"];

/**
 * The diamagnetic (bound-electron) part, drawn only when a set has that term on. It is a sub-part of
 * the electric-dipole part (physics-model §5.5), so it takes θe's violet with its own fine dots.
 */
export const DIAMAGNETIC_STYLE = {
  key: "diamagnetic",
  label: "Diamagnetic part θdia (within θe)",
  color: "#7048c8",
  dash: "1 3",
  width: 1.6,
};

/** Overlay colours for comparing parameter sets (the same family, plus a steel blue and a mid grey). */
export const COMPARE_COLORS = ["#1d2433", "#7048c8", "#c43a3a", "#d4a017", "#3a8fb7", "#9c9c9c"] as const;
export const COMPARE_DASHES = [undefined, "8 4", "2 3", "10 3 2 3", "4 2 1 2 1 2", "12 4"] as const;

/** Spin-trace components. */
export const COMPONENT_COLORS = { ux: "#3a8fb7", uy: "#d4a017", uz: "#1d2433" } as const;
