/*
 * Benchmark (not a test): the API under a lab's load. Seeds one lab with 2,000 parameter sets and
 * 300 measurement sets (straight into the database, as the product would have stored them), signs
 * in a few members, then runs CLIENTS concurrent loops over the lists and detail endpoints on
 * loopback for a bounded time, and prints requests per second and p50/p95/p99 latency per
 * endpoint and overall. Nothing is asserted; the figures depend on the machine and its load.
 *
 *   npx tsx scripts/bench-api.ts BASE_URL [--seconds 20] [--clients 50]   (DATABASE_URL: the server's database)
 * `npm run bench:api` starts PostgreSQL, a fresh database, the production build and the server first.
 */
import { randomUUID } from "node:crypto";
import { parseArgs } from "node:util";
import { createDb, createPool } from "../db/connection";
import { labMemberships, labs, measurementSets, parameterSets, parameterSetVersions, users } from "../db/schema";
import { hashPassword } from "../lib/auth/password";
import { TERBIUM_GARNET_DEFAULTS } from "../lib/model/defaults";
import { scriptSettings } from "../lib/settings/scripts";

const { values, positionals } = parseArgs({
  allowPositionals: true,
  options: { seconds: { type: "string", default: "20" }, clients: { type: "string", default: "50" } },
});
const BASE = positionals[0] ?? "http://localhost:3000";
const SECONDS = Number(values.seconds);
const CLIENTS = Number(values.clients);
const PARAMETER_SETS = 2000;
const MEASUREMENT_SETS = 300;
const MEMBERS = 5;
const PASSWORD = "bench-password-not-secret";

async function seed(): Promise<{ labId: string; emails: string[]; setIds: string[]; measurementIds: string[] }> {
  const pool = createPool({ url: scriptSettings.database.url, max: 2 });
  const db = createDb(pool);
  try {
    const tag = Date.now().toString(36);
    const passwordHash = await hashPassword(PASSWORD);
    const members = await db
      .insert(users)
      .values(
        Array.from({ length: MEMBERS }, (_, i) => ({ email: `bench-${tag}-${i}@bench.gyrolux.test`, name: `Bench ${i}`, passwordHash })),
      )
      .returning({ id: users.id, email: users.email });
    const [lab] = await db
      .insert(labs)
      .values({ name: `Bench lab ${tag}` })
      .returning({ id: labs.id });
    if (!lab) throw new Error("no lab");
    await db
      .insert(labMemberships)
      .values(members.map((m, i) => ({ labId: lab.id, userId: m.id, role: i === 0 ? ("owner" as const) : ("editor" as const) })));
    const author = members[0]!.id;
    const setIds: string[] = [];
    for (let start = 0; start < PARAMETER_SETS; start += 500) {
      const rows = Array.from({ length: Math.min(500, PARAMETER_SETS - start) }, (_, k) => {
        const i = start + k;
        return {
          id: randomUUID(),
          labId: lab.id,
          name: `Bench set ${i}`,
          description: `Terbium garnet variant ${i}, ion density scaled for the load benchmark.`,
          tags: ["bench", i % 2 ? "garnet" : "glass"],
          params: { ...TERBIUM_GARNET_DEFAULTS, temperatureK: 4 + (i % 290) },
          createdById: author,
          updatedById: author,
        };
      });
      await db.insert(parameterSets).values(rows);
      await db.insert(parameterSetVersions).values(
        rows.map((r) => ({
          setId: r.id,
          version: 1,
          name: r.name,
          description: r.description,
          tags: r.tags,
          params: r.params,
          createdById: author,
        })),
      );
      setIds.push(...rows.map((r) => r.id));
    }
    const measurementRows = Array.from({ length: MEASUREMENT_SETS }, (_, i) => ({
      id: randomUUID(),
      labId: lab.id,
      name: `Bench measurements ${i}`,
      sample: `sample ${i % 17}`,
      quantity: "verdet" as const,
      rowCount: 120,
      wavelengthMinNm: 400,
      wavelengthMaxNm: 1100,
      temperaturesK: [4.2, 10, 20, 50, 77, 150, 293],
      fieldsT: [0.5, 1, 2],
      lengthsM: [0.01],
      mapping: {},
      fileName: `bench-${i}.csv`,
      fileBytes: 4096,
      contentType: "text/csv",
      fileSha256: "0".repeat(64),
      objectKey: `bench/${i}`,
      createdById: author,
    }));
    await db.insert(measurementSets).values(measurementRows);
    return { labId: lab.id, emails: members.map((m) => m.email), setIds, measurementIds: measurementRows.map((r) => r.id) };
  } finally {
    await pool.end();
  }
}

/** Signs in through Auth.js's credentials callback and returns the Cookie header. */
async function signIn(email: string): Promise<string> {
  const jar = new Map<string, string>();
  const keep = (response: Response) => {
    for (const line of response.headers.getSetCookie()) {
      const [pair] = line.split(";");
      const at = pair!.indexOf("=");
      jar.set(pair!.slice(0, at), pair!.slice(at + 1));
    }
  };
  const header = () => [...jar].map(([k, v]) => `${k}=${v}`).join("; ");
  const csrf = await fetch(`${BASE}/api/auth/csrf`);
  keep(csrf);
  const { csrfToken } = (await csrf.json()) as { csrfToken: string };
  const response = await fetch(`${BASE}/api/auth/callback/credentials`, {
    method: "POST",
    redirect: "manual",
    headers: { "content-type": "application/x-www-form-urlencoded", cookie: header() },
    body: new URLSearchParams({ csrfToken, email, password: PASSWORD }).toString(),
  });
  keep(response);
  await response.body?.cancel();
  if (![...jar.keys()].some((k) => k.includes("session-token"))) throw new Error(`sign-in of ${email} failed: ${response.status}`);
  return header();
}

const percentile = (sorted: number[], p: number) =>
  sorted[Math.min(sorted.length - 1, Math.floor((p / 100) * sorted.length))] ?? Number.NaN;

async function main(): Promise<void> {
  const seeded = await seed();
  const cookies = await Promise.all(seeded.emails.map(signIn));
  const pick = <T>(items: T[]) => items[Math.floor(Math.random() * items.length)]!;
  const endpoints: { name: string; path: () => string }[] = [
    { name: "GET /api/parameter-sets?labId", path: () => `/api/parameter-sets?labId=${seeded.labId}` },
    { name: "GET /api/measurement-sets?labId", path: () => `/api/measurement-sets?labId=${seeded.labId}` },
    { name: "GET /api/parameter-sets/{id}", path: () => `/api/parameter-sets/${pick(seeded.setIds)}` },
    { name: "GET /api/measurement-sets/{id}", path: () => `/api/measurement-sets/${pick(seeded.measurementIds)}` },
  ];
  const latencies = new Map(endpoints.map((e) => [e.name, [] as number[]]));
  const bytes = new Map(endpoints.map((e) => [e.name, 0]));
  let failures = 0;
  const until = performance.now() + SECONDS * 1000;
  const started = performance.now();
  await Promise.all(
    Array.from({ length: CLIENTS }, async (_, client) => {
      const cookie = cookies[client % cookies.length]!;
      let i = client;
      while (performance.now() < until) {
        const endpoint = endpoints[i++ % endpoints.length]!;
        const t0 = performance.now();
        const response = await fetch(`${BASE}${endpoint.path()}`, { headers: { cookie } });
        const body = await response.arrayBuffer();
        latencies.get(endpoint.name)!.push(performance.now() - t0);
        bytes.set(endpoint.name, body.byteLength);
        if (response.status !== 200) failures++;
      }
    }),
  );
  const elapsedS = (performance.now() - started) / 1000;
  const row = (name: string, values: number[], size?: number) => {
    const sorted = [...values].sort((a, b) => a - b);
    const f = (ms: number) => `${ms.toFixed(1)} ms`.padStart(10);
    const sizeText = size === undefined ? "" : `  ${(size / 1024).toFixed(1)} KiB/answer`;
    console.log(
      `${name.padEnd(36)} ${String(values.length).padStart(6)} req ${(values.length / elapsedS).toFixed(1).padStart(7)} req/s  ` +
        `p50 ${f(percentile(sorted, 50))}  p95 ${f(percentile(sorted, 95))}  p99 ${f(percentile(sorted, 99))}${sizeText}`,
    );
  };
  console.log(
    `bench:api — ${BASE}, ${CLIENTS} concurrent clients for ${elapsedS.toFixed(1)} s; lab of ${PARAMETER_SETS} parameter sets ` +
      `and ${MEASUREMENT_SETS} measurement sets; ${failures} answers other than 200`,
  );
  for (const endpoint of endpoints) row(endpoint.name, latencies.get(endpoint.name)!, bytes.get(endpoint.name));
  row("all", [...latencies.values()].flat());
}

main().catch((error) => {
  console.error(error);
  process.exit(1);
});
