/*
 * Spin trace at one wavelength: the lab-frame LLG under the "+" circular drive sampled over ramp,
 * settle and lock-in, plus χ± from both drives and the Polder reference (physics-model.md §4.5, §7).
 */
import { MU0_N_PER_A2, VACUUM_IMPEDANCE_OHM, angularFrequencyFromNm, gyromagneticRatio } from "./constants";
import { rootDecaying } from "./complex";
import { deltaMzFromCone, linearDrive, lockIn, planWindow } from "./llg";
import { staticMagnetization } from "./magnetization";
import { permittivity, polderSusceptibilities } from "./optics";
import { type SpinTraceRequest, formatIssues, spinTraceRequestSchema } from "./schema";
import { SpectrumInputError } from "./spectrum";
import type { SpinTraceResult } from "./types";

const SAMPLES_PER_PERIOD = 64;
/** At most this many samples are spent on a long settle phase, so the trace stays small. */
const MAX_SETTLE_SAMPLES = 3200;

export function computeSpinTrace(input: SpinTraceRequest): SpinTraceResult {
  const parsed = spinTraceRequestSchema.safeParse(input);
  if (!parsed.success) throw new SpectrumInputError(formatIssues(parsed.error));
  const p = parsed.data;
  const m0 = staticMagnetization(p);
  const sign: 1 | -1 = m0 < 0 ? -1 : 1;
  const gamma = gyromagneticRatio(p.landeG);
  const omega = angularFrequencyFromNm(p.wavelengthNm);
  const omega0 = gamma * p.fieldT;
  const omegaM = gamma * MU0_N_PER_A2 * m0;
  const w0 = omega0 / omega;
  const alpha = p.gilbertDamping;

  // Drive amplitude: from the intensity (§4.5, h0 = √(n I / Z0)) or the linear-regime drive (§7).
  const n = rootDecaying(permittivity(p, p.wavelengthNm, omega)).re;
  const h0 = Math.sqrt((n * p.intensityWPerM2) / VACUUM_IMPEDANCE_OHM);
  const h = p.intensityWPerM2 > 0 ? (gamma * MU0_N_PER_A2 * h0) / omega : linearDrive(w0, alpha);
  const plan = planWindow(w0, alpha, p.periods);

  const t: number[] = [];
  const ux: number[] = [];
  const uy: number[] = [];
  const uz: number[] = [];
  const sink = (time: number, x: number, y: number, z: number) => {
    const periods = time / (2 * Math.PI);
    const last = t[t.length - 1];
    if (last !== undefined && periods <= last + 1e-9) return;
    t.push(periods);
    ux.push(x);
    uy.push(y);
    uz.push(z);
  };
  const plus = lockIn({
    w0,
    alpha,
    h,
    drive: 1,
    sign,
    plan,
    trace: { samplesPerPeriod: SAMPLES_PER_PERIOD, maxSettleSamples: MAX_SETTLE_SAMPLES, sink },
  });
  const minus = lockIn({ w0, alpha, h, drive: -1, sign, plan });

  const factor = (p.magneticScale * Math.abs(omegaM)) / omega / h;
  const analytic = polderSusceptibilities(omega0, omegaM * p.magneticScale, alpha, sign, omega);
  const withLight = p.intensityWPerM2 > 0;
  return {
    timePeriods: Float64Array.from(t),
    ux: Float64Array.from(ux),
    uy: Float64Array.from(uy),
    uz: Float64Array.from(uz),
    chiPlus: { re: factor * plus.cRe, im: factor * plus.cIm },
    chiMinus: { re: factor * minus.cRe, im: factor * minus.cIm },
    chiPlusAnalytic: analytic.plus,
    chiMinusAnalytic: analytic.minus,
    deltaMzPlusAPerM: withLight ? deltaMzFromCone(m0, Math.hypot(plus.cRe, plus.cIm)) : 0,
    deltaMzMinusAPerM: withLight ? deltaMzFromCone(m0, Math.hypot(minus.cRe, minus.cIm)) : 0,
  };
}
