import type PgBoss from "pg-boss";

/*
 * The two job moves a lab-run worker needs that pg-boss 10 has no call for. Both are one UPDATE on
 * pg-boss's own job table (schema "pgboss", the default), guarded by the job's state, so they are
 * atomic and never touch a job another worker holds.
 *
 * - hand back: a job this worker will not finish (it is stopping, or the job was made for another
 *   engine version) waits again as if never started. `fail` would count a retry (pg-boss adds one
 *   at the next fetch of a job that has `started_on`), and a graceful restart is not a failure.
 * - fail for good: an invalid payload or a physics error fails the same way every time, so the job
 *   ends "failed" at once instead of being retried, or being marked "completed" as when the
 *   handler returned normally.
 */

const SCHEMA = "pgboss";

export async function handBackJob(boss: PgBoss, name: string, id: string, delaySeconds: number): Promise<boolean> {
  const result = await boss.getDb().executeSql(
    `UPDATE ${SCHEMA}.job SET state = 'created', started_on = NULL, start_after = now() + $3 * interval '1 second'
     WHERE name = $1 AND id = $2 AND state = 'active' RETURNING id`,
    [name, id, delaySeconds],
  );
  return result.rows.length > 0;
}

export async function failJobForGood(boss: PgBoss, name: string, id: string, message: string): Promise<boolean> {
  const result = await boss.getDb().executeSql(
    `UPDATE ${SCHEMA}.job SET state = 'failed', completed_on = now(), output = $3::jsonb
     WHERE name = $1 AND id = $2 AND state < 'completed' RETURNING id`,
    [name, id, JSON.stringify({ message })],
  );
  return result.rows.length > 0;
}
