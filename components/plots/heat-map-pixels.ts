import { interpolateCividis, rgb } from "d3";

/*
 * The pixels of a heat map's cell bitmap (one pixel a cell), kept apart from the component so the
 * layout of rows and the colours can be tested without a canvas.
 */

/** The fill of a cell whose value is undefined (null or not finite). */
export const UNDEFINED_FILL = rgb("#d9d6cf");

/** Colours of the scale in 256 steps (the usual size of a colour map's table; common practice, no source). */
const CIVIDIS_TABLE = Array.from({ length: 256 }, (_, k) => rgb(interpolateCividis(k / 255)));

/**
 * RGBA bytes of an nx × ny image of row-major values (values[j·nx + i] at column i, row j), row 0
 * at the bottom as on the plot (image rows run top to bottom); values mapped from lo…lo + span
 * onto the colour scale, clamped at its ends.
 */
export function cellPixels(values: readonly (number | null)[], nx: number, ny: number, lo: number, span: number): Uint8ClampedArray {
  const out = new Uint8ClampedArray(nx * ny * 4);
  for (let j = 0; j < ny; j++) {
    for (let i = 0; i < nx; i++) {
      const v = values[j * nx + i];
      const c =
        v === null || v === undefined || !Number.isFinite(v)
          ? UNDEFINED_FILL
          : CIVIDIS_TABLE[Math.round(Math.min(1, Math.max(0, (v - lo) / span)) * 255)]!;
      const at = ((ny - 1 - j) * nx + i) * 4;
      out[at] = c.r;
      out[at + 1] = c.g;
      out[at + 2] = c.b;
      out[at + 3] = 255;
    }
  }
  return out;
}
