/*
 * WCAG 2.x contrast: relative luminance of sRGB colours and the contrast ratio
 * (L1 + 0.05) / (L2 + 0.05). Definitions: W3C, Web Content Accessibility Guidelines 2.2,
 * "relative luminance" and "contrast ratio" in the glossary; AA asks 4.5:1 for normal text.
 */

export const AA_NORMAL_TEXT = 4.5;

type Rgb = [number, number, number];

export function parseHex(hex: string): Rgb {
  const m = /^#([0-9a-f]{6})$/i.exec(hex);
  if (!m) throw new Error(`not a #rrggbb colour: ${hex}`);
  const n = parseInt(m[1]!, 16);
  return [(n >> 16) & 255, (n >> 8) & 255, n & 255];
}

function toHex([r, g, b]: Rgb): string {
  return `#${[r, g, b].map((c) => Math.round(c).toString(16).padStart(2, "0")).join("")}`;
}

/** A colour at `alpha` over an opaque background, as the browser composites it (in sRGB values). */
export function over(hex: string, alpha: number, backgroundHex: string): string {
  const f = parseHex(hex);
  const b = parseHex(backgroundHex);
  return toHex([0, 1, 2].map((i) => f[i]! * alpha + b[i]! * (1 - alpha)) as Rgb);
}

/** WCAG relative luminance (sRGB → linear with the 0.04045 threshold of IEC 61966-2-1). */
export function relativeLuminance(hex: string): number {
  const [r, g, b] = parseHex(hex).map((c) => {
    const s = c / 255;
    return s <= 0.04045 ? s / 12.92 : ((s + 0.055) / 1.055) ** 2.4;
  }) as Rgb;
  return 0.2126 * r + 0.7152 * g + 0.0722 * b;
}

export function contrastRatio(a: string, b: string): number {
  const la = relativeLuminance(a);
  const lb = relativeLuminance(b);
  return (Math.max(la, lb) + 0.05) / (Math.min(la, lb) + 0.05);
}
