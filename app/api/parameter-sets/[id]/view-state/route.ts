import { saveParameterSetViewState } from "@/db/queries/parameter-sets";
import { readJson } from "@/lib/api/body";
import { requireParameterSetRole } from "@/lib/api/parameter-set-access";
import { apiRoute, json } from "@/lib/api/route";
import { viewStateSchema } from "@/lib/contracts/workbench-views";
import { requireCaller } from "@/lib/auth/access";

/** PUT /api/parameter-sets/{id}/view-state { viewState } (editor) → { item }; no new version. */
export const PUT = apiRoute<{ id: string }>(async (request, { params }) => {
  const { id } = await params;
  const caller = await requireCaller(request);
  const access = await requireParameterSetRole(caller, id, "editor");
  const { viewState } = await readJson(request, viewStateSchema);
  return json({ item: await saveParameterSetViewState({ caller, id, labId: access.labId, role: access.role, viewState }) });
});
