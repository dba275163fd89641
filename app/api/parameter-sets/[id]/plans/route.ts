import { db } from "@/db/client";
import { listPlans, savePlan } from "@/db/queries/plans";
import { readJson } from "@/lib/api/body";
import { apiRoute, json } from "@/lib/api/route";
import { authorize, requireCaller } from "@/lib/auth/access";
import { savePlanSchema } from "@/lib/contracts/plans";

/** GET /api/parameter-sets/{id}/plans (viewer) → { items: SavedPlan[] }, newest first */
export const GET = apiRoute<{ id: string }>(async (request, { params }) => {
  const { id } = await params;
  const caller = await requireCaller(request);
  const access = await authorize(caller, { kind: "parameter_set", id }, "viewer");
  return json({ items: await listPlans(db, { access }) });
});

/** POST /api/parameter-sets/{id}/plans { name, setVersion, request, plan } (editor) → 201 { item } */
export const POST = apiRoute<{ id: string }>(async (request, { params }) => {
  const { id } = await params;
  const caller = await requireCaller(request);
  const access = await authorize(caller, { kind: "parameter_set", id }, "editor");
  const input = await readJson(request, savePlanSchema);
  return json({ item: await savePlan(db, { access, input }) }, 201);
});
