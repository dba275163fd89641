/*
 * Closed forms written out again for the tests, independently of lib/physics (no imports from it), so
 * that a check "code against closed form" does not compare the code with itself. Each form names its
 * source. Constants are typed in from CODATA 2018 (NIST, https://physics.nist.gov/cuu/Constants/).
 */

// CODATA 2018.
export const MU_B = 9.2740100783e-24; // J/T
export const HBAR = 1.054571817e-34; // J s
export const K_B = 1.380649e-23; // J/K (exact)
export const MU0 = 1.25663706212e-6; // N/A²
export const C0 = 299792458; // m/s (exact)
export const Z0 = 376.730313668; // Ω

export interface C {
  re: number;
  im: number;
}
export const c = (re: number, im = 0): C => ({ re, im });
export const cAdd = (a: C, b: C): C => c(a.re + b.re, a.im + b.im);
export const cSub = (a: C, b: C): C => c(a.re - b.re, a.im - b.im);
export const cMul = (a: C, b: C): C => c(a.re * b.re - a.im * b.im, a.re * b.im + a.im * b.re);
export const cDiv = (a: C, b: C): C => {
  const d = b.re * b.re + b.im * b.im;
  return c((a.re * b.re + a.im * b.im) / d, (a.im * b.re - a.re * b.im) / d);
};
export const cAbs = (a: C): number => Math.hypot(a.re, a.im);
/** e^{z} */
export const cExp = (z: C): C => c(Math.exp(z.re) * Math.cos(z.im), Math.exp(z.re) * Math.sin(z.im));

/**
 * Square root with Im ≤ 0 for a passive factor (exp(+iωt): the wave that decays along +z), via polar
 * form: √|x| e^{i arg(x)/2} with arg in (−π, π], and −i√(−x) on the negative real axis.
 */
export function rootDecaying(x: C): C {
  if (x.im === 0 && x.re < 0) return c(0, -Math.sqrt(-x.re));
  const r = Math.sqrt(cAbs(x));
  const phi = Math.atan2(x.im, x.re) / 2;
  return c(r * Math.cos(phi), r * Math.sin(phi));
}

/** ω = 2πc/λ (common practice, no source). */
export const omegaOfNm = (nm: number) => (2 * Math.PI * C0) / (nm * 1e-9);

/**
 * Brillouin function B_J(x) = ((2J+1)/(2J)) coth((2J+1)x/(2J)) − (1/(2J)) coth(x/(2J)), in its plain
 * closed form (Kittel, Introduction to Solid State Physics, 8th ed., ch. 11, eq. for B_J; chapter
 * from memory). Fine for x ≳ 1e-3, where the cancellation costs at most a few digits.
 */
export function brillouinClosed(j: number, x: number): number {
  const a = (2 * j + 1) / (2 * j);
  const b = 1 / (2 * j);
  return a / Math.tanh(a * x) - b / Math.tanh(b * x);
}

/** Curie constant C = μ0 N g² μB² J(J+1) / (3 kB) in K (Kittel ch. 11, Curie law χ = C/T in SI). */
export const curieConstant = (n: number, g: number, j: number) => (MU0 * n * g * g * MU_B * MU_B * j * (j + 1)) / (3 * K_B);

/** γ = g μB / ħ (definition of the gyromagnetic ratio). */
export const gamma = (g: number) => (g * MU_B) / HBAR;

/**
 * Polder susceptibilities with Gilbert damping in the signed form (D. Polder, Phil. Mag. 40, 99 (1949);
 * Stancil & Prabhakar, "Spin Waves", ch. 3; physics-model.md §4.2 for the exp(+iωt) sign and s):
 *   χ± = ωM / (ω0 ∓ ω + i s α ω),  ω0 = γ B0, ωM = γ μ0 M0, s = sign(M0).
 * Evaluated directly, as two separate divisions.
 */
export function polder(omega0: number, omegaM: number, alpha: number, omega: number): { plus: C; minus: C } {
  const s = Math.sign(omegaM);
  return {
    plus: cDiv(c(omegaM), c(omega0 - omega, s * alpha * omega)),
    minus: cDiv(c(omegaM), c(omega0 + omega, s * alpha * omega)),
  };
}

export interface Dielectric {
  epsInf: number;
  sellmeierB: number;
  sellmeierWavelengthNm: number;
  oscillatorStrength: number;
  oscillatorWavelengthNm: number;
  oscillatorDampingRadPerS: number;
}

/**
 * ε(ω) = ε∞ + B ωS²/(ωS² − ω²) + f ωE²/(ωE² − ω² + i ΓE ω): one undamped Sellmeier pole plus a damped
 * Lorentz oscillator (the Lorentz model, e.g. Ashcroft & Mermin / any optics text; physics-model.md
 * §5.1 for the choice of poles). Written in frequencies, where the product writes the Sellmeier term in
 * wavelengths.
 */
export function permittivityClosed(p: Dielectric, nm: number): C {
  const w = omegaOfNm(nm);
  const ws = omegaOfNm(p.sellmeierWavelengthNm);
  const we = omegaOfNm(p.oscillatorWavelengthNm);
  const sellmeier = (p.sellmeierB * ws * ws) / (ws * ws - w * w);
  const osc = cDiv(c(p.oscillatorStrength * we * we), c(we * we - w * w, p.oscillatorDampingRadPerS * w));
  return cAdd(c(p.epsInf + sellmeier), osc);
}

/** G(ω) = κE μ0 M0 · 2 ω ωE / (ωE² − ω² + i ΓE ω) (physics-model.md §5.2, product model definition). */
export function gyrationClosed(p: Dielectric, kappaE: number, mu0M0: number, nm: number): C {
  const w = omegaOfNm(nm);
  const we = omegaOfNm(p.oscillatorWavelengthNm);
  return cDiv(c(kappaE * mu0M0 * 2 * w * we), c(we * we - w * w, p.oscillatorDampingRadPerS * w));
}
