import { type ComputeKind, type ComputeResultBody, SYNC_FIT_POINT_LIMIT, syncCells } from "@/lib/contracts/compute";
import { DomainError } from "@/lib/contracts/errors";
import { fitOutput } from "@/lib/fit/output";
import { analyseFit } from "@/lib/fit/report";
import { type FitRequest, requestSets } from "@/lib/fit/schema";
import { columnsAsJson } from "./encoding";
import { ENGINE_VERSION } from "./engine";
import { computeRunInProcess, type MapPayload, type SpectrumPayload } from "./kinds";

/*
 * The synchronous compute of /api/compute/*: a small spectrum or map computed in this process with
 * the lab-run kinds' own code (the same chunks a worker computes, so the same bits), or a small fit.
 * Above the limits, a payload_too_large error that points to the lab runs.
 */

/** A spectrum or map, computed now; too large → payload_too_large with a `labRun` pointer. */
export function computeNow(kind: ComputeKind, payload: SpectrumPayload | MapPayload): ComputeResultBody {
  const { cells, limit } = syncCells(kind, payload);
  if (cells > limit) {
    throw new DomainError(
      "payload_too_large",
      `This ${kind} has ${cells} cells; the synchronous endpoint computes up to ${limit} with method "${payload.method}". ` +
        `Submit it as a lab run instead: POST /api/runs with { "labId": …, "kind": "${kind}", "payload": <this body> }.`,
      { extra: { cells, limit, labRun: { method: "POST", path: "/api/runs", kind } } },
    );
  }
  const started = performance.now();
  const result = computeRunInProcess(kind, payload);
  return {
    kind,
    engineVersion: ENGINE_VERSION,
    computeMs: Math.round(performance.now() - started),
    meta: result.meta,
    columns: columnsAsJson(result.columns),
  };
}

/**
 * A fit and its report (comparison, profile intervals, held values, verdict), computed now, as the
 * command line prints it; more points than the synchronous limit → payload_too_large. The per-point
 * share intervals cost a few dozen refits per distinct condition, so they are computed only when asked.
 */
export function fitNow(
  request: FitRequest,
  options: { shareIntervals?: boolean } = {},
): { engineVersion: string; computeMs: number; result: ReturnType<typeof fitOutput> } {
  const points = requestSets(request).reduce((n, set) => n + set.points.length, 0);
  if (points > SYNC_FIT_POINT_LIMIT) {
    throw new DomainError(
      "payload_too_large",
      `This fit has ${points} points; the synchronous endpoint fits up to ${SYNC_FIT_POINT_LIMIT}. ` +
        "Fit larger sets in the workbench or with the fit command line (npm run fit).",
      { extra: { points, limit: SYNC_FIT_POINT_LIMIT } },
    );
  }
  const started = performance.now();
  const result = fitOutput(analyseFit(request, { shareProfiles: options.shareIntervals ?? false }));
  return { engineVersion: ENGINE_VERSION, computeMs: Math.round(performance.now() - started), result };
}
