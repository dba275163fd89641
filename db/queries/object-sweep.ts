import { and, eq, inArray, lt, notExists, or, sql } from "drizzle-orm";
import type { ObjectStore } from "@/lib/storage/object-store";
import type { Executor } from "../executor";
import { measurementSets, pendingObjectDeletes } from "../schema";

/*
 * The sweep of objects no row refers to (pendingObjectDeletes in db/schema.ts): deletes of sets
 * whose object could not be removed at once, and uploads whose import never committed. An upload
 * row is swept only after UPLOAD_GRACE_MS, so an import in progress keeps its object.
 */

const UPLOAD_GRACE_MS = 15 * 60 * 1000;
const BATCH = 100;

/** Removes the due pending objects (or just `keys`) that no measurement set names; the number removed. */
export async function sweepObjects(db: Executor, options: { store: ObjectStore; keys?: string[] }): Promise<number> {
  const orphan = notExists(
    db.select({ id: measurementSets.id }).from(measurementSets).where(eq(measurementSets.objectKey, pendingObjectDeletes.objectKey)),
  );
  const due = or(eq(pendingObjectDeletes.reason, "delete"), lt(pendingObjectDeletes.createdAt, new Date(Date.now() - UPLOAD_GRACE_MS)));
  const rows = await db
    .select({ objectKey: pendingObjectDeletes.objectKey })
    .from(pendingObjectDeletes)
    .where(and(orphan, options.keys ? inArray(pendingObjectDeletes.objectKey, options.keys) : due))
    .limit(BATCH);
  let removed = 0;
  let firstError: unknown = null;
  for (const { objectKey } of rows) {
    try {
      await options.store.delete(objectKey);
      await db.delete(pendingObjectDeletes).where(eq(pendingObjectDeletes.objectKey, objectKey));
      removed++;
    } catch (error) {
      firstError ??= error;
      await db
        .update(pendingObjectDeletes)
        .set({
          attempts: sql`${pendingObjectDeletes.attempts} + 1`,
          lastError: (error instanceof Error ? error.message : String(error)).slice(0, 500),
        })
        .where(eq(pendingObjectDeletes.objectKey, objectKey));
    }
  }
  if (firstError && options.keys) throw firstError;
  return removed;
}
