import { deleteLightSource, findLightSourceLabId, getLightSource, updateLightSource } from "@/db/queries/light-sources";
import type { LabRole } from "@/lib/contracts/roles";
import { readJson } from "@/lib/api/body";
import { notFound } from "@/lib/contracts/errors";
import { isUuid } from "@/lib/contracts/validation";
import { apiRoute, json, noContent } from "@/lib/api/route";
import { type Caller } from "@/lib/contracts/access";
import { requireCaller, requireLabRole } from "@/lib/auth/access";
import { updateLightSourceSchema } from "@/lib/contracts/light-sources";

const NOT_FOUND = "No such light source.";

/** The source's lab, with the caller's role checked there (404 for unknown ids and non-members alike). */
async function requireSourceRole(caller: Caller, id: string, minRole: LabRole) {
  if (!isUuid(id)) throw notFound(NOT_FOUND);
  const labId = await findLightSourceLabId({ id });
  if (!labId) throw notFound(NOT_FOUND);
  return requireLabRole(caller, labId, minRole, { notFoundMessage: NOT_FOUND });
}

/** GET /api/light-sources/{id} (viewer) → { item } */
export const GET = apiRoute<{ id: string }>(async (request, { params }) => {
  const { id } = await params;
  const caller = await requireCaller(request);
  const access = await requireSourceRole(caller, id, "viewer");
  const item = await getLightSource({ id, labId: access.labId });
  if (!item) throw notFound(NOT_FOUND);
  return json({ item });
});

/** PATCH /api/light-sources/{id} { any of name, wavelengthNm, tunableMinNm, tunableMaxNm, powerW } (editor) → { item } */
export const PATCH = apiRoute<{ id: string }>(async (request, { params }) => {
  const { id } = await params;
  const caller = await requireCaller(request);
  const access = await requireSourceRole(caller, id, "editor");
  const patch = await readJson(request, updateLightSourceSchema);
  return json({ item: await updateLightSource({ caller, id, labId: access.labId, patch }) });
});

/** DELETE /api/light-sources/{id} (editor) → 204 */
export const DELETE = apiRoute<{ id: string }>(async (request, { params }) => {
  const { id } = await params;
  const caller = await requireCaller(request);
  const access = await requireSourceRole(caller, id, "editor");
  await deleteLightSource({ caller, id, labId: access.labId });
  return noContent();
});
