import { isDeepStrictEqual } from "node:util";
import { db } from "@/db/client";
import { createRun, listRuns, markRunUnqueued } from "@/db/queries/runs";
import { getParameterSetInLab } from "@/db/queries/parameter-sets";
import { readJson } from "@/lib/api/body";
import { DomainError, validationError } from "@/lib/contracts/errors";
import { apiRoute, json } from "@/lib/api/route";
import { requireCaller, requireLabRole } from "@/lib/auth/access";
import { listRunsQuery, submitRunSchema } from "@/lib/contracts/lab-runs";
import { runKindHandler } from "@/lib/runs/kinds";
import { enqueueRun } from "@/lib/runs/queue";

/** GET /api/runs?labId=&limit= (viewer) → { items: LabRunSummary[] } */
export const GET = apiRoute(async (request) => {
  const caller = await requireCaller(request);
  const search = new URL(request.url).searchParams;
  const parsed = listRunsQuery.safeParse({ labId: search.get("labId") || undefined, limit: search.get("limit") || undefined });
  if (!parsed.success) throw validationError(parsed.error);
  if (parsed.data.labId) await requireLabRole(caller, parsed.data.labId, "viewer");
  return json({ items: await listRuns({ userId: caller.id, siteRole: caller.siteRole, ...parsed.data }) });
});

/** POST /api/runs (editor) → 201 { item }: stores the run and puts its job on the queue. */
export const POST = apiRoute(async (request) => {
  const caller = await requireCaller(request);
  const input = await readJson(request, submitRunSchema);
  const access = await requireLabRole(caller, input.labId, "editor");
  const handler = runKindHandler(input.kind)!;
  let set: { id: string; name: string; version: number; edited: boolean } | null = null;
  if (input.parameterSetId) {
    const stored = await getParameterSetInLab(db, { access, id: input.parameterSetId });
    if (!stored)
      throw new DomainError("validation", "One field is invalid.", { fields: { parameterSetId: "No such parameter set in this lab." } });
    set = { id: stored.id, name: stored.name, version: stored.version, edited: !isDeepStrictEqual(stored.params, input.payload.params) };
  }
  const item = await createRun({
    actorId: caller.id,
    role: access.role,
    run: {
      labId: access.labId,
      submittedById: caller.id,
      kind: input.kind,
      title: handler.describe(input.payload),
      payload: input.payload as Record<string, unknown>,
      cells: handler.cells(input.payload),
      parameterSetId: set?.id ?? null,
      parameterSetName: set?.name ?? null,
      parameterSetVersion: set?.version ?? null,
      paramsEdited: set?.edited ?? false,
    },
  });
  try {
    await enqueueRun(item.id);
  } catch (error) {
    console.error("[runs] cannot queue run", item.id, error);
    await markRunUnqueued({ id: item.id, error: "The job queue could not take the run; submit it again." });
    throw new DomainError("db_unavailable", "The job queue is unavailable; try again shortly.");
  }
  return json({ item }, 201);
});
