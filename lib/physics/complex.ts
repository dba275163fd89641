/*
 * A tiny complex-number helper for the optics (physics-model.md §5–6). Values are plain
 * { re, im } records so they cross worker boundaries and JSON unchanged; every function is pure
 * and small enough for the JIT to inline.
 */

export interface Complex {
  re: number;
  im: number;
}

export const cx = (re: number, im = 0): Complex => ({ re, im });

export const add = (a: Complex, b: Complex): Complex => ({ re: a.re + b.re, im: a.im + b.im });

export const sub = (a: Complex, b: Complex): Complex => ({ re: a.re - b.re, im: a.im - b.im });

export const neg = (a: Complex): Complex => ({ re: -a.re, im: -a.im });

export const scale = (a: Complex, s: number): Complex => ({ re: a.re * s, im: a.im * s });

export const mul = (a: Complex, b: Complex): Complex => ({
  re: a.re * b.re - a.im * b.im,
  im: a.re * b.im + a.im * b.re,
});

/** a / b by Smith's algorithm, which avoids overflow and keeps relative accuracy when |b.re| ≫ |b.im| or vice versa. */
export function div(a: Complex, b: Complex): Complex {
  if (Math.abs(b.re) >= Math.abs(b.im)) {
    const r = b.im / b.re;
    const den = b.re + b.im * r;
    return { re: (a.re + a.im * r) / den, im: (a.im - a.re * r) / den };
  }
  const r = b.re / b.im;
  const den = b.re * r + b.im;
  return { re: (a.re * r + a.im) / den, im: (a.im * r - a.re) / den };
}

/** s / b for a real numerator. */
export const divReal = (s: number, b: Complex): Complex => div({ re: s, im: 0 }, b);

export const abs = (a: Complex): number => Math.hypot(a.re, a.im);

/** Principal square root (branch cut on the negative real axis, Re ≥ 0), computed without cancellation. */
export function sqrtPrincipal(a: Complex): Complex {
  if (a.re === 0 && a.im === 0) return { re: 0, im: 0 };
  const t = Math.sqrt((Math.abs(a.re) + Math.hypot(a.re, a.im)) / 2);
  if (a.re >= 0) return { re: t, im: a.im / (2 * t) };
  return { re: Math.abs(a.im) / (2 * t), im: a.im < 0 ? -t : t };
}

/**
 * The root r(x) of physics-model.md §6.1: the principal square root, except −i √(−x) for real
 * x < 0. With exp(+iωt) a passive factor (Im x ≤ 0) then gives Im r ≤ 0, the wave that decays
 * along +z; a lossless negative factor gives the evanescent (decaying) root, not the growing one.
 */
export function rootDecaying(a: Complex): Complex {
  if (a.im === 0 && a.re < 0) return { re: 0, im: -Math.sqrt(-a.re) };
  return sqrtPrincipal(a);
}

export const isFiniteComplex = (a: Complex): boolean => Number.isFinite(a.re) && Number.isFinite(a.im);
