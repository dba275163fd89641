import { db } from "@/db/client";
import { revokeToken } from "@/db/queries/tokens";
import { notFound } from "@/lib/contracts/errors";
import { isUuid } from "@/lib/contracts/validation";
import { apiRoute, noContent } from "@/lib/api/route";
import { requireSessionCaller } from "@/lib/auth/access";

/** DELETE /api/tokens/{id} → 204 (revokes one of the caller's own tokens) */
export const DELETE = apiRoute<{ id: string }>(async (request, { params }) => {
  const { id } = await params;
  const caller = await requireSessionCaller(request);
  if (!isUuid(id) || !(await revokeToken(db, { userId: caller.id, tokenId: id }))) throw notFound("No such token.");
  return noContent();
});
