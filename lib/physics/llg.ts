/*
 * Numerical Landau–Lifshitz–Gilbert response at optical frequencies (physics-model.md §4.1, §7).
 *
 * Each wavelength and each circular drive is a small ODE problem in scaled units: time in 1/ω
 * (drive period 2π), fields in ω/(γ μ0). With W = w0 ẑ + h e(t) (cos t, ±sin t, 0), w0 = ω0/ω,
 *   du/dt = −[u × W + α u × (u × W)/|u|] / (1 + α²),   u(0) = (0, 0, s),
 * the explicit (Landau–Lifshitz) form of the Gilbert equation. The transverse response is
 * demodulated at the drive frequency by lock-in integrals carried as extra ODE states, so the
 * integrator's error control covers them: I = ∫ (u_x ± i u_y) e^{−it} dt over whole periods,
 * C± = I / (2π N_win), and χ± = magneticScale (|ωM|/ω) C± / h.
 *
 * Integrator: odex (E. Hairer and G. Wanner's ODEX, Gragg–Bulirsch–Stoer extrapolation; Hairer,
 * Nørsett and Wanner, "Solving Ordinary Differential Equations I", §II.9).
 */
import { Solver } from "odex";

/** Ramp, settle and lock-in plan for one wavelength (§7). */
export interface LockInPlan {
  rampPeriods: number;
  /** Drive held at full amplitude before the lock-in, in scaled time (whole periods). */
  settleTime: number;
  lockInPeriods: number;
  /** False when the free-precession transient could not be given time to decay (see planWindow). */
  settled: boolean;
}

/** Longest settle we are willing to integrate, in drive periods; beyond it the transient is left in and flagged. */
export const MAX_SETTLE_PERIODS = 4000;

/**
 * Window rule of §7: the ramp excites free precession at w0, of which a whole-period lock-in picks
 * up about |w0| × A(ramp). 2 ramp periods where |w0| ≤ 1e-3, 8 where |w0| ≤ 0.05; beyond, the
 * transient must decay: hold the drive for 25 (1 + α²)/(α |w0|) (a factor e^−25). When that is
 * unaffordable (α → 0, or more than MAX_SETTLE_PERIODS periods) a 20-period ramp is used instead
 * and the plan is marked unsettled.
 */
export function planWindow(w0: number, alpha: number, lockInPeriods = 1): LockInPlan {
  const aw = Math.abs(w0);
  if (aw <= 1e-3) return { rampPeriods: 2, settleTime: 0, lockInPeriods, settled: true };
  if (aw <= 0.05) return { rampPeriods: 8, settleTime: 0, lockInPeriods, settled: true };
  const settle = alpha > 0 ? (25 * (1 + alpha * alpha)) / (alpha * aw) : Infinity;
  const settlePeriods = Math.ceil(settle / (2 * Math.PI));
  if (!(settlePeriods <= MAX_SETTLE_PERIODS)) return { rampPeriods: 20, settleTime: 0, lockInPeriods, settled: false };
  return { rampPeriods: 8, settleTime: settlePeriods * 2 * Math.PI, lockInPeriods, settled: true };
}

/**
 * C∞ switch-on e = ψ(x)/(ψ(x) + ψ(1 − x)), ψ(x) = exp(−1/x) (§7), written as 1/(1 + exp(1/x − 1/(1−x)))
 * so one exp suffices. A ramp that is only C^k would leave a transient that a short lock-in sees.
 */
export function smoothRamp(x: number): number {
  if (x <= 0) return 0;
  if (x >= 1) return 1;
  return 1 / (1 + Math.exp(1 / x - 1 / (1 - x)));
}

export interface LockInOptions {
  /** ω0/ω, signed. */
  w0: number;
  alpha: number;
  /** Drive amplitude in units of ω/(γ μ0). */
  h: number;
  /** +1: h ∝ (cos t, +sin t), the "+" mode; −1: (cos t, −sin t). */
  drive: 1 | -1;
  /** sign(M0): the initial state is u = (0, 0, s). */
  sign: 1 | -1;
  plan?: LockInPlan;
  relativeTolerance?: number;
  /** Called at evenly spaced scaled times (samplesPerPeriod per period) with the state; for traces. */
  trace?: { samplesPerPeriod: number; maxSettleSamples?: number; sink: (t: number, ux: number, uy: number, uz: number) => void };
}

export interface LockInResult {
  /** Complex cone amplitude C: u_x ± i u_y = C e^{it} in the steady state. */
  cRe: number;
  cIm: number;
  /** Window mean of u_z − s. */
  meanUzMinusS: number;
  /** Largest | |u| − 1 | seen at the ends of the phases. */
  normError: number;
  steps: number;
  evaluations: number;
  plan: LockInPlan;
}

export class LlgIntegrationError extends Error {}

const RAMP_STATES = 3;
const LOCKIN_STATES = 6;

/** What the phases (ramp, settle, lock-in) of one lock-in add up. */
interface PhaseTally {
  steps: number;
  evaluations: number;
  normError: number;
}

/** The odex solver of one phase; both lock-ins use the same settings. */
function phaseSolver(n: number, rtol: number, atol: readonly number[], initialStepSize: number): Solver {
  const solver = new Solver(n);
  solver.relativeTolerance = rtol;
  solver.absoluteTolerance = atol.slice(0, n);
  solver.maxSteps = 1_000_000;
  solver.initialStepSize = initialStepSize;
  // Half a drive period at most. Measured for 2 + 1 periods at rtol 1e-6: about 320 derivative
  // evaluations per drive with odex's default step-number sequence (2, 4, 6, …), which beat the
  // other four sequences; π/2 cost ~30 % more, longer caps gave no gain.
  solver.maxStepSize = Math.PI;
  return solver;
}

/** Checks a phase's outcome, adds its counts and the |u| drift at its end, returns its end state. */
function finishPhase(res: { outcome: number; nStep: number; nEval: number; y: number[] }, tally: PhaseTally): number[] {
  if (res.outcome !== 0) throw new LlgIntegrationError(`LLG integration did not finish (odex outcome ${res.outcome})`);
  tally.steps += res.nStep;
  tally.evaluations += res.nEval;
  const y = res.y;
  tally.normError = Math.max(tally.normError, Math.abs(Math.hypot(y[0]!, y[1]!, y[2]!) - 1));
  return y;
}

/**
 * Integrates one drive (ramp, optional settle, lock-in) and returns the cone amplitude.
 * Step control: odex with the default (2, 4, 6, …) step-number sequence; the absolute tolerance of
 * the transverse components and lock-in states is scaled to the expected cone h/|w0 ∓ 1 + iα| so
 * the relative tolerance applies to the small quantities we need, not to |u| = 1.
 */
export function lockIn(o: LockInOptions): LockInResult {
  const { w0, alpha, h, drive, sign } = o;
  const plan = o.plan ?? planWindow(w0, alpha);
  const rtol = o.relativeTolerance ?? 1e-6;
  const k = 1 / (1 + alpha * alpha);
  const twoPi = 2 * Math.PI;
  const rampT = plan.rampPeriods * twoPi;
  const invRampT = 1 / rampT;
  const lockStart = rampT + plan.settleTime;
  const lockEnd = lockStart + plan.lockInPeriods * twoPi;

  // Expected cone from the linear response; the resonant denominator is w0·s − drive in these units.
  const coneEstimate = Math.min(1, Math.abs(h) / Math.hypot(Math.abs(w0) - drive * sign, alpha));
  const transverseTol = Math.max(coneEstimate, 1e-300) * rtol;

  const out = [0, 0, 0, 0, 0, 0];
  const ds = drive;
  const f = (t: number, y: number[]): number[] => {
    const ux = y[0]!;
    const uy = y[1]!;
    const uz = y[2]!;
    const env = t < rampT ? smoothRamp(t * invRampT) : 1;
    const c = Math.cos(t);
    const sn = Math.sin(t);
    const he = h * env;
    const wx = he * c;
    const wy = ds * he * sn;
    const ax = uy * w0 - uz * wy;
    const ay = uz * wx - ux * w0;
    const az = ux * wy - uy * wx;
    const bx = uy * az - uz * ay;
    const by = uz * ax - ux * az;
    const bz = ux * ay - uy * ax;
    const damp = alpha / Math.sqrt(ux * ux + uy * uy + uz * uz);
    out[0] = -(ax + damp * bx) * k;
    out[1] = -(ay + damp * by) * k;
    out[2] = -(az + damp * bz) * k;
    out[3] = ux * c + ds * uy * sn;
    out[4] = ds * uy * c - ux * sn;
    out[5] = uz - sign;
    return out;
  };

  const tally: PhaseTally = { steps: 0, evaluations: 0, normError: 0 };
  let lastStep = Math.PI / 4;
  const atol = [transverseTol, transverseTol, rtol, transverseTol, transverseTol, rtol];

  const run = (n: number, t0: number, t1: number, y0: number[]): number[] => {
    const solver = phaseSolver(n, rtol, atol, lastStep);
    let solOut: ((nr: number, xOld: number, x: number, y: number[], dense?: (c: number, x: number) => number) => void) | undefined;
    const tr = o.trace;
    if (tr) {
      solver.denseOutput = true;
      solver.denseComponents = [0, 1, 2];
      const inSettle = t0 >= rampT && t1 <= lockStart && plan.settleTime > 0;
      let dt = twoPi / tr.samplesPerPeriod;
      if (inSettle && tr.maxSettleSamples !== undefined) dt = Math.max(dt, (t1 - t0) / tr.maxSettleSamples);
      let next = t0;
      solOut = (nr, _xOld, x, y, dense) => {
        if (nr === 1) {
          tr.sink(x, y[0]!, y[1]!, y[2]!);
          next = t0 + dt;
          return;
        }
        while (next <= x + 1e-12 * Math.abs(x) && dense) {
          tr.sink(next, dense(0, next), dense(1, next), dense(2, next));
          next += dt;
        }
      };
    } else {
      solOut = (_nr, xOld, x) => {
        if (x > xOld) lastStep = x - xOld;
      };
    }
    return finishPhase(solver.solve(f, t0, y0, t1, solOut), tally);
  };

  let y = run(RAMP_STATES, 0, rampT, [0, 0, sign]);
  if (plan.settleTime > 0) y = run(RAMP_STATES, rampT, lockStart, y);
  y = run(LOCKIN_STATES, lockStart, lockEnd, [y[0]!, y[1]!, y[2]!, 0, 0, 0]);
  const window = lockEnd - lockStart;
  return {
    cRe: y[3]! / window,
    cIm: y[4]! / window,
    meanUzMinusS: y[5]! / window,
    normError: tally.normError,
    steps: tally.steps,
    evaluations: tally.evaluations,
    plan,
  };
}

const BOTH_LOCKIN_STATES = 8;

export interface BothDrivesResult {
  /** Cone amplitudes of the "+" and "−" circular parts (u_x ± i u_y = C± e^{it}). */
  plusRe: number;
  plusIm: number;
  minusRe: number;
  minusIm: number;
  normError: number;
  steps: number;
  evaluations: number;
}

/**
 * Both circular drives in one integration, for the linear regime only. The linear drive
 * 2h (cos t, 0) is the sum of the "+" drive h (cos t, sin t) and the "−" drive h (cos t, −sin t);
 * while the cone stays small the response is the sum of the two responses (physics-model.md §7: the
 * residual nonlinearity at the linear-regime drive is ~1e-8, far below the 1e-4 the numerical path
 * promises). The "−" part then sits in u_x − i u_y at e^{+it}, and the "+" part in u_x + i u_y at
 * e^{+it}; each lock-in over whole periods removes the other part (its term rotates at e^{−2it}).
 * One run of four extra lock-in states replaces two runs, so a wavelength costs about half the
 * derivative evaluations. Not for a strong drive (an intensity): there the modes do not superpose.
 */
export function lockInBothDrives(o: {
  w0: number;
  alpha: number;
  h: number;
  sign: 1 | -1;
  plan: LockInPlan;
  relativeTolerance?: number;
}): BothDrivesResult {
  const { w0, alpha, h, sign, plan } = o;
  const rtol = o.relativeTolerance ?? 1e-6;
  const k = 1 / (1 + alpha * alpha);
  const twoPi = 2 * Math.PI;
  const rampT = plan.rampPeriods * twoPi;
  const invRampT = 1 / rampT;
  const lockStart = rampT + plan.settleTime;
  const lockEnd = lockStart + plan.lockInPeriods * twoPi;
  const h2 = 2 * h;

  // Expected cones of the two parts (resonant denominators |w0| − s·drive, as in lockIn); the
  // transverse components carry both, so they get the tolerance of the smaller one.
  const conePlus = Math.max(Math.min(1, Math.abs(h) / Math.hypot(Math.abs(w0) - sign, alpha)), 1e-300);
  const coneMinus = Math.max(Math.min(1, Math.abs(h) / Math.hypot(Math.abs(w0) + sign, alpha)), 1e-300);
  const tolT = Math.min(conePlus, coneMinus) * rtol;
  const tolP = conePlus * rtol;
  const tolM = coneMinus * rtol;

  // Filled with doubles from the start so the array never changes its element kind in the hot loop.
  const out = [0.5, 0.5, 0.5, 0.5, 0.5, 0.5, 0.5, 0.5];
  const f = (t: number, y: number[]): number[] => {
    const ux = y[0]!;
    const uy = y[1]!;
    const uz = y[2]!;
    const env = t < rampT ? smoothRamp(t * invRampT) : 1;
    const c = Math.cos(t);
    const sn = Math.sin(t);
    const wx = h2 * env * c;
    const ax = uy * w0;
    const ay = uz * wx - ux * w0;
    const az = -uy * wx;
    const bx = uy * az - uz * ay;
    const by = uz * ax - ux * az;
    const bz = ux * ay - uy * ax;
    const damp = alpha / Math.sqrt(ux * ux + uy * uy + uz * uz);
    out[0] = -(ax + damp * bx) * k;
    out[1] = -(ay + damp * by) * k;
    out[2] = -(az + damp * bz) * k;
    // (u_x + i u_y) e^{−it} and (u_x − i u_y) e^{−it}
    out[3] = ux * c + uy * sn;
    out[4] = uy * c - ux * sn;
    out[5] = ux * c - uy * sn;
    out[6] = -uy * c - ux * sn;
    out[7] = uz - sign;
    return out;
  };

  const tally: PhaseTally = { steps: 0, evaluations: 0, normError: 0 };
  let lastStep = Math.PI / 4;
  const atol = [tolT, tolT, rtol, tolP, tolP, tolM, tolM, rtol];
  const run = (n: number, t0: number, t1: number, y0: number[]): number[] => {
    const solver = phaseSolver(n, rtol, atol, lastStep);
    const res = solver.solve(f, t0, y0, t1, (_nr, xOld, x) => {
      if (x > xOld) lastStep = x - xOld;
    });
    return finishPhase(res, tally);
  };

  let y = run(RAMP_STATES, 0, rampT, [0, 0, sign]);
  if (plan.settleTime > 0) y = run(RAMP_STATES, rampT, lockStart, y);
  y = run(BOTH_LOCKIN_STATES, lockStart, lockEnd, [y[0]!, y[1]!, y[2]!, 0, 0, 0, 0, 0]);
  const window = lockEnd - lockStart;
  return {
    plusRe: y[3]! / window,
    plusIm: y[4]! / window,
    minusRe: y[5]! / window,
    minusIm: y[6]! / window,
    normError: tally.normError,
    steps: tally.steps,
    evaluations: tally.evaluations,
  };
}

export interface LlgChiInput {
  omega: number;
  /** γ B0, signed. */
  omega0: number;
  /** γ μ0 M0, signed (magneticScale not applied). */
  omegaM: number;
  alpha: number;
  /** Drive in units of ω/(γ μ0); undefined → linear-regime drive 1e-4 max(| |w0| − 1 |, α) (§7). */
  hScaled?: number;
  relativeTolerance?: number;
}

export interface LlgChiResult {
  /** χ± at magneticScale = 1. */
  plusRe: number;
  plusIm: number;
  minusRe: number;
  minusIm: number;
  /** Cone amplitudes |C±| (for δMz). */
  conePlus: number;
  coneMinus: number;
  normError: number;
  steps: number;
  settled: boolean;
  hScaled: number;
}

/** Linear-regime drive of §7: keeps the cone ≲ 1e-4 rad; residual nonlinearity ~5e-9. */
export function linearDrive(w0: number, alpha: number): number {
  return 1e-4 * Math.max(Math.abs(Math.abs(w0) - 1), alpha);
}

/**
 * χ± from the lab-frame LLG at one optical frequency (both drives), magneticScale = 1. At the
 * linear-regime drive both drives are integrated together (lockInBothDrives); a given drive
 * (an intensity, possibly strong) integrates each drive on its own.
 */
export function llgSusceptibilities(input: LlgChiInput): LlgChiResult {
  const { omega, omega0, omegaM, alpha } = input;
  const sign: 1 | -1 = omegaM < 0 ? -1 : 1;
  const w0 = omega0 / omega;
  const h = input.hScaled ?? linearDrive(w0, alpha);
  const plan = planWindow(w0, alpha);
  const rtol = input.relativeTolerance;
  const factor = Math.abs(omegaM) / omega / h;
  if (input.hScaled === undefined) {
    const both = lockInBothDrives({ w0, alpha, h, sign, plan, relativeTolerance: rtol });
    return {
      plusRe: factor * both.plusRe,
      plusIm: factor * both.plusIm,
      minusRe: factor * both.minusRe,
      minusIm: factor * both.minusIm,
      conePlus: Math.hypot(both.plusRe, both.plusIm),
      coneMinus: Math.hypot(both.minusRe, both.minusIm),
      normError: both.normError,
      steps: both.steps,
      settled: plan.settled,
      hScaled: h,
    };
  }
  const plus = lockIn({ w0, alpha, h, drive: 1, sign, plan, relativeTolerance: rtol });
  const minus = lockIn({ w0, alpha, h, drive: -1, sign, plan, relativeTolerance: rtol });
  return {
    plusRe: factor * plus.cRe,
    plusIm: factor * plus.cIm,
    minusRe: factor * minus.cRe,
    minusIm: factor * minus.cIm,
    conePlus: Math.hypot(plus.cRe, plus.cIm),
    coneMinus: Math.hypot(minus.cRe, minus.cIm),
    normError: Math.max(plus.normError, minus.normError),
    steps: plus.steps + minus.steps,
    settled: plan.settled,
    hScaled: h,
  };
}

/**
 * Static change of Mz under a circular drive (§4.5): δMz = −s |M0| |C|² / (1 + √(1 − |C|²)),
 * the non-cancelling form of s |M0| (√(1 − |C|²) − 1). Null when |C| ≥ 1 (no steady cone).
 */
export function deltaMzFromCone(magnetizationAPerM: number, cone: number): number | null {
  if (!(cone < 1)) return null;
  const s = Math.sign(magnetizationAPerM);
  const c2 = cone * cone;
  return (-s * Math.abs(magnetizationAPerM) * c2) / (1 + Math.sqrt(1 - c2));
}

export interface FreeLlgOptions {
  w0: number;
  alpha: number;
  u0: [number, number, number];
  /** Scaled times at which to report u (ascending, ≥ 0). */
  sampleTimes: number[];
  relativeTolerance?: number;
}

/**
 * Free LLG (h = 0) from u0, sampled at the given scaled times with odex's dense output; used to check
 * precession and Gilbert decay (§4.1, §8). Returns the samples and the largest | |u| − 1 | seen.
 */
export function freeLlgTrajectory(o: FreeLlgOptions): { samples: [number, number, number][]; normError: number } {
  const { w0, alpha, sampleTimes } = o;
  const k = 1 / (1 + alpha * alpha);
  const out = [0, 0, 0];
  const f = (_t: number, y: number[]): number[] => {
    const ux = y[0]!;
    const uy = y[1]!;
    const uz = y[2]!;
    const ax = uy * w0;
    const ay = -ux * w0;
    const bx = -uz * ay;
    const by = uz * ax;
    const bz = ux * ay - uy * ax;
    const damp = alpha / Math.sqrt(ux * ux + uy * uy + uz * uz);
    out[0] = -(ax + damp * bx) * k;
    out[1] = -(ay + damp * by) * k;
    out[2] = -(damp * bz) * k;
    return out;
  };
  const rtol = o.relativeTolerance ?? 1e-10;
  const solver = new Solver(3);
  solver.relativeTolerance = rtol;
  solver.absoluteTolerance = rtol;
  solver.maxSteps = 1_000_000;
  solver.denseOutput = true;
  const samples: [number, number, number][] = [];
  let normError = 0;
  let next = 0;
  const tEnd = sampleTimes[sampleTimes.length - 1] ?? 0;
  const res = solver.solve(f, 0, [...o.u0], tEnd, (nr, _xOld, x, y, dense) => {
    normError = Math.max(normError, Math.abs(Math.hypot(y[0]!, y[1]!, y[2]!) - 1));
    while (next < sampleTimes.length && sampleTimes[next]! <= x) {
      const t = sampleTimes[next]!;
      samples.push(nr === 1 || !dense ? [y[0]!, y[1]!, y[2]!] : [dense(0, t), dense(1, t), dense(2, t)]);
      next++;
    }
  });
  if (res.outcome !== 0) throw new LlgIntegrationError(`LLG integration did not finish (odex outcome ${res.outcome})`);
  return { samples, normError };
}
