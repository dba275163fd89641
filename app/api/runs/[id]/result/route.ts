import { db } from "@/db/client";
import { getRunResult } from "@/db/queries/lab-runs";
import { apiRoute, json } from "@/lib/api/route";
import { authorize, requireCaller } from "@/lib/auth/access";
import { DomainError } from "@/lib/contracts/errors";
import type { LabRunResultBody } from "@/lib/contracts/lab-runs";
import { columnsAsJson, decodeResult } from "@/lib/lab-runs/encoding";

/**
 * GET /api/runs/{id}/result (viewer) → LabRunResultBody. Numbers go out as JSON's shortest
 * round-trip form, so a client parses back the very doubles the worker computed; NaN becomes null.
 */
export const GET = apiRoute<{ id: string }>(async (request, { params }) => {
  const caller = await requireCaller(request);
  const { id } = await params;
  const access = await authorize(caller, { kind: "lab_run", id }, "viewer");
  const result = await getRunResult(db, { access });
  if (!result) throw new DomainError("not_found", "This run has no result (yet).");
  const columns = columnsAsJson(decodeResult(result.meta, result.data));
  const body: LabRunResultBody = {
    runId: id,
    workerId: result.workerId,
    attempt: result.attempt,
    computeMs: result.computeMs,
    engineVersion: result.engineVersion,
    meta: result.meta,
    columns,
  };
  return json(body);
});
