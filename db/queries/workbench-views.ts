import "server-only";
import { and, eq } from "drizzle-orm";
import { notFound } from "@/lib/contracts/errors";
import type { MyWorkbenchView } from "@/lib/contracts/workbench-views";
import { db } from "../client";
import { parameterSets, workbenchViews } from "../schema";
import type { Caller } from "@/lib/contracts/access";

/*
 * One workbench view per person and set. Callers pass the lab they were authorized for
 * (requireLabRole), and every query filters the set on it, so a set of another lab finds nothing.
 * The lab's shared view is the set's own view_state column; it is read here and written only by
 * saveParameterSetViewState (editors, audited).
 */

const NOT_FOUND = "No such parameter set.";

interface Scope {
  caller: Caller;
  setId: string;
  labId: string;
}

export async function getMyWorkbenchView(options: Scope): Promise<MyWorkbenchView> {
  const [row] = await db
    .select({ shared: parameterSets.viewState, mine: workbenchViews.viewState, updatedAt: workbenchViews.updatedAt })
    .from(parameterSets)
    .leftJoin(workbenchViews, and(eq(workbenchViews.setId, parameterSets.id), eq(workbenchViews.userId, options.caller.id)))
    .where(and(eq(parameterSets.id, options.setId), eq(parameterSets.labId, options.labId)))
    .limit(1);
  if (!row) throw notFound(NOT_FOUND);
  return {
    setId: options.setId,
    viewState: row.mine ?? null,
    updatedAt: row.updatedAt?.toISOString() ?? null,
    sharedViewState: row.shared ?? null,
  };
}

/** Creates or replaces the caller's own view of a set. */
export async function saveMyWorkbenchView(options: Scope & { viewState: Record<string, unknown> }): Promise<MyWorkbenchView> {
  const [set] = await db
    .select({ id: parameterSets.id })
    .from(parameterSets)
    .where(and(eq(parameterSets.id, options.setId), eq(parameterSets.labId, options.labId)))
    .limit(1);
  if (!set) throw notFound(NOT_FOUND);
  const now = new Date();
  await db
    .insert(workbenchViews)
    .values({ userId: options.caller.id, setId: options.setId, viewState: options.viewState, updatedAt: now })
    .onConflictDoUpdate({ target: [workbenchViews.userId, workbenchViews.setId], set: { viewState: options.viewState, updatedAt: now } });
  return getMyWorkbenchView(options);
}

/** "Reset view": forgets the caller's own view, so the lab's shared view applies again. */
export async function deleteMyWorkbenchView(options: Scope): Promise<MyWorkbenchView> {
  await db.delete(workbenchViews).where(and(eq(workbenchViews.userId, options.caller.id), eq(workbenchViews.setId, options.setId)));
  return getMyWorkbenchView(options);
}
