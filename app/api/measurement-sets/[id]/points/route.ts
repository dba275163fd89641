import { db } from "@/db/client";
import { getMeasurementPoints } from "@/db/queries/measurement-sets";
import { notFound } from "@/lib/contracts/errors";
import { apiRoute, json } from "@/lib/api/route";
import { authorize, requireCaller } from "@/lib/auth/access";

type Params = { id: string };

/** GET /api/measurement-sets/{id}/points (viewer) → { points: MeasuredPoint[] } in SI, file order. */
export const GET = apiRoute<Params>(async (request, { params }) => {
  const { id } = await params;
  const caller = await requireCaller(request);
  const access = await authorize(caller, { kind: "measurement_set", id }, "viewer");
  const points = await getMeasurementPoints(db, { access });
  if (!points) throw notFound("No such measurement set.");
  return json({ points });
});
