import { z } from "zod";
import { columnMappingSchema, fileDefaultsSchema } from "@/lib/measurements/parse";

/*
 * Request schemas of the measurement-set API. Pure zod, shared by the upload form and the route.
 * The upload is multipart: the file under "file", the text fields below beside it, and "mapping"
 * and "defaults" as JSON text.
 */

export const MEASUREMENT_NAME_MAX = 120;
export const SAMPLE_MAX = 200;

export const uploadMeasurementMetaSchema = z.object({
  labId: z.uuid({ error: "Choose a lab." }),
  name: z
    .string({ error: "Enter a name." })
    .trim()
    .min(1, "Enter a name.")
    .max(MEASUREMENT_NAME_MAX, `At most ${MEASUREMENT_NAME_MAX} characters.`),
  sample: z.string({ error: "Must be text." }).trim().max(SAMPLE_MAX, `At most ${SAMPLE_MAX} characters.`).default(""),
  mapping: columnMappingSchema,
  defaults: fileDefaultsSchema.default({}),
});
export type UploadMeasurementMeta = z.infer<typeof uploadMeasurementMetaSchema>;

export const listMeasurementSetsQuery = z.object({
  labId: z.string().optional(),
  q: z.string().trim().max(200, "At most 200 characters.").optional(),
});
