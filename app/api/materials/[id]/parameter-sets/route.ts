import { db } from "@/db/client";
import { createParameterSet } from "@/db/queries/parameter-sets";
import { readJson } from "@/lib/api/body";
import { apiRoute, json } from "@/lib/api/route";
import { authorizeLab, requireCaller } from "@/lib/auth/access";
import { notFound } from "@/lib/contracts/errors";
import { copyMaterialSchema } from "@/lib/contracts/materials";
import { materialCopy } from "@/lib/materials/copy";
import { materialById } from "@/lib/materials/library";

type Params = { id: string };

/**
 * POST /api/materials/{id}/parameter-sets { labId, name? } (editor of that lab) → 201 { item }: a new
 * set with the material's values, its version 1 carrying "from material X, library version Y".
 */
export const POST = apiRoute<Params>(async (request, { params }) => {
  const { id } = await params;
  const caller = await requireCaller(request);
  const input = await readJson(request, copyMaterialSchema);
  const material = materialById(id);
  if (!material) throw notFound("No such material in the library.");
  const access = await authorizeLab(caller, input.labId, "editor");
  const copy = materialCopy(material, input.name);
  const item = await createParameterSet(db, {
    access,
    input: { labId: input.labId, name: copy.name, description: copy.description, tags: copy.tags, params: copy.params },
    provenance: { ...copy.provenance },
  });
  return json({ item }, 201);
});
