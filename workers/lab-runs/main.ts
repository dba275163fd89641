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
import { createDb, createPool, type Database } from "@/db/connection";
import {
  claimRun,
  closeStaleRun,
  endRun,
  finishRun,
  heartbeat,
  markCancelledIfRequested,
  releaseSilentRuns,
  staleRuns,
} from "@/db/queries/lab-runs";
import { zodIssueLines } from "@/lib/contracts/validation";
import { encodeResult } from "@/lib/lab-runs/encoding";
import { type ChunkOutput, type RunChunk, type RunKindHandler, runKindHandler } from "@/lib/lab-runs/kinds";
import { RUN_QUEUE } from "@/lib/lab-runs/queue-options";
import { scriptSettings } from "@/lib/settings/scripts";
import { ChunkError, ThreadPool } from "./thread-pool";

const settings = scriptSettings.runs;
const log = (msg: string) => process.stderr.write(`[worker ${settings.workerId}] ${msg}\n`);

/** Errors of the input or the physics: deterministic, so not worth a retry. */
const PERMANENT = new Set(["SpectrumInputError", "NonFiniteResultError", "ZodError", "LlgIntegrationError"]);
const HEARTBEAT_MS = 1000;

type Job = PgBoss.JobWithMetadata<{ runId: string }>;

/** A claimed run whose payload this worker understands, cut into its chunks. */
interface StartedRun {
  runId: string;
  attempt: number;
  kind: string;
  cells: number;
  handler: RunKindHandler<unknown>;
  payload: unknown;
  chunks: RunChunk[];
}

/** What the threads computed, and why they stopped early if they did. */
interface Computed {
  outputs: ChunkOutput[];
  stop: "cancel" | "lost" | null;
}

/**
 * Takes the run for this attempt and reads its payload. Null when there is nothing to compute:
 * the run was cancelled, finished or unknown, or it failed here for good (unknown kind, invalid
 * payload) and its row says why.
 */
async function startRun(db: Database, runId: string): Promise<StartedRun | null> {
  const claim = await claimRun(db, { runId, workerId: settings.workerId });
  if (!claim) {
    await markCancelledIfRequested(db, { runId });
    log(`run ${runId}: nothing to do (cancelled, finished or unknown)`);
    return null;
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
    return null;
  }
  const parsed = handler.payloadSchema.safeParse(claim.payload);
  if (!parsed.success) {
    await endRun(db, {
      runId,
      attempt,
      state: "failed",
      error: `Invalid run: ${zodIssueLines(parsed.error.issues).join("; ")}`,
    });
    return null;
  }
  const payload = parsed.data;
  return { runId, attempt, kind: claim.kind, cells: claim.cells, handler, payload, chunks: handler.chunks(payload) };
}

/**
 * Computes the chunks on the threads, as many at once as there are threads, writing progress and
 * reading back the cancel flag about once a second. No further chunk starts once cancel was asked
 * or the attempt was lost; a chunk that fails rejects the whole computation.
 */
async function computeChunks(db: Database, threads: ThreadPool, run: StartedRun, deadline: number): Promise<Computed> {
  const { runId, attempt, chunks } = run;
  const totalCells = run.handler.cells(run.payload);
  const cellsPerChunk = chunks.map((c) => (totalCells * (c.end - c.start)) / Math.max(1, chunks.at(-1)!.end));
  const outputs: ChunkOutput[] = new Array(chunks.length);
  let stop: Computed["stop"] = null;
  let doneCells = 0;
  let next = 0;

  const beat = async () => {
    if (stop) return;
    // Past the expiry pg-boss has given the job to another worker; stop without writing.
    if (Date.now() > deadline) {
      stop = "lost";
      return;
    }
    const said = await heartbeat(db, { runId, attempt, progress: Math.min(0.999, doneCells / run.cells) });
    if (said !== "go") stop = said;
  };
  const timer = setInterval(() => void beat().catch((e: Error) => log(`progress write failed: ${e.message}`)), HEARTBEAT_MS);
  const lane = async () => {
    while (!stop && next < chunks.length) {
      const i = next++;
      outputs[i] = await threads.run({ runId, kind: run.kind, payload: run.payload, chunk: chunks[i]! });
      doneCells += cellsPerChunk[i]!;
    }
  };
  try {
    await Promise.all(Array.from({ length: Math.min(threads.size, chunks.length) }, lane));
  } finally {
    clearInterval(timer);
  }
  return { outputs, stop };
}

/**
 * A chunk failed. Errors of the input or the physics fail the run at once (a retry would fail the
 * same way); any other error fails the attempt: the run is queued again, or failed after the last
 * retry, and the error is rethrown so pg-boss retries the job with backoff.
 */
async function failAttempt(db: Database, run: StartedRun, job: Job, error: unknown): Promise<void> {
  const { runId, attempt } = run;
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

/** Ends an attempt whose chunks all returned: cancelled, taken over, or done with its result stored. */
async function finishAttempt(db: Database, run: StartedRun, computed: Computed, started: number): Promise<void> {
  const { runId, attempt } = run;
  if (computed.stop === "cancel") {
    await endRun(db, { runId, attempt, state: "cancelled" });
    log(`run ${runId}: cancelled after ${Date.now() - started} ms`);
    return;
  }
  if (computed.stop === "lost") {
    log(`run ${runId}: attempt ${attempt} was taken over; stopping without a result`);
    return;
  }
  const computeMs = Date.now() - started;
  const { meta, data } = encodeResult(run.handler.assemble(run.payload, computed.outputs));
  const stored = await finishRun(db, { runId, attempt, workerId: settings.workerId, meta: { ...meta, computeMs }, data, computeMs });
  const outcome = stored ? "done" : "finished but no longer ours; result not stored";
  log(`run ${runId}: ${outcome} in ${computeMs} ms (${Math.round(run.cells / (computeMs / 1000))} cells/s)`);
}

/** One job: claim and start the run, compute its chunks, then finish, fail or requeue it. */
async function computeRun(db: Database, threads: ThreadPool, job: Job): Promise<void> {
  const runId = job.data?.runId ?? job.id;
  const run = await startRun(db, runId);
  if (!run) return;
  log(`run ${runId} (${run.kind}, ${run.cells} cells, attempt ${run.attempt}): ${run.chunks.length} chunks on ${threads.size} threads`);
  const started = Date.now();
  let computed: Computed;
  try {
    computed = await computeChunks(db, threads, run, started + job.expireInSeconds * 1000);
  } catch (error) {
    await failAttempt(db, run, job, error);
    return;
  }
  await finishAttempt(db, run, computed, started);
}

/**
 * A worker that died leaves its run "running" with no progress writes: its job goes back to the
 * queue (pg-boss retries it with backoff) instead of waiting for the job's expiry. Runs whose job
 * the queue has given up on or cancelled would stay open forever; any worker closes them.
 */
async function sweepRuns(db: Database, boss: PgBoss): Promise<void> {
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
}

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

  await boss.work<{ runId: string }>(
    RUN_QUEUE,
    { batchSize: 1, includeMetadata: true, pollingIntervalSeconds: settings.pollSeconds },
    async ([job]) => {
      if (job) await computeRun(db, threads, job);
    },
  );

  const sweepTimer = setInterval(
    () => void sweepRuns(db, boss).catch((e: Error) => log(`sweep failed: ${e.message}`)),
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
