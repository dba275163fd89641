import "server-only";
import { and, desc, eq, inArray, sql } from "drizzle-orm";
import type { LabRole } from "@/lib/contracts/roles";
import type { LabRunDetail, LabRunSummary } from "@/lib/contracts/lab-runs";
import { db } from "../client";
import { labMemberships, labRunResults, labRuns, labs, users, type LabRun, type NewLabRun } from "../schema";
import { type SiteRole } from "@/lib/contracts/roles";
import { recordAudit } from "./audit";

/*
 * Lab runs as the API sees them. Authorization is done by the route (requireLabRole on the run's
 * lab); the list query also restricts itself to the caller's labs in its WHERE.
 */

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
    cancelRequested: r.cancelRequested,
    error: r.error,
    workerId: r.workerId,
    attempt: r.attempt,
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

export async function createRun(options: { run: NewLabRun; role: LabRole; actorId: string }): Promise<LabRunSummary> {
  return db.transaction(async (tx) => {
    const [created] = await tx.insert(labRuns).values(options.run).returning();
    await recordAudit({
      tx,
      entry: {
        actorId: options.actorId,
        action: "run.submit",
        targetType: "lab_run",
        targetId: created!.id,
        labId: created!.labId,
        details: { kind: created!.kind, cells: created!.cells },
      },
    });
    const [row] = await tx
      .select(columns)
      .from(labRuns)
      .innerJoin(labs, eq(labs.id, labRuns.labId))
      .innerJoin(users, eq(users.id, labRuns.submittedById))
      .where(eq(labRuns.id, created!.id));
    return toSummary(row!, options.role);
  });
}

/** The send to the queue failed: the run cannot start, say so on the row. */
export async function markRunUnqueued(options: { id: string; error: string }): Promise<void> {
  await db
    .update(labRuns)
    .set({ state: "failed", error: options.error, finishedAt: sql`now()`, updatedAt: sql`now()` })
    .where(eq(labRuns.id, options.id));
}

/** Runs of the caller's labs (or of one lab the route has authorized), newest first. */
export async function listRuns(options: { userId: string; siteRole: SiteRole; labId?: string; limit: number }): Promise<LabRunSummary[]> {
  const roleExpr = options.siteRole === "admin" ? sql<LabRole>`'owner'` : sql<LabRole>`${labMemberships.role}`;
  const base = db
    .select({ ...columns, role: roleExpr })
    .from(labRuns)
    .innerJoin(labs, eq(labs.id, labRuns.labId))
    .innerJoin(users, eq(users.id, labRuns.submittedById))
    .leftJoin(labMemberships, and(eq(labMemberships.labId, labRuns.labId), eq(labMemberships.userId, options.userId)));
  const visible = options.siteRole === "admin" ? sql`true` : sql`${labMemberships.userId} is not null`;
  const rows = await base
    .where(and(visible, options.labId ? eq(labRuns.labId, options.labId) : undefined))
    .orderBy(desc(labRuns.createdAt))
    .limit(options.limit);
  return rows.map((r) => toSummary(r, r.role));
}

/** The lab of a run (for the role check), or null. */
export async function findRunLabId(options: { id: string }): Promise<string | null> {
  const [row] = await db.select({ labId: labRuns.labId }).from(labRuns).where(eq(labRuns.id, options.id)).limit(1);
  return row?.labId ?? null;
}

export async function getRun(options: { id: string; labId: string; role: LabRole }): Promise<LabRunDetail | null> {
  const [row] = await db
    .select(columns)
    .from(labRuns)
    .innerJoin(labs, eq(labs.id, labRuns.labId))
    .innerJoin(users, eq(users.id, labRuns.submittedById))
    .where(and(eq(labRuns.id, options.id), eq(labRuns.labId, options.labId)))
    .limit(1);
  return row ? { ...toSummary(row, options.role), payload: row.run.payload } : null;
}

/**
 * Asks a run to stop. A queued run is cancelled at once; a running one is flagged and its worker
 * stops at its next check (about a second). Returns the state after the request, null if unknown.
 */
export async function requestCancel(options: {
  id: string;
  labId: string;
  actorId: string;
}): Promise<{ state: string; wasQueued: boolean } | null> {
  return db.transaction(async (tx) => {
    const [before] = await tx
      .select({ state: labRuns.state })
      .from(labRuns)
      .where(and(eq(labRuns.id, options.id), eq(labRuns.labId, options.labId)))
      .for("update");
    if (!before) return null;
    if (before.state !== "queued" && before.state !== "running") return { state: before.state, wasQueued: false };
    const queued = before.state === "queued";
    await tx
      .update(labRuns)
      .set({ cancelRequested: true, updatedAt: sql`now()`, ...(queued ? { state: "cancelled" as const, finishedAt: sql`now()` } : {}) })
      .where(and(eq(labRuns.id, options.id), inArray(labRuns.state, ["queued", "running"])));
    await recordAudit({
      tx,
      entry: {
        actorId: options.actorId,
        action: "run.cancel",
        targetType: "lab_run",
        targetId: options.id,
        labId: options.labId,
        details: {},
      },
    });
    return { state: queued ? "cancelled" : "running", wasQueued: queued };
  });
}

export async function getRunResult(options: { id: string; labId: string }) {
  const [row] = await db
    .select({ result: labRunResults })
    .from(labRunResults)
    .innerJoin(labRuns, eq(labRuns.id, labRunResults.runId))
    .where(and(eq(labRunResults.runId, options.id), eq(labRuns.labId, options.labId)))
    .limit(1);
  return row?.result ?? null;
}
