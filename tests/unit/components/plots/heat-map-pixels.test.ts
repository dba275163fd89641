import { interpolateCividis, rgb } from "d3";
import { describe, expect, it } from "vitest";
import { UNDEFINED_FILL, cellPixels } from "@/components/plots/heat-map-pixels";

const pixel = (px: Uint8ClampedArray, nx: number, x: number, yFromTop: number) =>
  Array.from(px.subarray((yFromTop * nx + x) * 4, (yFromTop * nx + x) * 4 + 4));
const rgba = (c: { r: number; g: number; b: number }) => [c.r, c.g, c.b, 255];

describe("heat-map cell bitmap", () => {
  it("puts row 0 at the bottom, columns left to right, one opaque pixel a cell", () => {
    // 3 columns × 2 rows: row 0 = [0, 0.5, 1], row 1 = [null, 1, 0].
    const px = cellPixels([0, 0.5, 1, null, 1, 0], 3, 2, 0, 1);
    expect(px).toHaveLength(3 * 2 * 4);
    // Bottom image row (y = 1 from the top) is data row 0.
    expect(pixel(px, 3, 0, 1)).toEqual(rgba(rgb(interpolateCividis(0))));
    expect(pixel(px, 3, 2, 1)).toEqual(rgba(rgb(interpolateCividis(1))));
    // Top image row is data row 1; its first cell is undefined.
    expect(pixel(px, 3, 0, 0)).toEqual(rgba(UNDEFINED_FILL));
    expect(pixel(px, 3, 1, 0)).toEqual(rgba(rgb(interpolateCividis(1))));
  });

  it("maps the domain onto the scale and clamps outside it", () => {
    const px = cellPixels([-5, 10, 30, Number.NaN], 4, 1, 10, 10);
    expect(pixel(px, 4, 0, 0)).toEqual(rgba(rgb(interpolateCividis(0))));
    expect(pixel(px, 4, 1, 0)).toEqual(rgba(rgb(interpolateCividis(0))));
    expect(pixel(px, 4, 2, 0)).toEqual(rgba(rgb(interpolateCividis(1))));
    expect(pixel(px, 4, 3, 0)).toEqual(rgba(UNDEFINED_FILL));
  });
});
