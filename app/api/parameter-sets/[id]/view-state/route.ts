import { db } from "@/db/client";
import { saveParameterSetViewState } from "@/db/queries/parameter-sets";
import { readJson } from "@/lib/api/body";
import { apiRoute, json } from "@/lib/api/route";
import { viewStateSchema } from "@/lib/contracts/workbench-views";
import { authorize, requireCaller } from "@/lib/auth/access";

/** PUT /api/parameter-sets/{id}/view-state { viewState } (editor) → { item }; no new version. */
export const PUT = apiRoute<{ id: string }>(async (request, { params }) => {
  const { id } = await params;
  const caller = await requireCaller(request);
  const access = await authorize(caller, { kind: "parameter_set", id }, "editor");
  const { viewState } = await readJson(request, viewStateSchema);
  return json({ item: await saveParameterSetViewState(db, { access, viewState }) });
});
