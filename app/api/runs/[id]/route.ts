import { findRunLabId, getRun } from "@/db/queries/runs";
import { notFound } from "@/lib/contracts/errors";
import { isUuid } from "@/lib/contracts/validation";
import { apiRoute, json } from "@/lib/api/route";
import { requireCaller, requireLabRole } from "@/lib/auth/access";

const NO_RUN = "No such run.";

/** GET /api/runs/{id} (viewer of the run's lab; anyone else 404) → { item: LabRunDetail } */
export const GET = apiRoute<{ id: string }>(async (request, { params }) => {
  const caller = await requireCaller(request);
  const { id } = await params;
  const labId = isUuid(id) ? await findRunLabId({ id }) : null;
  if (!labId) throw notFound(NO_RUN);
  const access = await requireLabRole(caller, labId, "viewer", { notFoundMessage: NO_RUN });
  const item = await getRun({ id, labId, role: access.role });
  if (!item) throw notFound(NO_RUN);
  return json({ item });
});
