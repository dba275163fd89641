import { db } from "@/db/client";
import { editMeasurementPoints } from "@/db/queries/measurement-points";
import { getMeasurementPoints } from "@/db/queries/measurement-sets";
import { readJson } from "@/lib/api/body";
import { apiRoute, json } from "@/lib/api/route";
import { authorize, requireCaller } from "@/lib/auth/access";
import { notFound } from "@/lib/contracts/errors";
import { editPointsSchema } from "@/lib/contracts/measurement-sets";

type Params = { id: string };

/** GET /api/measurement-sets/{id}/points (viewer) → { revision, points: StoredPoint[] } in SI, file order, masked ones included. */
export const GET = apiRoute<Params>(async (request, { params }) => {
  const { id } = await params;
  const caller = await requireCaller(request);
  const access = await authorize(caller, { kind: "measurement_set", id }, "viewer");
  const result = await getMeasurementPoints(db, { access });
  if (!result) throw notFound("No such measurement set.");
  return json(result);
});

/**
 * PATCH /api/measurement-sets/{id}/points { revision, changes: [{ ordinal, masked?, maskReason?, note?, values? }] } (editor)
 * → { revision, changedPoints }: one new revision, audited; the original file is never changed.
 */
export const PATCH = apiRoute<Params>(async (request, { params }) => {
  const { id } = await params;
  const caller = await requireCaller(request);
  const input = await readJson(request, editPointsSchema);
  const access = await authorize(caller, { kind: "measurement_set", id }, "editor");
  return json(await editMeasurementPoints(db, { access, input }));
});
