import { db } from "@/db/client";
import { deleteParameterSet, getParameterSet, updateParameterSet } from "@/db/queries/parameter-sets";
import { readJson } from "@/lib/api/body";
import { notFound } from "@/lib/contracts/errors";
import { apiRoute, json, noContent } from "@/lib/api/route";
import { updateParameterSetSchema } from "@/lib/contracts/parameter-sets";
import { authorize, requireCaller } from "@/lib/auth/access";

type Params = { id: string };

/** GET /api/parameter-sets/{id} (viewer) → { item } */
export const GET = apiRoute<Params>(async (request, { params }) => {
  const { id } = await params;
  const caller = await requireCaller(request);
  const access = await authorize(caller, { kind: "parameter_set", id }, "viewer");
  const item = await getParameterSet(db, { access });
  if (!item) throw notFound("No such parameter set.");
  return json({ item });
});

/**
 * PATCH /api/parameter-sets/{id} { version, name?, description?, tags?, params? } (editor) → { item }
 * with version+1; a body that changes nothing answers the item unchanged and adds no version.
 */
export const PATCH = apiRoute<Params>(async (request, { params }) => {
  const { id } = await params;
  const caller = await requireCaller(request);
  const access = await authorize(caller, { kind: "parameter_set", id }, "editor");
  const input = await readJson(request, updateParameterSetSchema);
  return json({ item: await updateParameterSet(db, { access, input }) });
});

/** DELETE /api/parameter-sets/{id} (editor) → 204 */
export const DELETE = apiRoute<Params>(async (request, { params }) => {
  const { id } = await params;
  const caller = await requireCaller(request);
  const access = await authorize(caller, { kind: "parameter_set", id }, "editor");
  if (!(await deleteParameterSet(db, { access }))) throw notFound("No such parameter set.");
  return noContent();
});
