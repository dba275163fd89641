import { zodResolver } from "@hookform/resolvers/zod";
import type { FieldErrors, Resolver, UseFormReturn } from "react-hook-form";
import { z } from "zod";
import { FLAG_META, PARAM_META } from "@/lib/model/param-meta";
import { modelParamsSchema, type ModelParamKey } from "@/lib/physics/schema";
import { descriptionSchema, setNameSchema, tagsSchema, type ParameterSet } from "@/lib/contracts/parameter-sets";
import { RequestError, describeError } from "@/lib/query/fetcher";
import type { SetSnapshot } from "@/lib/model/diff";

/** "a, b ,, a" → ["a", "b"]: the tag box takes a comma-separated list. */
export function parseTags(text: string): string[] {
  return [
    ...new Set(
      text
        .split(",")
        .map((t) => t.trim())
        .filter(Boolean),
    ),
  ];
}

/*
 * The form's schema is made of the API's own field schemas (lib/contracts/parameter-sets.ts) and the model's
 * modelParamsSchema, unchanged, so the form enforces exactly the limits the API enforces; only the
 * tag box's text is split into a list first.
 */
export const setFormSchema = z.object({
  labId: z.string().min(1, "Choose a lab"),
  name: setNameSchema,
  description: descriptionSchema,
  tags: z.string().transform(parseTags).pipe(tagsSchema),
  params: modelParamsSchema,
});

export type SetFormInput = z.input<typeof setFormSchema>;
export type SetFormOutput = z.output<typeof setFormSchema>;

const zod = zodResolver(setFormSchema);

/**
 * What a number box holds in the form: the number, NaN for an empty box, or the text itself when
 * it is not a number (see ParamInput), so the message can tell "Required" from "Not a number".
 */
export type ParamBoxValue = number | string;

export const REQUIRED_MESSAGE = "Required";
export const NOT_A_NUMBER_MESSAGE = "Not a number";

/** The first message in a nested error (a list's per-item errors are reported on the list). */
function firstMessage(error: unknown): string | undefined {
  if (!error || typeof error !== "object") return undefined;
  const message = (error as { message?: unknown }).message;
  if (typeof message === "string") return message;
  for (const value of Object.values(error)) {
    const nested = firstMessage(value);
    if (nested) return nested;
  }
  return undefined;
}

/*
 * Two adjustments to zod's errors: an empty number box says "Required" and unreadable text says
 * "Not a number" (the model schema would say "must be a number" for both), and a per-tag error
 * ("Each tag at most 40 characters.") is shown on the tag box, which has no per-tag fields.
 */
export const setFormResolver: Resolver<SetFormInput, unknown, SetFormOutput> = async (values, context, options) => {
  const result = await zod(values, context, options);
  const boxes = (values.params ?? {}) as Partial<Record<ModelParamKey, ParamBoxValue>>;
  const empty = PARAM_META.filter((meta) => typeof boxes[meta.key] === "number" && Number.isNaN(boxes[meta.key]));
  const unreadable = PARAM_META.filter((meta) => typeof boxes[meta.key] === "string");
  const tagsError = result.errors.tags;
  const tagsNeedMessage = tagsError !== undefined && typeof tagsError.message !== "string";
  if (empty.length === 0 && unreadable.length === 0 && !tagsNeedMessage) return result;
  const errors: Record<string, unknown> = { ...result.errors };
  if (tagsNeedMessage) errors.tags = { type: "too_big", message: firstMessage(tagsError) ?? "Check the tags." };
  if (empty.length > 0 || unreadable.length > 0) {
    const paramErrors: Record<string, { type: string; message: string }> = { ...(result.errors.params as object | undefined) };
    for (const meta of empty) paramErrors[meta.key] = { type: "required", message: REQUIRED_MESSAGE };
    for (const meta of unreadable) paramErrors[meta.key] = { type: "nan", message: NOT_A_NUMBER_MESSAGE };
    errors.params = paramErrors;
  }
  return { values: {}, errors: errors as FieldErrors<SetFormInput> };
};

export function toFormValues(set: Pick<ParameterSet, "labId" | "name" | "description" | "tags" | "params">): SetFormInput {
  // A switch never stored is off: give its checkbox an explicit false, so that resetting the form
  // to a saved version leaves nothing dirty.
  const params: SetFormInput["params"] = { ...set.params };
  for (const meta of FLAG_META) params[meta.key] = set.params[meta.key] === true;
  return { labId: set.labId, name: set.name, description: set.description ?? "", tags: set.tags.join(", "), params };
}

/** The form's current content as a snapshot for the diff (unparsed, so half-filled values show). */
export function formSnapshot(values: SetFormInput): SetSnapshot {
  const params: SetSnapshot["params"] = {};
  for (const meta of PARAM_META) {
    const value = values.params?.[meta.key];
    if (typeof value === "number") params[meta.key] = value;
  }
  for (const meta of FLAG_META) params[meta.key] = values.params?.[meta.key] === true;
  // The refinements have no boxes in the form: they ride along unchanged, and the diff must see them.
  const carried = values.params as SetSnapshot["params"] | undefined;
  if (carried?.diamagneticAnomaly !== undefined) params.diamagneticAnomaly = carried.diamagneticAnomaly;
  if (carried?.diamagneticDispersion !== undefined) params.diamagneticDispersion = carried.diamagneticDispersion;
  if (carried?.absorptionTable !== undefined) params.absorptionTable = carried.absorptionTable;
  return { name: values.name ?? "", description: values.description ?? "", tags: parseTags(values.tags ?? ""), params };
}

const PARAM_KEYS = new Set<string>([...PARAM_META, ...FLAG_META].map((m) => m.key));
const TOP_FIELDS = new Set(["labId", "name", "description", "tags"]);

export type FormFieldPath = "labId" | "name" | "description" | "tags" | `params.${ModelParamKey}`;

/**
 * Maps the API's `fields` (keys like "name", "params.temperatureK" or bare "temperatureK") onto form
 * paths; what does not match a field is returned for a general message.
 */
export function mapServerFields(fields: Record<string, string>): { field: [FormFieldPath, string][]; other: string[] } {
  const field: [FormFieldPath, string][] = [];
  const other: string[] = [];
  for (const [path, message] of Object.entries(fields)) {
    const bare = path.startsWith("params.") ? path.slice("params.".length) : path;
    const top = path.split(".")[0] ?? path;
    if (PARAM_KEYS.has(bare)) field.push([`params.${bare as ModelParamKey}`, message]);
    else if (TOP_FIELDS.has(path)) field.push([path as FormFieldPath, message]);
    // "tags.3": the form has one box for all tags.
    else if (top === "tags") field.push(["tags", message]);
    else other.push(`${path}: ${message}`);
  }
  return { field, other };
}

/**
 * A failed create or save: the server's per-field messages go to their fields (the first one gets
 * the focus); the returned text, for the form's alert, holds the rest.
 */
export function showServerError(form: UseFormReturn<SetFormInput, unknown, SetFormOutput>, error: unknown): string {
  if (!(error instanceof RequestError && error.fields)) return describeError(error);
  const { field, other } = mapServerFields(error.fields);
  for (const [i, [path, message]] of field.entries()) form.setError(path, { type: "server", message }, { shouldFocus: i === 0 });
  return other.length > 0 ? `${error.message} ${other.join("; ")}` : error.message;
}
