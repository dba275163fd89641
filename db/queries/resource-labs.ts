import { and, eq } from "drizzle-orm";
import type { ResourceKind } from "@/lib/contracts/access";
import type { LabRole } from "@/lib/contracts/roles";
import type { Executor } from "../executor";
import { labMemberships, labRuns, labs, lightSources, measurementSets, parameterSets } from "../schema";

/*
 * The one lookup behind authorization (lib/auth/access.ts authorize): which lab a resource belongs
 * to, and the user's own membership role there. Nothing else resolves a resource to its lab.
 */

const LAB_OF = {
  parameter_set: { table: parameterSets, id: parameterSets.id, labId: parameterSets.labId },
  measurement_set: { table: measurementSets, id: measurementSets.id, labId: measurementSets.labId },
  light_source: { table: lightSources, id: lightSources.id, labId: lightSources.labId },
  lab_run: { table: labRuns, id: labRuns.id, labId: labRuns.labId },
} as const;

/** The lab a resource belongs to; null when there is no such resource. */
export async function findResourceLabId(db: Executor, options: { kind: ResourceKind; id: string }): Promise<string | null> {
  if (options.kind === "lab") return options.id;
  const of = LAB_OF[options.kind];
  const [row] = await db.select({ labId: of.labId }).from(of.table).where(eq(of.id, options.id)).limit(1);
  return row?.labId ?? null;
}

/** A lab and the user's own membership role in it (null when not a member); null when no such lab. */
export async function findLabMembership(
  db: Executor,
  options: { labId: string; userId: string },
): Promise<{ labId: string; labName: string; role: LabRole | null } | null> {
  const [row] = await db
    .select({ labId: labs.id, labName: labs.name, role: labMemberships.role })
    .from(labs)
    .leftJoin(labMemberships, and(eq(labMemberships.labId, labs.id), eq(labMemberships.userId, options.userId)))
    .where(eq(labs.id, options.labId))
    .limit(1);
  return row ?? null;
}
