import { listParameterSetVersions } from "@/db/queries/parameter-sets";
import { notFound } from "@/lib/contracts/errors";
import { readPage } from "@/lib/api/paging";
import { requireParameterSetRole } from "@/lib/api/parameter-set-access";
import { apiRoute, json } from "@/lib/api/route";
import { requireCaller } from "@/lib/auth/access";

/** GET /api/parameter-sets/{id}/versions?limit=&cursor= (viewer) → { items, nextCursor } newest first */
export const GET = apiRoute<{ id: string }>(async (request, { params }) => {
  const { id } = await params;
  const caller = await requireCaller(request);
  const access = await requireParameterSetRole(caller, id, "viewer");
  const page = await listParameterSetVersions({ id, labId: access.labId, page: readPage(request) });
  if (!page) throw notFound("No such parameter set.");
  return json(page);
});
