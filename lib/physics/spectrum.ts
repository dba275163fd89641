/*
 * Faraday-rotation spectrum of a paramagnet, split into electric-dipole, magnetic-dipole and cross
 * parts (physics-model.md). Pure and synchronous at its core; an async chunked variant yields to
 * the event loop so a worker can receive cancel messages while it runs. The errors are
 * spectrum-errors.ts, the per-wavelength flags and warnings spectrum-flags.ts, the conversions to
 * the reported quantities spectrum-units.ts.
 */
import { type Complex, abs, add, cx, rootDecaying, sub } from "./complex";
import { MU0_N_PER_A2, angularFrequencyFromNm, gyromagneticRatio } from "./constants";
import { deltaMzFromCone, llgSusceptibilities } from "./llg";
import { staticMagnetization } from "./magnetization";
import { absorptionCoefficientPerM, ellipticityAngleRad, tableAbsorptionPerM, transmissionOf, withMeasuredLoss } from "./absorption";
import {
  type DiamagneticOptions,
  type DielectricParams,
  diamagneticGyration,
  diamagneticRotationRad,
  gyration,
  permittivity,
  polderSusceptibilities,
  rotations,
} from "./optics";
import { type SpectrumRequest, formatIssues, spectrumRequestSchema } from "./schema";
import {
  SpectrumCancelledError,
  assertFiniteColumns,
  assertFiniteDeltaMz,
  assertFiniteFigure,
  validSpectrumRequest,
} from "./spectrum-errors";
import {
  WAVELENGTH_FLAG_CONE,
  WAVELENGTH_FLAG_GAIN,
  WAVELENGTH_FLAG_OUTSIDE_TABLE,
  WAVELENGTH_FLAG_UNSETTLED,
  hasGain,
  spectrumWarnings,
} from "./spectrum-flags";
import { driveFieldAPerM, magneticShare, scaledDrive, verdetRadPerTm } from "./spectrum-units";
import type { ProgressCallback, SpectrumArrays, SpectrumPoint, SpectrumResult } from "./types";

export { rotatorLength45M, passivityLimitNm, verdetToGyration, gyrationToVerdet } from "./verdet";
export type { VerdetReference, GyrationConversionParams, PassivityParams } from "./verdet";
export { NonFiniteResultError, SpectrumCancelledError, SpectrumInputError } from "./spectrum-errors";
export {
  WAVELENGTH_FLAG_CONE,
  WAVELENGTH_FLAG_GAIN,
  WAVELENGTH_FLAG_OUTSIDE_TABLE,
  WAVELENGTH_FLAG_UNSETTLED,
  spectrumWarnings,
} from "./spectrum-flags";

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
  /** ωE of the oscillator, rad/s. */
  omegaE: number;
  /** γ μ0, which turns the drive field into the LLG's scaled units (§7). */
  gammaMu0: number;
  withIntensity: boolean;
  withDiamagnetic: boolean;
  /** The diamagnetic term's refinements (§5.5); absent keys keep today's term bit for bit. */
  diamagneticOptions: DiamagneticOptions;
  isLlg: boolean;
  hasSpins: boolean;
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
    omegaE: angularFrequencyFromNm(request.oscillatorWavelengthNm),
    gammaMu0: gamma * MU0_N_PER_A2,
    withIntensity: request.intensityWPerM2 !== undefined,
    withDiamagnetic: request.diamagneticTerm === true,
    diamagneticOptions: { anomaly: request.diamagneticAnomaly, dispersion: request.diamagneticDispersion },
    isLlg: request.method === "llg",
    hasSpins: m0 !== 0,
  };
}

/** The columns a run fills, NaN-encoded where a value is null (arraysToResult decodes). */
type RunColumns = SpectrumArrays & { flags: Uint8Array };

/** Columns of the run's length; the optional ones only when the request asks for them. */
function allocateColumns(ctx: RunContext): RunColumns {
  const { request } = ctx;
  const n = request.wavelengthsNm.length;
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
  if (ctx.withDiamagnetic) out.thetaDiamagneticRad = new Float64Array(n);
  if (ctx.withIntensity) {
    out.deltaMzPlusAPerM = new Float64Array(n);
    out.deltaMzMinusAPerM = new Float64Array(n);
  }
  out.flags = new Uint8Array(n);
  return out as RunColumns;
}

const nullable = (v: number | null) => (v === null ? Number.NaN : v);

function relDeviation(numRe: number, numIm: number, ref: Complex): number {
  const den = abs(ref);
  if (den === 0) return Math.hypot(numRe, numIm) === 0 ? 0 : Infinity;
  return Math.hypot(numRe - ref.re, numIm - ref.im) / den;
}

/** A spectrum computation that can be advanced a range of wavelengths at a time. */
export interface SpectrumJob {
  readonly length: number;
  computeRange(start: number, end: number): void;
  finish(): SpectrumArrays;
}

/** Validates the request (the one schema, §2) and prepares a job. Throws SpectrumInputError. */
export function createSpectrumJob(input: SpectrumRequest): SpectrumJob {
  const request = validSpectrumRequest(input);
  const ctx = runContext(request);
  const out = allocateColumns(ctx);
  assertFiniteFigure("magnetizationAPerM", ctx.magnetizationAPerM);
  const deviation = { max: 0 };
  return {
    length: request.wavelengthsNm.length,
    computeRange(start: number, end: number) {
      for (let i = start; i < end; i++) computeWavelength(ctx, out, deviation, i);
    },
    finish(): SpectrumArrays {
      if (ctx.isLlg) {
        assertFiniteFigure("maxRelDeviationFromAnalytic", deviation.max);
        out.maxRelDeviationFromAnalytic = deviation.max;
      }
      out.warnings = spectrumWarnings(request, out);
      return out;
    },
  };
}

/** Fills the columns of wavelength i; flags it, and raises the largest LLG deviation, as it goes. */
function computeWavelength(ctx: RunContext, out: RunColumns, deviation: { max: number }, i: number): void {
  const { request } = ctx;
  const { fieldT, lengthM } = request;
  const wavelengthNm = request.wavelengthsNm[i]!;
  const omega = angularFrequencyFromNm(wavelengthNm);
  const eps = permittivity(ctx.dielectric, wavelengthNm, omega);
  // §5.5: with the diamagnetic term on, G is G + G_dia everywhere; off, G is untouched (bit for bit).
  const gDia = ctx.withDiamagnetic ? diamagneticGyration(ctx.dielectric, fieldT, omega, ctx.diamagneticOptions) : null;
  const gSpin = gyration(ctx.dielectric, ctx.gyrationK, omega);
  const g = gDia ? add(gSpin, gDia) : gSpin;
  const nIso = rootDecaying(eps).re;
  if (hasGain(request, ctx.omegaE, ctx.gyrationK, omega)) out.flags[i] = out.flags[i]! | WAVELENGTH_FLAG_GAIN;

  let h0 = 0;
  if (ctx.withIntensity) h0 = driveFieldAPerM(nIso, request.intensityWPerM2!);
  const chi = susceptibilities(ctx, out.flags, deviation, i, omega, h0);

  const rot = rotations({ omega, lengthM, eps, gyration: g, chiPlus: chi.plus, chiMinus: chi.minus, chiDiff: chi.diff, chiSum: chi.sum });
  const share = magneticShare(rot.thetaElectricRad, rot.thetaMagneticRad);
  const verdet = verdetRadPerTm(rot.thetaRad, fieldT, lengthM);
  const thetaDia = gDia ? diamagneticRotationRad(omega, lengthM, eps, gDia) : null;
  let alphaPlus = absorptionCoefficientPerM(omega, rot.nPlus.im);
  let alphaMinus = absorptionCoefficientPerM(omega, rot.nMinus.im);
  if (request.absorptionTable) {
    // A measured table sets the isotropic loss where it has data; outside it the oscillator's tail stays, flagged.
    const measured = tableAbsorptionPerM(request.absorptionTable, wavelengthNm);
    if (measured === null) out.flags[i] = out.flags[i]! | WAVELENGTH_FLAG_OUTSIDE_TABLE;
    else [alphaPlus, alphaMinus] = withMeasuredLoss(alphaPlus, alphaMinus, measured);
  }
  assertFiniteColumns(i, wavelengthNm, [
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
  ]);
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
  if (ctx.withIntensity) writeDeltaMz(ctx, out, i, h0, chi.conePlus, chi.coneMinus);
}

/** χ± of the magnetic-dipole part with magneticScale applied, and the cone amplitudes of both modes. */
interface Susceptibilities {
  plus: Complex;
  minus: Complex;
  diff: Complex;
  sum: Complex;
  conePlus: number;
  coneMinus: number;
}

/**
 * χ± at ω: Polder's closed form (analytic), or the lab-frame LLG at magneticScale = 1 scaled
 * afterwards (llg). Flags an unsettled LLG transient and raises the largest deviation from Polder.
 */
function susceptibilities(
  ctx: RunContext,
  flags: Uint8Array,
  deviation: { max: number },
  i: number,
  omega: number,
  h0: number,
): Susceptibilities {
  const { gilbertDamping: alpha, magneticScale } = ctx.request;
  const polder1 = polderSusceptibilities(ctx.omega0, ctx.omegaM, alpha, ctx.sign, omega);
  let chiPlus1 = polder1.plus;
  let chiMinus1 = polder1.minus;
  let conePlus = 0;
  let coneMinus = 0;
  if (ctx.isLlg && ctx.hasSpins) {
    const hScaled = ctx.withIntensity && h0 > 0 ? scaledDrive(ctx.gammaMu0, h0, omega) : undefined;
    const r = llgSusceptibilities({ omega, omega0: ctx.omega0, omegaM: ctx.omegaM, alpha, hScaled });
    if (!r.settled) flags[i] = flags[i]! | WAVELENGTH_FLAG_UNSETTLED;
    chiPlus1 = cx(r.plusRe, r.plusIm);
    chiMinus1 = cx(r.minusRe, r.minusIm);
    deviation.max = Math.max(
      deviation.max,
      relDeviation(r.plusRe, r.plusIm, polder1.plus),
      relDeviation(r.minusRe, r.minusIm, polder1.minus),
    );
    if (hScaled !== undefined) {
      conePlus = r.conePlus;
      coneMinus = r.coneMinus;
    }
  } else if (ctx.withIntensity && ctx.hasSpins) {
    // Small-signal cone (§4.5): C± = χ±(magneticScale = 1) h0 / |M0|.
    const m = Math.abs(ctx.magnetizationAPerM);
    conePlus = (abs(polder1.plus) * h0) / m;
    coneMinus = (abs(polder1.minus) * h0) / m;
  }

  // magneticScale multiplies ωM in the magnetic-dipole part only (§4.3).
  if (ctx.isLlg) {
    const plus = cx(chiPlus1.re * magneticScale, chiPlus1.im * magneticScale);
    const minus = cx(chiMinus1.re * magneticScale, chiMinus1.im * magneticScale);
    return { plus, minus, diff: sub(minus, plus), sum: cx(plus.re + minus.re, plus.im + minus.im), conePlus, coneMinus };
  }
  const scaled = magneticScale === 1 ? polder1 : polderSusceptibilities(ctx.omega0, ctx.omegaM * magneticScale, alpha, ctx.sign, omega);
  return { plus: scaled.plus, minus: scaled.minus, diff: scaled.diff, sum: scaled.sum, conePlus, coneMinus };
}

/** δMz± of wavelength i from the cone amplitudes (§4.5); flags and nulls a cone that reached |C| ≥ 1. */
function writeDeltaMz(ctx: RunContext, out: RunColumns, i: number, h0: number, conePlus: number, coneMinus: number): void {
  let dPlus: number | null = 0;
  let dMinus: number | null = 0;
  if (ctx.hasSpins && h0 > 0) {
    dPlus = deltaMzFromCone(ctx.magnetizationAPerM, conePlus);
    dMinus = deltaMzFromCone(ctx.magnetizationAPerM, coneMinus);
    if (dPlus === null || dMinus === null) out.flags[i] = out.flags[i]! | WAVELENGTH_FLAG_CONE;
    assertFiniteDeltaMz(i, ctx.request.wavelengthsNm[i]!, dPlus, dMinus);
  }
  out.deltaMzPlusAPerM![i] = nullable(dPlus);
  out.deltaMzMinusAPerM![i] = nullable(dMinus);
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
