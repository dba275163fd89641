import { db } from "@/db/client";
import { getRun, requestCancel } from "@/db/queries/lab-runs";
import { apiRoute, json } from "@/lib/api/route";
import { authorize, requireCaller } from "@/lib/auth/access";
import { notFound } from "@/lib/contracts/errors";
import { cancelQueuedJob } from "@/lib/lab-runs/queue";

/**
 * POST /api/runs/{id}/cancel (editor) → { item }. A queued run is cancelled at once and its job
 * taken off the queue; a running one is flagged and its worker stops within about a second.
 * Cancelling a finished run changes nothing.
 */
export const POST = apiRoute<{ id: string }>(async (request, { params }) => {
  const caller = await requireCaller(request);
  const { id } = await params;
  const access = await authorize(caller, { kind: "lab_run", id }, "editor");
  const outcome = await requestCancel(db, { access });
  if (!outcome) throw notFound("No such run.");
  if (outcome.wasQueued) await cancelQueuedJob(id).catch((e: unknown) => console.error("[runs] queue cancel failed", id, e));
  return json({ item: await getRun(db, { access }) });
});
