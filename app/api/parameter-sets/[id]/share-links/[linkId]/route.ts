import { db } from "@/db/client";
import { revokeShareLink } from "@/db/queries/share-links";
import { notFound } from "@/lib/contracts/errors";
import { isUuid } from "@/lib/contracts/validation";
import { apiRoute, noContent } from "@/lib/api/route";
import { authorize, requireCaller } from "@/lib/auth/access";

/** DELETE /api/parameter-sets/{id}/share-links/{linkId} (editor) → 204; the link stops working at once. */
export const DELETE = apiRoute<{ id: string; linkId: string }>(async (request, { params }) => {
  const { id, linkId } = await params;
  const caller = await requireCaller(request);
  const access = await authorize(caller, { kind: "parameter_set", id }, "editor");
  if (!isUuid(linkId) || !(await revokeShareLink(db, { access, linkId }))) {
    throw notFound("No such share link.");
  }
  return noContent();
});
