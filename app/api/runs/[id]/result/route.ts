import { findRunLabId, getRunResult } from "@/db/queries/runs";
import { DomainError, notFound } from "@/lib/contracts/errors";
import { isUuid } from "@/lib/contracts/validation";
import { apiRoute, json } from "@/lib/api/route";
import { requireCaller, requireLabRole } from "@/lib/auth/access";
import type { LabRunResultBody } from "@/lib/contracts/lab-runs";
import { decodeResult } from "@/lib/runs/encoding";

const NO_RUN = "No such run.";

/**
 * GET /api/runs/{id}/result (viewer) → LabRunResultBody. Numbers go out as JSON's shortest
 * round-trip form, so a client parses back the very doubles the worker computed; NaN becomes null.
 */
export const GET = apiRoute<{ id: string }>(async (request, { params }) => {
  const caller = await requireCaller(request);
  const { id } = await params;
  const labId = isUuid(id) ? await findRunLabId({ id }) : null;
  if (!labId) throw notFound(NO_RUN);
  await requireLabRole(caller, labId, "viewer", { notFoundMessage: NO_RUN });
  const result = await getRunResult({ id, labId });
  if (!result) throw new DomainError("not_found", "This run has no result (yet).");
  const columns: LabRunResultBody["columns"] = {};
  for (const [name, col] of Object.entries(decodeResult(result.meta, result.data))) {
    columns[name] = Array.from(col, (v) => (Number.isNaN(v) ? null : v));
  }
  const body: LabRunResultBody = {
    runId: id,
    workerId: result.workerId,
    attempt: result.attempt,
    computeMs: result.computeMs,
    meta: result.meta,
    columns,
  };
  return json(body);
});
