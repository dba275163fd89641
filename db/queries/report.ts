import { and, desc, eq, isNotNull } from "drizzle-orm";
import type { ResourceAccess } from "@/lib/contracts/access";
import type { Executor } from "../executor";
import { parameterSets, parameterSetVersions } from "../schema";

/*
 * What the printable report of a set needs beyond the set itself: the newest version that carries
 * a provenance record (a fit, when there is one). Takes the proof authorize() made for the set and
 * filters on both its id and its lab.
 */

export interface ProvenanceRecord {
  version: number;
  createdAt: string;
  provenance: Record<string, unknown>;
}

export async function latestProvenance(
  db: Executor,
  options: { access: ResourceAccess<"parameter_set"> },
): Promise<ProvenanceRecord | null> {
  const { access } = options;
  const [row] = await db
    .select({
      version: parameterSetVersions.version,
      createdAt: parameterSetVersions.createdAt,
      provenance: parameterSetVersions.provenance,
    })
    .from(parameterSetVersions)
    .innerJoin(parameterSets, eq(parameterSets.id, parameterSetVersions.setId))
    .where(
      and(eq(parameterSetVersions.setId, access.id), eq(parameterSets.labId, access.labId), isNotNull(parameterSetVersions.provenance)),
    )
    .orderBy(desc(parameterSetVersions.version))
    .limit(1);
  if (!row?.provenance) return null;
  return { version: row.version, createdAt: row.createdAt.toISOString(), provenance: row.provenance };
}
