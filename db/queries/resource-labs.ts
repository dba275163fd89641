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

export interface ResourceMembership {
  labId: string;
  labName: string;
  /** The user's own role in the resource's lab; null when not a member. */
  role: LabRole | null;
}

/**
 * The resource's lab and the user's own membership role there, in one query (one round trip per
 * authorization: this runs on every request of the API); null when there is no such resource.
 */
export async function findResourceMembership(
  db: Executor,
  options: { kind: ResourceKind; id: string; userId: string },
): Promise<ResourceMembership | null> {
  const columns = { labId: labs.id, labName: labs.name, role: labMemberships.role };
  const membership = and(eq(labMemberships.labId, labs.id), eq(labMemberships.userId, options.userId));
  if (options.kind === "lab") {
    const [row] = await db.select(columns).from(labs).leftJoin(labMemberships, membership).where(eq(labs.id, options.id)).limit(1);
    return row ?? null;
  }
  const of = LAB_OF[options.kind];
  const [row] = await db
    .select(columns)
    .from(of.table)
    .innerJoin(labs, eq(labs.id, of.labId))
    .leftJoin(labMemberships, membership)
    .where(eq(of.id, options.id))
    .limit(1);
  return row ?? null;
}
