import { db } from "@/db/client";
import { listAudit } from "@/db/queries/audit";
import { validationError } from "@/lib/contracts/errors";
import { apiRoute, json } from "@/lib/api/route";
import { AUDIT_MIN_ROLE, auditQuerySchema } from "@/lib/contracts/audit";
import { authorizeLab, requireCaller } from "@/lib/auth/access";

/**
 * GET /api/labs/{id}/audit?setId=&actorId=&subjectId=&kind=&from=&to=&limit=&cursor= (owner) →
 * { items: [{ id, at, action, actor, targetType, targetId, targetName, set, details }], nextCursor }, newest first.
 */
export const GET = apiRoute<{ id: string }>(async (request, { params }) => {
  const { id } = await params;
  const caller = await requireCaller(request);
  const access = await authorizeLab(caller, id, AUDIT_MIN_ROLE);
  const search = new URL(request.url).searchParams;
  const raw: Record<string, string> = {};
  for (const key of ["setId", "actorId", "subjectId", "kind", "from", "to", "limit", "cursor"]) {
    const value = search.get(key);
    if (value) raw[key] = value;
  }
  // The lab is the proof's (authorize checked the id), not a query parameter.
  const parsed = auditQuerySchema.omit({ labId: true }).safeParse(raw);
  if (!parsed.success) throw validationError(parsed.error);
  const { limit, cursor, ...filters } = parsed.data;
  return json(await listAudit(db, { access, ...filters, page: { limit, cursor } }));
});
