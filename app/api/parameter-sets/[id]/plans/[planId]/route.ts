import { deletePlan, getPlan } from "@/db/queries/plans";
import { notFound } from "@/lib/contracts/errors";
import { isUuid } from "@/lib/contracts/validation";
import { requireParameterSetRole } from "@/lib/api/parameter-set-access";
import { apiRoute, json, noContent } from "@/lib/api/route";
import { requireCaller } from "@/lib/auth/access";

const NOT_FOUND = "No such plan.";

/** GET /api/parameter-sets/{id}/plans/{planId} (viewer) → { item } */
export const GET = apiRoute<{ id: string; planId: string }>(async (request, { params }) => {
  const { id, planId } = await params;
  const caller = await requireCaller(request);
  const access = await requireParameterSetRole(caller, id, "viewer");
  if (!isUuid(planId)) throw notFound(NOT_FOUND);
  const item = await getPlan({ id: planId, setId: id, labId: access.labId });
  if (!item) throw notFound(NOT_FOUND);
  return json({ item });
});

/** DELETE /api/parameter-sets/{id}/plans/{planId} (editor) → 204 */
export const DELETE = apiRoute<{ id: string; planId: string }>(async (request, { params }) => {
  const { id, planId } = await params;
  const caller = await requireCaller(request);
  const access = await requireParameterSetRole(caller, id, "editor");
  if (!isUuid(planId)) throw notFound(NOT_FOUND);
  await deletePlan({ caller, id: planId, setId: id, labId: access.labId });
  return noContent();
});
