import { db } from "@/db/client";
import { deleteMyWorkbenchView, getMyWorkbenchView, saveMyWorkbenchView } from "@/db/queries/workbench-views";
import { readJson } from "@/lib/api/body";
import { apiRoute, json } from "@/lib/api/route";
import { myViewBodySchema } from "@/lib/contracts/workbench-views";
import { authorize, requireCaller } from "@/lib/auth/access";

/*
 * The caller's own workbench view of a set. Every member, viewers included, keeps their own:
 * it changes what they see and nothing anyone else sees. Sharing a view with the lab is
 * PUT …/view-state (editors).
 */

type Params = { id: string };

async function viewerAccess(request: Request, params: Promise<Params>) {
  const { id } = await params;
  const caller = await requireCaller(request);
  return authorize(caller, { kind: "parameter_set", id }, "viewer");
}

/** GET /api/parameter-sets/{id}/my-view (viewer) → { item: { viewState, updatedAt, sharedViewState } } */
export const GET = apiRoute<Params>(async (request, { params }) =>
  json({ item: await getMyWorkbenchView(db, { access: await viewerAccess(request, params) }) }),
);

/** PUT /api/parameter-sets/{id}/my-view { viewState } (viewer) → { item } */
export const PUT = apiRoute<Params>(async (request, { params }) => {
  const access = await viewerAccess(request, params);
  const { viewState } = await readJson(request, myViewBodySchema);
  return json({ item: await saveMyWorkbenchView(db, { access, viewState }) });
});

/** DELETE /api/parameter-sets/{id}/my-view (viewer) → { item } with viewState null: back to the lab's shared view. */
export const DELETE = apiRoute<Params>(async (request, { params }) =>
  json({ item: await deleteMyWorkbenchView(db, { access: await viewerAccess(request, params) }) }),
);
