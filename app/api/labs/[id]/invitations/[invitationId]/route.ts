import { db } from "@/db/client";
import { revokeInvitation } from "@/db/queries/invitations";
import { notFound } from "@/lib/contracts/errors";
import { isUuid } from "@/lib/contracts/validation";
import { apiRoute, noContent } from "@/lib/api/route";
import { authorizeLab, requireCaller } from "@/lib/auth/access";

/** DELETE /api/labs/{id}/invitations/{invitationId} (owner) → 204; the link stops working at once. */
export const DELETE = apiRoute<{ id: string; invitationId: string }>(async (request, { params }) => {
  const { id, invitationId } = await params;
  const caller = await requireCaller(request);
  const access = await authorizeLab(caller, id, "owner");
  if (!isUuid(invitationId) || !(await revokeInvitation(db, { access, id: invitationId }))) {
    throw notFound("No such pending invitation.");
  }
  return noContent();
});
