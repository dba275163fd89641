/* Number formatting shared by tables, readouts and exports. */

/** Engineering-friendly: 4 significant digits, exponent outside 1e-3…1e5. */
export function fmt(value: number | null | undefined, digits = 4): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return "–";
  if (value === 0) return "0";
  const abs = Math.abs(value);
  if (abs >= 1e5 || abs < 1e-3) return value.toExponential(digits - 1).replace("e+", "e");
  return Number(value.toPrecision(digits)).toString();
}

/**
 * A stored value as a person reads it: 12 significant digits, so the binary noise of a unit
 * conversion (0.6328 µm → 632.8000000000001 nm) is gone while every digit a file can carry stays.
 */
/** A held value of a fit (a number at 5 significant digits, a switch or a word as it is). */
export function fmtHeldValue(value: number | boolean | string): string {
  return typeof value === "number" ? fmt(value, 5) : String(value);
}

export function fmtStored(value: number | null | undefined): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return "–";
  return String(Number(value.toPrecision(12)));
}

export function fmtPercent(share: number | null | undefined, digits = 1): string {
  if (share === null || share === undefined || !Number.isFinite(share)) return "–";
  return `${(share * 100).toFixed(digits)} %`;
}

/** Lengths in the unit a lab would use: µm, mm, m or km. */
export function fmtLength(m: number | null | undefined): string {
  if (m === null || m === undefined || !Number.isFinite(m)) return "–";
  if (m < 1e-3) return `${fmt(m * 1e6, 3)} µm`;
  if (m < 1) return `${fmt(m * 1e3, 3)} mm`;
  if (m < 1e3) return `${fmt(m, 3)} m`;
  return `${fmt(m / 1e3, 3)} km`;
}

export function fmtNm(nm: number): string {
  return `${Number(nm.toPrecision(6))} nm`;
}

/** The label physics-model §4.3 requires on every result computed with magneticScale ≠ 1. */
export function magneticScaleLabel(magneticScale: number | undefined): string | null {
  if (magneticScale === undefined || magneticScale === 1) return null;
  const shown = Number.isInteger(magneticScale) ? magneticScale.toFixed(1) : String(Number(magneticScale.toPrecision(3)));
  return `magnetic-dipole part × ${shown}, not first-principles`;
}

/**
 * A signed difference with a fixed number of decimals: "+1.23", "−0.45", and "0.00" for anything
 * that rounds to zero (toFixed alone writes "-0.00" for −0.001, a sign with no meaning).
 */
export function fmtDelta(value: number | null | undefined, digits = 2): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return "–";
  const rounded = Number(value.toFixed(digits));
  if (rounded === 0) return (0).toFixed(digits);
  return `${rounded > 0 ? "+" : "−"}${Math.abs(rounded).toFixed(digits)}`;
}

const SUPERSCRIPT: Record<string, string> = {
  "-": "⁻",
  "0": "⁰",
  "1": "¹",
  "2": "²",
  "3": "³",
  "4": "⁴",
  "5": "⁵",
  "6": "⁶",
  "7": "⁷",
  "8": "⁸",
  "9": "⁹",
};

/** "2.99 × 10⁻⁴" for a value outside 1e-3…1e5, plain otherwise; three significant digits, no sign. */
function magnitudeText(abs: number, digits: number): string {
  if (abs === 0) return "0";
  if (abs >= 1e-3 && abs < 1e5) return String(Number(abs.toPrecision(digits)));
  const [mantissa, exponent] = abs.toExponential(digits - 1).split("e");
  const power = String(Number(exponent)).replace(/./g, (c) => SUPERSCRIPT[c] ?? c);
  return `${Number(mantissa)} × 10${power}`;
}

/**
 * A difference against a reference value as a reader takes it in: signed (typographic minus),
 * three significant digits with a power of ten written out, and the relative change beside it —
 * "−2.99 × 10⁻⁴ (−0.22 %)" rather than "-2.991e-4".
 */
export function fmtDifference(delta: number | null | undefined, reference: number | null | undefined, digits = 3): string {
  if (delta === null || delta === undefined || !Number.isFinite(delta)) return "–";
  if (delta === 0) return "0";
  const sign = delta > 0 ? "+" : "−";
  const relative =
    reference !== null && reference !== undefined && Number.isFinite(reference) && reference !== 0
      ? ` (${fmtDelta((delta / Math.abs(reference)) * 100, 2)} %)`
      : "";
  return `${sign}${magnitudeText(Math.abs(delta), digits)}${relative}`;
}

/** A probability as a reader takes it: tiny ones in powers of ten rather than 0.000. */
export function fmtProbability(p: number | null | undefined): string {
  if (p === null || p === undefined || !Number.isFinite(p)) return "–";
  if (p === 0) return "< 1e-300";
  return p < 1e-3 ? p.toExponential(1).replace("e+", "e") : p.toFixed(3);
}
