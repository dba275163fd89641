import type { z } from "zod";
import { zodIssueFields, zodIssueLines } from "@/lib/contracts/validation";
import { numericalRangeIssues } from "@/lib/physics/numerical-range";
import { modelParamsSchema, spectrumRequestSchema, type ModelParamKey, type ModelParams, type SpectrumRequest } from "@/lib/physics/schema";
import { FLAG_META, PARAM_META } from "@/lib/model/param-meta";
import { formatNumberInput, parseDecimalOrNull } from "@/lib/model/number-text";
import { rangeSchema, type WavelengthRange } from "./view-state";
import { wavelengthGrid } from "./units";

/*
 * From what the user typed to a request the worker may see. The model schema in lib/physics is the
 * one validator; this only turns text into numbers and issues into per-field messages, so an
 * out-of-range value is flagged at its field and never sent to the worker.
 */

/** What the user typed, per parameter; a switch (FLAG_META) is held as "true" or "false". */
export type ParamDrafts = Record<ModelParamKey, string>;
export type FieldErrors<K extends string> = Partial<Record<K, string>>;

/** The schema's message for each field that has none yet (the first issue per field wins); flat schemas only. */
function addFieldErrors<K extends string>(errors: FieldErrors<K>, issues: readonly z.core.$ZodIssue[]): void {
  for (const [field, message] of Object.entries(zodIssueFields(issues))) if (field !== "body") errors[field as K] ??= message;
}

export function draftsFromParams(params: ModelParams): ParamDrafts {
  const out = {} as ParamDrafts;
  for (const m of PARAM_META) out[m.key] = formatNumberInput(params[m.key]);
  for (const f of FLAG_META) out[f.key] = params[f.key] === true ? "true" : "false";
  return out;
}

/** Accepts "1.27e28", " 293.15 ", "−8" (typographic minus) and a decimal comma ("1,5"); see parseDecimal. */
export function parseNumber(text: string): number | null {
  return parseDecimalOrNull(text);
}

export function validateParams(drafts: ParamDrafts): { params: ModelParams | null; errors: FieldErrors<ModelParamKey> } {
  const errors: FieldErrors<ModelParamKey> = {};
  const candidate: Record<string, number | boolean> = {};
  for (const f of FLAG_META) candidate[f.key] = drafts[f.key] === "true";
  for (const m of PARAM_META) {
    const v = parseNumber(drafts[m.key] ?? "");
    if (v === null) errors[m.key] = "must be a number";
    else candidate[m.key] = v;
  }
  const parsed = modelParamsSchema.safeParse(candidate);
  if (!parsed.success) addFieldErrors(errors, parsed.error.issues);
  return Object.keys(errors).length > 0 || !parsed.success ? { params: null, errors } : { params: parsed.data, errors };
}

export interface RangeDrafts {
  fromNm: string;
  toNm: string;
  points: string;
  spacing: "log" | "linear";
}

export function draftsFromRange(range: WavelengthRange): RangeDrafts {
  return { fromNm: String(range.fromNm), toNm: String(range.toNm), points: String(range.points), spacing: range.spacing };
}

export function validateRange(drafts: RangeDrafts): { range: WavelengthRange | null; errors: FieldErrors<"fromNm" | "toNm" | "points"> } {
  const errors: FieldErrors<"fromNm" | "toNm" | "points"> = {};
  const from = parseNumber(drafts.fromNm);
  const to = parseNumber(drafts.toNm);
  const points = parseNumber(drafts.points);
  if (from === null) errors.fromNm = "must be a number";
  if (to === null) errors.toNm = "must be a number";
  if (points === null) errors.points = "must be a number";
  if (from === null || to === null || points === null) return { range: null, errors };
  const parsed = rangeSchema.safeParse({ fromNm: from, toNm: to, points, spacing: drafts.spacing });
  if (!parsed.success) {
    addFieldErrors(errors, parsed.error.issues);
    return { range: null, errors };
  }
  return { range: parsed.data, errors };
}

/**
 * The full spectrum request, checked by the shared request schema (wavelengths above the
 * Sellmeier pole, etc.). Wavelength problems are reported against the range's start field.
 */
export function buildRequest(
  params: ModelParams,
  range: WavelengthRange,
  method: "analytic" | "llg",
): { request: SpectrumRequest | null; rangeError: string | null } {
  const wavelengthsNm = wavelengthGrid(range.fromNm, range.toNm, range.points, range.spacing);
  const parsed = spectrumRequestSchema.safeParse({ ...params, wavelengthsNm, method });
  if (parsed.success) return { request: parsed.data, rangeError: null };
  const issue = parsed.error.issues[0];
  return { request: null, rangeError: issue ? issue.message : "invalid wavelength range" };
}

/** Marker wavelengths that a request with these parameters can compute (above the Sellmeier pole, …). */
export function computableMarkers(params: ModelParams, markersNm: readonly number[]): number[] {
  return markersNm.filter(
    (nm) =>
      Number.isFinite(nm) &&
      nm > 0 &&
      !(params.sellmeierB > 0 && nm <= params.sellmeierWavelengthNm) &&
      !(params.oscillatorDampingRadPerS === 0 && nm === params.oscillatorWavelengthNm),
  );
}

/**
 * A spectrum request checked by the shared schema, and for the numerical method by its range,
 * before it is sent, for the panels that build their own requests (maps, comparison, ΔMz curve):
 * anything out of range becomes an error on the page and never reaches a worker.
 */
export function checkedSpectrumRequest(input: z.input<typeof spectrumRequestSchema>): SpectrumRequest {
  const parsed = spectrumRequestSchema.safeParse(input);
  if (!parsed.success) throw new Error(zodIssueLines(parsed.error.issues)[0] ?? "invalid spectrum request");
  const outside = numericalRangeIssues(parsed.data);
  if (outside.length > 0) throw new Error(outside[0]);
  return parsed.data;
}

/** True when two parameter sets differ in any model parameter (key order and extra keys ignored). */
export function paramsDiffer(a: ModelParams, b: ModelParams): boolean {
  return PARAM_META.some((m) => a[m.key] !== b[m.key]);
}
