import { db } from "@/db/client";
import { createLightSource, listLightSources } from "@/db/queries/light-sources";
import { readJson } from "@/lib/api/body";
import { validationError } from "@/lib/contracts/errors";
import { apiRoute, json } from "@/lib/api/route";
import { authorizeLab, requireCaller } from "@/lib/auth/access";
import { createLightSourceSchema, listLightSourcesQuery } from "@/lib/contracts/light-sources";

/** GET /api/light-sources?labId= (viewer) → { items: LightSource[] } */
export const GET = apiRoute(async (request) => {
  const caller = await requireCaller(request);
  const parsed = listLightSourcesQuery.safeParse({ labId: new URL(request.url).searchParams.get("labId") ?? undefined });
  if (!parsed.success) throw validationError(parsed.error);
  const access = await authorizeLab(caller, parsed.data.labId, "viewer");
  return json({ items: await listLightSources(db, { access }) });
});

/** POST /api/light-sources { labId, name, wavelengthNm, tunableMinNm?, tunableMaxNm?, powerW? } (editor) → 201 { item } */
export const POST = apiRoute(async (request) => {
  const caller = await requireCaller(request);
  const input = await readJson(request, createLightSourceSchema);
  const access = await authorizeLab(caller, input.labId, "editor");
  return json({ item: await createLightSource(db, { access, input }) }, 201);
});
