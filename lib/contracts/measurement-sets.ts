import { z } from "zod";
import { columnMappingSchema, fileDefaultsSchema } from "@/lib/measurements/parse";
import type { UserRef } from "./common";
import type { LabRole } from "./roles";
import { nameSchema, safeString, searchTermSchema, textSchema } from "./validation";

/*
 * Measurement sets: request schemas and answer shapes, shared by the upload form and the route.
 * The upload is multipart: the file under "file", the text fields below beside it, and "mapping"
 * and "defaults" as JSON text.
 */

export const MEASUREMENT_NAME_MAX = 120;
export const SAMPLE_MAX = 200;

export const uploadMeasurementMetaSchema = z.object({
  labId: z.uuid({ error: "Choose a lab." }),
  name: nameSchema({ max: MEASUREMENT_NAME_MAX }),
  sample: textSchema({ max: SAMPLE_MAX }).default(""),
  mapping: columnMappingSchema,
  defaults: fileDefaultsSchema.default({}),
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
  /** The caller's role in the set's lab (site admins: owner). */
  role: LabRole;
}
