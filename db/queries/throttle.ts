import { and, count, eq, gt, lt, sql } from "drizzle-orm";
import type { Executor } from "../executor";
import { requestThrottle } from "../schema";

/*
 * A small sliding-window counter in PostgreSQL for requests that create accounts or send mail: at
 * most `max` per `windowMs` per (kind, key). Kept in the database, like the sign-in failures, so
 * the limit holds across restarts and several server processes. The count and the insert run in
 * one transaction under an advisory lock on (kind, key): simultaneous requests queue and each sees
 * the slots taken before it, so 20 at once against a limit of 5 get exactly 5.
 */

/** Takes one slot of the window; false (and nothing recorded) when the window is full. */
export async function takeThrottleSlot(
  db: Executor,
  options: { kind: string; key: string; max: number; windowMs: number },
): Promise<boolean> {
  const key = options.key.trim().toLowerCase().slice(0, 320);
  return db.transaction(async (tx) => {
    await tx.execute(sql`select pg_advisory_xact_lock(hashtextextended(${`throttle ${options.kind} ${key}`}, 0))`);
    const since = new Date(Date.now() - options.windowMs);
    const [row] = await tx
      .select({ n: count() })
      .from(requestThrottle)
      .where(and(eq(requestThrottle.kind, options.kind), eq(requestThrottle.key, key), gt(requestThrottle.at, since)));
    if ((row?.n ?? 0) >= options.max) return false;
    await tx.insert(requestThrottle).values({ kind: options.kind, key });
    // Rows older than a day never count again; trimming here spares a separate job.
    await tx.delete(requestThrottle).where(lt(requestThrottle.at, new Date(Date.now() - 24 * 60 * 60 * 1000)));
    return true;
  });
}
