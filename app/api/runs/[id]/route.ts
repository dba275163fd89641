import { db } from "@/db/client";
import { getRun } from "@/db/queries/lab-runs";
import { apiRoute, json } from "@/lib/api/route";
import { authorize, requireCaller } from "@/lib/auth/access";
import { notFound } from "@/lib/contracts/errors";

/** GET /api/runs/{id} (viewer of the run's lab; anyone else 404) → { item: LabRunDetail } */
export const GET = apiRoute<{ id: string }>(async (request, { params }) => {
  const caller = await requireCaller(request);
  const { id } = await params;
  const access = await authorize(caller, { kind: "lab_run", id }, "viewer");
  const item = await getRun(db, { access });
  if (!item) throw notFound("No such run.");
  return json({ item });
});
