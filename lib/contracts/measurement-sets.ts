import { z } from "zod";
import { columnMappingSchema, fileDefaultsSchema, tableFormatSchema } from "@/lib/measurements/parse";
import type { EDITABLE_POINT_FIELDS, MeasuredPoint } from "@/lib/measurements/point";
import type { UserRef } from "./common";
import { setVersionSchema } from "./parameter-sets";
import type { LabRole } from "./roles";
import { finiteNumber, nameSchema, safeString, searchTermSchema, textSchema } from "./validation";

/*
 * Measurement sets: request schemas and answer shapes, shared by the upload form and the route.
 * The upload is multipart: the file under "file", the text fields below beside it, and "mapping",
 * "defaults", "format" and "signsFrom" as JSON text.
 */

/**
 * "These are magnitudes: take the model's sign." The parameter set (at the version the upload
 * checked against, its current one) whose model gives each value its sign
 * (lib/measurements/sign-check.ts takeModelSigns).
 */
export const signsFromSchema = z.strictObject({
  parameterSetId: z.uuid({ error: "Name the parameter set whose model gives the signs." }),
  version: setVersionSchema,
});
export type SignsFrom = z.infer<typeof signsFromSchema>;

/** Where a set's signs came from when not from its file: the model of one parameter set version. */
export interface SignSource {
  parameterSetId: string;
  /** The set's name at upload, kept so the note still reads after a rename or delete. */
  parameterSetName: string;
  version: number;
  /** Values whose sign the model changed. */
  changedCount: number;
}

export const signSourceSchema: z.ZodType<SignSource> = z.object({
  parameterSetId: z.string(),
  parameterSetName: z.string(),
  version: z.number().int(),
  changedCount: z.number().int(),
});

export const MEASUREMENT_NAME_MAX = 120;
export const SAMPLE_MAX = 200;

export const uploadMeasurementMetaSchema = z.object({
  labId: z.uuid({ error: "Choose a lab." }),
  name: nameSchema({ max: MEASUREMENT_NAME_MAX }),
  sample: textSchema({ max: SAMPLE_MAX }).default(""),
  mapping: columnMappingSchema,
  defaults: fileDefaultsSchema.default({}),
  /** How the file is read; detected when absent (lib/measurements/parse.ts readTable). */
  format: tableFormatSchema.default({ delimiter: "auto", decimal: "auto" }),
  /** Absent: the values are stored with the file's signs. */
  signsFrom: signsFromSchema.optional(),
});
export type UploadMeasurementMeta = z.infer<typeof uploadMeasurementMetaSchema>;

export const listMeasurementSetsQuery = z.object({
  // Storable text, not a uuid check: an id that names no lab answers 404 at the lookup, not 400 here.
  labId: safeString().optional(),
  q: searchTermSchema.optional(),
});

/** A measurement set as listed (GET /api/measurement-sets); the points come from …/{id}/points. */
export interface MeasurementSetSummary {
  id: string;
  labId: string;
  labName: string;
  name: string;
  sample: string;
  /** What the values are: a Verdet constant in rad/(T·m) or a rotation in rad. */
  quantity: "verdet" | "rotation";
  rowCount: number;
  wavelengthSpanNm: { min: number; max: number };
  /** Distinct values over the rows, ascending. */
  temperaturesK: number[];
  fieldsT: number[];
  lengthsM: number[];
  fileName: string;
  fileBytes: number;
  uploadedBy: UserRef;
  /** ISO 8601 */
  createdAt: string;
  /** 1 at import; each edit of the points makes the next (the original file never changes). */
  revision: number;
  /** Points left out of fits and overlays. */
  maskedCount: number;
  /** The file held magnitudes and the values took the model's sign at upload; null when the signs are the file's. */
  signSource: SignSource | null;
  /** The caller's role in the set's lab (site admins: owner). */
  role: LabRole;
}

export type EditablePointField = (typeof EDITABLE_POINT_FIELDS)[number];

/** A point as stored: the measured point, its place in the set, and what people said or did to it. */
export interface StoredPoint extends MeasuredPoint {
  /** 0-based position in the file's order; the point's id within the set. */
  ordinal: number;
  masked: boolean;
  maskReason: string | null;
  note: string;
  /** The imported values of the fields an edit changed; null while the point is as in the file. */
  original: Partial<Record<EditablePointField, number>> | null;
}

/** GET /api/measurement-sets/{id}/points */
export interface PointsResponse {
  revision: number;
  points: StoredPoint[];
}

export const NOTE_MAX = 500;
export const MASK_REASON_MAX = 200;

const pointValues = z.strictObject({
  wavelengthNm: finiteNumber("wavelength").gt(0, "must be > 0 nm").optional(),
  value: finiteNumber("value").optional(),
  sigma: finiteNumber("σ").gt(0, "must be > 0").optional(),
  temperatureK: finiteNumber("temperature").gt(0, "must be > 0 K").optional(),
  fieldT: finiteNumber("field").optional(),
  lengthM: finiteNumber("length").gt(0, "must be > 0 m").optional(),
}) satisfies z.ZodType<Partial<Record<EditablePointField, number>>>;

export const pointChangeSchema = z
  .strictObject({
    ordinal: z.number({ error: "Name the point (its ordinal)." }).int("Must be a whole number.").min(0, "Must be ≥ 0."),
    /** true masks the point (a reason is required), false unmasks it. */
    masked: z.boolean().optional(),
    maskReason: textSchema({ max: MASK_REASON_MAX }).optional(),
    note: textSchema({ max: NOTE_MAX }).optional(),
    /** New values in SI (the units of StoredPoint). */
    values: pointValues.optional(),
  })
  .superRefine((change, ctx) => {
    if (change.masked === true && !change.maskReason)
      ctx.addIssue({ code: "custom", path: ["maskReason"], message: "Say why the point is masked." });
    if (change.masked === undefined && change.note === undefined && (!change.values || Object.keys(change.values).length === 0))
      ctx.addIssue({ code: "custom", path: ["ordinal"], message: "The change changes nothing: mask, note or a value." });
  });
export type PointChange = z.infer<typeof pointChangeSchema>;

/** PATCH /api/measurement-sets/{id}/points: one new revision with these changes. */
export const editPointsSchema = z.strictObject({
  /** The revision the client edited; an older one answers 409 stale_version. */
  revision: z.number({ error: "Send the revision you edited (a whole number)." }).int("Must be a whole number.").min(1, "Must be ≥ 1."),
  changes: z.array(pointChangeSchema).min(1, "Send at least one change.").max(500, "At most 500 changes at once."),
});
export type EditPointsInput = z.infer<typeof editPointsSchema>;

export const pointHistoryQuery = z.object({
  limit: z.coerce.number({ error: "limit must be a whole number." }).int().min(1).max(500).default(200),
});

/** One point's change in a revision (GET …/points/history). */
export interface PointChangeEntry {
  revision: number;
  ordinal: number;
  line: number;
  changes: Record<string, { from: unknown; to: unknown }>;
  actor: UserRef | null;
  /** ISO 8601 */
  at: string;
}
