import { db } from "@/db/client";
import { deleteMeasurementSet, getMeasurementSet } from "@/db/queries/measurement-sets";
import { notFound } from "@/lib/contracts/errors";
import { apiRoute, json, noContent } from "@/lib/api/route";
import { authorize, requireCaller } from "@/lib/auth/access";
import { objectStore } from "@/lib/storage/server";

const NOT_FOUND = "No such measurement set.";

type Params = { id: string };

/** GET /api/measurement-sets/{id} (viewer) → { item } */
export const GET = apiRoute<Params>(async (request, { params }) => {
  const { id } = await params;
  const caller = await requireCaller(request);
  const access = await authorize(caller, { kind: "measurement_set", id }, "viewer");
  const item = await getMeasurementSet(db, { access });
  if (!item) throw notFound(NOT_FOUND);
  return json({ item });
});

/** DELETE /api/measurement-sets/{id} (editor) → 204; the audit log keeps the name and row count. */
export const DELETE = apiRoute<Params>(async (request, { params }) => {
  const { id } = await params;
  const caller = await requireCaller(request);
  const access = await authorize(caller, { kind: "measurement_set", id }, "editor");
  if (!(await deleteMeasurementSet(db, { access, store: objectStore }))) throw notFound(NOT_FOUND);
  return noContent();
});
