import { zodResolver } from "@hookform/resolvers/zod";
import type { FieldErrors, Resolver, UseFormReturn } from "react-hook-form";
import { z } from "zod";
import { FLAG_META, PARAM_META } from "@/lib/model/param-meta";
import { modelParamsSchema, type ModelParamKey } from "@/lib/physics/schema";
import type { ParameterSet } from "@/lib/query/types";
import { ApiError, describeError } from "@/lib/query/fetcher";
import type { SetSnapshot } from "@/lib/model/diff";

/** "a, b ,, a" → ["a", "b"]: the tag box takes a comma-separated list. */
export function parseTags(text: string): string[] {
  return [...new Set(text.split(",").map((t) => t.trim()).filter(Boolean))];
}

/*
 * The form's schema wraps the model's own modelParamsSchema unchanged, so the form enforces exactly
 * the ranges the API enforces.
 */
export const setFormSchema = z.object({
  labId: z.string().min(1, "Choose a lab"),
  name: z.string().trim().min(1, "Required").max(200, "At most 200 characters"),
  description: z.string().trim().max(4000, "At most 4000 characters"),
  tags: z
    .string()
    .transform(parseTags)
    .pipe(z.array(z.string().max(40, "Each tag at most 40 characters")).max(20, "At most 20 tags")),
  params: modelParamsSchema,
});

export type SetFormInput = z.input<typeof setFormSchema>;
export type SetFormOutput = z.output<typeof setFormSchema>;

const zod = zodResolver(setFormSchema);

/*
 * Number inputs are read with valueAsNumber, so an empty box arrives as NaN and the schema would
 * say "must be a number"; for an empty box "Required" is the helpful message.
 */
export const setFormResolver: Resolver<SetFormInput, unknown, SetFormOutput> = async (values, context, options) => {
  const result = await zod(values, context, options);
  const empty = PARAM_META.filter((meta) => Number.isNaN(values.params?.[meta.key]));
  if (empty.length === 0) return result;
  const paramErrors: Record<string, { type: string; message: string }> = { ...(result.errors.params as object | undefined) };
  for (const meta of empty) paramErrors[meta.key] = { type: "required", message: "Required" };
  return { values: {}, errors: { ...result.errors, params: paramErrors } as FieldErrors<SetFormInput> };
};

export function toFormValues(set: Pick<ParameterSet, "labId" | "name" | "description" | "tags" | "params">): SetFormInput {
  return { labId: set.labId, name: set.name, description: set.description ?? "", tags: set.tags.join(", "), params: { ...set.params } };
}

/** The form's current content as a snapshot for the diff (unparsed, so half-filled values show). */
export function formSnapshot(values: SetFormInput): SetSnapshot {
  const params: SetSnapshot["params"] = {};
  for (const meta of PARAM_META) {
    const value = values.params?.[meta.key];
    if (typeof value === "number") params[meta.key] = value;
  }
  for (const meta of FLAG_META) params[meta.key] = values.params?.[meta.key] === true;
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
    if (PARAM_KEYS.has(bare)) field.push([`params.${bare as ModelParamKey}`, message]);
    else if (TOP_FIELDS.has(path)) field.push([path as FormFieldPath, message]);
    else other.push(`${path}: ${message}`);
  }
  return { field, other };
}

/**
 * A failed create or save: the server's per-field messages go to their fields (the first one gets
 * the focus); the returned text, for the form's alert, holds the rest.
 */
export function showServerError(form: UseFormReturn<SetFormInput, unknown, SetFormOutput>, error: unknown): string {
  if (!(error instanceof ApiError && error.fields)) return describeError(error);
  const { field, other } = mapServerFields(error.fields);
  field.forEach(([path, message], i) => form.setError(path, { type: "server", message }, { shouldFocus: i === 0 }));
  return other.length > 0 ? `${error.message} ${other.join("; ")}` : error.message;
}
