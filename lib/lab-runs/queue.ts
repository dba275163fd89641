import "server-only";
import PgBoss from "pg-boss";
import { serverSettings } from "@/lib/settings/server";
import { ensureQueue, RUN_QUEUE, runJobData, sendOptions } from "./queue-options";

/*
 * The web server's side of the job queue: it only sends. One pg-boss instance per server process,
 * started on first use, without maintenance or scheduling (the workers do that).
 */

const globalForBoss = globalThis as unknown as { gyroluxBoss?: Promise<PgBoss> };

async function startSender(): Promise<PgBoss> {
  const settings = serverSettings.runs;
  const boss = new PgBoss({ connectionString: settings.databaseUrl, max: 2, supervise: false, schedule: false });
  boss.on("error", (e: Error) => console.error("[runs] queue error:", e.message));
  await boss.start();
  await ensureQueue(boss);
  return boss;
}

function sender(): Promise<PgBoss> {
  globalForBoss.gyroluxBoss ??= startSender().catch((error: unknown) => {
    globalForBoss.gyroluxBoss = undefined;
    throw error;
  });
  return globalForBoss.gyroluxBoss;
}

/** Queues the job of a run; its pg-boss id is the run id. */
export async function enqueueRun(run: { id: string; kind: string; payload: unknown }): Promise<void> {
  const boss = await sender();
  const sent = await boss.send(RUN_QUEUE, runJobData(run.id), sendOptions(serverSettings.runs, run));
  if (sent === null) throw new Error(`the queue refused job ${run.id}`);
}

/** Takes a queued job off the queue (a running one is stopped by its worker, which sees the flag). */
export async function cancelQueuedJob(runId: string): Promise<void> {
  const boss = await sender();
  await boss.cancel(RUN_QUEUE, runId);
}
