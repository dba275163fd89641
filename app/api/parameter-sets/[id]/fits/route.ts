import { findMeasurementSetLabId } from "@/db/queries/measurement-sets";
import { saveFitAsVersion } from "@/db/queries/parameter-sets";
import { readJson } from "@/lib/api/body";
import { DomainError } from "@/lib/contracts/errors";
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
  // The provenance may name only measurement sets of the same lab (others do not exist for the caller).
  const labs = await Promise.all(input.fit.measurementSets.map((m) => findMeasurementSetLabId({ id: m.id })));
  const foreign = labs.findIndex((labId) => labId !== access.labId);
  if (foreign >= 0) {
    throw new DomainError("validation", "The fit names a measurement set that is not in this parameter set's lab.", {
      fields: { [`fit.measurementSets.${foreign}.id`]: "no such measurement set in this lab" },
    });
  }
  const item = await saveFitAsVersion({ caller, id, labId: access.labId, role: access.role, input });
  return json({ item }, 201);
});
