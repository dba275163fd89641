import { and, desc, eq } from "drizzle-orm";
import { DomainError, notFound } from "@/lib/contracts/errors";
import type { SavePlanInput, SavedPlan, SavedPlanBody } from "@/lib/contracts/plans";
import type { Executor } from "../executor";
import { parameterSets, parameterSetVersions, plans, users } from "../schema";
import { recordAudit } from "./audit";
import type { ResourceAccess } from "@/lib/contracts/access";

/*
 * Measurement plans saved with a parameter set. Every query takes the proof authorize() made for
 * the set, joins the set and filters on both its id and its lab.
 */

type SetAccess = ResourceAccess<"parameter_set">;

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

/** The set's plans, newest first. */
export async function listPlans(db: Executor, options: { access: SetAccess }): Promise<SavedPlan[]> {
  const { access } = options;
  const rows = await db
    .select(columns)
    .from(plans)
    .innerJoin(parameterSets, eq(parameterSets.id, plans.setId))
    .innerJoin(users, eq(users.id, plans.createdById))
    .where(and(eq(plans.setId, access.id), eq(parameterSets.labId, access.labId)))
    .orderBy(desc(plans.createdAt), desc(plans.id));
  return rows.map(toDto);
}

/** One plan of the set; null when the set has no plan with this id. */
export async function getPlan(db: Executor, options: { access: SetAccess; id: string }): Promise<SavedPlan | null> {
  const { access } = options;
  const [row] = await db
    .select(columns)
    .from(plans)
    .innerJoin(parameterSets, eq(parameterSets.id, plans.setId))
    .innerJoin(users, eq(users.id, plans.createdById))
    .where(and(eq(plans.id, options.id), eq(plans.setId, access.id), eq(parameterSets.labId, access.labId)))
    .limit(1);
  return row ? toDto(row) : null;
}

export async function savePlan(db: Executor, options: { access: SetAccess; input: SavePlanInput }): Promise<SavedPlan> {
  const { access, input } = options;
  const { caller, id: setId, labId } = access;
  const id = await db.transaction(async (tx) => {
    // A plan names the version it was made for; one the set never had would mislead every reader.
    const [version] = await tx
      .select({ version: parameterSetVersions.version })
      .from(parameterSetVersions)
      .where(and(eq(parameterSetVersions.setId, setId), eq(parameterSetVersions.version, input.setVersion)))
      .limit(1);
    if (!version) {
      throw new DomainError("validation", `This parameter set has no version ${input.setVersion}.`, {
        fields: { setVersion: `No version ${input.setVersion} of this set.` },
      });
    }
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
  const saved = await getPlan(db, { access, id });
  if (!saved) throw new Error("saved plan not found");
  return saved;
}

export async function deletePlan(db: Executor, options: { access: SetAccess; id: string }): Promise<void> {
  const { access, id } = options;
  const { caller, id: setId, labId } = access;
  const existing = await getPlan(db, { access, id });
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
