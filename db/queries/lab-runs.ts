import { and, desc, eq, inArray, lt, sql } from "drizzle-orm";
import type { Caller, ResourceAccess } from "@/lib/contracts/access";
import { ACTIVE_LAB_RUN_STATES, isActiveLabRun, type LabRunDetail, type LabRunState, type LabRunSummary } from "@/lib/contracts/lab-runs";
import type { LabRole } from "@/lib/contracts/roles";
import type { Executor } from "../executor";
import {
  type LabRun,
  type LabRunResult,
  labMemberships,
  labRunCheckpoints,
  labRunResults,
  labRuns,
  labs,
  type NewLabRun,
  users,
} from "../schema";
import { recordAudit } from "./audit";

/*
 * Lab runs: the web side (submit, list, read, cancel, result; each lab-scoped query takes the
 * proof lib/auth's authorize made) and the worker side (claim, progress, finish). The web server
 * passes its pooled client, the worker its own Database.
 *
 * Every worker write after the claim names the attempt it belongs to, so a worker whose job was
 * taken over (expired and retried elsewhere) changes nothing, and the result is inserted at most
 * once (primary key on run_id, ON CONFLICT DO NOTHING) in the same transaction that marks the run
 * done.
 */

/** The run still has work ahead (queued or running). */
const isActive = () => inArray(labRuns.state, [...ACTIVE_LAB_RUN_STATES]);

const columns = {
  run: labRuns,
  labName: labs.name,
  submitterName: users.name,
};

type Row = { run: LabRun; labName: string; submitterName: string };

const iso = (d: Date | null) => (d ? d.toISOString() : null);

function toSummary(row: Row, role: LabRole): LabRunSummary {
  const r = row.run;
  return {
    id: r.id,
    labId: r.labId,
    labName: row.labName,
    kind: r.kind,
    title: r.title,
    cells: r.cells,
    state: r.state,
    progress: r.progress,
    progressAtStart: r.progressAtStart,
    cancelRequested: r.cancelRequested,
    error: r.error,
    workerId: r.workerId,
    attempt: r.attempt,
    engineVersion: r.engineVersion,
    submittedBy: { id: r.submittedById, name: row.submitterName },
    parameterSet:
      r.parameterSetVersion !== null
        ? { id: r.parameterSetId, name: r.parameterSetName ?? "", version: r.parameterSetVersion, edited: r.paramsEdited }
        : null,
    createdAt: r.createdAt.toISOString(),
    startedAt: iso(r.startedAt),
    finishedAt: iso(r.finishedAt),
    updatedAt: r.updatedAt.toISOString(),
    role,
  };
}

/** The run as submitted; its lab and submitter come from the access. */
export type NewLabRunInput = Omit<NewLabRun, "labId" | "submittedById">;

/** Stores a run, queued, in the access's lab, submitted by its caller. */
export async function createRun(db: Executor, options: { access: ResourceAccess<"lab">; run: NewLabRunInput }): Promise<LabRunSummary> {
  const { caller, labId, role } = options.access;
  return db.transaction(async (tx) => {
    const [created] = await tx
      .insert(labRuns)
      .values({ ...options.run, labId, submittedById: caller.id })
      .returning();
    if (!created) throw new Error("insert into lab_runs returned no row");
    await recordAudit(tx, {
      entry: {
        actorId: caller.id,
        action: "run.submit",
        targetType: "lab_run",
        targetId: created.id,
        labId: created.labId,
        details: { kind: created.kind, cells: created.cells },
      },
    });
    const [row] = await tx
      .select(columns)
      .from(labRuns)
      .innerJoin(labs, eq(labs.id, labRuns.labId))
      .innerJoin(users, eq(users.id, labRuns.submittedById))
      .where(eq(labRuns.id, created.id));
    if (!row) throw new Error("lab run missing right after its insert");
    return toSummary(row, role);
  });
}

/** The send to the queue failed: the run cannot start, say so on the row. */
export async function markRunUnqueued(
  db: Executor,
  options: { access: ResourceAccess<"lab">; runId: string; error: string },
): Promise<void> {
  await db
    .update(labRuns)
    .set({ state: "failed", error: options.error, finishedAt: sql`now()`, updatedAt: sql`now()` })
    .where(and(eq(labRuns.id, options.runId), eq(labRuns.labId, options.access.labId)));
}

/** Runs of the caller's labs (or of the one lab of `access`), newest first. */
export async function listRuns(
  db: Executor,
  options: { caller: Caller; access?: ResourceAccess<"lab">; limit: number },
): Promise<LabRunSummary[]> {
  const { caller } = options;
  const isAdmin = caller.siteRole === "admin";
  const roleExpr = isAdmin ? sql<LabRole>`'owner'` : sql<LabRole>`${labMemberships.role}`;
  const visible = isAdmin ? sql`true` : sql`${labMemberships.userId} is not null`;
  const rows = await db
    .select({ ...columns, role: roleExpr })
    .from(labRuns)
    .innerJoin(labs, eq(labs.id, labRuns.labId))
    .innerJoin(users, eq(users.id, labRuns.submittedById))
    .leftJoin(labMemberships, and(eq(labMemberships.labId, labRuns.labId), eq(labMemberships.userId, caller.id)))
    .where(and(visible, options.access ? eq(labRuns.labId, options.access.labId) : undefined))
    .orderBy(desc(labRuns.createdAt))
    .limit(options.limit);
  return rows.map((r) => toSummary(r, r.role));
}

const ofAccess = (access: ResourceAccess<"lab_run">) => and(eq(labRuns.id, access.id), eq(labRuns.labId, access.labId));

export async function getRun(db: Executor, options: { access: ResourceAccess<"lab_run"> }): Promise<LabRunDetail | null> {
  const [row] = await db
    .select(columns)
    .from(labRuns)
    .innerJoin(labs, eq(labs.id, labRuns.labId))
    .innerJoin(users, eq(users.id, labRuns.submittedById))
    .where(ofAccess(options.access))
    .limit(1);
  return row ? { ...toSummary(row, options.access.role), payload: row.run.payload } : null;
}

/**
 * Asks a run to stop, as the access's caller. A queued run is cancelled at once; a running one is
 * flagged and its worker stops at its next check (about a second). Returns the state after the
 * request, null if unknown.
 */
export async function requestCancel(
  db: Executor,
  options: { access: ResourceAccess<"lab_run"> },
): Promise<{ state: LabRunState; wasQueued: boolean } | null> {
  const { access } = options;
  return db.transaction(async (tx) => {
    const [before] = await tx.select({ state: labRuns.state }).from(labRuns).where(ofAccess(access)).for("update");
    if (!before) return null;
    if (!isActiveLabRun(before.state)) return { state: before.state, wasQueued: false };
    const queued = before.state === "queued";
    await tx
      .update(labRuns)
      .set({ cancelRequested: true, updatedAt: sql`now()`, ...(queued ? { state: "cancelled" as const, finishedAt: sql`now()` } : {}) })
      .where(and(ofAccess(access), isActive()));
    if (queued) await tx.delete(labRunCheckpoints).where(eq(labRunCheckpoints.runId, access.id));
    await recordAudit(tx, {
      entry: {
        actorId: access.caller.id,
        action: "run.cancel",
        targetType: "lab_run",
        targetId: access.id,
        labId: access.labId,
        details: {},
      },
    });
    return { state: queued ? ("cancelled" as const) : ("running" as const), wasQueued: queued };
  });
}

export async function getRunResult(db: Executor, options: { access: ResourceAccess<"lab_run"> }): Promise<LabRunResult | null> {
  const [row] = await db
    .select({ result: labRunResults })
    .from(labRunResults)
    .innerJoin(labRuns, eq(labRuns.id, labRunResults.runId))
    .where(ofAccess(options.access))
    .limit(1);
  return row?.result ?? null;
}

// The worker's side. It acts on the run id its job carries: the job queue, not a caller, names it.

export interface Claim {
  attempt: number;
  kind: string;
  payload: unknown;
  cells: number;
  engineVersion: string;
}

/** What a worker may read before claiming: the engine version the run was made for, while it is still active. */
export async function runToTake(db: Executor, options: { runId: string }): Promise<{ engineVersion: string } | null> {
  const [row] = await db
    .select({ engineVersion: labRuns.engineVersion })
    .from(labRuns)
    .where(and(eq(labRuns.id, options.runId), isActive(), eq(labRuns.cancelRequested, false)));
  return row ?? null;
}

/**
 * A job this worker will not compute (another engine version, or the worker is stopping before it
 * began) goes back to waiting: the row says why, and the attempt it did not make is not counted.
 */
export async function noteHandedBack(db: Executor, options: { runId: string; note: string }): Promise<void> {
  await db
    .update(labRuns)
    .set({ error: options.note, updatedAt: sql`now()` })
    .where(and(eq(labRuns.id, options.runId), eq(labRuns.state, "queued")));
}

/** Takes the run for this worker; null when it is cancelled, finished or unknown. */
export async function claimRun(db: Executor, options: { runId: string; workerId: string }): Promise<Claim | null> {
  const rows = await db
    .update(labRuns)
    .set({
      state: "running",
      attempt: sql`${labRuns.attempt} + 1`,
      workerId: options.workerId,
      progress: 0,
      progressAtStart: 0,
      startedAt: sql`now()`,
      updatedAt: sql`now()`,
    })
    .where(and(eq(labRuns.id, options.runId), isActive(), eq(labRuns.cancelRequested, false)))
    .returning({
      attempt: labRuns.attempt,
      kind: labRuns.kind,
      payload: labRuns.payload,
      cells: labRuns.cells,
      engineVersion: labRuns.engineVersion,
    });
  return rows[0] ?? null;
}

/** A run that could not be claimed because cancel was asked is marked cancelled. */
export async function markCancelledIfRequested(db: Executor, options: { runId: string }): Promise<void> {
  await db
    .update(labRuns)
    .set({ state: "cancelled", finishedAt: sql`now()`, updatedAt: sql`now()` })
    .where(and(eq(labRuns.id, options.runId), isActive(), eq(labRuns.cancelRequested, true)));
  await db.delete(labRunCheckpoints).where(eq(labRunCheckpoints.runId, options.runId));
}

/** An attempt's own run, still running: the condition of every write after the claim. */
const ownRunning = (options: { runId: string; attempt: number }) =>
  and(eq(labRuns.id, options.runId), eq(labRuns.attempt, options.attempt), eq(labRuns.state, "running"));

/**
 * Writes progress and reads back whether to stop: "cancel" when cancel was asked, "lost" when
 * another attempt owns the run now.
 */
export async function heartbeat(
  db: Executor,
  options: { runId: string; attempt: number; progress: number },
): Promise<"go" | "cancel" | "lost"> {
  const rows = await db
    .update(labRuns)
    .set({ progress: options.progress, updatedAt: sql`now()` })
    .where(ownRunning(options))
    .returning({ cancel: labRuns.cancelRequested });
  const row = rows[0];
  if (!row) return "lost";
  return row.cancel ? "cancel" : "go";
}

/**
 * Saves one finished chunk of the attempt's run. A chunk is the same whichever attempt computed it,
 * so a second save of the same chunk changes nothing; an attempt that no longer owns the run saves
 * nothing.
 */
export async function saveCheckpoint(
  db: Executor,
  options: { runId: string; attempt: number; chunkIndex: number; meta: Record<string, unknown>; data: Buffer },
): Promise<boolean> {
  const rows = await db.execute<{ chunk_index: number }>(sql`
    insert into ${labRunCheckpoints} (run_id, chunk_index, attempt, meta, data)
    select ${options.runId}, ${options.chunkIndex}, ${options.attempt}, ${JSON.stringify(options.meta)}::jsonb, ${options.data}
    where exists (
      select 1 from ${labRuns}
      where ${labRuns.id} = ${options.runId} and ${labRuns.attempt} = ${options.attempt} and ${labRuns.state} = 'running'
    )
    on conflict do nothing
    returning chunk_index`);
  return rows.rows.length > 0;
}

/** An attempt that resumes from saved chunks starts at their share of the run (the time left counts from there). */
export async function markResumed(db: Executor, options: { runId: string; attempt: number; progress: number }): Promise<void> {
  await db
    .update(labRuns)
    .set({ progress: options.progress, progressAtStart: options.progress, updatedAt: sql`now()` })
    .where(ownRunning(options));
}

/** The saved chunks of a run, by chunk index. */
export async function loadCheckpoints(
  db: Executor,
  options: { runId: string },
): Promise<{ chunkIndex: number; meta: Record<string, unknown>; data: Buffer }[]> {
  return db
    .select({ chunkIndex: labRunCheckpoints.chunkIndex, meta: labRunCheckpoints.meta, data: labRunCheckpoints.data })
    .from(labRunCheckpoints)
    .where(eq(labRunCheckpoints.runId, options.runId));
}

/** Marks the run done and stores its result; false when the attempt no longer owns the run. */
export async function finishRun(
  db: Executor,
  options: {
    runId: string;
    attempt: number;
    workerId: string;
    meta: Record<string, unknown>;
    data: Buffer;
    computeMs: number;
    engineVersion: string;
  },
): Promise<boolean> {
  return db.transaction(async (tx) => {
    const owned = await tx
      .update(labRuns)
      .set({ state: "done", progress: 1, error: null, workerId: options.workerId, finishedAt: sql`now()`, updatedAt: sql`now()` })
      .where(ownRunning(options))
      .returning({ id: labRuns.id });
    if (owned.length === 0) return false;
    await tx
      .insert(labRunResults)
      .values({
        runId: options.runId,
        workerId: options.workerId,
        attempt: options.attempt,
        meta: options.meta,
        data: options.data,
        computeMs: options.computeMs,
        engineVersion: options.engineVersion,
      })
      .onConflictDoNothing({ target: labRunResults.runId });
    await tx.delete(labRunCheckpoints).where(eq(labRunCheckpoints.runId, options.runId));
    return true;
  });
}

/** Ends the attempt: failed or cancelled for good, or queued again for a retry. */
export async function endRun(
  db: Executor,
  options: { runId: string; attempt: number; state: "failed" | "cancelled" | "queued"; error?: string },
): Promise<void> {
  const final = options.state !== "queued";
  const ended = await db
    .update(labRuns)
    .set({ state: options.state, error: options.error ?? null, updatedAt: sql`now()`, ...(final ? { finishedAt: sql`now()` } : {}) })
    .where(ownRunning(options))
    .returning({ id: labRuns.id });
  // Checkpoints serve a retry; a run that ended for good has none ahead.
  if (final && ended.length > 0) await db.delete(labRunCheckpoints).where(eq(labRunCheckpoints.runId, options.runId));
}

/**
 * Running runs whose worker stopped writing progress (it died). The update is the arbiter between
 * workers sweeping at the same time: only the one whose update matched hands the job back.
 */
export async function releaseSilentRuns(
  db: Executor,
  options: { silentSeconds: number },
): Promise<{ id: string; workerId: string | null }[]> {
  return db
    .update(labRuns)
    .set({
      state: "queued",
      error: sql`'The worker ' || coalesce(${labRuns.workerId}, '?') || ' stopped answering; the run is queued again.'`,
      updatedAt: sql`now()`,
    })
    .where(and(eq(labRuns.state, "running"), lt(labRuns.updatedAt, sql`now() - make_interval(secs => ${options.silentSeconds})`)))
    .returning({ id: labRuns.id, workerId: labRuns.workerId });
}

/** Runs still active that nobody has touched for a while: candidates for the sweep. */
export async function staleRuns(db: Executor, options: { olderThanSeconds: number }): Promise<{ id: string; state: LabRunState }[]> {
  return db
    .select({ id: labRuns.id, state: labRuns.state })
    .from(labRuns)
    .where(and(isActive(), lt(labRuns.updatedAt, sql`now() - make_interval(secs => ${options.olderThanSeconds})`)))
    .limit(100);
}

/** Closes an active run whose job the queue has given up on or cancelled. */
export async function closeStaleRun(
  db: Executor,
  options: { runId: string; state: "failed" | "cancelled"; error: string | null },
): Promise<void> {
  await db
    .update(labRuns)
    .set({ state: options.state, error: options.error, finishedAt: sql`now()`, updatedAt: sql`now()` })
    .where(and(eq(labRuns.id, options.runId), isActive()));
  await db.delete(labRunCheckpoints).where(eq(labRunCheckpoints.runId, options.runId));
}
