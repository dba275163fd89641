import { db } from "@/db/client";
import { listParameterSetVersions } from "@/db/queries/parameter-sets";
import { notFound } from "@/lib/contracts/errors";
import { readPage } from "@/lib/api/paging";
import { apiRoute, json } from "@/lib/api/route";
import { authorize, requireCaller } from "@/lib/auth/access";

/** GET /api/parameter-sets/{id}/versions?limit=&cursor= (viewer) → { items, nextCursor } newest first */
export const GET = apiRoute<{ id: string }>(async (request, { params }) => {
  const { id } = await params;
  const caller = await requireCaller(request);
  const access = await authorize(caller, { kind: "parameter_set", id }, "viewer");
  const page = await listParameterSetVersions(db, { access, page: readPage(request) });
  if (!page) throw notFound("No such parameter set.");
  return json(page);
});
