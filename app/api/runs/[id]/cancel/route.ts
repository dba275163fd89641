import { findRunLabId, getRun, requestCancel } from "@/db/queries/runs";
import { notFound } from "@/lib/contracts/errors";
import { isUuid } from "@/lib/contracts/validation";
import { apiRoute, json } from "@/lib/api/route";
import { requireCaller, requireLabRole } from "@/lib/auth/access";
import { cancelQueuedJob } from "@/lib/runs/queue";

const NO_RUN = "No such run.";

/**
 * POST /api/runs/{id}/cancel (editor) → { item }. A queued run is cancelled at once and its job
 * taken off the queue; a running one is flagged and its worker stops within about a second.
 * Cancelling a finished run changes nothing.
 */
export const POST = apiRoute<{ id: string }>(async (request, { params }) => {
  const caller = await requireCaller(request);
  const { id } = await params;
  const labId = isUuid(id) ? await findRunLabId({ id }) : null;
  if (!labId) throw notFound(NO_RUN);
  const access = await requireLabRole(caller, labId, "editor", { notFoundMessage: NO_RUN });
  const outcome = await requestCancel({ id, labId, actorId: caller.id });
  if (!outcome) throw notFound(NO_RUN);
  if (outcome.wasQueued) await cancelQueuedJob(id).catch((e: unknown) => console.error("[runs] queue cancel failed", id, e));
  return json({ item: await getRun({ id, labId, role: access.role }) });
});
