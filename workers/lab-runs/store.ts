import { and, eq, inArray, lt, sql } from "drizzle-orm";
import type { Database } from "@/db/connection";
import { labRunResults, labRuns } from "@/db/schema";

/*
 * The worker's reads and writes of lab_runs / lab_run_results. Every write after the claim names
 * the attempt it belongs to, so a worker whose job was taken over (expired and retried elsewhere)
 * changes nothing, and the result is inserted at most once (primary key on run_id, ON CONFLICT DO
 * NOTHING) in the same transaction that marks the run done.
 */

export interface Claim {
  attempt: number;
  kind: string;
  payload: unknown;
  cells: number;
}

/** Takes the run for this worker; null when it is cancelled, finished or unknown. */
export async function claimRun(db: Database, options: { runId: string; workerId: string }): Promise<Claim | null> {
  const rows = await db
    .update(labRuns)
    .set({
      state: "running",
      attempt: sql`${labRuns.attempt} + 1`,
      workerId: options.workerId,
      progress: 0,
      startedAt: sql`now()`,
      updatedAt: sql`now()`,
    })
    .where(and(eq(labRuns.id, options.runId), inArray(labRuns.state, ["queued", "running"]), eq(labRuns.cancelRequested, false)))
    .returning({ attempt: labRuns.attempt, kind: labRuns.kind, payload: labRuns.payload, cells: labRuns.cells });
  return rows[0] ?? null;
}

/** Whether a run that could not be claimed was cancelled (so it is marked so). */
export async function markCancelledIfRequested(db: Database, options: { runId: string }): Promise<void> {
  await db
    .update(labRuns)
    .set({ state: "cancelled", finishedAt: sql`now()`, updatedAt: sql`now()` })
    .where(and(eq(labRuns.id, options.runId), inArray(labRuns.state, ["queued", "running"]), eq(labRuns.cancelRequested, true)));
}

/**
 * Writes progress and reads back whether to stop: "cancel" when cancel was asked, "lost" when
 * another attempt owns the run now.
 */
export async function heartbeat(
  db: Database,
  options: { runId: string; attempt: number; progress: number },
): Promise<"go" | "cancel" | "lost"> {
  const rows = await db
    .update(labRuns)
    .set({ progress: options.progress, updatedAt: sql`now()` })
    .where(and(eq(labRuns.id, options.runId), eq(labRuns.attempt, options.attempt), eq(labRuns.state, "running")))
    .returning({ cancel: labRuns.cancelRequested });
  const row = rows[0];
  if (!row) return "lost";
  return row.cancel ? "cancel" : "go";
}

export async function finishRun(
  db: Database,
  options: { runId: string; attempt: number; workerId: string; meta: Record<string, unknown>; data: Buffer; computeMs: number },
): Promise<boolean> {
  return db.transaction(async (tx) => {
    const owned = await tx
      .update(labRuns)
      .set({ state: "done", progress: 1, error: null, workerId: options.workerId, finishedAt: sql`now()`, updatedAt: sql`now()` })
      .where(and(eq(labRuns.id, options.runId), eq(labRuns.attempt, options.attempt), eq(labRuns.state, "running")))
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
      })
      .onConflictDoNothing({ target: labRunResults.runId });
    return true;
  });
}

export async function endRun(
  db: Database,
  options: { runId: string; attempt: number; state: "failed" | "cancelled" | "queued"; error?: string },
): Promise<void> {
  const final = options.state !== "queued";
  await db
    .update(labRuns)
    .set({ state: options.state, error: options.error ?? null, updatedAt: sql`now()`, ...(final ? { finishedAt: sql`now()` } : {}) })
    .where(and(eq(labRuns.id, options.runId), eq(labRuns.attempt, options.attempt), eq(labRuns.state, "running")));
}

/**
 * Running runs whose worker stopped writing progress (it died). The update is the arbiter between
 * workers sweeping at the same time: only the one whose update matched hands the job back.
 */
export async function releaseSilentRuns(
  db: Database,
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

/** Runs still marked queued/running that nobody has touched for a while: candidates for the sweep. */
export async function staleRuns(db: Database, options: { olderThanSeconds: number }): Promise<{ id: string; state: string }[]> {
  return db
    .select({ id: labRuns.id, state: labRuns.state })
    .from(labRuns)
    .where(
      and(
        inArray(labRuns.state, ["queued", "running"]),
        lt(labRuns.updatedAt, sql`now() - make_interval(secs => ${options.olderThanSeconds})`),
      ),
    )
    .limit(100);
}

export async function closeStaleRun(
  db: Database,
  options: { runId: string; state: "failed" | "cancelled"; error: string | null },
): Promise<void> {
  await db
    .update(labRuns)
    .set({ state: options.state, error: options.error, finishedAt: sql`now()`, updatedAt: sql`now()` })
    .where(and(eq(labRuns.id, options.runId), inArray(labRuns.state, ["queued", "running"])));
}
