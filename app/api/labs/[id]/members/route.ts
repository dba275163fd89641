import { db } from "@/db/client";
import { listMembers } from "@/db/queries/labs";
import { readPage } from "@/lib/api/paging";
import { apiRoute, json } from "@/lib/api/route";
import { authorizeLab, requireCaller } from "@/lib/auth/access";

type Params = { id: string };

/**
 * GET /api/labs/{id}/members?limit=&cursor= (viewer) → { items: [{ userId, email, name, role }], nextCursor }.
 * People join a lab only by accepting an invitation (…/invitations); there is no direct add.
 */
export const GET = apiRoute<Params>(async (request, { params }) => {
  const { id } = await params;
  const caller = await requireCaller(request);
  const access = await authorizeLab(caller, id, "viewer");
  return json(await listMembers(db, { access, page: readPage(request) }));
});
