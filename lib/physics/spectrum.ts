/*
 * Faraday-rotation spectrum of a paramagnet, split into electric-dipole, magnetic-dipole and cross
 * parts (physics-model.md). Pure and synchronous at its core; an async chunked variant yields to
 * the event loop so a worker can receive cancel messages while it runs.
 */
import { type Complex, abs, add, cx, rootDecaying, sub } from "./complex";
import { MU0_N_PER_A2, VACUUM_IMPEDANCE_OHM, angularFrequencyFromNm, gyromagneticRatio } from "./constants";
import { deltaMzFromCone, llgSusceptibilities } from "./llg";
import { staticMagnetization } from "./magnetization";
import { absorptionCoefficientPerM, ellipticityAngleRad, transmissionOf } from "./absorption";
import {
  type DielectricParams,
  diamagneticGyration,
  diamagneticRotationRad,
  gyration,
  permittivity,
  polderSusceptibilities,
  rotations,
} from "./optics";
import { numericalRangeIssues } from "./numerical-range";
import { type SpectrumRequest, formatIssues, spectrumRequestSchema } from "./schema";
import type { ProgressCallback, SpectrumArrays, SpectrumPoint, SpectrumResult } from "./types";

import { passivityLimitNm } from "./verdet";

export { rotatorLength45M, passivityLimitNm, verdetToGyration, gyrationToVerdet } from "./verdet";
export type { VerdetReference, GyrationConversionParams, PassivityParams } from "./verdet";

/** Invalid input, with one "field: rule" line per problem (schema.ts formatIssues). */
export class SpectrumInputError extends Error {
  constructor(readonly issues: string[]) {
    super(issues.join("; "));
    this.name = "SpectrumInputError";
  }
}

/** A computed number came out non-finite: reported as an error, never as a silent NaN (§6.3). */
export class NonFiniteResultError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "NonFiniteResultError";
  }
}

/** Thrown by a job whose shouldCancel() returned true. */
export class SpectrumCancelledError extends Error {
  constructor() {
    super("Cancelled");
    this.name = "CancelledError";
  }
}

/** M0 in A/m for the parameters in force (§3.2, long rod); re-exported for the UI's one import. */
export { staticMagnetization };

/** Everything that is fixed for a run, derived once (§3–5). */
interface RunContext {
  request: SpectrumRequest;
  dielectric: DielectricParams;
  magnetizationAPerM: number;
  sign: number;
  omega0: number;
  omegaM: number;
  gyrationK: number;
}

function runContext(request: SpectrumRequest): RunContext {
  const m0 = staticMagnetization(request);
  const gamma = gyromagneticRatio(request.landeG);
  return {
    request,
    dielectric: request,
    magnetizationAPerM: m0,
    sign: Math.sign(m0),
    omega0: gamma * request.fieldT,
    omegaM: gamma * MU0_N_PER_A2 * m0,
    gyrationK: request.gyrationPerT * MU0_N_PER_A2 * m0,
  };
}

const nullable = (v: number | null) => (v === null ? Number.NaN : v);

function relDeviation(numRe: number, numIm: number, ref: Complex): number {
  const den = abs(ref);
  if (den === 0) return Math.hypot(numRe, numIm) === 0 ? 0 : Infinity;
  return Math.hypot(numRe - ref.re, numIm - ref.im) / den;
}

function listWavelengths(values: number[]): string {
  const shown = values.slice(0, 8).map((v) => String(v));
  return values.length > 8 ? `${shown.join(", ")}, … (${values.length} in all)` : shown.join(", ");
}

/** A spectrum computation that can be advanced a range of wavelengths at a time. */
export interface SpectrumJob {
  readonly length: number;
  computeRange(start: number, end: number): void;
  finish(): SpectrumArrays;
}

/** Validates the request (the one schema, §2) and prepares a job. Throws SpectrumInputError. */
export function createSpectrumJob(input: SpectrumRequest): SpectrumJob {
  const parsed = spectrumRequestSchema.safeParse(input);
  if (!parsed.success) throw new SpectrumInputError(formatIssues(parsed.error));
  const request = parsed.data;
  if (numericalRangeIssues(request).length > 0) throw new SpectrumInputError(numericalRangeIssues(request));
  const ctx = runContext(request);
  const n = request.wavelengthsNm.length;
  const withIntensity = request.intensityWPerM2 !== undefined;
  const isLlg = request.method === "llg";
  const out: SpectrumArrays = {
    magnetizationAPerM: ctx.magnetizationAPerM,
    wavelengthNm: Float64Array.from(request.wavelengthsNm),
    thetaRad: new Float64Array(n),
    thetaElectricRad: new Float64Array(n),
    thetaMagneticRad: new Float64Array(n),
    thetaCrossRad: new Float64Array(n),
    ellipticityRad: new Float64Array(n),
    magneticShare: new Float64Array(n),
    verdetRadPerTm: new Float64Array(n),
    absorptionPlusPerM: new Float64Array(n),
    absorptionMinusPerM: new Float64Array(n),
    transmissionPlus: new Float64Array(n),
    transmissionMinus: new Float64Array(n),
    ellipticityAngleRad: new Float64Array(n),
    warnings: [],
  };
  const withDiamagnetic = request.diamagneticTerm === true;
  if (withDiamagnetic) out.thetaDiamagneticRad = new Float64Array(n);
  if (withIntensity) {
    out.deltaMzPlusAPerM = new Float64Array(n);
    out.deltaMzMinusAPerM = new Float64Array(n);
  }
  if (!Number.isFinite(ctx.magnetizationAPerM)) throw new NonFiniteResultError("magnetizationAPerM: computed value is not finite");

  const flags = new Uint8Array(n);
  out.flags = flags;
  let maxDeviation = 0;
  const omegaE = angularFrequencyFromNm(request.oscillatorWavelengthNm);
  const { gilbertDamping: alpha, magneticScale, fieldT, lengthM } = request;
  const hasSpins = ctx.magnetizationAPerM !== 0;

  const computeOne = (i: number) => {
    const wavelengthNm = request.wavelengthsNm[i]!;
    const omega = angularFrequencyFromNm(wavelengthNm);
    const eps = permittivity(ctx.dielectric, wavelengthNm, omega);
    // §5.5: with the diamagnetic term on, G is G + G_dia everywhere; off, G is untouched (bit for bit).
    const gDia = withDiamagnetic ? diamagneticGyration(ctx.dielectric, fieldT, omega) : null;
    const gSpin = gyration(ctx.dielectric, ctx.gyrationK, omega);
    const g = gDia ? add(gSpin, gDia) : gSpin;
    const nIso = rootDecaying(eps).re;

    // Passivity (§5.3): Im ε± = −ΓE ω ωE (f ωE ± 2Kω)/|D|²; with ΓE = 0 both are exactly real.
    if (request.oscillatorDampingRadPerS > 0 && request.oscillatorStrength * omegaE < 2 * Math.abs(ctx.gyrationK) * omega) {
      flags[i] = flags[i]! | WAVELENGTH_FLAG_GAIN;
    }

    const polder1 = polderSusceptibilities(ctx.omega0, ctx.omegaM, alpha, ctx.sign, omega);
    let chiPlus1 = polder1.plus;
    let chiMinus1 = polder1.minus;
    let h0 = 0;
    if (withIntensity) h0 = Math.sqrt((nIso * request.intensityWPerM2!) / VACUUM_IMPEDANCE_OHM);

    let conePlus = 0;
    let coneMinus = 0;
    if (isLlg && hasSpins) {
      const gammaMu0 = gyromagneticRatio(request.landeG) * MU0_N_PER_A2;
      const hScaled = withIntensity && h0 > 0 ? (gammaMu0 * h0) / omega : undefined;
      const r = llgSusceptibilities({ omega, omega0: ctx.omega0, omegaM: ctx.omegaM, alpha, hScaled });
      if (!r.settled) flags[i] = flags[i]! | WAVELENGTH_FLAG_UNSETTLED;
      chiPlus1 = cx(r.plusRe, r.plusIm);
      chiMinus1 = cx(r.minusRe, r.minusIm);
      maxDeviation = Math.max(
        maxDeviation,
        relDeviation(r.plusRe, r.plusIm, polder1.plus),
        relDeviation(r.minusRe, r.minusIm, polder1.minus),
      );
      if (hScaled !== undefined) {
        conePlus = r.conePlus;
        coneMinus = r.coneMinus;
      }
    } else if (withIntensity && hasSpins) {
      // Small-signal cone (§4.5): C± = χ±(magneticScale = 1) h0 / |M0|.
      const m = Math.abs(ctx.magnetizationAPerM);
      conePlus = (abs(polder1.plus) * h0) / m;
      coneMinus = (abs(polder1.minus) * h0) / m;
    }

    // magneticScale multiplies ωM in the magnetic-dipole part only (§4.3).
    let chiPlus: Complex;
    let chiMinus: Complex;
    let chiDiff: Complex;
    let chiSum: Complex;
    if (isLlg) {
      chiPlus = cx(chiPlus1.re * magneticScale, chiPlus1.im * magneticScale);
      chiMinus = cx(chiMinus1.re * magneticScale, chiMinus1.im * magneticScale);
      chiDiff = sub(chiMinus, chiPlus);
      chiSum = cx(chiPlus.re + chiMinus.re, chiPlus.im + chiMinus.im);
    } else {
      const scaled = magneticScale === 1 ? polder1 : polderSusceptibilities(ctx.omega0, ctx.omegaM * magneticScale, alpha, ctx.sign, omega);
      chiPlus = scaled.plus;
      chiMinus = scaled.minus;
      chiDiff = scaled.diff;
      chiSum = scaled.sum;
    }

    const rot = rotations({ omega, lengthM, eps, gyration: g, chiPlus, chiMinus, chiDiff, chiSum });
    const denom = Math.abs(rot.thetaElectricRad) + Math.abs(rot.thetaMagneticRad);
    const share = denom === 0 ? null : Math.abs(rot.thetaMagneticRad) / denom;
    const verdet = fieldT === 0 ? null : rot.thetaRad / (fieldT * lengthM);
    const thetaDia = gDia ? diamagneticRotationRad(omega, lengthM, eps, gDia) : null;
    const alphaPlus = absorptionCoefficientPerM(omega, rot.nPlus.im);
    const alphaMinus = absorptionCoefficientPerM(omega, rot.nMinus.im);

    const values: [string, number | null][] = [
      ["thetaDiamagneticRad", thetaDia],
      ["absorptionPlusPerM", alphaPlus],
      ["absorptionMinusPerM", alphaMinus],
      ["thetaRad", rot.thetaRad],
      ["thetaElectricRad", rot.thetaElectricRad],
      ["thetaMagneticRad", rot.thetaMagneticRad],
      ["thetaCrossRad", rot.thetaCrossRad],
      ["ellipticityRad", rot.ellipticityRad],
      ["magneticShare", share],
      ["verdetRadPerTm", verdet],
    ];
    for (const [name, v] of values) {
      if (v !== null && !Number.isFinite(v)) {
        throw new NonFiniteResultError(
          `wavelengthsNm.${i}: computed ${name} is not finite at ${wavelengthNm} nm (the parameters reach a singularity there)`,
        );
      }
    }
    out.thetaRad[i] = rot.thetaRad;
    out.thetaElectricRad[i] = rot.thetaElectricRad;
    out.thetaMagneticRad[i] = rot.thetaMagneticRad;
    out.thetaCrossRad[i] = rot.thetaCrossRad;
    out.ellipticityRad[i] = rot.ellipticityRad;
    out.magneticShare[i] = nullable(share);
    out.verdetRadPerTm[i] = nullable(verdet);
    if (thetaDia !== null) out.thetaDiamagneticRad![i] = thetaDia;
    out.absorptionPlusPerM[i] = alphaPlus;
    out.absorptionMinusPerM[i] = alphaMinus;
    // Gain (α < 0, §5.3) can overflow exp: the transmission is then +∞, which the UI shows as gain.
    out.transmissionPlus[i] = transmissionOf(alphaPlus, lengthM);
    out.transmissionMinus[i] = transmissionOf(alphaMinus, lengthM);
    out.ellipticityAngleRad[i] = ellipticityAngleRad(rot.ellipticityRad);

    if (withIntensity) {
      let dPlus: number | null = 0;
      let dMinus: number | null = 0;
      if (hasSpins && h0 > 0) {
        dPlus = deltaMzFromCone(ctx.magnetizationAPerM, conePlus);
        dMinus = deltaMzFromCone(ctx.magnetizationAPerM, coneMinus);
        if (dPlus === null || dMinus === null) flags[i] = flags[i]! | WAVELENGTH_FLAG_CONE;
        if ((dPlus !== null && !Number.isFinite(dPlus)) || (dMinus !== null && !Number.isFinite(dMinus))) {
          throw new NonFiniteResultError(`wavelengthsNm.${i}: computed deltaMz is not finite at ${wavelengthNm} nm`);
        }
      }
      out.deltaMzPlusAPerM![i] = nullable(dPlus);
      out.deltaMzMinusAPerM![i] = nullable(dMinus);
    }
  };

  return {
    length: n,
    computeRange(start: number, end: number) {
      for (let i = start; i < end; i++) computeOne(i);
    },
    finish(): SpectrumArrays {
      if (isLlg) {
        if (!Number.isFinite(maxDeviation)) throw new NonFiniteResultError("maxRelDeviationFromAnalytic: computed value is not finite");
        out.maxRelDeviationFromAnalytic = maxDeviation;
      }
      out.warnings = spectrumWarnings(request, out);
      return out;
    },
  };
}

/** ε± has gain here (§5.3). */
export const WAVELENGTH_FLAG_GAIN = 1;
/** The precession cone reached |C| ≥ 1, δMz null (§4.5). */
export const WAVELENGTH_FLAG_CONE = 2;
/** The LLG transient could not be settled (§7). */
export const WAVELENGTH_FLAG_UNSETTLED = 4;

/**
 * Warning texts from the per-wavelength flags (§5.3, §4.5, §7). A pure function of the request and
 * the columns, so the pool can rebuild one set of warnings after merging chunks.
 */
export function spectrumWarnings(
  request: Pick<SpectrumRequest, "gyrationPerT" | "oscillatorStrength" | "oscillatorWavelengthNm" | "oscillatorDampingRadPerS">,
  arrays: Pick<SpectrumArrays, "wavelengthNm" | "flags" | "magnetizationAPerM">,
): string[] {
  const warnings: string[] = [];
  const flags = arrays.flags;
  if (!flags) return warnings;
  const pick = (bit: number) => {
    const list: number[] = [];
    for (let i = 0; i < flags.length; i++) if (flags[i]! & bit) list.push(arrays.wavelengthNm[i]!);
    return list;
  };
  const gain = pick(WAVELENGTH_FLAG_GAIN);
  if (gain.length > 0) {
    const limit = passivityLimitNm({ ...request, magnetizationAPerM: arrays.magnetizationAPerM });
    warnings.push(
      `passivity: ε± has gain (Im ε± > 0) where f·ωE < 2|κE μ0 M0|·ω, i.e. below ${formatNm(limit)} nm; affected wavelengths (nm): ${listWavelengths(gain)}`,
    );
  }
  const cone = pick(WAVELENGTH_FLAG_CONE);
  if (cone.length > 0) {
    warnings.push(`intensity: the precession cone reaches |C| ≥ 1, so δMz is undefined (null) at (nm): ${listWavelengths(cone)}`);
  }
  const unsettled = pick(WAVELENGTH_FLAG_UNSETTLED);
  if (unsettled.length > 0) {
    warnings.push(
      `llg: the free-precession transient cannot be given time to decay (|ω0/ω| > 0.05 with small damping) at (nm): ${listWavelengths(unsettled)}; the deviation from the analytic form may exceed 1e-4 there`,
    );
  }
  return warnings;
}

function formatNm(v: number): string {
  return Number.isFinite(v) ? String(Number(v.toPrecision(5))) : "∞";
}

export interface SpectrumOptions {
  onProgress?: ProgressCallback;
  shouldCancel?: () => boolean;
}

/** Wavelengths per progress/cancel check in the synchronous path. */
const SYNC_BLOCK = 8;

/** Column result, synchronously. Throws SpectrumInputError, NonFiniteResultError or SpectrumCancelledError. */
export function computeSpectrumArrays(request: SpectrumRequest, opts: SpectrumOptions = {}): SpectrumArrays {
  const job = createSpectrumJob(request);
  for (let start = 0; start < job.length; start += SYNC_BLOCK) {
    if (opts.shouldCancel?.()) throw new SpectrumCancelledError();
    const end = Math.min(job.length, start + SYNC_BLOCK);
    job.computeRange(start, end);
    opts.onProgress?.(end / job.length);
  }
  return job.finish();
}

export interface AsyncSpectrumOptions extends SpectrumOptions {
  /** Wall-clock budget per chunk before yielding to the event loop, ms (default 30). */
  chunkMs?: number;
  /** How to yield; default a zero-delay timeout, which lets queued messages (cancel) run. */
  yieldToEventLoop?: () => Promise<void>;
}

/**
 * Same result as computeSpectrumArrays, computed in chunks of about chunkMs with a yield between
 * chunks, so a worker's message handler (cancel) gets to run during a long numerical spectrum.
 */
export async function computeSpectrumArraysAsync(request: SpectrumRequest, opts: AsyncSpectrumOptions = {}): Promise<SpectrumArrays> {
  const job = createSpectrumJob(request);
  const chunkMs = opts.chunkMs ?? 30;
  const yieldNow = opts.yieldToEventLoop ?? (() => new Promise<void>((resolve) => setTimeout(resolve, 0)));
  let i = 0;
  while (i < job.length) {
    await yieldNow();
    if (opts.shouldCancel?.()) throw new SpectrumCancelledError();
    const t0 = Date.now();
    do {
      job.computeRange(i, i + 1);
      i++;
    } while (i < job.length && Date.now() - t0 < chunkMs);
    opts.onProgress?.(i / job.length);
  }
  return job.finish();
}

/** Rows from columns: NaN in the nullable columns becomes null. */
export function arraysToResult(a: SpectrumArrays): SpectrumResult {
  const points: SpectrumPoint[] = [];
  const orNull = (v: number) => (Number.isNaN(v) ? null : v);
  for (let i = 0; i < a.wavelengthNm.length; i++) {
    const p: SpectrumPoint = {
      wavelengthNm: a.wavelengthNm[i]!,
      thetaRad: a.thetaRad[i]!,
      thetaElectricRad: a.thetaElectricRad[i]!,
      thetaMagneticRad: a.thetaMagneticRad[i]!,
      thetaCrossRad: a.thetaCrossRad[i]!,
      ellipticityRad: a.ellipticityRad[i]!,
      magneticShare: orNull(a.magneticShare[i]!),
      verdetRadPerTm: orNull(a.verdetRadPerTm[i]!),
      absorptionPlusPerM: a.absorptionPlusPerM[i]!,
      absorptionMinusPerM: a.absorptionMinusPerM[i]!,
      transmissionPlus: a.transmissionPlus[i]!,
      transmissionMinus: a.transmissionMinus[i]!,
      ellipticityAngleRad: a.ellipticityAngleRad[i]!,
    };
    if (a.thetaDiamagneticRad) p.thetaDiamagneticRad = a.thetaDiamagneticRad[i]!;
    if (a.deltaMzPlusAPerM && a.deltaMzMinusAPerM) {
      p.deltaMzPlusAPerM = orNull(a.deltaMzPlusAPerM[i]!);
      p.deltaMzMinusAPerM = orNull(a.deltaMzMinusAPerM[i]!);
    }
    points.push(p);
  }
  const result: SpectrumResult = { magnetizationAPerM: a.magnetizationAPerM, points };
  if (a.maxRelDeviationFromAnalytic !== undefined) result.maxRelDeviationFromAnalytic = a.maxRelDeviationFromAnalytic;
  if (a.warnings.length > 0) result.warnings = [...a.warnings];
  return result;
}

/**
 * The spectrum of physics-model.md §6.3, synchronously (command line, instant analytic preview).
 * Throws SpectrumInputError for invalid input, NonFiniteResultError if a number would be non-finite,
 * SpectrumCancelledError when shouldCancel() turns true.
 */
export function computeSpectrum(request: SpectrumRequest, opts: SpectrumOptions = {}): SpectrumResult {
  return arraysToResult(computeSpectrumArrays(request, opts));
}

/** Parses unknown input with the one schema; returns the request or the "field: rule" lines. */
export function parseSpectrumRequest(input: unknown): { ok: true; request: SpectrumRequest } | { ok: false; issues: string[] } {
  const parsed = spectrumRequestSchema.safeParse(input);
  return parsed.success ? { ok: true, request: parsed.data } : { ok: false, issues: formatIssues(parsed.error) };
}

/** Index of refraction n = Re r(ε) of the isotropic background at one wavelength (§4.4, §5.4). */
export function backgroundIndex(params: DielectricParams, wavelengthNm: number): number {
  return rootDecaying(permittivity(params, wavelengthNm, angularFrequencyFromNm(wavelengthNm))).re;
}
