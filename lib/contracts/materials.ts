import { z } from "zod";
import { setNameSchema } from "./parameter-sets";

/*
 * The material library's API contract: copying a library material into a lab as a new parameter
 * set (POST /api/materials/{id}/parameter-sets), and the provenance its first version carries.
 */

export const copyMaterialSchema = z.object({
  labId: z.uuid({ error: "Choose a lab." }),
  /** The new set's name; absent = the material's name. */
  name: setNameSchema.optional(),
});
export type CopyMaterialInput = z.infer<typeof copyMaterialSchema>;

/** Stored with version 1 of a set copied from the library (parameter_set_versions.provenance). */
export interface MaterialProvenance {
  kind: "material";
  materialId: string;
  materialName: string;
  libraryVersion: string;
}

const materialProvenanceSchema = z.object({
  kind: z.literal("material"),
  materialId: z.string(),
  materialName: z.string(),
  libraryVersion: z.string(),
});

/** Reads a stored provenance back; anything else (null, a fit) is not a library copy. */
export function asMaterialProvenance(value: unknown): MaterialProvenance | null {
  const parsed = materialProvenanceSchema.safeParse(value);
  return parsed.success ? parsed.data : null;
}

/** "from material X, library version Y", as the history and the workbench say it. */
export function describeMaterialProvenance(p: MaterialProvenance): string {
  return `from material ${p.materialName}, library version ${p.libraryVersion}`;
}
