import { db } from "@/db/client";
import { deletePlan, getPlan } from "@/db/queries/plans";
import { notFound } from "@/lib/contracts/errors";
import { isUuid } from "@/lib/contracts/validation";
import { apiRoute, json, noContent } from "@/lib/api/route";
import { authorize, requireCaller } from "@/lib/auth/access";

const NOT_FOUND = "No such plan.";

/** GET /api/parameter-sets/{id}/plans/{planId} (viewer) → { item } */
export const GET = apiRoute<{ id: string; planId: string }>(async (request, { params }) => {
  const { id, planId } = await params;
  const caller = await requireCaller(request);
  const access = await authorize(caller, { kind: "parameter_set", id }, "viewer");
  if (!isUuid(planId)) throw notFound(NOT_FOUND);
  const item = await getPlan(db, { access, id: planId });
  if (!item) throw notFound(NOT_FOUND);
  return json({ item });
});

/** DELETE /api/parameter-sets/{id}/plans/{planId} (editor) → 204 */
export const DELETE = apiRoute<{ id: string; planId: string }>(async (request, { params }) => {
  const { id, planId } = await params;
  const caller = await requireCaller(request);
  const access = await authorize(caller, { kind: "parameter_set", id }, "editor");
  if (!isUuid(planId)) throw notFound(NOT_FOUND);
  await deletePlan(db, { access, id: planId });
  return noContent();
});
