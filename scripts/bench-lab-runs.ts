/*
 * Benchmark (not a test): lab-run throughput of one and of two workers on the same run kind, a
 * numerical (LLG) map, each worker with one compute thread. Needs a migrated and seeded database
 * (DATABASE_URL, e.g. the demo's: `npm run demo` once, or `bash db/pg.sh start` + migrate + seed)
 * and the built worker (`npm run build:cli`, done here when stale). Stop other workers on that
 * database first (`bash scripts/worker.sh stop`): they would take jobs too.
 *
 * For each worker count: queue RUNS maps of COLUMNS × ROWS cells, start the workers, and time from
 * the first claim to the last result. Prints cells per second (all runs' cells over that span) and
 * the speed-up of two workers. The runs it made are deleted afterwards.
 *
 *   npm run bench:lab-runs [-- RUNS COLUMNS ROWS]     (default 8 runs of 96 × 32)
 */
import { type ChildProcess, spawn, spawnSync } from "node:child_process";
import path from "node:path";
import pg from "pg";
import PgBoss from "pg-boss";
import { DEMO_LAB, DEMO_USERS } from "../db/demo-data";
import { ENGINE_VERSION } from "../lib/lab-runs/engine";
import { mapRun } from "../lib/lab-runs/kinds";
import { RUN_QUEUE, runJobData, sendOptions } from "../lib/lab-runs/queue-options";
import { TERBIUM_GARNET_DEFAULTS } from "../lib/model/defaults";
import { scriptSettings } from "../lib/settings/scripts";

const [runs = 8, columns = 96, rows = 32] = process.argv.slice(2).map(Number);
const root = path.resolve(import.meta.dirname, "..");
const url = scriptSettings.database.url;

const payload = mapRun.payloadSchema.parse({
  params: TERBIUM_GARNET_DEFAULTS,
  method: "llg",
  axis: "temperature",
  wavelengths: { fromNm: 400, toNm: 1600, count: columns, spacing: "log" },
  rows: { from: 20, to: 300, count: rows, spacing: "linear" },
});
const cells = mapRun.cells(payload);

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

async function measure(db: pg.Client, boss: PgBoss, submitterId: string, workerCount: number): Promise<number> {
  const ids: string[] = [];
  for (let i = 0; i < runs; i++) {
    const row = await db.query(
      `insert into lab_runs (lab_id, submitted_by, kind, title, payload, cells, engine_version)
       values ($1, $2, 'map', 'throughput benchmark', $3, $4, $5) returning id`,
      [DEMO_LAB.id, submitterId, JSON.stringify(payload), cells, ENGINE_VERSION],
    );
    ids.push(row.rows[0].id);
    await boss.send(RUN_QUEUE, runJobData(row.rows[0].id), sendOptions(scriptSettings.runs, { id: row.rows[0].id, kind: "map", payload }));
  }
  const children: ChildProcess[] = [];
  for (let w = 0; w < workerCount; w++) {
    children.push(
      spawn(process.execPath, ["dist/lab-worker.mjs"], {
        cwd: root,
        env: { ...process.env, GYROLUX_WORKER_ID: `bench-${workerCount}-${w}`, GYROLUX_WORKER_THREADS: "1" },
        stdio: "ignore",
      }),
    );
  }
  try {
    for (;;) {
      const { rows: state } = await db.query(
        `select count(*) filter (where state = 'done')::int as done, count(*) filter (where state in ('failed', 'cancelled'))::int as bad,
                min(started_at) as first, max(finished_at) as last
         from lab_runs where id = any($1::uuid[])`,
        [ids],
      );
      const s = state[0];
      if (s.bad > 0) throw new Error(`${s.bad} benchmark runs failed`);
      if (s.done === runs) {
        // started_at is the last attempt's claim; each run here has one attempt.
        const seconds = (new Date(s.last).getTime() - new Date(s.first).getTime()) / 1000;
        return (runs * cells) / seconds;
      }
      await sleep(200);
    }
  } finally {
    for (const c of children) c.kill("SIGTERM");
    await Promise.all(children.map((c) => new Promise((r) => (c.exitCode === null ? c.once("exit", r) : r(null)))));
    await db.query("delete from lab_runs where id = any($1::uuid[])", [ids]);
  }
}

async function main(): Promise<void> {
  const build = spawnSync(process.execPath, ["scripts/build-cli.mjs", "lab-worker", "lab-worker-thread"], { cwd: root, stdio: "inherit" });
  if (build.status !== 0) throw new Error("the worker build failed");
  const db = new pg.Client({ connectionString: url });
  await db.connect();
  const boss = new PgBoss({ connectionString: url, max: 2, supervise: false, schedule: false });
  await boss.start();
  try {
    const user = await db.query("select id from users where email = $1", [DEMO_USERS.postdoc.email]);
    if (!user.rows[0]) throw new Error("the demo lab is not seeded in this database (npx tsx db/seed.ts)");
    console.log(`lab-run throughput: ${runs} numerical maps of ${columns} × ${rows} = ${cells} cells each, one thread per worker`);
    const one = await measure(db, boss, user.rows[0].id, 1);
    console.log(`  1 worker : ${Math.round(one).toLocaleString("en")} cells/s`);
    const two = await measure(db, boss, user.rows[0].id, 2);
    console.log(`  2 workers: ${Math.round(two).toLocaleString("en")} cells/s (×${(two / one).toFixed(2)})`);
  } finally {
    await boss.stop({ graceful: false, wait: true });
    await db.end();
  }
}

main().catch((error: unknown) => {
  console.error(`[bench:lab-runs] ${error instanceof Error ? error.message : String(error)}`);
  process.exit(1);
});
