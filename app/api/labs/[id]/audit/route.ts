import { listAudit } from "@/db/queries/audit";
import { validationError } from "@/lib/contracts/errors";
import { apiRoute, json } from "@/lib/api/route";
import { auditQuerySchema } from "@/lib/contracts/audit";
import { requireCaller, requireLabRole } from "@/lib/auth/access";

/**
 * GET /api/labs/{id}/audit?setId=&actorId=&kind=&from=&to=&limit=&cursor= (owner) →
 * { items: [{ id, at, action, actor, targetType, targetId, details }], nextCursor }, newest first.
 */
export const GET = apiRoute<{ id: string }>(async (request, { params }) => {
  const { id } = await params;
  const caller = await requireCaller(request);
  const access = await requireLabRole(caller, id, "owner");
  const search = new URL(request.url).searchParams;
  const raw: Record<string, string> = { labId: access.labId };
  for (const key of ["setId", "actorId", "kind", "from", "to", "limit", "cursor"]) {
    const value = search.get(key);
    if (value) raw[key] = value;
  }
  const parsed = auditQuerySchema.safeParse(raw);
  if (!parsed.success) throw validationError(parsed.error);
  const { labId, limit, cursor, ...filters } = parsed.data;
  return json(await listAudit({ labId, ...filters, page: { limit, cursor } }));
});
