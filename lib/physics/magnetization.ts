/*
 * Static magnetization of a paramagnet: Brillouin function with a Curie–Weiss (Weiss molecular)
 * mean field, physics-model.md §3. Formulas: C. Kittel, "Introduction to Solid State Physics",
 * 8th ed., ch. 11 (Brillouin function, Curie law) and ch. 12 (Curie–Weiss mean field; chapter numbers from memory).
 */
import { BOHR_MAGNETON_J_PER_T, BOLTZMANN_J_PER_K, MU0_N_PER_A2 } from "./constants";

export interface MagnetizationParams {
  ionDensityPerM3: number;
  landeG: number;
  totalJ: number;
  curieWeissK: number;
  temperatureK: number;
  fieldT: number;
}

/** Saturation magnetization Ms = N g μ_B J in A/m (§3.2). */
export function saturationMagnetization(p: Pick<MagnetizationParams, "ionDensityPerM3" | "landeG" | "totalJ">): number {
  return p.ionDensityPerM3 * p.landeG * BOHR_MAGNETON_J_PER_T * p.totalJ;
}

/** Curie constant C = μ0 N g² μ_B² J(J+1) / (3 k_B) in K, so that χ = C / (T − θCW) (§3.2; Kittel ch. 11). */
export function curieConstantK(p: Pick<MagnetizationParams, "ionDensityPerM3" | "landeG" | "totalJ">): number {
  const { ionDensityPerM3: n, landeG: g, totalJ: j } = p;
  return (MU0_N_PER_A2 * n * g * g * BOHR_MAGNETON_J_PER_T * BOHR_MAGNETON_J_PER_T * j * (j + 1)) / (3 * BOLTZMANN_J_PER_K);
}

/** coth(y) − 1/y, evaluated from its series for small |y| where the closed form cancels. */
function langevinLike(y: number): number {
  const ay = Math.abs(y);
  if (ay < 1e-3) {
    // coth y − 1/y = y/3 − y³/45 + 2y⁵/945 − … (Abramowitz & Stegun 4.5.67)
    const y2 = y * y;
    return y * (1 / 3 - y2 * (1 / 45 - (2 * y2) / 945));
  }
  if (ay > 20) return Math.sign(y) - 1 / y;
  return 1 / Math.tanh(y) - 1 / y;
}

/**
 * Brillouin function B_J(x) = a coth(a x) − b coth(b x), a = (2J+1)/(2J), b = 1/(2J) (Kittel ch. 11).
 * Written as a·L(a x) − b·L(b x) with L(y) = coth y − 1/y: the 1/x terms cancel exactly
 * (a·1/(a x) = b·1/(b x)), so no cancellation remains near x = 0.
 */
export function brillouin(totalJ: number, x: number): number {
  const a = (2 * totalJ + 1) / (2 * totalJ);
  const b = 1 / (2 * totalJ);
  return a * langevinLike(a * x) - b * langevinLike(b * x);
}

/**
 * Brent's method (R. P. Brent, "Algorithms for Minimization without Derivatives", 1973, ch. 4):
 * a bracketed root finder that never leaves [lo, hi] and converges superlinearly.
 */
export function brentRoot(f: (x: number) => number, lo: number, hi: number, tol = 0): number {
  let a = lo;
  let b = hi;
  let fa = f(a);
  let fb = f(b);
  if (fa === 0) return a;
  if (fb === 0) return b;
  if (fa * fb > 0) throw new Error("brentRoot: root is not bracketed");
  let c = a;
  let fc = fa;
  let d = b - a;
  let e = d;
  for (let iter = 0; iter < 200; iter++) {
    if (fb * fc > 0) {
      c = a;
      fc = fa;
      d = b - a;
      e = d;
    }
    if (Math.abs(fc) < Math.abs(fb)) {
      a = b;
      b = c;
      c = a;
      fa = fb;
      fb = fc;
      fc = fa;
    }
    const tol1 = 2 * Number.EPSILON * Math.abs(b) + 0.5 * tol;
    const xm = 0.5 * (c - b);
    if (Math.abs(xm) <= tol1 || fb === 0) return b;
    if (Math.abs(e) >= tol1 && Math.abs(fa) > Math.abs(fb)) {
      const s = fb / fa;
      let p: number;
      let q: number;
      if (a === c) {
        p = 2 * xm * s;
        q = 1 - s;
      } else {
        const qq = fa / fc;
        const r = fb / fc;
        p = s * (2 * xm * qq * (qq - r) - (b - a) * (r - 1));
        q = (qq - 1) * (r - 1) * (s - 1);
      }
      if (p > 0) q = -q;
      p = Math.abs(p);
      if (2 * p < Math.min(3 * xm * q - Math.abs(tol1 * q), Math.abs(e * q))) {
        e = d;
        d = p / q;
      } else {
        d = xm;
        e = d;
      }
    } else {
      d = xm;
      e = d;
    }
    a = b;
    fa = fb;
    b += Math.abs(d) > tol1 ? d : xm > 0 ? tol1 : -tol1;
    fb = f(b);
  }
  return b;
}

/**
 * Equilibrium magnetization M0 in A/m along z (§3.2): M − Ms B_J(x(M)) = 0 with
 * x = g μ_B J (B0 + μ0 λW M) / (k_B T), λW = θCW / C, solved by a bracketed root on [0, Ms].
 * The long-rod geometry (demagnetizing factor 0, §3.1) is assumed: B0 is the applied μ0 H.
 * The root is found for |B0| and the sign applied afterwards, so M0(−B0) = −M0(B0) exactly.
 * B0 = 0 or N = 0 gives exactly 0 (T > θCW, so there is no spontaneous moment).
 */
export function staticMagnetization(p: MagnetizationParams): number {
  const ms = saturationMagnetization(p);
  if (p.fieldT === 0 || ms === 0) return 0;
  const b0 = Math.abs(p.fieldT);
  const curie = curieConstantK(p);
  const lambdaW = p.curieWeissK / curie;
  const xPerTesla = (p.landeG * BOHR_MAGNETON_J_PER_T * p.totalJ) / (BOLTZMANN_J_PER_K * p.temperatureK);
  const residual = (m: number) => m - ms * brillouin(p.totalJ, xPerTesla * (b0 + MU0_N_PER_A2 * lambdaW * m));
  const m0 = brentRoot(residual, 0, ms);
  return p.fieldT > 0 ? m0 : -m0;
}

/** Low-field (Curie–Weiss) volume susceptibility χ = μ0 M0 / B0 = C / (T − θCW) (§3.2). */
export function curieWeissSusceptibility(p: Omit<MagnetizationParams, "fieldT">): number {
  return curieConstantK(p) / (p.temperatureK - p.curieWeissK);
}
