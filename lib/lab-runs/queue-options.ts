import type PgBoss from "pg-boss";
import type { RunSettings } from "@/lib/settings/runs";
import { ENGINE_VERSION } from "./engine";
import { runKindHandler } from "./kinds";

/*
 * The lab-run queue as the web server (which sends jobs) and the workers (which take them) both
 * name it; its timings come from the settings (lib/settings/runs.ts).
 */

/** The pg-boss queue every worker serves. */
export const RUN_QUEUE = "lab-runs";

/** What a job carries: the run it computes and the engine version it was made for. */
export interface RunJobData {
  runId: string;
  engineVersion: string;
}

/**
 * The job's expiry: pg-boss's backstop for a worker that vanished without a trace (the stale sweep
 * usually notices far sooner). A long run gets the time its kind estimates for it on a slow core,
 * three times over, and never less than GYROLUX_RUN_EXPIRE_S: one expiry for every kind either
 * cut long maps short or left a short spectrum's dead worker unnoticed for a quarter of an hour.
 */
export function runExpireSeconds(s: Pick<RunSettings, "expireSeconds">, kind: string, payload: unknown): number {
  const handler = runKindHandler(kind);
  const parsed = handler?.payloadSchema.safeParse(payload);
  // A payload the kind refuses fails at its first attempt; the least expiry covers that.
  const estimate = handler && parsed?.success ? handler.slowCoreSeconds(parsed.data) : 0;
  return Math.min(86_400, Math.max(s.expireSeconds, Math.ceil(3 * estimate)));
}

/** pg-boss send options of one run, from the settings and the run's own size. */
export function sendOptions(s: RunSettings, run: { id: string; kind: string; payload: unknown }) {
  return {
    id: run.id,
    retryLimit: s.retryLimit,
    retryDelay: s.retryDelaySeconds,
    retryBackoff: true,
    expireInSeconds: runExpireSeconds(s, run.kind, run.payload),
  };
}

export const runJobData = (runId: string): RunJobData => ({ runId, engineVersion: ENGINE_VERSION });

/**
 * Creates the queue unless it exists. Two processes starting together may race to create it: the
 * loser's error is harmless only when the queue is there afterwards; any other error (no rights on
 * the pgboss schema, database down) is thrown, never swallowed.
 */
export async function ensureQueue(boss: PgBoss, name: string = RUN_QUEUE): Promise<void> {
  if (await boss.getQueue(name)) return;
  try {
    await boss.createQueue(name);
  } catch (error) {
    if (await boss.getQueue(name).catch(() => null)) return;
    throw error;
  }
}
