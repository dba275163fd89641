import {
  type Calibration,
  DEFAULT_FREE_KEYS,
  FREEABLE_KEYS,
  type FreeParam,
  type FreeableKey,
  type Prior,
  calibrationSchema,
} from "@/lib/analysis/definition";
import { MAX_FIT_STARTS } from "@/lib/fit/schema";
import type { ModelParams } from "@/lib/physics/schema";
import { fmt } from "./format";

/*
 * The fit panel's inputs as typed text, and their reading into the parts of a fit request (free
 * parameters with bounds, Gaussian priors, each measurement set's calibration, starts, the
 * wavelengths at which to profile the magnetic share). Each reader returns what it could read and
 * a message per field it could not, so the panel can flag the field and keep the rest.
 */

export interface ParamDraft {
  free: boolean;
  min: string;
  max: string;
  /** Empty: the prior is centred on the starting value. */
  priorMean: string;
  /** Empty: no prior. */
  priorSigma: string;
}

export interface CalibrationDraft {
  /** σ of the field × length scale, in per cent. */
  scalePercent: string;
  /** Relative error floor added in quadrature, in per cent. */
  floorPercent: string;
  temperatureSigmaK: string;
}

export const EMPTY_CALIBRATION: CalibrationDraft = { scalePercent: "", floorPercent: "", temperatureSigmaK: "" };

export function initialParamDrafts(): Record<FreeableKey, ParamDraft> {
  return Object.fromEntries(
    FREEABLE_KEYS.map((k) => [
      k,
      { free: DEFAULT_FREE_KEYS.includes(k), min: k === "magneticScale" ? "0" : "", max: "", priorMean: "", priorSigma: "" },
    ]),
  ) as Record<FreeableKey, ParamDraft>;
}

/** A number typed in a field: undefined when empty, null when not a number. */
export function readNumber(text: string): number | undefined | null {
  const t = text.trim();
  if (t === "") return undefined;
  const v = Number(t);
  return Number.isFinite(v) ? v : null;
}

export interface ParamReading {
  free: FreeParam[];
  priors: Prior[];
  errors: Partial<Record<FreeableKey, string>>;
}

/** Free parameters with their bounds and the priors (on free or held parameters) from the drafts, at the given start. */
export function readParamDrafts(drafts: Record<FreeableKey, ParamDraft>, start: Partial<ModelParams> | null): ParamReading {
  const free: FreeParam[] = [];
  const priors: Prior[] = [];
  const errors: Partial<Record<FreeableKey, string>> = {};
  for (const key of FREEABLE_KEYS) {
    const d = drafts[key];
    const at = start?.[key] as number | undefined;
    if (d.free) {
      const min = readNumber(d.min);
      const max = readNumber(d.max);
      if (min === null || max === null) errors[key] = "Bounds must be numbers (or empty for none).";
      else if (min !== undefined && max !== undefined && !(min < max)) errors[key] = "The lower bound must be below the upper bound.";
      else if (at !== undefined && ((min !== undefined && at < min) || (max !== undefined && at > max)))
        errors[key] = `The starting value ${fmt(at)} lies outside the bounds.`;
      free.push({ key, ...(typeof min === "number" ? { min } : {}), ...(typeof max === "number" ? { max } : {}) });
    }
    const sigma = readNumber(d.priorSigma);
    const mean = readNumber(d.priorMean);
    if (sigma === undefined) {
      if (mean !== undefined) errors[key] ??= "Give the prior a σ, or clear its mean.";
      continue;
    }
    if (sigma === null || sigma <= 0) errors[key] ??= "The prior σ must be a number above 0.";
    else if (mean === null) errors[key] ??= "The prior mean must be a number (or empty for the starting value).";
    else if (mean === undefined && at === undefined) errors[key] ??= "Give the prior a mean: there is no starting value.";
    else priors.push({ key, mean: mean ?? (at as number), sigma });
  }
  return { free, priors, errors };
}

/** One measurement set's calibration from its draft (per cent to fractions), or the message of the first field it could not read. */
export function readCalibration(draft: CalibrationDraft): { calibration: Calibration } | { error: string } {
  const scale = readNumber(draft.scalePercent);
  const floor = readNumber(draft.floorPercent);
  const temperature = readNumber(draft.temperatureSigmaK);
  if (scale === null || floor === null || temperature === null)
    return { error: "Calibration entries must be numbers (or empty for none)." };
  const parsed = calibrationSchema.safeParse({
    scaleSigma: (scale ?? 0) / 100,
    relativeFloor: (floor ?? 0) / 100,
    temperatureSigmaK: temperature ?? 0,
  });
  if (!parsed.success) {
    const issue = parsed.error.issues[0]!;
    const field = { scaleSigma: "Field × length σ", relativeFloor: "Error floor", temperatureSigmaK: "Temperature σ" }[
      String(issue.path[0]) as keyof Calibration
    ];
    // The schema's limits are fractions; the form speaks per cent.
    const percent = issue.path[0] === "scaleSigma" || issue.path[0] === "relativeFloor";
    return { error: `${field}: ${percent ? issue.message.replace(/([\d.]+)$/, (v) => `${Number(v) * 100} %`) : issue.message}` };
  }
  return { calibration: parsed.data };
}

/** The number of optimiser starts, 1 … MAX_FIT_STARTS. */
export function readStarts(text: string): { starts: number } | { error: string } {
  const v = readNumber(text);
  if (v === undefined) return { starts: 4 };
  if (v === null || !Number.isInteger(v) || v < 1 || v > MAX_FIT_STARTS)
    return { error: `Starts must be a whole number from 1 to ${MAX_FIT_STARTS}.` };
  return { starts: v };
}

/** At most this many extra wavelengths for share profiles (each costs a few dozen refits). */
export const MAX_SHARE_WAVELENGTHS = 8;

/** Wavelengths (nm) typed as a list separated by commas or spaces. */
export function readWavelengths(text: string): { wavelengthsNm: number[] } | { error: string } {
  const parts = text
    .split(/[\s,;]+/)
    .map((p) => p.trim())
    .filter((p) => p !== "");
  const values = parts.map(Number);
  const bad = parts.find((_, i) => !Number.isFinite(values[i]!) || values[i]! <= 0);
  if (bad !== undefined) return { error: `"${bad}" is not a wavelength in nm above 0.` };
  if (values.length > MAX_SHARE_WAVELENGTHS) return { error: `At most ${MAX_SHARE_WAVELENGTHS} wavelengths.` };
  return { wavelengthsNm: [...new Set(values)] };
}
