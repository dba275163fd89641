import "server-only";
import { and, desc, eq } from "drizzle-orm";
import { notFound } from "@/lib/contracts/errors";
import type { SavePlanInput, SavedPlan, SavedPlanBody } from "@/lib/contracts/plans";
import { db } from "../client";
import { parameterSets, plans, users } from "../schema";
import { recordAudit } from "./audit";
import type { Caller } from "@/lib/contracts/access";

/*
 * Measurement plans saved with a parameter set. Callers pass the set's lab they were authorized
 * for; every query joins the set and filters on that lab.
 */

const NOT_FOUND = "No such plan.";

const columns = {
  id: plans.id,
  setId: plans.setId,
  setVersion: plans.setVersion,
  name: plans.name,
  request: plans.request,
  plan: plans.plan,
  createdAt: plans.createdAt,
  createdById: users.id,
  createdByName: users.name,
};

type Row = { [K in keyof typeof columns]: (typeof columns)[K]["_"]["data"] };

const toDto = (row: Row): SavedPlan => ({
  id: row.id,
  setId: row.setId,
  setVersion: row.setVersion,
  name: row.name,
  request: row.request,
  plan: row.plan as unknown as SavedPlanBody,
  createdBy: { id: row.createdById, name: row.createdByName },
  createdAt: row.createdAt.toISOString(),
});

/** Newest first. */
export async function listPlans(options: { setId: string; labId: string }): Promise<SavedPlan[]> {
  const rows = await db
    .select(columns)
    .from(plans)
    .innerJoin(parameterSets, eq(parameterSets.id, plans.setId))
    .innerJoin(users, eq(users.id, plans.createdById))
    .where(and(eq(plans.setId, options.setId), eq(parameterSets.labId, options.labId)))
    .orderBy(desc(plans.createdAt), desc(plans.id));
  return rows.map(toDto);
}

export async function getPlan(options: { id: string; setId: string; labId: string }): Promise<SavedPlan | null> {
  const [row] = await db
    .select(columns)
    .from(plans)
    .innerJoin(parameterSets, eq(parameterSets.id, plans.setId))
    .innerJoin(users, eq(users.id, plans.createdById))
    .where(and(eq(plans.id, options.id), eq(plans.setId, options.setId), eq(parameterSets.labId, options.labId)))
    .limit(1);
  return row ? toDto(row) : null;
}

export async function savePlan(options: { caller: Caller; setId: string; labId: string; input: SavePlanInput }): Promise<SavedPlan> {
  const { caller, setId, labId, input } = options;
  const id = await db.transaction(async (tx) => {
    const [row] = await tx
      .insert(plans)
      .values({
        setId,
        setVersion: input.setVersion,
        name: input.name,
        request: input.request as unknown as Record<string, unknown>,
        plan: input.plan as unknown as Record<string, unknown>,
        createdById: caller.id,
      })
      .returning({ id: plans.id });
    if (!row) throw new Error("insert into plans returned no row");
    await recordAudit(tx, {
      entry: { actorId: caller.id, action: "plan.save", targetType: "plan", targetId: row.id, labId, details: { setId, name: input.name } },
    });
    return row.id;
  });
  const saved = await getPlan({ id, setId, labId });
  if (!saved) throw new Error("saved plan not found");
  return saved;
}

export async function deletePlan(options: { caller: Caller; id: string; setId: string; labId: string }): Promise<void> {
  const { caller, id, setId, labId } = options;
  const existing = await getPlan({ id, setId, labId });
  if (!existing) throw notFound(NOT_FOUND);
  await db.transaction(async (tx) => {
    await tx.delete(plans).where(and(eq(plans.id, id), eq(plans.setId, setId)));
    await recordAudit(tx, {
      entry: {
        actorId: caller.id,
        action: "plan.delete",
        targetType: "plan",
        targetId: id,
        labId,
        details: { setId, name: existing.name },
      },
    });
  });
}
