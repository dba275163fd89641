import { cpus, hostname } from "node:os";
import { z } from "zod";
import { databaseVariables } from "./database";

/*
 * The lab-run queue fragment, shared by the web server (which sends jobs) and the workers (which
 * take them); the queue lives in the app's database, hence DATABASE_URL. Defaults suit a lab: a
 * worker that dies is noticed after GYROLUX_RUN_EXPIRE_S and its job retried; tests shorten every
 * interval so the retry takes seconds.
 */

const seconds = (fallback: number, min = 1) => z.coerce.number().int().min(min).max(86_400).default(fallback);

export const runSettingsSchema = z
  .object({
    ...databaseVariables,
    /** Retries after the first attempt (a worker that died or failed for a passing reason). */
    GYROLUX_RUN_RETRY_LIMIT: z.coerce.number().int().min(0).max(20).default(3),
    /** Delay before the first retry; pg-boss doubles it each time (retryBackoff). */
    GYROLUX_RUN_RETRY_DELAY_S: seconds(10),
    /**
     * The least expiry of a job: one still active after this long counts as lost (its worker died)
     * and is retried. A run whose kind estimates more (lib/lab-runs/queue-options.ts) gets more.
     */
    GYROLUX_RUN_EXPIRE_S: seconds(900),
    /**
     * A running run whose worker has not written progress for this long is given back to the queue
     * (pg-boss fail → retry with backoff): its worker died. Much shorter than the expiry, which stays
     * as pg-boss's own backstop.
     */
    GYROLUX_RUN_STALE_S: seconds(60, 3),
    /** How often pg-boss looks for expired jobs. */
    GYROLUX_RUN_MAINTENANCE_S: seconds(30),
    /** How often an idle worker asks for a job (pg-boss allows 0.5 s and more). */
    GYROLUX_RUN_POLL_S: z.coerce.number().min(0.5).max(60).default(2),
    /** Threads per worker; default one per core. */
    GYROLUX_WORKER_THREADS: z.coerce.number().int().min(1).max(256).optional(),
    /**
     * Connections of one worker: its run queries (progress, checkpoints, results) and its queue
     * client (fetch, settle, sweep, pg-boss maintenance). 2 + 2 serve a worker of any thread count,
     * since one run at a time writes about once a second and once per finished chunk.
     */
    GYROLUX_WORKER_DB_POOL: z.coerce.number().int().min(1).max(50).default(2),
    GYROLUX_WORKER_QUEUE_POOL: z.coerce.number().int().min(2).max(50).default(2),
    /** Name of the worker in the runs list; default host-pid. */
    GYROLUX_WORKER_ID: z.string().min(1).max(100).optional(),
  })
  .transform(
    (env): RunSettings => ({
      databaseUrl: env.DATABASE_URL,
      retryLimit: env.GYROLUX_RUN_RETRY_LIMIT,
      retryDelaySeconds: env.GYROLUX_RUN_RETRY_DELAY_S,
      expireSeconds: env.GYROLUX_RUN_EXPIRE_S,
      maintenanceSeconds: env.GYROLUX_RUN_MAINTENANCE_S,
      staleSeconds: env.GYROLUX_RUN_STALE_S,
      pollSeconds: env.GYROLUX_RUN_POLL_S,
      threads: env.GYROLUX_WORKER_THREADS ?? Math.max(1, cpus().length),
      workerId: env.GYROLUX_WORKER_ID ?? `${hostname()}-${process.pid}`,
      workerDbPool: env.GYROLUX_WORKER_DB_POOL,
      workerQueuePool: env.GYROLUX_WORKER_QUEUE_POOL,
    }),
  );

export interface RunSettings {
  databaseUrl: string;
  retryLimit: number;
  retryDelaySeconds: number;
  expireSeconds: number;
  maintenanceSeconds: number;
  staleSeconds: number;
  pollSeconds: number;
  threads: number;
  workerId: string;
  workerDbPool: number;
  workerQueuePool: number;
}
