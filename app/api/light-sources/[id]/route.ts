import { db } from "@/db/client";
import { deleteLightSource, getLightSource, updateLightSource } from "@/db/queries/light-sources";
import { readJson } from "@/lib/api/body";
import { notFound } from "@/lib/contracts/errors";
import { apiRoute, json, noContent } from "@/lib/api/route";
import { authorize, requireCaller } from "@/lib/auth/access";
import { updateLightSourceSchema } from "@/lib/contracts/light-sources";

/** GET /api/light-sources/{id} (viewer) → { item } */
export const GET = apiRoute<{ id: string }>(async (request, { params }) => {
  const { id } = await params;
  const caller = await requireCaller(request);
  const access = await authorize(caller, { kind: "light_source", id }, "viewer");
  const item = await getLightSource(db, { access });
  if (!item) throw notFound("No such light source.");
  return json({ item });
});

/** PATCH /api/light-sources/{id} { any of name, wavelengthNm, tunableMinNm, tunableMaxNm, powerW } (editor) → { item } */
export const PATCH = apiRoute<{ id: string }>(async (request, { params }) => {
  const { id } = await params;
  const caller = await requireCaller(request);
  const access = await authorize(caller, { kind: "light_source", id }, "editor");
  const patch = await readJson(request, updateLightSourceSchema);
  return json({ item: await updateLightSource(db, { access, patch }) });
});

/** DELETE /api/light-sources/{id} (editor) → 204 */
export const DELETE = apiRoute<{ id: string }>(async (request, { params }) => {
  const { id } = await params;
  const caller = await requireCaller(request);
  const access = await authorize(caller, { kind: "light_source", id }, "editor");
  await deleteLightSource(db, { access });
  return noContent();
});
