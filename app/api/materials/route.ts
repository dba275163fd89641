import { apiRoute, json } from "@/lib/api/route";
import { requireCaller } from "@/lib/auth/access";
import { materialExport } from "@/lib/materials/cli";
import { MATERIALS, MATERIAL_LIBRARY_VERSION } from "@/lib/materials/library";

/** GET /api/materials (any signed-in caller; the library is site-wide and read-only) → { libraryVersion, items } */
export const GET = apiRoute(async (request) => {
  await requireCaller(request);
  return json({ libraryVersion: MATERIAL_LIBRARY_VERSION, items: MATERIALS.map(materialExport) });
});
