import { spawn, spawnSync, type ChildProcess } from "node:child_process";
import { mkdtempSync, readdirSync, rmSync, statSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import pg from "pg";
import PgBoss from "pg-boss";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { DEMO_USERS } from "@/db/demo-data";
import { ENGINE_VERSION } from "@/lib/lab-runs/engine";
import { computeRunInProcess, runKindHandler, type RunSpec } from "@/lib/lab-runs/kinds";
import { RUN_QUEUE, sendOptions } from "@/lib/lab-runs/queue-options";
import { scriptSettings } from "@/lib/settings/scripts";
import { computeSpectrumArrays } from "@/lib/physics/spectrum";
import { wavelengthGrid } from "@/lib/workbench/units";
import { type Client, DEMO, DEMO_GARNET_SET_ID, DEMO_LAB_ID, OTHER_LAB_ID, signIn, validParams } from "./support";

/*
 * Lab runs end to end: the API queues a job on pg-boss, worker processes started here (the built
 * `npm run worker`) take it, and the result comes back through the API. scripts/test.sh shortens
 * the queue's timings (GYROLUX_RUN_STALE_S and friends) so the worker-fault retry takes seconds.
 */

const workers = new Map<string, ChildProcess>();

function startWorker(id: string, env: Record<string, string> = {}, bundle?: string): ChildProcess {
  const child = spawn(process.execPath, [bundle ? "lab-worker.mjs" : "dist/lab-worker.mjs"], {
    cwd: bundle ?? process.cwd(),
    env: { ...process.env, GYROLUX_WORKER_ID: id, GYROLUX_WORKER_THREADS: "1", ...env },
    stdio: ["ignore", "ignore", "pipe"],
  });
  child.stderr?.on("data", (b: Buffer) => process.stderr.write(b));
  workers.set(id, child);
  return child;
}

async function stopWorker(id: string, signal: NodeJS.Signals = "SIGTERM"): Promise<void> {
  const child = workers.get(id);
  workers.delete(id);
  if (!child || child.exitCode !== null) return;
  const exited = new Promise<void>((resolve) => child.once("exit", () => resolve()));
  child.kill(signal);
  await exited;
}

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

async function waitFor<T>(what: string, probe: () => Promise<T | null | undefined | false>, timeoutMs = 90_000): Promise<T> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const value = await probe();
    if (value) return value;
    if (Date.now() > until) throw new Error(`timed out waiting for ${what}`);
    await sleep(200);
  }
}

const mapSpec = (cols: number, rows: number, method: "llg" | "analytic" = "llg"): RunSpec => ({
  kind: "map",
  payload: {
    params: validParams(),
    method,
    axis: "temperature",
    wavelengths: { fromNm: 400, toNm: 1600, count: cols, spacing: "log" },
    rows: { from: 20, to: 300, count: rows, spacing: "linear" },
  },
});

const spectrumSpec = (count: number): RunSpec => ({
  kind: "spectrum",
  payload: { params: validParams(), method: "llg", wavelengths: { fromNm: 300, toNm: 3000, count, spacing: "log" } },
});

async function submit(client: Client, spec: RunSpec, extra: Record<string, unknown> = {}) {
  const res = await client.post("/api/runs", { labId: DEMO_LAB_ID, ...spec, ...extra });
  if (res.status !== 201) throw new Error(`submit failed: ${res.status} ${JSON.stringify(res.body)}`);
  return res.body.item as { id: string; state: string };
}

async function runOf(client: Client, id: string) {
  return (await client.get(`/api/runs/${id}`)).body.item as {
    state: string;
    progress: number;
    workerId: string | null;
    attempt: number;
    error: string | null;
  };
}

const finished = (client: Client, id: string) =>
  waitFor(`run ${id} to finish`, async () => {
    const run = await runOf(client, id);
    return run.state === "done" || run.state === "failed" || run.state === "cancelled" ? run : null;
  });

/** Every double equal to the last bit (NaN ↔ null, as the API sends it). */
function expectBitIdentical(got: Record<string, (number | null)[]>, want: Record<string, Float64Array>) {
  expect(Object.keys(got).sort()).toEqual(Object.keys(want).sort());
  for (const [name, col] of Object.entries(want)) {
    const g = got[name]!;
    expect(g.length, name).toBe(col.length);
    for (let i = 0; i < col.length; i++) {
      const w = col[i]!;
      if (Number.isNaN(w)) expect(g[i], `${name}[${i}]`).toBeNull();
      else if (!Object.is(g[i], w)) expect.fail(`${name}[${i}]: worker ${g[i]} ≠ in-process ${w}`);
    }
  }
}

describe("lab runs on the job queue", () => {
  let editor: Client;
  let viewer: Client;
  let outsider: Client;
  let db: pg.Client;

  beforeAll(async () => {
    const build = spawnSync(process.execPath, ["scripts/build-cli.mjs", "lab-worker", "lab-worker-thread"], {
      cwd: process.cwd(),
      encoding: "utf8",
    });
    if (build.status !== 0) throw new Error(`worker build failed: ${build.stderr}`);
    [editor, viewer, outsider] = await Promise.all([signIn(DEMO.editor), signIn(DEMO.viewer), signIn(DEMO.outsider)]);
    db = new pg.Client({ connectionString: process.env.DATABASE_URL });
    await db.connect();
  });

  afterAll(async () => {
    await Promise.all([...workers.keys()].map((id) => stopWorker(id, "SIGKILL")));
    await db?.end();
  });

  it("a viewer cannot submit or cancel; another lab's member gets 404; bad input is refused with the field", async () => {
    const denied = await viewer.post("/api/runs", { labId: DEMO_LAB_ID, ...mapSpec(8, 4) });
    expect(denied.status).toBe(403);

    const bad = await editor.post("/api/runs", { labId: DEMO_LAB_ID, ...mapSpec(8, 300) });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields["payload.rows.count"]).toMatch(/≤ 256/);

    // No worker is running yet, so this run stays queued until it is cancelled below.
    const run = await submit(editor, mapSpec(8, 4), { parameterSetId: DEMO_GARNET_SET_ID });
    expect(run.state).toBe("queued");

    const seen = await viewer.get(`/api/runs/${run.id}`);
    expect(seen.status).toBe(200);
    expect(seen.body.item.submittedBy.name).toBeTruthy();
    expect(seen.body.item.parameterSet.version).toBeGreaterThanOrEqual(1);
    expect((await viewer.post(`/api/runs/${run.id}/cancel`, {})).status).toBe(403);

    expect((await outsider.get(`/api/runs/${run.id}`)).status).toBe(404);
    expect((await outsider.post(`/api/runs/${run.id}/cancel`, {})).status).toBe(404);
    expect((await outsider.get(`/api/runs/${run.id}/result`)).status).toBe(404);
    expect((await outsider.get(`/api/runs?labId=${DEMO_LAB_ID}`)).status).toBe(404);
    const outsiderList = await outsider.get("/api/runs");
    expect(outsiderList.body.items.map((r: { id: string }) => r.id)).not.toContain(run.id);
    expect((await outsider.post("/api/runs", { labId: DEMO_LAB_ID, ...mapSpec(8, 4) })).status).toBe(404);
    expect((await outsider.post("/api/runs", { labId: OTHER_LAB_ID, ...mapSpec(8, 4), parameterSetId: DEMO_GARNET_SET_ID })).status).toBe(
      400,
    );

    // A queued run is cancelled at once.
    const cancelled = await editor.post(`/api/runs/${run.id}/cancel`, {});
    expect(cancelled.status).toBe(200);
    expect(cancelled.body.item.state).toBe("cancelled");
  });

  it("a worker computes a submitted map and a long spectrum to the same bits as this process", async () => {
    const map = await submit(editor, mapSpec(48, 12));
    const spectrum = await submit(editor, spectrumSpec(600));
    startWorker("integ-a");
    for (const [run, spec] of [
      [map, mapSpec(48, 12)],
      [spectrum, spectrumSpec(600)],
    ] as const) {
      const done = await finished(editor, run.id);
      expect(done.state, done.error ?? "").toBe("done");
      const result = await viewer.get(`/api/runs/${run.id}/result`);
      expect(result.status).toBe(200);
      expect(result.body.workerId).toBe("integ-a");
      expectBitIdentical(result.body.columns, computeRunInProcess(spec.kind, spec.payload).columns);
    }
    // The spectrum also equals one plain in-process spectrum of the physics, column by column.
    const wavelengthsNm = wavelengthGrid(300, 3000, 600, "log");
    const direct = computeSpectrumArrays({ ...validParams(), method: "llg", wavelengthsNm });
    const result = (await viewer.get(`/api/runs/${spectrum.id}/result`)).body;
    expectBitIdentical(
      { thetaRad: result.columns.thetaRad, magneticShare: result.columns.magneticShare },
      { thetaRad: direct.thetaRad, magneticShare: direct.magneticShare },
    );
    expect(result.meta.maxRelDeviationFromAnalytic).toBe(direct.maxRelDeviationFromAnalytic);
  });

  it("two workers serve one queue and both take jobs", async () => {
    startWorker("integ-b");
    const runs = [];
    for (let i = 0; i < 6; i++) runs.push(await submit(editor, mapSpec(64, 12)));
    const ids = new Set<string>();
    for (const run of runs) {
      const done = await finished(editor, run.id);
      expect(done.state, done.error ?? "").toBe("done");
      ids.add((await viewer.get(`/api/runs/${run.id}/result`)).body.workerId);
    }
    expect([...ids].sort()).toEqual(["integ-a", "integ-b"]);
  });

  it("a cancelled run stops within seconds and keeps no result", async () => {
    await stopWorker("integ-b");
    const run = await submit(editor, mapSpec(256, 128));
    await waitFor("the run to start", async () => (await runOf(editor, run.id)).state === "running");
    const asked = Date.now();
    expect((await editor.post(`/api/runs/${run.id}/cancel`, {})).status).toBe(200);
    const done = await finished(editor, run.id);
    expect(done.state).toBe("cancelled");
    // How fast the cancel took is a figure, not an assertion (the machine may be busy).
    console.log(`[lab runs] cancel → cancelled after ${((Date.now() - asked) / 1000).toFixed(1)} s`);
    expect((await viewer.get(`/api/runs/${run.id}/result`)).status).toBe(404);
  });

  it("a worker killed in the middle of a job: another worker retries it, one result, no lost job", async () => {
    const run = await submit(editor, mapSpec(256, 96));
    const running = await waitFor("integ-a to make progress", async () => {
      const r = await runOf(editor, run.id);
      return r.state === "running" && r.workerId === "integ-a" && r.progress > 0 ? r : null;
    });
    expect(running.attempt).toBe(1);
    await stopWorker("integ-a", "SIGKILL");
    const killedAt = Date.now();
    startWorker("integ-c");
    const retried = await waitFor("the retry to start", async () => {
      const r = await runOf(editor, run.id);
      return r.state === "running" && r.workerId === "integ-c" ? r : null;
    });
    const retryStartMs = Date.now() - killedAt;
    const done = await finished(editor, run.id);
    const doneMs = Date.now() - killedAt;
    console.log(
      `[lab runs] SIGKILL → retry started on another worker after ${(retryStartMs / 1000).toFixed(1)} s, ` +
        `run done after ${(doneMs / 1000).toFixed(1)} s`,
    );
    expect(retried.attempt).toBe(2);
    expect(done.state, done.error ?? "").toBe("done");
    const result = await viewer.get(`/api/runs/${run.id}/result`);
    expect(result.body.workerId).toBe("integ-c");
    expect(result.body.attempt).toBe(2);
    const rows = await db.query("select count(*)::int as n from lab_run_results where run_id = $1", [run.id]);
    expect(rows.rows[0].n).toBe(1);
    const job = await db.query("select state from pgboss.job where id = $1 union all select state from pgboss.archive where id = $1", [
      run.id,
    ]);
    expect(job.rows.map((r) => r.state)).toEqual(["completed"]);
  });
});

/*
 * The worker's handling of the queue, straight on the database: runs are inserted as the API would
 * store them and their jobs sent with the API's options, so each case controls what the worker sees
 * (a job whose cancel never reached the queue, a job made for another engine, a payload the
 * registry refuses) and reads the queue's own record of how the job ended.
 */
describe("the worker and the queue, straight on the database", () => {
  let db: pg.Client;
  let boss: PgBoss;
  let submitterId: string;

  beforeAll(async () => {
    const build = spawnSync(process.execPath, ["scripts/build-cli.mjs", "lab-worker", "lab-worker-thread"], {
      cwd: process.cwd(),
      encoding: "utf8",
    });
    if (build.status !== 0) throw new Error(`worker build failed: ${build.stderr}`);
    db = new pg.Client({ connectionString: process.env.DATABASE_URL });
    await db.connect();
    boss = new PgBoss({ connectionString: process.env.DATABASE_URL, max: 2, supervise: false, schedule: false });
    await boss.start();
    const user = await db.query("select id from users where email = $1", [DEMO_USERS.postdoc.email]);
    submitterId = user.rows[0].id;
  });

  afterAll(async () => {
    await Promise.all([...workers.keys()].map((id) => stopWorker(id, "SIGKILL")));
    await boss?.stop({ graceful: false, wait: true });
    await db?.end();
  });

  /** Stores a run as POST /api/runs does and queues its job; `engineVersion` as the submitting server had it. */
  async function insertRun(spec: { kind: string; payload: unknown }, options: { engineVersion?: string; send?: boolean } = {}) {
    const handler = runKindHandler(spec.kind);
    const parsed = handler?.payloadSchema.safeParse(spec.payload);
    const cells = handler && parsed?.success ? handler.cells(parsed.data) : 1;
    const engineVersion = options.engineVersion ?? ENGINE_VERSION;
    const row = await db.query(
      `insert into lab_runs (lab_id, submitted_by, kind, title, payload, cells, engine_version)
       values ($1, $2, $3, 'worker test', $4, $5, $6) returning id`,
      [DEMO_LAB_ID, submitterId, spec.kind, JSON.stringify(spec.payload), cells, engineVersion],
    );
    const id: string = row.rows[0].id;
    if (options.send !== false) {
      await boss.send(RUN_QUEUE, { runId: id, engineVersion }, sendOptions(scriptSettings.runs, { id, ...spec }));
    }
    return id;
  }

  /** Each case names the worker it relies on, so it also runs alone (vitest -t). */
  const ensureWorker = (id: string) => {
    if (!workers.has(id)) startWorker(id);
  };
  const runRow = async (id: string) => (await db.query("select * from lab_runs where id = $1", [id])).rows[0];
  const jobRow = async (id: string) =>
    (await db.query("select state, retry_count, start_after > now() as delayed, output from pgboss.job where id = $1", [id])).rows[0];
  const checkpointCount = async (id: string) =>
    (await db.query("select count(*)::int as n from lab_run_checkpoints where run_id = $1", [id])).rows[0].n as number;
  const settledRun = (id: string) =>
    waitFor(`run ${id} to end`, async () => {
      const run = await runRow(id);
      return ["done", "failed", "cancelled"].includes(run.state) ? run : null;
    });

  it("a worker logged in with the least-privilege role over TLS completes a run and cannot read the users table", async () => {
    // The role db/pg.sh worker-role creates (db/worker-role.sql), and the certificate db/pg.sh made.
    const url = new URL(process.env.DATABASE_URL!);
    url.username = "gyrolux_worker";
    url.password = process.env.GYROLUX_WORKER_DB_PASSWORD ?? "gyrolux-worker";
    url.searchParams.set("sslmode", "verify-full");
    url.searchParams.set("sslrootcert", `${process.env.GYROLUX_PG_DATA ?? `/tmp/gyrolux-pg-${url.port}`}.crt`);
    const asWorker = new pg.Client({ connectionString: url.href });
    await asWorker.connect();
    try {
      const tls = await asWorker.query("select ssl from pg_stat_ssl where pid = pg_backend_pid()");
      expect(tls.rows[0].ssl).toBe(true);
      await expect(asWorker.query("select email, password_hash from users limit 1")).rejects.toThrow(/permission denied/);
      await expect(asWorker.query("select * from parameter_sets limit 1")).rejects.toThrow(/permission denied/);
    } finally {
      await asWorker.end();
    }
    await Promise.all([...workers.keys()].map((id) => stopWorker(id, "SIGKILL")));
    startWorker("queue-role", { DATABASE_URL: url.href });
    const spec = mapSpec(32, 8);
    const id = await insertRun(spec);
    const done = await settledRun(id);
    expect(done.state, done.error ?? "").toBe("done");
    const result = (await db.query("select worker_id, meta, data from lab_run_results where run_id = $1", [id])).rows[0];
    expect(result.worker_id).toBe("queue-role");
    const { decodeResult } = await import("@/lib/lab-runs/encoding");
    const want = computeRunInProcess(spec.kind, spec.payload).columns;
    const got = decodeResult(result.meta, result.data);
    expect(Object.is(got.thetaRad![7], want.thetaRad![7])).toBe(true);
    await stopWorker("queue-role");
  });

  it("the self-contained worker bundle (npm run build:worker) runs a job from a folder outside the checkout", async () => {
    const folder = mkdtempSync(path.join(tmpdir(), "gyrolux-worker-bundle-"));
    const build = spawnSync(process.execPath, ["scripts/build-cli.mjs", "--worker-bundle", folder], {
      cwd: process.cwd(),
      encoding: "utf8",
    });
    expect(build.status, build.stderr).toBe(0);
    expect(path.relative(process.cwd(), folder).startsWith("..")).toBe(true);
    const files = readdirSync(folder).sort();
    expect(files).toEqual(["lab-worker-thread.mjs", "lab-worker.mjs", "package.json"]);
    const bytes = files.reduce((sum, f) => sum + statSync(path.join(folder, f)).size, 0);
    console.log(`[lab runs] worker bundle: ${files.join(", ")}, ${(bytes / 1e6).toFixed(2)} MB`);
    await Promise.all([...workers.keys()].map((w) => stopWorker(w, "SIGKILL")));
    // No node_modules on the way up from the folder: only Node and the bundle.
    startWorker("queue-bundle", { NODE_PATH: "" }, folder);
    const id = await insertRun(spectrumSpec(300));
    const done = await settledRun(id);
    expect(done.state, done.error ?? "").toBe("done");
    expect((await db.query("select worker_id from lab_run_results where run_id = $1", [id])).rows[0].worker_id).toBe("queue-bundle");
    await stopWorker("queue-bundle");
    rmSync(folder, { recursive: true, force: true });
  });

  it("a run cancelled while queued never starts, even when its job is still on the queue", async () => {
    const id = await insertRun(mapSpec(8, 4));
    // The cancel as requestCancel stores it for a queued run; the queue's own cancel is left out,
    // as when it failed or a worker had already fetched the job.
    await db.query("update lab_runs set cancel_requested = true, state = 'cancelled', finished_at = now() where id = $1", [id]);
    ensureWorker("queue-a");
    const job = await waitFor("the job to be settled", async () => {
      const j = await jobRow(id);
      return j && j.state !== "created" && j.state !== "active" ? j : null;
    });
    expect(job.state).toBe("cancelled");
    const run = await runRow(id);
    expect(run.state).toBe("cancelled");
    expect(run.attempt).toBe(0);
    expect(run.started_at).toBeNull();
    expect(run.worker_id).toBeNull();
  });

  it("a job made for another major engine version is handed back, not computed and not counted as a retry", async () => {
    const major = Number(ENGINE_VERSION.split(".")[0]);
    ensureWorker("queue-a");
    const id = await insertRun(mapSpec(8, 4), { engineVersion: `${major + 1}.0.0` });
    const run = await waitFor("the hand-back note", async () => {
      const r = await runRow(id);
      return r.error ? r : null;
    });
    expect(run.error).toMatch(new RegExp(`engine ${major + 1}\\.x`));
    expect(run.state).toBe("queued");
    expect(run.attempt).toBe(0);
    const job = await jobRow(id);
    expect(job.state).toBe("created");
    expect(job.retry_count).toBe(0);
    expect(job.delayed).toBe(true);
    await db.query("update lab_runs set cancel_requested = true, state = 'cancelled' where id = $1", [id]);
  });

  it("a run whose payload the registry refuses fails for good: failed in the queue at once, no retry", async () => {
    ensureWorker("queue-a");
    const id = await insertRun({ kind: "map", payload: { method: "llg" } });
    const run = await settledRun(id);
    expect(run.state).toBe("failed");
    expect(run.error).toMatch(/Invalid run/);
    const job = await waitFor("the job to fail", async () => {
      const j = await jobRow(id);
      return j?.state === "failed" ? j : null;
    });
    expect(job.retry_count).toBe(0);
  });

  it("a 65k-cell map: a graceful stop hands it back without a retry, and the next worker resumes from the saved rows", async () => {
    const spec = mapSpec(256, 256);
    ensureWorker("queue-a");
    const id = await insertRun(spec);
    await waitFor("a third of the rows saved", async () => (await checkpointCount(id)) >= 86, 180_000);
    await stopWorker("queue-a", "SIGTERM");
    const stopped = await runRow(id);
    const saved = await checkpointCount(id);
    expect(stopped.state).toBe("queued");
    expect(stopped.error).toMatch(/stopped with \d+ of 256 parts saved/);
    const job = await jobRow(id);
    expect(job.state).toBe("created");
    expect(job.retry_count).toBe(0);

    startWorker("queue-b");
    const done = await settledRun(id);
    expect(done.state, done.error ?? "").toBe("done");
    const result = (await db.query("select meta, worker_id, attempt, engine_version from lab_run_results where run_id = $1", [id])).rows[0];
    expect(result.worker_id).toBe("queue-b");
    expect(result.engine_version).toBe(ENGINE_VERSION);
    // The resumed attempt began at the saved rows' share of the run (its time left counts from there).
    expect(done.progress_at_start).toBeCloseTo(saved / 256, 9);
    const { resumed, computed, chunks } = result.meta.checkpoints;
    expect(chunks).toBe(256);
    expect(resumed).toBe(saved);
    expect(resumed + computed).toBe(256);
    expect(await checkpointCount(id)).toBe(0);
    const finalJob = await jobRow(id);
    expect(finalJob.state).toBe("completed");
    expect(finalJob.retry_count).toBe(0);
    console.log(
      `[lab runs] graceful stop of a 65,536-cell map: ${saved} of 256 rows saved at the stop, the next worker computed ${computed}`,
    );
  });

  it("a 65k-cell map whose worker is killed: the retry redoes less than half the work and gives the same bits", async () => {
    const spec = mapSpec(256, 256);
    ensureWorker("queue-b");
    const id = await insertRun(spec);
    await waitFor("half the rows saved", async () => (await checkpointCount(id)) >= 128, 180_000);
    await stopWorker("queue-b", "SIGKILL");
    const killedAt = Date.now();
    const saved = await checkpointCount(id);
    startWorker("queue-c");
    const done = await settledRun(id);
    const doneS = (Date.now() - killedAt) / 1000;
    expect(done.state, done.error ?? "").toBe("done");
    expect(done.attempt).toBe(2);
    const result = (await db.query("select meta, data from lab_run_results where run_id = $1", [id])).rows[0];
    const { resumed, computed } = result.meta.checkpoints;
    expect(resumed).toBe(saved);
    // Work redone: what the killed attempt had computed beyond its saved rows (at most the rows in
    // flight on its one thread) plus nothing else, since the retry computes only the missing rows.
    expect(computed).toBe(256 - saved);
    const totalComputed = saved + computed;
    expect(totalComputed / 256).toBeLessThan(1.5);
    const { decodeResult } = await import("@/lib/lab-runs/encoding");
    const got = decodeResult(result.meta, result.data);
    const want = computeRunInProcess(spec.kind, spec.payload).columns;
    for (const name of Object.keys(want)) {
      const a = got[name]!;
      const b = want[name]!;
      expect(a.length, name).toBe(b.length);
      const differing = a.findIndex((v, i) => !Object.is(v, b[i]));
      expect(differing, `${name} first differing cell`).toBe(-1);
    }
    console.log(
      `[lab runs] SIGKILL of a 65,536-cell map: ${saved} of 256 rows saved before the kill; the retry computed ${computed} rows ` +
        `(a restart from zero: 256), done ${doneS.toFixed(1)} s after the kill`,
    );
  });
});
