import { z } from "zod";
import { BOHR_MAGNETON_J_PER_T, BOLTZMANN_J_PER_K, MU0_N_PER_A2 } from "@/lib/physics/constants";
import { brentRoot, curieConstantK, saturationMagnetization, staticMagnetization } from "@/lib/physics/magnetization";
import { type ModelParams, modelParamsSchema } from "@/lib/physics/schema";
import { computeSpectrum } from "@/lib/physics/spectrum";

/*
 * Faraday rotator sizing for a parameter set at one wavelength, temperature and field: the length
 * for a target angle (45° for an isolator), the Verdet constant and its magnetic-dipole share, the
 * sensitivities dθ/dT and dθ/dB, and the temperature and field windows that keep an ideal
 * isolator above a target isolation.
 *
 * dθ/dT and dθ/dB are computed in closed form, not by differencing the engine: both parts are
 * proportional to M0 (physics-model.md §4.2 with ω ≫ ω0, §5.2; the corrections are second order
 * in G and (ω0/ω)², about 1e-8 in the optical range), so dθ = (θ/M0) dM0, and dM0 follows from
 * differentiating the mean-field equation of §3.2 implicitly. The tests compare this with finite
 * differences of the engine.
 */

export const rotatorRequestSchema = z.strictObject({
  params: modelParamsSchema,
  wavelengthNm: z.number().gt(0, "must be > 0 nm").max(1e6, "must be ≤ 1e6 nm"),
  temperatureK: z.number().gt(0, "must be > 0 K").max(10000, "must be ≤ 10000 K"),
  fieldT: z
    .number()
    .min(-100, "must be ≥ −100 T")
    .max(100, "must be ≤ 100 T")
    .refine((b) => b !== 0, { message: "a rotator needs a nonzero field" }),
  targetAngleDeg: z.number().gt(0, "must be > 0°").max(3600, "must be ≤ 3600°").default(45),
  isolationTargetDb: z.number().gt(0, "must be > 0 dB").max(100, "must be ≤ 100 dB").default(30),
});
export type RotatorRequest = z.infer<typeof rotatorRequestSchema>;
export type RotatorRequestInput = z.input<typeof rotatorRequestSchema>;

/**
 * Isolation of an ideal polarizer pair when the rotator misses its angle by Δθ:
 * the leak is sin²Δθ, so −10·log10(sin²Δθ) dB (Malus's law; common practice, no source).
 */
export function isolationDb(angleErrorRad: number): number {
  const s = Math.sin(angleErrorRad);
  return -10 * Math.log10(s * s);
}

/** The largest |Δθ| that keeps the isolation at or above `targetDb` (inverse of isolationDb). */
export function maxAngleErrorRad(targetDb: number): number {
  return Math.asin(10 ** (-targetDb / 20));
}

/** Length that turns by `angleRad` with Verdet constant V in field B: L = angle/(|V||B|) (§6.3, §8). */
export function rotatorLengthM(verdetRadPerTm: number, fieldT: number, angleRad: number): number | null {
  const vb = Math.abs(verdetRadPerTm * fieldT);
  return vb > 0 && Number.isFinite(vb) ? angleRad / vb : null;
}

/** L'(y) for L(y) = coth y − 1/y: 1/y² − 1/sinh² y, from its series where that form cancels. */
function langevinLikeDerivative(y: number): number {
  const ay = Math.abs(y);
  if (ay < 1e-2) {
    // coth y − 1/y = y/3 − y³/45 + 2y⁵/945 − y⁷/4725 (Abramowitz & Stegun 4.5.67), differentiated.
    const y2 = y * y;
    return 1 / 3 - y2 * (1 / 15 - y2 * (2 / 189 - y2 / 675));
  }
  if (ay > 40) return 1 / (y * y);
  const s = Math.sinh(y);
  return 1 / (y * y) - 1 / (s * s);
}

/** dB_J/dx for B_J(x) = a L(a x) − b L(b x) (same form as lib/physics/magnetization.ts). */
export function brillouinDerivative(totalJ: number, x: number): number {
  const a = (2 * totalJ + 1) / (2 * totalJ);
  const b = 1 / (2 * totalJ);
  return a * a * langevinLikeDerivative(a * x) - b * b * langevinLikeDerivative(b * x);
}

/**
 * ∂M0/∂B0 and ∂M0/∂T of the mean-field Brillouin magnetization (§3.2), by implicit
 * differentiation of M = Ms B_J(x), x = k (B0 + μ0 λW M), k = g μB J/(kB T):
 *   dM = Ms B_J'(x) (k dB0 + k μ0 λW dM − (x/T) dT).
 */
export function magnetizationDerivatives(
  p: Pick<ModelParams, "ionDensityPerM3" | "landeG" | "totalJ" | "curieWeissK" | "temperatureK" | "fieldT">,
): {
  m0: number;
  dMdB: number;
  dMdT: number;
} {
  const m0 = staticMagnetization(p);
  const ms = saturationMagnetization(p);
  if (ms === 0) return { m0, dMdB: 0, dMdT: 0 };
  const lambdaW = p.curieWeissK / curieConstantK(p);
  const k = (p.landeG * BOHR_MAGNETON_J_PER_T * p.totalJ) / (BOLTZMANN_J_PER_K * p.temperatureK);
  const x = k * (p.fieldT + MU0_N_PER_A2 * lambdaW * m0);
  const slope = ms * brillouinDerivative(p.totalJ, x);
  const den = 1 - slope * k * MU0_N_PER_A2 * lambdaW;
  return { m0, dMdB: (slope * k) / den, dMdT: (-slope * x) / p.temperatureK / den };
}

export interface Window {
  low: number;
  high: number;
  /** The window reaches the end of the range searched (the isolation never drops below target there). */
  lowOpen: boolean;
  highOpen: boolean;
}

export interface RotatorResult {
  verdetRadPerTm: number;
  magneticVerdetRadPerTm: number;
  electricVerdetRadPerTm: number;
  magneticShare: number | null;
  length45M: number | null;
  targetAngleRad: number;
  lengthM: number | null;
  /** At lengthM (the sized rotator). */
  dThetaDTRadPerK: number;
  dThetaDBRadPerT: number;
  maxAngleErrorRad: number;
  isolationTargetDb: number;
  temperatureWindowK: Window | null;
  fieldWindowT: Window | null;
  magneticScale: number;
}

function rotationRad(params: ModelParams, wavelengthNm: number, temperatureK: number, fieldT: number, lengthM: number): number {
  return computeSpectrum({ ...params, temperatureK, fieldT, lengthM, wavelengthsNm: [wavelengthNm], method: "analytic" }).points[0]!
    .thetaRad;
}

/** The window around x0 where |f(x) − f(x0)| ≤ tol, searched out to [lo, hi]; f monotone there. */
function windowAround(f: (x: number) => number, x0: number, tol: number, lo: number, hi: number): Window {
  const f0 = f(x0);
  const g = (x: number) => Math.abs(f(x) - f0) - tol;
  const side = (end: number) =>
    g(end) <= 0 ? { x: end, open: true } : { x: brentRoot(g, Math.min(x0, end), Math.max(x0, end), 1e-9 * Math.abs(x0 || 1)), open: false };
  const l = side(lo);
  const h = side(hi);
  return { low: l.x, high: h.x, lowOpen: l.open, highOpen: h.open };
}

export function sizeRotator(request: RotatorRequest): RotatorResult {
  const { params, wavelengthNm, temperatureK, fieldT } = request;
  const at = { ...params, temperatureK, fieldT };
  const point = computeSpectrum({ ...at, lengthM: 1, wavelengthsNm: [wavelengthNm], method: "analytic" }).points[0]!;
  const verdet = point.verdetRadPerTm ?? 0;
  const targetAngleRad = (request.targetAngleDeg * Math.PI) / 180;
  const lengthM = rotatorLengthM(verdet, fieldT, targetAngleRad);
  const length45M = rotatorLengthM(verdet, fieldT, Math.PI / 4);
  const L = lengthM ?? 0;
  // θ at the sized length; the diamagnetic sub-part (when a set has it on) does not scale with M0.
  const thetaRad = point.thetaRad * L;
  const thetaDia = ((point as unknown as { thetaDiamagneticRad?: number }).thetaDiamagneticRad ?? 0) * L;
  const { m0, dMdB, dMdT } = magnetizationDerivatives(at);
  const perM = m0 !== 0 ? (thetaRad - thetaDia) / m0 : 0;
  const dThetaDTRadPerK = perM * dMdT;
  const dThetaDBRadPerT = perM * dMdB + thetaDia / fieldT;
  const tol = maxAngleErrorRad(request.isolationTargetDb);
  let temperatureWindowK: Window | null = null;
  let fieldWindowT: Window | null = null;
  if (lengthM !== null) {
    // Temperatures from just above the Curie–Weiss point (or 0.1 K) to 1000 K; fields of the same
    // sign as B0 out to 10× |B0| (the magnet, not the model, limits the field).
    const tLow = Math.max(params.curieWeissK, 0) + 0.1;
    temperatureWindowK = windowAround(
      (t) => rotationRad(params, wavelengthNm, t, fieldT, lengthM),
      temperatureK,
      tol,
      Math.min(tLow, temperatureK),
      Math.max(1000, temperatureK),
    );
    const sign = Math.sign(fieldT);
    const w = windowAround(
      (b) => rotationRad(params, wavelengthNm, temperatureK, sign * b, lengthM),
      Math.abs(fieldT),
      tol,
      Math.abs(fieldT) * 1e-3,
      Math.abs(fieldT) * 10,
    );
    fieldWindowT = sign > 0 ? w : { low: -w.high, high: -w.low, lowOpen: w.highOpen, highOpen: w.lowOpen };
  }
  return {
    verdetRadPerTm: verdet,
    magneticVerdetRadPerTm: point.thetaMagneticRad / fieldT,
    electricVerdetRadPerTm: point.thetaElectricRad / fieldT,
    magneticShare: point.magneticShare,
    length45M,
    targetAngleRad,
    lengthM,
    dThetaDTRadPerK,
    dThetaDBRadPerT,
    maxAngleErrorRad: tol,
    isolationTargetDb: request.isolationTargetDb,
    temperatureWindowK,
    fieldWindowT,
    magneticScale: params.magneticScale,
  };
}
