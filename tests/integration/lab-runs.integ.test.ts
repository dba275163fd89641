import { spawn, spawnSync, type ChildProcess } from "node:child_process";
import pg from "pg";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { computeRunInProcess, type RunSpec } from "@/lib/lab-runs/kinds";
import { computeSpectrumArrays } from "@/lib/physics/spectrum";
import { wavelengthGrid } from "@/lib/workbench/units";
import { type Client, DEMO, DEMO_GARNET_SET_ID, DEMO_LAB_ID, OTHER_LAB_ID, signIn, validParams } from "./support";

/*
 * Lab runs end to end: the API queues a job on pg-boss, worker processes started here (the built
 * `npm run worker`) take it, and the result comes back through the API. scripts/test.sh shortens
 * the queue's timings (GYROLUX_RUN_STALE_S and friends) so the worker-fault retry takes seconds.
 */

const workers = new Map<string, ChildProcess>();

function startWorker(id: string): ChildProcess {
  const child = spawn(process.execPath, ["dist/lab-worker.mjs"], {
    cwd: process.cwd(),
    env: { ...process.env, GYROLUX_WORKER_ID: id, GYROLUX_WORKER_THREADS: "1" },
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
