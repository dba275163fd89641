/*
 * `npm run worker`: a lab-run worker. Takes jobs from the pg-boss queue in the app's PostgreSQL
 * (DATABASE_URL), computes each run's chunks on worker_threads (one per core unless
 * GYROLUX_WORKER_THREADS says otherwise), saves every finished chunk as a checkpoint, writes
 * progress about once a second and checks for cancel at the same time, and stores the result once.
 * Any number of workers, on any machine that reaches the database, can serve the same queue.
 *
 * The worker fetches jobs itself (boss.fetch) and settles each one explicitly, so every way a run
 * ends has its own queue state: done → completed, cancelled → cancelled, failed for good →
 * failed at once, a passing error → failed with a retry, and a job the worker will not finish
 * (it is stopping, or the job was made for another engine version) → handed back without costing
 * a retry (lib/lab-runs/queue-jobs.ts).
 *
 * Failure handling: a run whose input the physics rejects fails at once with the reason (a retry
 * would fail the same way); any other error fails the attempt and pg-boss retries it with backoff.
 * A worker that dies leaves its run silent; the stale sweep of any worker hands its job back (a
 * retry) and the retry resumes from the saved chunks. SIGTERM or SIGINT stops gracefully: no new
 * chunk starts, the ones in flight finish and are saved, and the job goes back to the queue.
 */
import PgBoss from "pg-boss";
import { createDb, createPool, type Database } from "@/db/connection";
import {
  claimRun,
  closeStaleRun,
  endRun,
  finishRun,
  heartbeat,
  loadCheckpoints,
  markCancelledIfRequested,
  markResumed,
  noteHandedBack,
  releaseSilentRuns,
  runToTake,
  saveCheckpoint,
  staleRuns,
} from "@/db/queries/lab-runs";
import { zodIssueLines } from "@/lib/contracts/validation";
import { decodeChunk, encodeChunk, encodeResult } from "@/lib/lab-runs/encoding";
import { ENGINE_VERSION, engineCompatible, engineMajor } from "@/lib/lab-runs/engine";
import { type ChunkOutput, type RunChunk, type RunKindHandler, runKindHandler } from "@/lib/lab-runs/kinds";
import { failJobForGood, handBackJob } from "@/lib/lab-runs/queue-jobs";
import { ensureQueue, RUN_QUEUE, type RunJobData } from "@/lib/lab-runs/queue-options";
import { scriptSettings } from "@/lib/settings/scripts";
import { ChunkError, ThreadPool } from "./thread-pool";

const settings = scriptSettings.runs;
const log = (msg: string) => process.stderr.write(`[worker ${settings.workerId}] ${msg}\n`);

/** Errors of the input or the physics: deterministic, so not worth a retry. */
const PERMANENT = new Set(["SpectrumInputError", "NonFiniteResultError", "ZodError", "LlgIntegrationError"]);
const HEARTBEAT_MS = 1000;
/** A job for another engine waits this long before a worker looks at it again. */
const OTHER_ENGINE_DELAY_S = 30;
/** A graceful stop gives the chunks in flight this long before the worker exits anyway. */
const STOP_GRACE_MS = 30_000;

type Job = PgBoss.JobWithMetadata<Partial<RunJobData>>;

/** How the worker leaves a job on the queue. */
type Settle =
  | { kind: "complete" }
  | { kind: "cancel" }
  | { kind: "retry"; message: string }
  | { kind: "fail"; message: string }
  | { kind: "handBack"; delaySeconds: number }
  /** The attempt was taken over: the job belongs to another worker now, leave it alone. */
  | { kind: "none" };

/** Set by SIGTERM/SIGINT: no new job is fetched and no new chunk starts. */
let stopping = false;

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
  stop: "cancel" | "lost" | "stopping" | null;
  resumed: number;
  computed: number;
}

/**
 * Takes the run for this attempt and reads its payload. A settle instead when there is nothing to
 * compute: the run was cancelled, finished or unknown, it was made for another engine, or it
 * failed here for good (unknown kind, invalid payload) and its row says why.
 */
async function startRun(db: Database, runId: string): Promise<StartedRun | Settle> {
  const waiting = await runToTake(db, { runId });
  if (waiting && !engineCompatible(waiting.engineVersion)) {
    const wanted = `${engineMajor(waiting.engineVersion)}.x`;
    const note = `Waiting for a worker of engine ${wanted}; worker ${settings.workerId} runs ${ENGINE_VERSION}.`;
    await noteHandedBack(db, { runId, note });
    log(`run ${runId}: made for engine ${waiting.engineVersion}, this worker runs ${ENGINE_VERSION}; handed back`);
    return { kind: "handBack", delaySeconds: OTHER_ENGINE_DELAY_S };
  }
  if (stopping) return { kind: "handBack", delaySeconds: 0 };
  const claim = waiting ? await claimRun(db, { runId, workerId: settings.workerId }) : null;
  if (!claim) {
    await markCancelledIfRequested(db, { runId });
    log(`run ${runId}: nothing to do (cancelled, finished or unknown)`);
    return { kind: "cancel" };
  }
  const { attempt } = claim;
  const handler = runKindHandler(claim.kind);
  if (!handler) {
    const error = `This worker does not know runs of kind "${claim.kind}"; update the worker.`;
    await endRun(db, { runId, attempt, state: "failed", error });
    return { kind: "fail", message: error };
  }
  const parsed = handler.payloadSchema.safeParse(claim.payload);
  if (!parsed.success) {
    const error = `Invalid run: ${zodIssueLines(parsed.error.issues).join("; ")}`;
    await endRun(db, { runId, attempt, state: "failed", error });
    return { kind: "fail", message: error };
  }
  const payload = parsed.data;
  return { runId, attempt, kind: claim.kind, cells: claim.cells, handler, payload, chunks: handler.chunks(payload) };
}

/** The chunks a previous attempt saved, decoded, by index (a chunk of another shape is ignored). */
async function savedChunks(db: Database, run: StartedRun): Promise<Map<number, ChunkOutput>> {
  const saved = new Map<number, ChunkOutput>();
  for (const row of await loadCheckpoints(db, { runId: run.runId })) {
    if (row.chunkIndex >= 0 && row.chunkIndex < run.chunks.length) saved.set(row.chunkIndex, decodeChunk(row.meta, row.data));
  }
  return saved;
}

/**
 * Computes the chunks no earlier attempt saved, as many at once as there are threads, saving each
 * as it finishes, writing progress and reading back the cancel flag about once a second. No further
 * chunk starts once cancel was asked, the attempt was lost or the worker is stopping; a chunk that
 * fails rejects the whole computation.
 */
async function computeChunks(db: Database, threads: ThreadPool, run: StartedRun, deadline: number): Promise<Computed> {
  const { runId, attempt, chunks } = run;
  const totalCells = run.handler.cells(run.payload);
  const cellsPerChunk = chunks.map((c) => (totalCells * (c.end - c.start)) / Math.max(1, chunks.at(-1)!.end));
  const outputs: ChunkOutput[] = new Array(chunks.length);
  const saved = await savedChunks(db, run);
  let doneCells = 0;
  for (const [i, output] of saved) {
    outputs[i] = output;
    doneCells += cellsPerChunk[i]!;
  }
  const todo = chunks.map((_, i) => i).filter((i) => !saved.has(i));
  if (saved.size > 0) await markResumed(db, { runId, attempt, progress: Math.min(0.999, doneCells / run.cells) });
  let stop: Computed["stop"] = null;
  let computed = 0;
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
    while (!stop && next < todo.length) {
      if (stopping) {
        stop = "stopping";
        break;
      }
      const i = todo[next++]!;
      const output = await threads.run({ runId, kind: run.kind, payload: run.payload, chunk: chunks[i]! });
      outputs[i] = output;
      computed++;
      doneCells += cellsPerChunk[i]!;
      const { meta, data } = encodeChunk(output);
      await saveCheckpoint(db, { runId, attempt, chunkIndex: i, meta, data });
    }
  };
  try {
    await Promise.all(Array.from({ length: Math.min(threads.size, Math.max(1, todo.length)) }, lane));
  } finally {
    clearInterval(timer);
  }
  return { outputs, stop, resumed: saved.size, computed };
}

/**
 * A chunk failed. Errors of the input or the physics fail the run and its job for good (a retry
 * would fail the same way); any other error fails the attempt: the run is queued again, or failed
 * after the last retry, and pg-boss retries the job with backoff.
 */
async function failAttempt(db: Database, run: StartedRun, job: Job, error: unknown): Promise<Settle> {
  const { runId, attempt } = run;
  const name = error instanceof ChunkError ? error.errorName : error instanceof Error ? error.name : "Error";
  const message = error instanceof Error ? error.message : String(error);
  if (PERMANENT.has(name)) {
    await endRun(db, { runId, attempt, state: "failed", error: message });
    log(`run ${runId}: failed (${message})`);
    return { kind: "fail", message };
  }
  const last = job.retryCount >= job.retryLimit;
  await endRun(db, {
    runId,
    attempt,
    state: last ? "failed" : "queued",
    error: last ? `Failed after ${attempt} attempts: ${message}` : `Attempt ${attempt} failed (${message}); retrying.`,
  });
  log(`run ${runId}: attempt ${attempt} failed (${message})${last ? "; no retries left" : "; the queue retries it"}`);
  return { kind: "retry", message };
}

/** Ends an attempt whose chunks all returned: cancelled, taken over, handed back, or done with its result stored. */
async function finishAttempt(db: Database, run: StartedRun, computed: Computed, started: number): Promise<Settle> {
  const { runId, attempt } = run;
  const figures = `${computed.computed} chunks computed, ${computed.resumed} resumed from checkpoints`;
  if (computed.stop === "cancel") {
    await endRun(db, { runId, attempt, state: "cancelled" });
    log(`run ${runId}: cancelled after ${Date.now() - started} ms`);
    return { kind: "cancel" };
  }
  if (computed.stop === "lost") {
    log(`run ${runId}: attempt ${attempt} was taken over; stopping without a result`);
    return { kind: "none" };
  }
  if (computed.stop === "stopping") {
    const kept = computed.resumed + computed.computed;
    const saved = `${kept} of ${run.chunks.length} parts saved`;
    const note = `Worker ${settings.workerId} stopped with ${saved}; the next attempt resumes from them.`;
    await endRun(db, { runId, attempt, state: "queued", error: note });
    log(`run ${runId}: handed back on stop (${figures})`);
    return { kind: "handBack", delaySeconds: 0 };
  }
  const computeMs = Date.now() - started;
  const { meta, data } = encodeResult(run.handler.assemble(run.payload, computed.outputs));
  const stored = await finishRun(db, {
    runId,
    attempt,
    workerId: settings.workerId,
    meta: {
      ...meta,
      computeMs,
      checkpoints: { chunks: run.chunks.length, resumed: computed.resumed, computed: computed.computed },
    },
    data,
    computeMs,
    engineVersion: ENGINE_VERSION,
  });
  const outcome = stored ? "done" : "finished but no longer ours; result not stored";
  log(`run ${runId}: ${outcome} in ${computeMs} ms (${figures}; ${Math.round(run.cells / (computeMs / 1000))} cells/s)`);
  return stored ? { kind: "complete" } : { kind: "none" };
}

/** One job: claim and start the run, compute its chunks, then say how to settle the job. */
async function computeRun(db: Database, threads: ThreadPool, job: Job): Promise<Settle> {
  const runId = job.data?.runId ?? job.id;
  const run = await startRun(db, runId);
  if (!("runId" in run)) return run;
  log(`run ${runId} (${run.kind}, ${run.cells} cells, attempt ${run.attempt}): ${run.chunks.length} chunks on ${threads.size} threads`);
  const started = Date.now();
  let computed: Computed;
  try {
    computed = await computeChunks(db, threads, run, started + job.expireInSeconds * 1000);
  } catch (error) {
    return failAttempt(db, run, job, error);
  }
  return finishAttempt(db, run, computed, started);
}

async function settleJob(boss: PgBoss, job: Job, settle: Settle): Promise<void> {
  switch (settle.kind) {
    case "complete":
      await boss.complete(RUN_QUEUE, job.id);
      return;
    case "cancel":
      await boss.cancel(RUN_QUEUE, job.id);
      return;
    case "retry":
      await boss.fail(RUN_QUEUE, job.id, { message: settle.message });
      return;
    case "fail":
      await failJobForGood(boss, RUN_QUEUE, job.id, settle.message);
      return;
    case "handBack":
      await handBackJob(boss, RUN_QUEUE, job.id, settle.delaySeconds);
      return;
    case "none":
      return;
  }
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

/** A pause that a stop cuts short. */
let wake: (() => void) | null = null;
const pause = (ms: number) =>
  new Promise<void>((resolve) => {
    const timer = setTimeout(resolve, ms);
    wake = () => {
      clearTimeout(timer);
      resolve();
    };
  });

/** Fetches and settles jobs one at a time until the worker stops. */
async function serve(db: Database, boss: PgBoss, threads: ThreadPool): Promise<void> {
  while (!stopping) {
    let job: Job | undefined;
    try {
      [job] = await boss.fetch<Partial<RunJobData>>(RUN_QUEUE, { batchSize: 1, includeMetadata: true });
    } catch (error) {
      log(`fetch failed: ${error instanceof Error ? error.message : String(error)}`);
    }
    if (!job) {
      await pause(settings.pollSeconds * 1000);
      continue;
    }
    let settle: Settle;
    try {
      settle = await computeRun(db, threads, job);
    } catch (error) {
      // The database or the queue failed under the run (not the physics): a passing error.
      const message = error instanceof Error ? error.message : String(error);
      log(`job ${job.id}: ${message}`);
      settle = { kind: "retry", message };
    }
    await settleJob(boss, job, settle).catch((e: Error) => log(`job ${job.id}: settling as ${settle.kind} failed: ${e.message}`));
  }
}

async function main(): Promise<void> {
  const pool = createPool({ url: settings.databaseUrl, max: settings.workerDbPool });
  const db = createDb(pool);
  const threads = new ThreadPool(new URL("./lab-worker-thread.mjs", import.meta.url), settings.threads);
  const boss = new PgBoss({
    connectionString: settings.databaseUrl,
    max: settings.workerQueuePool,
    schedule: false,
    maintenanceIntervalSeconds: settings.maintenanceSeconds,
    // The queue's archive keeps finished jobs for a week; the run rows are the lasting record.
    archiveCompletedAfterSeconds: 7 * 86_400,
  });
  boss.on("error", (e: Error) => log(`queue error: ${e.message}`));
  await boss.start();
  await ensureQueue(boss);

  const sweepTimer = setInterval(
    () => void sweepRuns(db, boss).catch((e: Error) => log(`sweep failed: ${e.message}`)),
    Math.max(1000, (settings.staleSeconds * 1000) / 4),
  );

  log(
    `serving queue "${RUN_QUEUE}" with ${threads.size} threads, engine ${ENGINE_VERSION} ` +
      `(expire at least ${settings.expireSeconds} s, retries ${settings.retryLimit})`,
  );
  const served = serve(db, boss, threads);
  const shutdown = async (signal: string) => {
    if (stopping) {
      log(`${signal} again: exiting at once`);
      process.exit(1);
    }
    stopping = true;
    wake?.();
    log(`${signal}: stopping (chunks in flight finish and are saved; the job goes back to the queue)`);
    setTimeout(() => {
      log("the graceful stop took too long; exiting");
      process.exit(1);
    }, STOP_GRACE_MS).unref();
    clearInterval(sweepTimer);
    await served.catch((e: Error) => log(`serving ended with: ${e.message}`));
    await boss.stop({ graceful: true, timeout: 5000, wait: true }).catch(() => undefined);
    await threads.close();
    await pool.end().catch(() => undefined);
    log("stopped");
    process.exit(0);
  };
  process.on("SIGTERM", () => void shutdown("SIGTERM"));
  process.on("SIGINT", () => void shutdown("SIGINT"));
}

main().catch((error: unknown) => {
  log(`cannot start: ${error instanceof Error ? error.message : String(error)}`);
  process.exit(1);
});
