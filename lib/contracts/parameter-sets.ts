import { z } from "zod";
import { type ModelParams, modelParamsSchema } from "@/lib/physics/schema";
import type { UserRef } from "./common";
import type { LabRole } from "./roles";
import { INT4_MAX, safeString, searchTermSchema } from "./validation";

/*
 * Parameter sets: request schemas and answer shapes. Pure zod, so forms use the same schemas as
 * resolvers. Outer objects strip unknown keys (older clients keep working); the model parameters
 * themselves are strict.
 */

export const NAME_MAX = 120;
export const DESCRIPTION_MAX = 4000;
export const TAG_MAX = 40;
export const TAGS_MAX = 20;

export const setNameSchema = safeString({ error: "Enter a name." })
  .trim()
  .min(1, "Enter a name.")
  .max(NAME_MAX, `At most ${NAME_MAX} characters.`);

export const descriptionSchema = safeString({ error: "Must be text." })
  .trim()
  .max(DESCRIPTION_MAX, `At most ${DESCRIPTION_MAX} characters.`);

export const tagsSchema = z
  .array(
    safeString({ error: "Each tag must be text." })
      .trim()
      .min(1, "Tags cannot be empty.")
      .max(TAG_MAX, `Each tag at most ${TAG_MAX} characters.`),
    {
      error: "Tags must be a list of text.",
    },
  )
  .max(TAGS_MAX, `At most ${TAGS_MAX} tags.`)
  .transform((tags) => [...new Set(tags)]);

/** The version the client edited: a write against an older one is refused (stale_version). */
export const setVersionSchema = z
  .number({ error: "Send the version you edited (a whole number)." })
  .int("Must be a whole number.")
  .min(1, "Must be ≥ 1.")
  .max(INT4_MAX, `Must be at most ${INT4_MAX}.`);

export const createParameterSetSchema = z.object({
  labId: z.uuid({ error: "Choose a lab." }),
  name: setNameSchema,
  description: descriptionSchema.optional().default(""),
  tags: tagsSchema.optional().default([]),
  params: modelParamsSchema,
});
export type CreateParameterSetInput = z.infer<typeof createParameterSetSchema>;

/** A save's note: one line or a few, stored with the version. */
export const versionNoteSchema = safeString({ error: "The note must be text." }).trim().max(500, "At most 500 characters.");

export const updateParameterSetSchema = z.object({
  version: setVersionSchema,
  name: setNameSchema.optional(),
  description: descriptionSchema.optional(),
  tags: tagsSchema.optional(),
  params: modelParamsSchema.optional(),
  /** Why this save, in a few words; shown in the version history. */
  note: versionNoteSchema.optional(),
});
export type UpdateParameterSetInput = z.infer<typeof updateParameterSetSchema>;

// Required like PATCH's: a restore without the version the client saw would be a blind write.
export const restoreVersionSchema = z.object({ version: setVersionSchema });

export const listParameterSetsQuery = z.object({
  // Storable text, not a uuid check: an id that names no lab answers 404 at the lookup, not 400 here.
  labId: safeString().optional(),
  q: searchTermSchema.optional(),
  tag: safeString().trim().max(TAG_MAX, `At most ${TAG_MAX} characters.`).optional(),
});

export interface ParameterSetSummary {
  id: string;
  labId: string;
  labName: string;
  name: string;
  description: string;
  tags: string[];
  version: number;
  /** ISO 8601 */
  createdAt: string;
  /** ISO 8601 */
  updatedAt: string;
  createdBy: UserRef;
  updatedBy: UserRef;
  /** The caller's role in the set's lab (site admins: owner). */
  role: LabRole;
}

export interface ParameterSet extends ParameterSetSummary {
  params: ModelParams;
  viewState: Record<string, unknown> | null;
}

/** One immutable snapshot of a set (GET …/versions). */
export interface ParameterSetVersion {
  version: number;
  name: string;
  description: string;
  tags: string[];
  params: ModelParams;
  /** Where the version came from when not typed in (a fit: lib/fit/provenance.ts FitProvenance); null otherwise. */
  provenance: Record<string, unknown> | null;
  /** Why it was saved ("" when no note was given). */
  note: string;
  /** The version a restore copied into this one; null for every other save. */
  restoredFrom: number | null;
  createdAt: string;
  createdBy: UserRef;
}
