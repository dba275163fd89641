import { getMeasurementPoints } from "@/db/queries/measurement-sets";
import { notFound } from "@/lib/contracts/errors";
import { MEASUREMENT_NOT_FOUND, requireMeasurementSetRole } from "@/lib/api/measurement-set-access";
import { apiRoute, json } from "@/lib/api/route";
import { requireCaller } from "@/lib/auth/access";

type Params = { id: string };

/** GET /api/measurement-sets/{id}/points (viewer) → { points: MeasuredPoint[] } in SI, file order. */
export const GET = apiRoute<Params>(async (request, { params }) => {
  const { id } = await params;
  const caller = await requireCaller(request);
  const access = await requireMeasurementSetRole(caller, id, "viewer");
  const points = await getMeasurementPoints({ id, labId: access.labId });
  if (!points) throw notFound(MEASUREMENT_NOT_FOUND);
  return json({ points });
});
