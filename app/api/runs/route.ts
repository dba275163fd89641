import { isDeepStrictEqual } from "node:util";
import { db } from "@/db/client";
import { createRun, listRuns, markRunUnqueued } from "@/db/queries/lab-runs";
import { getParameterSet } from "@/db/queries/parameter-sets";
import { readJson } from "@/lib/api/body";
import { apiRoute, json } from "@/lib/api/route";
import { authorize, authorizeLab, requireCaller } from "@/lib/auth/access";
import type { ResourceAccess } from "@/lib/contracts/access";
import { DomainError, validationError } from "@/lib/contracts/errors";
import { listRunsQuery, type SubmitRunInput, submitRunSchema } from "@/lib/contracts/lab-runs";
import { ENGINE_VERSION } from "@/lib/lab-runs/engine";
import { runKindHandler } from "@/lib/lab-runs/kinds";
import { enqueueRun } from "@/lib/lab-runs/queue";

/** GET /api/runs?labId=&limit= (viewer) → { items: LabRunSummary[] } */
export const GET = apiRoute(async (request) => {
  const caller = await requireCaller(request);
  const search = new URL(request.url).searchParams;
  const parsed = listRunsQuery.safeParse({ labId: search.get("labId") || undefined, limit: search.get("limit") || undefined });
  if (!parsed.success) throw validationError(parsed.error);
  const { labId, limit } = parsed.data;
  const access = labId ? await authorizeLab(caller, labId, "viewer") : undefined;
  return json({ items: await listRuns(db, { caller, access, limit }) });
});

type SourceSet = { id: string; name: string; version: number; edited: boolean };

const NO_SUCH_SET = () =>
  new DomainError("validation", "One field is invalid.", { fields: { parameterSetId: "No such parameter set in this lab." } });

/**
 * The set (and its current version) the run's parameters came from. It must belong to the run's
 * lab: a set the caller cannot see, or one of another lab, is the same invalid field.
 */
async function sourceSet(access: ResourceAccess<"lab">, input: SubmitRunInput & { parameterSetId: string }): Promise<SourceSet> {
  const setAccess = await authorize(access.caller, { kind: "parameter_set", id: input.parameterSetId }, "viewer").catch(
    (error: unknown) => {
      if (error instanceof DomainError && error.code === "not_found") return null;
      throw error;
    },
  );
  if (setAccess?.labId !== access.labId) throw NO_SUCH_SET();
  const stored = await getParameterSet(db, { access: setAccess });
  if (!stored) throw NO_SUCH_SET();
  return { id: stored.id, name: stored.name, version: stored.version, edited: !isDeepStrictEqual(stored.params, input.payload.params) };
}

/** POST /api/runs (editor) → 201 { item }: stores the run and puts its job on the queue. */
export const POST = apiRoute(async (request) => {
  const caller = await requireCaller(request);
  const input = await readJson(request, submitRunSchema);
  const access = await authorizeLab(caller, input.labId, "editor");
  const handler = runKindHandler(input.kind)!;
  const set = input.parameterSetId ? await sourceSet(access, { ...input, parameterSetId: input.parameterSetId }) : null;
  const item = await createRun(db, {
    access,
    run: {
      kind: input.kind,
      title: handler.describe(input.payload),
      payload: input.payload as Record<string, unknown>,
      cells: handler.cells(input.payload),
      parameterSetId: set?.id ?? null,
      parameterSetName: set?.name ?? null,
      parameterSetVersion: set?.version ?? null,
      paramsEdited: set?.edited ?? false,
      engineVersion: ENGINE_VERSION,
    },
  });
  try {
    await enqueueRun({ id: item.id, kind: input.kind, payload: input.payload });
  } catch (error) {
    console.error("[runs] cannot queue run", item.id, error);
    await markRunUnqueued(db, { access, runId: item.id, error: "The job queue could not take the run; submit it again." });
    throw new DomainError("db_unavailable", "The job queue is unavailable; try again shortly.");
  }
  return json({ item }, 201);
});
