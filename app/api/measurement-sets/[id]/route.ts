import { deleteMeasurementSet, getMeasurementSet } from "@/db/queries/measurement-sets";
import { notFound } from "@/lib/contracts/errors";
import { MEASUREMENT_NOT_FOUND, requireMeasurementSetRole } from "@/lib/api/measurement-set-access";
import { apiRoute, json, noContent } from "@/lib/api/route";
import { requireCaller } from "@/lib/auth/access";

type Params = { id: string };

/** GET /api/measurement-sets/{id} (viewer) → { item } */
export const GET = apiRoute<Params>(async (request, { params }) => {
  const { id } = await params;
  const caller = await requireCaller(request);
  const access = await requireMeasurementSetRole(caller, id, "viewer");
  const item = await getMeasurementSet({ id, labId: access.labId, role: access.role });
  if (!item) throw notFound(MEASUREMENT_NOT_FOUND);
  return json({ item });
});

/** DELETE /api/measurement-sets/{id} (editor) → 204; the audit log keeps the name and row count. */
export const DELETE = apiRoute<Params>(async (request, { params }) => {
  const { id } = await params;
  const caller = await requireCaller(request);
  const access = await requireMeasurementSetRole(caller, id, "editor");
  if (!(await deleteMeasurementSet({ caller, id, labId: access.labId }))) throw notFound(MEASUREMENT_NOT_FOUND);
  return noContent();
});
