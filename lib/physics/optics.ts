/*
 * Optical response of a gyrotropic paramagnet at one wavelength: permittivity, gyration, Polder
 * susceptibilities, circular-mode indices and the split of the rotation (physics-model.md §4–6).
 * Conventions (§1): exp(+iωt), light along +z, "+" = (1, −i)/√2, passive ⇔ Im ≤ 0.
 */
import { type Complex, add, cx, div, divReal, mul, neg, rootDecaying, scale, sub } from "./complex";
import { ELECTRON_MASS_KG, ELEMENTARY_CHARGE_C, SPEED_OF_LIGHT_M_PER_S } from "./constants";

/** Isotropic background and gyrotropic-transition parameters (§5). */
export interface DielectricParams {
  epsInf: number;
  sellmeierB: number;
  sellmeierWavelengthNm: number;
  oscillatorStrength: number;
  oscillatorWavelengthNm: number;
  oscillatorDampingRadPerS: number;
}

/** D = ωE² − ω² + i ΓE ω, the resonance denominator of the gyrotropic transition (§5.1–5.3). */
export function oscillatorDenominator(p: DielectricParams, omega: number): Complex {
  const omegaE = (2 * Math.PI * SPEED_OF_LIGHT_M_PER_S) / (p.oscillatorWavelengthNm * 1e-9);
  return cx(omegaE * omegaE - omega * omega, p.oscillatorDampingRadPerS * omega);
}

/**
 * ε(ω) = ε∞ + B λ²/(λ² − λS²) + f ωE²/(ωE² − ω² + i ΓE ω) (§5.1): an undamped one-term Sellmeier
 * background plus the isotropic part of the gyrotropic transition.
 */
export function permittivity(p: DielectricParams, wavelengthNm: number, omega: number): Complex {
  const l2 = wavelengthNm * wavelengthNm;
  const sellmeier = p.sellmeierB === 0 ? 0 : (p.sellmeierB * l2) / (l2 - p.sellmeierWavelengthNm * p.sellmeierWavelengthNm);
  const omegaE = (2 * Math.PI * SPEED_OF_LIGHT_M_PER_S) / (p.oscillatorWavelengthNm * 1e-9);
  const osc = p.oscillatorStrength === 0 ? cx(0) : divReal(p.oscillatorStrength * omegaE * omegaE, oscillatorDenominator(p, omega));
  return add(cx(p.epsInf + sellmeier), osc);
}

/** G(ω) = K · 2 ω ωE / (ωE² − ω² + i ΓE ω) with K = κE μ0 M0 (§5.2); ε± = ε ± G. */
export function gyration(p: DielectricParams, gyrationK: number, omega: number): Complex {
  if (gyrationK === 0) return cx(0);
  const omegaE = (2 * Math.PI * SPEED_OF_LIGHT_M_PER_S) / (p.oscillatorWavelengthNm * 1e-9);
  return divReal(gyrationK * 2 * omega * omegaE, oscillatorDenominator(p, omega));
}

/**
 * The two refinements of the diamagnetic term (§5.5). anomaly is the magneto-optic anomaly factor γ
 * that multiplies G_dia (default 1); dispersion "host" keeps only the Sellmeier background's pole,
 * so the paramagnetic ion's own transition (already carried by the spin gyration G) is not counted
 * a second time as bound-electron dispersion (default "whole", every pole of ε).
 */
export interface DiamagneticOptions {
  anomaly?: number;
  dispersion?: "whole" | "host";
}

/**
 * Classical bound-electron (diamagnetic) gyration of §5.5:
 *   G_dia(ω) = −(e B0 / m_e) ω [ B ωS² / (ωS² − ω²)² + f ωE² / (ωE² − ω² + i ΓE ω)² ],
 * which for ΓE = 0 is −(e B0 / 2 m_e) dε/dω: each oscillator of ε shifted by the Larmor frequency
 * e B0 / 2 m_e in opposite senses for the two circular modes (the Becquerel picture, Larmor's
 * theorem; common practice, no source). It follows B0, not M0.
 */
export function diamagneticGyration(p: DielectricParams, fieldT: number, omega: number, options: DiamagneticOptions = {}): Complex {
  if (fieldT === 0) return cx(0);
  const anomaly = options.anomaly ?? 1;
  const pre = (-ELEMENTARY_CHARGE_C * fieldT * omega * anomaly) / ELECTRON_MASS_KG;
  let re = 0;
  let im = 0;
  if (p.sellmeierB !== 0) {
    const omegaS = (2 * Math.PI * SPEED_OF_LIGHT_M_PER_S) / (p.sellmeierWavelengthNm * 1e-9);
    const dS = omegaS * omegaS - omega * omega;
    re += (p.sellmeierB * omegaS * omegaS) / (dS * dS);
  }
  if (p.oscillatorStrength !== 0 && options.dispersion !== "host") {
    const omegaE = (2 * Math.PI * SPEED_OF_LIGHT_M_PER_S) / (p.oscillatorWavelengthNm * 1e-9);
    const d = oscillatorDenominator(p, omega);
    const osc = divReal(p.oscillatorStrength * omegaE * omegaE, mul(d, d));
    re += osc.re;
    im += osc.im;
  }
  return cx(pre * re, pre * im);
}

/**
 * Rotation of the diamagnetic term on its own, with μ = 1 (§5.5):
 * (ω L / 2c) Re(−2 G_dia / (r(ε + G_dia) + r(ε − G_dia))); plain difference where the sum cancels.
 */
export function diamagneticRotationRad(omega: number, lengthM: number, eps: Complex, gDia: Complex): number {
  const k = (omega * lengthM) / (2 * SPEED_OF_LIGHT_M_PER_S);
  const a = rootDecaying(add(eps, gDia));
  const b = rootDecaying(sub(eps, gDia));
  const d = nearlyCancels(a, b) ? sub(b, a) : div(scale(gDia, -2), add(a, b));
  return k * d.re;
}

export interface CircularSusceptibilities {
  plus: Complex;
  minus: Complex;
  /** χ− − χ+, from the product form (no cancellation). */
  diff: Complex;
  /** χ+ + χ−. */
  sum: Complex;
}

/**
 * Polder susceptibilities with Gilbert damping (§4.2; D. D. Stancil and A. Prabhakar, "Spin Waves",
 * ch. 3; A. G. Gurevich and G. A. Melkov, "Magnetization Oscillations and Waves", ch. 1):
 *   χ± = |ωM'| / (|ω0| ∓ s ω + i α ω),  s = sign(M0), ωM' = magneticScale · ωM.
 * The |·| form is the signed form with s folded in; it keeps Im χ± ≤ 0 for both field signs and
 * makes B0 → −B0 swap χ+ and χ− bit for bit. χ− − χ+ = −2 s ω |ωM'| / (A B) with
 * A = |ω0| − ω + iαω, B = |ω0| + ω + iαω, evaluated as a product, not a difference.
 */
export function polderSusceptibilities(
  omega0: number,
  omegaMScaled: number,
  alpha: number,
  sign: number,
  omega: number,
): CircularSusceptibilities {
  if (omegaMScaled === 0 || sign === 0) {
    const zero = cx(0);
    return { plus: zero, minus: zero, diff: zero, sum: zero };
  }
  const a0 = Math.abs(omega0);
  const m = Math.abs(omegaMScaled);
  const damp = alpha * omega;
  const resonant = cx(a0 - omega, damp);
  const antiResonant = cx(a0 + omega, damp);
  const chiRes = divReal(m, resonant);
  const chiAnti = divReal(m, antiResonant);
  const product = mul(resonant, antiResonant);
  const diff = divReal(-2 * sign * omega * m, product);
  // χ+ + χ− = m (A + B) / (A B) with A + B = 2(|ω0| + iαω).
  const sum = div(scale(cx(a0, damp), 2 * m), product);
  return sign > 0 ? { plus: chiRes, minus: chiAnti, diff, sum } : { plus: chiAnti, minus: chiRes, diff, sum };
}

export interface RotationInput {
  omega: number;
  lengthM: number;
  eps: Complex;
  gyration: Complex;
  chiPlus: Complex;
  chiMinus: Complex;
  /** χ− − χ+ (pass the product form when it is available). */
  chiDiff: Complex;
  /** χ+ + χ−. */
  chiSum: Complex;
}

export interface RotationOutput {
  thetaRad: number;
  thetaElectricRad: number;
  thetaMagneticRad: number;
  thetaCrossRad: number;
  ellipticityRad: number;
  nPlus: Complex;
  nMinus: Complex;
  epsPlus: Complex;
  epsMinus: Complex;
}

/** |a + b| < (|a| + |b|)/4: the sum nearly cancels (evanescent bands only, §6.2). */
function nearlyCancels(a: Complex, b: Complex): boolean {
  const s = add(a, b);
  return Math.hypot(s.re, s.im) < (Math.hypot(a.re, a.im) + Math.hypot(b.re, b.im)) / 4;
}

/**
 * Indices (§6.1) and rotations (§6.2). n± = r(ε±) r(μ±) with r the decaying root; the parts use
 * the same r: ne± = r(ε ± G), nm± = r(ε) r(μ±). The small differences are the exact rearrangements
 *   d   = (ε Δχ − G (2 + Σχ)) / S,  d_e = −2G / S_e,  d_m = ε Δχ / S_m,
 *   d_x = ε Δχ (S_m − S)/(S S_m) − 2G (S_e − S)/(S S_e) − G Σχ / S,
 * which keep ~1e-13 relative accuracy where plain root differences would lose it to round-off.
 * Where a denominator sum nearly cancels, plain differences are used instead.
 */
export function rotations(input: RotationInput): RotationOutput {
  const { omega, lengthM, eps, gyration: g, chiPlus, chiMinus, chiDiff, chiSum } = input;
  const k = (omega * lengthM) / (2 * SPEED_OF_LIGHT_M_PER_S);
  const epsPlus = add(eps, g);
  const epsMinus = sub(eps, g);
  const muPlus = add(cx(1), chiPlus);
  const muMinus = add(cx(1), chiMinus);
  const rEpsPlus = rootDecaying(epsPlus);
  const rEpsMinus = rootDecaying(epsMinus);
  const rEps = rootDecaying(eps);
  const rMuPlus = rootDecaying(muPlus);
  const rMuMinus = rootDecaying(muMinus);
  const nPlus = mul(rEpsPlus, rMuPlus);
  const nMinus = mul(rEpsMinus, rMuMinus);
  const nePlus = rEpsPlus;
  const neMinus = rEpsMinus;
  const nmPlus = mul(rEps, rMuPlus);
  const nmMinus = mul(rEps, rMuMinus);

  const S = add(nPlus, nMinus);
  const Se = add(nePlus, neMinus);
  const Sm = add(nmPlus, nmMinus);
  const epsDchi = mul(eps, chiDiff);

  const d = nearlyCancels(nPlus, nMinus) ? sub(nMinus, nPlus) : div(sub(epsDchi, mul(g, add(cx(2), chiSum))), S);
  const de = nearlyCancels(nePlus, neMinus) ? sub(neMinus, nePlus) : div(scale(g, -2), Se);
  const dm = nearlyCancels(nmPlus, nmMinus) ? sub(nmMinus, nmPlus) : div(epsDchi, Sm);

  let dx: Complex;
  const crossUnsafe =
    nearlyCancels(nPlus, nMinus) ||
    nearlyCancels(nePlus, neMinus) ||
    nearlyCancels(nmPlus, nmMinus) ||
    nearlyCancels(nPlus, nmPlus) ||
    nearlyCancels(nMinus, nmMinus) ||
    nearlyCancels(nPlus, nePlus) ||
    nearlyCancels(nMinus, neMinus);
  if (crossUnsafe) {
    dx = sub(sub(d, de), dm);
  } else {
    // S_m − S = −G (μ+ / (n+ + nm+) − μ− / (n− + nm−))
    const SmMinusS = neg(mul(g, sub(div(muPlus, add(nPlus, nmPlus)), div(muMinus, add(nMinus, nmMinus)))));
    // S_e − S = −((ε + G) χ+ / (n+ + ne+) + (ε − G) χ− / (n− + ne−))
    const SeMinusS = neg(add(div(mul(epsPlus, chiPlus), add(nPlus, nePlus)), div(mul(epsMinus, chiMinus), add(nMinus, neMinus))));
    const term1 = div(mul(epsDchi, SmMinusS), mul(S, Sm));
    const term2 = div(mul(scale(g, 2), SeMinusS), mul(S, Se));
    const term3 = div(mul(g, chiSum), S);
    dx = sub(sub(term1, term2), term3);
  }

  return {
    thetaRad: k * d.re,
    ellipticityRad: k * d.im,
    thetaElectricRad: k * de.re,
    thetaMagneticRad: k * dm.re,
    thetaCrossRad: k * dx.re,
    nPlus,
    nMinus,
    epsPlus,
    epsMinus,
  };
}
