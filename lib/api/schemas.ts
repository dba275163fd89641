import { z } from "zod";
import { modelParamsSchema } from "@/lib/physics/schema";
import { jsonProblem, safeString } from "./text";

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
/** The workbench's own view state is a few levels deep; anything far deeper is not one. */
export const VIEW_STATE_MAX_DEPTH = 16;

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

// Required like PATCH's: a restore without the version the client saw would be a blind write.
export const restoreVersionSchema = z.object({ version: versionSchema });

export const viewStateSchema = z.object({
  viewState: z
    .record(z.string(), z.unknown(), { error: "viewState must be a JSON object." })
    .nullable()
    .superRefine((value, ctx) => {
      const problem = value === null ? null : jsonProblem(value, VIEW_STATE_MAX_DEPTH);
      if (problem) ctx.addIssue({ code: "custom", message: `viewState: ${problem}`, abort: true });
    })
    // Bytes of UTF-8, not UTF-16 code units: the limit is a storage size.
    .refine((value) => value === null || new TextEncoder().encode(JSON.stringify(value)).byteLength <= VIEW_STATE_MAX_BYTES, {
      message: `viewState must be at most ${VIEW_STATE_MAX_BYTES / 1024} KiB of JSON.`,
    }),
});

export const listParameterSetsQuery = z.object({
  labId: z.string().optional(),
  q: safeString().trim().max(200, "At most 200 characters.").optional(),
  tag: safeString().trim().max(TAG_MAX, `At most ${TAG_MAX} characters.`).optional(),
});

export const labRoleSchema = z.enum(["owner", "editor", "viewer"], { error: 'Role must be "owner", "editor" or "viewer".' });

export const emailSchema = safeString({ error: "Enter an e-mail address." })
  .trim()
  .toLowerCase()
  .max(320, "That e-mail address is too long.")
  .pipe(z.email({ error: "Enter a valid e-mail address." }));

export const createInvitationSchema = z.object({ email: emailSchema, role: labRoleSchema });

export const changeMemberSchema = z.object({ role: labRoleSchema });

export const createTokenSchema = z.object({
  name: safeString({ error: "Name the token." }).trim().min(1, "Name the token.").max(80, "At most 80 characters."),
});

/*
 * Paging: every list takes `limit` (default 50, at most 200) and an opaque `cursor` from the
 * previous page's `nextCursor`. Keyset paging, so a page costs the same however deep it is.
 */
export const PAGE_DEFAULT = 50;
export const PAGE_MAX = 200;

export const pageQuerySchema = z.object({
  limit: z.coerce
    .number({ error: "limit must be a whole number." })
    .int("limit must be a whole number.")
    .min(1, "limit must be at least 1.")
    .max(PAGE_MAX, `limit must be at most ${PAGE_MAX}.`)
    .default(PAGE_DEFAULT),
  cursor: safeString().max(200, "That cursor is not valid.").optional(),
});
export type PageQuery = z.infer<typeof pageQuerySchema>;

export const createShareLinkSchema = z.object({}).strict();

export const auditQuerySchema = pageQuerySchema.extend({
  labId: z.uuid({ error: "Choose a lab." }),
  setId: z.uuid({ error: "Not a parameter set id." }).optional(),
  actorId: z.uuid({ error: "Not a person's id." }).optional(),
  kind: z.enum(["parameter_set", "member", "invitation", "share_link"], { error: "Unknown kind." }).optional(),
  from: z.iso.date({ error: "Use a date like 2026-01-31." }).optional(),
  to: z.iso.date({ error: "Use a date like 2026-01-31." }).optional(),
});
