/*
 * `npm run worker`: a lab-run worker. Takes jobs from the pg-boss queue in the app's PostgreSQL
 * (DATABASE_URL), computes each run's chunks on worker_threads (one per core unless
 * GYROLUX_WORKER_THREADS says otherwise), writes progress about once a second and checks for
 * cancel at the same time, and stores the result once. Any number of workers, on any machine that
 * reaches the database, can serve the same queue.
 *
 * Failure handling: a run whose input the physics rejects fails at once with the reason (a retry
 * would fail the same way); any other error fails the attempt and pg-boss retries it with backoff.
 * A worker that dies leaves its job active until it expires (GYROLUX_RUN_EXPIRE_S); pg-boss then
 * retries it on whichever worker asks next.
 */
import PgBoss from "pg-boss";
import { createDb, createPool } from "@/db/connection";
import { zodIssueLines } from "@/lib/contracts/validation";
import { runKindHandler, type ChunkOutput } from "@/lib/runs/kinds";
import { encodeResult } from "@/lib/runs/encoding";
import { RUN_QUEUE } from "@/lib/runs/queue-options";
import { scriptSettings } from "@/lib/settings/scripts";
import { ChunkError, ThreadPool } from "./thread-pool";
import { claimRun, closeStaleRun, endRun, finishRun, heartbeat, markCancelledIfRequested, releaseSilentRuns, staleRuns } from "./store";

const settings = scriptSettings.runs;
const log = (msg: string) => process.stderr.write(`[worker ${settings.workerId}] ${msg}\n`);

/** Errors of the input or the physics: deterministic, so not worth a retry. */
const PERMANENT = new Set(["SpectrumInputError", "NonFiniteResultError", "ZodError", "LlgIntegrationError"]);
const HEARTBEAT_MS = 1000;

async function main(): Promise<void> {
  const pool = createPool({ url: settings.databaseUrl, max: 4 });
  const db = createDb(pool);
  const threads = new ThreadPool(new URL("./lab-worker-thread.mjs", import.meta.url), settings.threads);
  const boss = new PgBoss({
    connectionString: settings.databaseUrl,
    max: 4,
    schedule: false,
    maintenanceIntervalSeconds: settings.maintenanceSeconds,
    // The queue's archive keeps finished jobs for a week; the run rows are the lasting record.
    archiveCompletedAfterSeconds: 7 * 86_400,
  });
  boss.on("error", (e: Error) => log(`queue error: ${e.message}`));
  await boss.start();
  await boss.createQueue(RUN_QUEUE).catch(() => undefined);

  const compute = async (runId: string, job: PgBoss.JobWithMetadata<{ runId: string }>): Promise<void> => {
    const claim = await claimRun(db, { runId, workerId: settings.workerId });
    if (!claim) {
      await markCancelledIfRequested(db, { runId });
      log(`run ${runId}: nothing to do (cancelled, finished or unknown)`);
      return;
    }
    const { attempt } = claim;
    const handler = runKindHandler(claim.kind);
    if (!handler) {
      await endRun(db, {
        runId,
        attempt,
        state: "failed",
        error: `This worker does not know runs of kind "${claim.kind}"; update the worker.`,
      });
      return;
    }
    const parsed = handler.payloadSchema.safeParse(claim.payload);
    if (!parsed.success) {
      await endRun(db, {
        runId,
        attempt,
        state: "failed",
        error: `Invalid run: ${zodIssueLines(parsed.error.issues).join("; ")}`,
      });
      return;
    }
    const payload = parsed.data;
    const chunks = handler.chunks(payload);
    const cellsPerChunk = chunks.map((c) => (handler.cells(payload) * (c.end - c.start)) / Math.max(1, chunks.at(-1)!.end));
    log(`run ${runId} (${claim.kind}, ${claim.cells} cells, attempt ${attempt}): ${chunks.length} chunks on ${threads.size} threads`);

    const started = Date.now();
    const deadline = started + job.expireInSeconds * 1000;
    const outputs: ChunkOutput[] = new Array(chunks.length);
    let stop: "cancel" | "lost" | null = null;
    let doneCells = 0;
    let next = 0;

    const beat = async () => {
      if (stop) return;
      // Past the expiry pg-boss has given the job to another worker; stop without writing.
      if (Date.now() > deadline) {
        stop = "lost";
        return;
      }
      const said = await heartbeat(db, { runId, attempt, progress: Math.min(0.999, doneCells / claim.cells) });
      if (said !== "go") stop = said;
    };
    const timer = setInterval(() => void beat().catch((e: Error) => log(`progress write failed: ${e.message}`)), HEARTBEAT_MS);
    try {
      const lane = async () => {
        while (!stop && next < chunks.length) {
          const i = next++;
          outputs[i] = await threads.run({ runId, kind: claim.kind, payload, chunk: chunks[i]! });
          doneCells += cellsPerChunk[i]!;
        }
      };
      await Promise.all(Array.from({ length: Math.min(threads.size, chunks.length) }, lane));
    } catch (error) {
      stop = stop ?? null;
      clearInterval(timer);
      const name = error instanceof ChunkError ? error.errorName : error instanceof Error ? error.name : "Error";
      const message = error instanceof Error ? error.message : String(error);
      if (PERMANENT.has(name)) {
        await endRun(db, { runId, attempt, state: "failed", error: message });
        log(`run ${runId}: failed (${message})`);
        return;
      }
      const last = job.retryCount >= job.retryLimit;
      await endRun(db, {
        runId,
        attempt,
        state: last ? "failed" : "queued",
        error: last ? `Failed after ${attempt} attempts: ${message}` : `Attempt ${attempt} failed (${message}); retrying.`,
      });
      throw error;
    }
    clearInterval(timer);
    if (stop === "cancel") {
      await endRun(db, { runId, attempt, state: "cancelled" });
      log(`run ${runId}: cancelled after ${Date.now() - started} ms`);
      return;
    }
    if (stop === "lost") {
      log(`run ${runId}: attempt ${attempt} was taken over; stopping without a result`);
      return;
    }
    const computeMs = Date.now() - started;
    const { meta, data } = encodeResult(handler.assemble(payload, outputs));
    const stored = await finishRun(db, { runId, attempt, workerId: settings.workerId, meta: { ...meta, computeMs }, data, computeMs });
    log(
      `run ${runId}: ${stored ? "done" : "finished but no longer ours; result not stored"} in ${computeMs} ms (${Math.round(claim.cells / (computeMs / 1000))} cells/s)`,
    );
  };

  await boss.work<{ runId: string }>(
    RUN_QUEUE,
    { batchSize: 1, includeMetadata: true, pollingIntervalSeconds: settings.pollSeconds },
    async ([job]) => {
      if (!job) return;
      const runId = job.data?.runId ?? job.id;
      await compute(runId, job);
    },
  );

  // A worker that died leaves its run "running" with no progress writes: hand its job back to
  // the queue (pg-boss retries it with backoff) instead of waiting for the job's expiry. Runs whose
  // job the queue has given up on or cancelled would stay open forever; any worker closes them.
  const sweep = async () => {
    for (const run of await releaseSilentRuns(db, { silentSeconds: settings.staleSeconds })) {
      log(`run ${run.id}: worker ${run.workerId ?? "?"} stopped answering; handing the job back to the queue`);
      await boss.fail(RUN_QUEUE, run.id, { message: `worker ${run.workerId ?? "?"} stopped answering` });
    }
    for (const run of await staleRuns(db, { olderThanSeconds: settings.staleSeconds })) {
      const job = await boss.getJobById(RUN_QUEUE, run.id);
      if (!job) continue;
      if (job.state === "failed") {
        await closeStaleRun(db, {
          runId: run.id,
          state: "failed",
          error: "The job queue gave up on this run: its worker stopped or failed on every attempt.",
        });
      } else if (job.state === "cancelled") {
        await closeStaleRun(db, { runId: run.id, state: "cancelled", error: null });
      }
    }
  };
  const sweepTimer = setInterval(
    () => void sweep().catch((e: Error) => log(`sweep failed: ${e.message}`)),
    Math.max(1000, (settings.staleSeconds * 1000) / 4),
  );

  log(`serving queue "${RUN_QUEUE}" with ${threads.size} threads (expire ${settings.expireSeconds} s, retries ${settings.retryLimit})`);
  let stopping = false;
  const shutdown = async (signal: string) => {
    if (stopping) return;
    stopping = true;
    log(`${signal}: stopping`);
    clearInterval(sweepTimer);
    await boss.stop({ graceful: true, timeout: 5000, wait: true }).catch(() => undefined);
    await threads.close();
    await pool.end().catch(() => undefined);
    process.exit(0);
  };
  process.on("SIGTERM", () => void shutdown("SIGTERM"));
  process.on("SIGINT", () => void shutdown("SIGINT"));
}

main().catch((error: unknown) => {
  log(`cannot start: ${error instanceof Error ? error.message : String(error)}`);
  process.exit(1);
});
