import { listPlans, savePlan } from "@/db/queries/plans";
import { readJson } from "@/lib/api/body";
import { requireParameterSetRole } from "@/lib/api/parameter-set-access";
import { apiRoute, json } from "@/lib/api/route";
import { requireCaller } from "@/lib/auth/access";
import { savePlanSchema } from "@/lib/contracts/plans";

/** GET /api/parameter-sets/{id}/plans (viewer) → { items: SavedPlan[] }, newest first */
export const GET = apiRoute<{ id: string }>(async (request, { params }) => {
  const { id } = await params;
  const caller = await requireCaller(request);
  const access = await requireParameterSetRole(caller, id, "viewer");
  return json({ items: await listPlans({ setId: id, labId: access.labId }) });
});

/** POST /api/parameter-sets/{id}/plans { name, setVersion, request, plan } (editor) → 201 { item } */
export const POST = apiRoute<{ id: string }>(async (request, { params }) => {
  const { id } = await params;
  const caller = await requireCaller(request);
  const access = await requireParameterSetRole(caller, id, "editor");
  const input = await readJson(request, savePlanSchema);
  return json({ item: await savePlan({ caller, setId: id, labId: access.labId, input }) }, 201);
});
