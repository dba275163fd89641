import { db } from "@/db/client";
import { saveFitAsVersion } from "@/db/queries/parameter-sets";
import { readJson } from "@/lib/api/body";
import { apiRoute, json } from "@/lib/api/route";
import { authorize, requireCaller } from "@/lib/auth/access";
import { saveFitSchema } from "@/lib/contracts/fits";

/**
 * POST /api/parameter-sets/{id}/fits { version, values, fit } (editor) → 201 { item }: the fitted
 * values saved as a new version, with the fit (measurement sets, free parameters and bounds,
 * σ, correlation, χ², date) as its provenance. A stale `version` answers 409 stale_version; a
 * measurement set outside the set's lab answers 400 on its field.
 */
export const POST = apiRoute<{ id: string }>(async (request, { params }) => {
  const { id } = await params;
  const caller = await requireCaller(request);
  const access = await authorize(caller, { kind: "parameter_set", id }, "editor");
  const input = await readJson(request, saveFitSchema);
  const item = await saveFitAsVersion(db, { access, input });
  return json({ item }, 201);
});
