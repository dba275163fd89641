import { saveFitAsVersion } from "@/db/queries/parameter-sets";
import { readJson } from "@/lib/api/body";
import { requireParameterSetRole } from "@/lib/api/parameter-set-access";
import { apiRoute, json } from "@/lib/api/route";
import { requireCaller } from "@/lib/auth/access";
import { saveFitSchema } from "@/lib/fit/provenance";

/**
 * POST /api/parameter-sets/{id}/fits { version, values, fit } (editor) → 201 { item }: the fitted
 * values saved as a new version, with the fit (measurement sets, free parameters and bounds,
 * σ, correlation, χ², date) as its provenance. A stale `version` answers 409 stale_version.
 */
export const POST = apiRoute<{ id: string }>(async (request, { params }) => {
  const { id } = await params;
  const caller = await requireCaller(request);
  const access = await requireParameterSetRole(caller, id, "editor");
  const input = await readJson(request, saveFitSchema);
  const item = await saveFitAsVersion({ caller, id, labId: access.labId, role: access.role, input });
  return json({ item }, 201);
});
