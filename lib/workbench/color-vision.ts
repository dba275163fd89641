/*
 * Colour-vision deficiency simulation, used to check the plot palette.
 *
 * Matrices: G. M. Machado, M. M. Oliveira, L. A. F. Fernandes, "A Physiologically-based Model for
 * Simulation of Color Vision Deficiency", IEEE TVCG 15(6):1291–1298 (2009), Table 1, severity 1.0
 * (dichromacy). They act on linear RGB. sRGB ↔ linear and linear RGB → XYZ (D65) follow
 * IEC 61966-2-1; XYZ → CIELAB uses the D65 white; ΔE is CIE76 (Euclidean distance in Lab).
 */

export type Rgb = readonly [number, number, number];
type Mat3 = readonly [Rgb, Rgb, Rgb];

export const MACHADO_2009: Record<"protanopia" | "deuteranopia" | "tritanopia", Mat3> = {
  protanopia: [
    [0.152286, 1.052583, -0.204868],
    [0.114503, 0.786281, 0.099216],
    [-0.003882, -0.048116, 1.051998],
  ],
  deuteranopia: [
    [0.367322, 0.860646, -0.227968],
    [0.280085, 0.672501, 0.047413],
    [-0.01182, 0.04294, 0.968881],
  ],
  tritanopia: [
    [1.255528, -0.076749, -0.178779],
    [-0.078411, 0.930809, 0.147602],
    [0.004733, 0.691367, 0.3039],
  ],
};

export type Vision = "normal" | keyof typeof MACHADO_2009;

export function hexToRgb(hex: string): Rgb {
  const m = /^#?([0-9a-f]{6})$/i.exec(hex);
  if (!m) throw new Error(`not a #rrggbb colour: ${hex}`);
  const n = parseInt(m[1]!, 16);
  return [((n >> 16) & 255) / 255, ((n >> 8) & 255) / 255, (n & 255) / 255];
}

const toLinear = (c: number) => (c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4);
const clamp01 = (x: number) => Math.min(1, Math.max(0, x));

/** sRGB (0…1) → linear RGB, simulated for a vision type, clamped to the gamut. */
export function simulateLinear(rgb: Rgb, vision: Vision): Rgb {
  const lin: Rgb = [toLinear(rgb[0]), toLinear(rgb[1]), toLinear(rgb[2])];
  if (vision === "normal") return lin;
  const m = MACHADO_2009[vision];
  return [
    clamp01(m[0][0] * lin[0] + m[0][1] * lin[1] + m[0][2] * lin[2]),
    clamp01(m[1][0] * lin[0] + m[1][1] * lin[1] + m[1][2] * lin[2]),
    clamp01(m[2][0] * lin[0] + m[2][1] * lin[1] + m[2][2] * lin[2]),
  ];
}

/** Relative luminance Y (0…1) of linear RGB, Rec. 709 primaries. */
export function luminance(lin: Rgb): number {
  return 0.2126 * lin[0] + 0.7152 * lin[1] + 0.0722 * lin[2];
}

/** Linear RGB → CIELAB (D65). */
export function linearToLab(lin: Rgb): Rgb {
  const x = 0.4124 * lin[0] + 0.3576 * lin[1] + 0.1805 * lin[2];
  const y = 0.2126 * lin[0] + 0.7152 * lin[1] + 0.0722 * lin[2];
  const z = 0.0193 * lin[0] + 0.1192 * lin[1] + 0.9505 * lin[2];
  const f = (t: number) => (t > 216 / 24389 ? Math.cbrt(t) : ((24389 / 27) * t + 16) / 116);
  const fx = f(x / 0.95047);
  const fy = f(y / 1);
  const fz = f(z / 1.08883);
  return [116 * fy - 16, 500 * (fx - fy), 200 * (fy - fz)];
}

export function deltaE76(a: Rgb, b: Rgb): number {
  return Math.hypot(a[0] - b[0], a[1] - b[1], a[2] - b[2]);
}

/** ΔE between two hex colours as seen by a viewer with the given vision. */
export function perceivedDeltaE(hexA: string, hexB: string, vision: Vision): number {
  return deltaE76(linearToLab(simulateLinear(hexToRgb(hexA), vision)), linearToLab(simulateLinear(hexToRgb(hexB), vision)));
}
