import { and, eq } from "drizzle-orm";
import { notFound } from "@/lib/contracts/errors";
import type { MyWorkbenchView } from "@/lib/contracts/workbench-views";
import type { ResourceAccess } from "@/lib/contracts/access";
import type { Executor } from "../executor";
import { parameterSets, workbenchViews } from "../schema";
import { selectSetInLab } from "./parameter-sets";

/*
 * One workbench view per person and set. Every query takes the proof authorize() made for the set
 * (the person is the proof's caller) and filters the set on both its id and its lab.
 * The lab's shared view is the set's own view_state column; it is read here and written only by
 * saveParameterSetViewState (editors, audited).
 */

const NOT_FOUND = "No such parameter set.";

interface Scope {
  access: ResourceAccess<"parameter_set">;
}

export async function getMyWorkbenchView(db: Executor, options: Scope): Promise<MyWorkbenchView> {
  const { access } = options;
  const [row] = await db
    .select({ shared: parameterSets.viewState, mine: workbenchViews.viewState, updatedAt: workbenchViews.updatedAt })
    .from(parameterSets)
    .leftJoin(workbenchViews, and(eq(workbenchViews.setId, parameterSets.id), eq(workbenchViews.userId, access.caller.id)))
    .where(and(eq(parameterSets.id, access.id), eq(parameterSets.labId, access.labId)))
    .limit(1);
  if (!row) throw notFound(NOT_FOUND);
  return {
    setId: access.id,
    viewState: row.mine ?? null,
    updatedAt: row.updatedAt?.toISOString() ?? null,
    sharedViewState: row.shared ?? null,
  };
}

/** Creates or replaces the caller's own view of a set. */
export async function saveMyWorkbenchView(db: Executor, options: Scope & { viewState: Record<string, unknown> }): Promise<MyWorkbenchView> {
  const { access } = options;
  const [set] = await selectSetInLab(db, access).limit(1);
  if (!set) throw notFound(NOT_FOUND);
  const now = new Date();
  await db
    .insert(workbenchViews)
    .values({ userId: access.caller.id, setId: access.id, viewState: options.viewState, updatedAt: now })
    .onConflictDoUpdate({ target: [workbenchViews.userId, workbenchViews.setId], set: { viewState: options.viewState, updatedAt: now } });
  return getMyWorkbenchView(db, { access });
}

/** "Reset view": forgets the caller's own view, so the lab's shared view applies again. */
export async function deleteMyWorkbenchView(db: Executor, options: Scope): Promise<MyWorkbenchView> {
  const { access } = options;
  await db.delete(workbenchViews).where(and(eq(workbenchViews.userId, access.caller.id), eq(workbenchViews.setId, access.id)));
  return getMyWorkbenchView(db, { access });
}
