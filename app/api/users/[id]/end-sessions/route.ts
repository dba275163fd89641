import { bumpSessionVersion, findUserById } from "@/db/queries/users";
import { recordAudit } from "@/db/queries/audit";
import { db } from "@/db/client";
import { forbidden, notFound } from "@/lib/contracts/errors";
import { isUuid } from "@/lib/contracts/validation";
import { apiRoute, noContent } from "@/lib/api/route";
import { requireSessionCaller } from "@/lib/auth/access";

/**
 * POST /api/users/{id}/end-sessions (a site admin, or the user themself) → 204: every browser
 * session of that user ends at once (API tokens are revoked separately).
 */
export const POST = apiRoute<{ id: string }>(async (request, { params }) => {
  const { id } = await params;
  const caller = await requireSessionCaller(request, "Ending sessions");
  if (!isUuid(id)) throw notFound("No such user.");
  if (caller.siteRole !== "admin" && caller.id !== id) throw forbidden("Only a site admin can end another person's sessions.");
  if (!(await findUserById({ id }))) throw notFound("No such user.");
  await db.transaction(async (tx) => {
    await bumpSessionVersion({ userId: id, executor: tx });
    await recordAudit({ tx, entry: { actorId: caller.id, action: "user.end_sessions", targetType: "user", targetId: id, details: {} } });
  });
  return noContent();
});
