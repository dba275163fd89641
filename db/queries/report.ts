import "server-only";
import { and, desc, eq, isNotNull } from "drizzle-orm";
import { db } from "../client";
import { parameterSets, parameterSetVersions } from "../schema";

/*
 * What the printable report of a set needs beyond the set itself: the newest version that carries
 * a provenance record (a fit, when there is one). Filtered on the lab the caller was authorized for.
 */

export interface ProvenanceRecord {
  version: number;
  createdAt: string;
  provenance: Record<string, unknown>;
}

export async function latestProvenance(options: { setId: string; labId: string }): Promise<ProvenanceRecord | null> {
  const [row] = await db
    .select({
      version: parameterSetVersions.version,
      createdAt: parameterSetVersions.createdAt,
      provenance: parameterSetVersions.provenance,
    })
    .from(parameterSetVersions)
    .innerJoin(parameterSets, eq(parameterSets.id, parameterSetVersions.setId))
    .where(
      and(
        eq(parameterSetVersions.setId, options.setId),
        eq(parameterSets.labId, options.labId),
        isNotNull(parameterSetVersions.provenance),
      ),
    )
    .orderBy(desc(parameterSetVersions.version))
    .limit(1);
  if (!row || !row.provenance) return null;
  return { version: row.version, createdAt: row.createdAt.toISOString(), provenance: row.provenance };
}
