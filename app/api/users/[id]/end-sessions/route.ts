import { db } from "@/db/client";
import { endSessions, findUserById } from "@/db/queries/users";
import { apiRoute, noContent } from "@/lib/api/route";
import { requireSessionCaller } from "@/lib/auth/access";
import { forbidden, notFound } from "@/lib/contracts/errors";
import { isUuid } from "@/lib/contracts/validation";

/**
 * POST /api/users/{id}/end-sessions (a site admin, or the user themself) → 204: "sign out
 * everywhere": every browser session of that user ends at once and every API token is revoked.
 */
export const POST = apiRoute<{ id: string }>(async (request, { params }) => {
  const { id } = await params;
  const caller = await requireSessionCaller(request, "Ending sessions");
  if (!isUuid(id)) throw notFound("No such user.");
  if (caller.siteRole !== "admin" && caller.id !== id) throw forbidden("Only a site admin can end another person's sessions.");
  if (!(await findUserById(db, { id }))) throw notFound("No such user.");
  await endSessions(db, { caller, userId: id });
  return noContent();
});
