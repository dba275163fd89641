import { z } from "zod";
import { modelParamsSchema } from "@/lib/physics/schema";

/*
 * Request schemas of the parameter-set, lab and token APIs. Pure zod, so forms may use them as
 * resolvers too. Outer objects strip unknown keys (older clients keep working); the model
 * parameters themselves are strict.
 */

export const NAME_MAX = 120;
export const DESCRIPTION_MAX = 4000;
export const TAG_MAX = 40;
export const TAGS_MAX = 20;
export const VIEW_STATE_MAX_BYTES = 32 * 1024;

export const setNameSchema = z
  .string({ error: "Enter a name." })
  .trim()
  .min(1, "Enter a name.")
  .max(NAME_MAX, `At most ${NAME_MAX} characters.`);

export const descriptionSchema = z.string({ error: "Must be text." }).trim().max(DESCRIPTION_MAX, `At most ${DESCRIPTION_MAX} characters.`);

export const tagsSchema = z
  .array(z.string({ error: "Each tag must be text." }).trim().min(1, "Tags cannot be empty.").max(TAG_MAX, `Each tag at most ${TAG_MAX} characters.`), {
    error: "Tags must be a list of text.",
  })
  .max(TAGS_MAX, `At most ${TAGS_MAX} tags.`)
  .transform((tags) => [...new Set(tags)]);

const versionSchema = z
  .number({ error: "Send the version you edited (a whole number)." })
  .int("Must be a whole number.")
  .min(1, "Must be ≥ 1.");

export const createParameterSetSchema = z.object({
  labId: z.uuid({ error: "Choose a lab." }),
  name: setNameSchema,
  description: descriptionSchema.optional().default(""),
  tags: tagsSchema.optional().default([]),
  params: modelParamsSchema,
});
export type CreateParameterSetInput = z.infer<typeof createParameterSetSchema>;

export const updateParameterSetSchema = z.object({
  version: versionSchema,
  name: setNameSchema.optional(),
  description: descriptionSchema.optional(),
  tags: tagsSchema.optional(),
  params: modelParamsSchema.optional(),
});
export type UpdateParameterSetInput = z.infer<typeof updateParameterSetSchema>;

export const restoreVersionSchema = z.object({ version: versionSchema.optional() });

export const viewStateSchema = z.object({
  viewState: z
    .record(z.string(), z.unknown(), { error: "viewState must be a JSON object." })
    .nullable()
    // Bytes of UTF-8, not UTF-16 code units: the limit is a storage size.
    .refine((value) => value === null || new TextEncoder().encode(JSON.stringify(value)).byteLength <= VIEW_STATE_MAX_BYTES, {
      message: `viewState must be at most ${VIEW_STATE_MAX_BYTES / 1024} KiB of JSON.`,
    }),
});

export const listParameterSetsQuery = z.object({
  labId: z.string().optional(),
  q: z.string().trim().max(200, "At most 200 characters.").optional(),
  tag: z.string().trim().max(TAG_MAX, `At most ${TAG_MAX} characters.`).optional(),
});

export const labRoleSchema = z.enum(["owner", "editor", "viewer"], { error: 'Role must be "owner", "editor" or "viewer".' });

export const addMemberSchema = z.object({
  email: z
    .string({ error: "Enter an e-mail address." })
    .trim()
    .toLowerCase()
    .max(320, "That e-mail address is too long.")
    .pipe(z.email({ error: "Enter a valid e-mail address." })),
  role: labRoleSchema,
});

export const changeMemberSchema = z.object({ role: labRoleSchema });

export const createTokenSchema = z.object({
  name: z.string({ error: "Name the token." }).trim().min(1, "Name the token.").max(80, "At most 80 characters."),
});
