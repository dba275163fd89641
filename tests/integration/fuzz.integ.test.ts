import { describe, expect, it } from "vitest";
import { Client, createSet, type JsonBody, signUp, uniqueEmail, validParams } from "./support";
import { seededRandom } from "@/lib/random";
import { encodeCursor } from "@/db/paging";

/*
 * Seeded fuzzing of every mutating route: each case is a valid request with one hostile change
 * (NUL, unpaired surrogates, deep nesting, wrong types, broken JSON or UTF-8, oversized bodies,
 * malformed percent-encoding in the path, wrong content type), so every case must be refused.
 * The test asserts no 5xx at all, and that nothing the requests could touch changed.
 */

const SEED = 0x9e3779b9;
// GYROLUX_FUZZ_CASES overrides the count for a longer (or quicker) local run.
const CASES_PER_ROUTE = Number(process.env.GYROLUX_FUZZ_CASES ?? 200);

type Random = () => number;
const pick = <T>(r: Random, items: readonly T[]): T => items[Math.floor(r() * items.length)]!;

const BAD_STRINGS = ["a\u0000b", "\u0000", "x\ud800", "\udc00y", "\ud83d", "ok\ud800\ud800", "é\u0000\ud800"];
const BAD_PATH_SEGMENTS = ["%C0%AF", "%", "%E0%A4%A", "%ZZ", "%ED%A0%80", "%FF%FE", "..%2F..%2F", "%00", "a%2"];

/** JSON text nested 33–5032 levels deep (built as text: JSON.stringify would recurse that deep). */
function deepText(r: Random): string {
  const depth = 33 + Math.floor(r() * 5000);
  const objects = r() < 0.5;
  return objects ? `${'{"k":'.repeat(depth)}1${"}".repeat(depth)}` : `${"[".repeat(depth)}1${"]".repeat(depth)}`;
}

function wrongType(r: Random, current: unknown): unknown {
  const options: unknown[] =
    typeof current === "number"
      ? ["NaN", null, [], {}, true]
      : typeof current === "string"
        ? [12, null, [], { a: 1 }, false]
        : ["text", 3, true];
  return pick(r, options);
}

interface FuzzRequest {
  method: string;
  path: string;
  body?: BodyInit;
  contentType?: string;
}

/** One hostile variant of a valid JSON body (or of its path), always something the API must refuse. */
function hostile(r: Random, base: { method: string; path: string; body?: Record<string, unknown>; pathIds?: string[] }): FuzzRequest {
  const kinds = base.body ? ["badString", "deep", "wrongType", "brokenJson", "badUtf8", "oversized", "contentType", "path"] : ["path"];
  const kind = pick(r, kinds);
  const json = (value: unknown): FuzzRequest => ({
    method: base.method,
    path: base.path,
    body: JSON.stringify(value),
    contentType: "application/json",
  });
  const body = { ...base.body };
  const keys = Object.keys(body);
  switch (kind) {
    case "badString": {
      const key = pick(r, keys);
      const current = body[key];
      body[key] = Array.isArray(current)
        ? [pick(r, BAD_STRINGS)]
        : typeof current === "object" && current !== null
          ? { [pick(r, BAD_STRINGS)]: 1 }
          : pick(r, BAD_STRINGS);
      return json(body);
    }
    case "deep": {
      body[pick(r, keys)] = "__DEEP__";
      const text = JSON.stringify(body).replace('"__DEEP__"', deepText(r));
      return { method: base.method, path: base.path, body: text, contentType: "application/json" };
    }
    case "wrongType": {
      const key = pick(r, keys);
      body[key] = wrongType(r, body[key]);
      return json(body);
    }
    case "brokenJson": {
      const text = JSON.stringify(body);
      return {
        method: base.method,
        path: base.path,
        body: text.slice(0, Math.max(1, Math.floor(r() * (text.length - 1)))),
        contentType: "application/json",
      };
    }
    case "badUtf8": {
      const text = Buffer.from(JSON.stringify(body));
      const at = Math.floor(r() * text.length);
      const bytes = Buffer.concat([text.subarray(0, at), Buffer.from([pick(r, [0xc0, 0xff, 0xed, 0x80]), 0xaf]), text.subarray(at)]);
      return { method: base.method, path: base.path, body: new Uint8Array(bytes), contentType: "application/json" };
    }
    case "oversized":
      body[pick(r, keys)] = "x".repeat(65 * 1024 + Math.floor(r() * 100_000));
      return json(body);
    case "contentType":
      return {
        ...json(body),
        contentType: pick(r, ["text/plain", "application/x-www-form-urlencoded", "multipart/form-data; boundary=x"]),
      };
    default: {
      const ids = base.pathIds ?? [];
      const target = ids.length > 0 ? pick(r, ids) : null;
      const segment = pick(r, BAD_PATH_SEGMENTS);
      const path = target ? base.path.replace(target, segment) : `${base.path}/${segment}`;
      return {
        method: base.method,
        path,
        body: base.body ? JSON.stringify(base.body) : undefined,
        contentType: base.body ? "application/json" : undefined,
      };
    }
  }
}

/** The status, or 0 when the server closed the connection without an answer. */
async function send(client: Client, request: FuzzRequest): Promise<number> {
  try {
    const response = await client.raw(request.method, request.path, {
      body: request.body,
      headers: request.contentType ? { "content-type": request.contentType } : {},
    });
    await response.body?.cancel();
    return response.status;
  } catch {
    return 0;
  }
}

describe("fuzzing the mutating routes", () => {
  it("no 5xx and no change from any refused request", { timeout: 900_000 }, async () => {
    const account = await signUp({ name: "Fuzz Owner" });
    const owner = account.client;
    const set = await createSet(owner, { labId: account.labId });
    const tokens = await owner.get("/api/tokens");
    const snapshot = async () => ({
      set: (await owner.get(`/api/parameter-sets/${set.id}`)).body.item,
      versions: (await owner.get(`/api/parameter-sets/${set.id}/versions?limit=200`)).body.items.length,
      sets: (await owner.get(`/api/parameter-sets?labId=${account.labId}&limit=200`)).body.items.map(
        (s: { id: string; version: number }) => `${s.id}:${s.version}`,
      ),
      members: (await owner.get(`/api/labs/${account.labId}/members?limit=200`)).body.items,
      invitations: (await owner.get(`/api/labs/${account.labId}/invitations?limit=200`)).body.items.length,
      tokens: (await owner.get("/api/tokens?limit=200")).body.items.length,
      links: (await owner.get(`/api/parameter-sets/${set.id}/share-links?limit=200`)).body.items.length,
      audit: (await owner.get(`/api/labs/${account.labId}/audit?limit=200`)).body.items.length,
    });
    const before = await snapshot();
    expect(tokens.status).toBe(200);

    const lab = account.labId;
    const routes: {
      method: string;
      path: string;
      body?: Record<string, unknown>;
      pathIds?: string[];
      anonymous?: boolean;
      form?: boolean;
    }[] = [
      {
        method: "POST",
        path: "/api/parameter-sets",
        body: { labId: lab, name: "fuzz set", description: "d", tags: ["t"], params: validParams() },
      },
      {
        method: "PATCH",
        path: `/api/parameter-sets/${set.id}`,
        body: { version: 1, name: "renamed", description: "d", tags: ["t"], params: validParams() },
        pathIds: [set.id],
      },
      { method: "DELETE", path: `/api/parameter-sets/${set.id}`, pathIds: [set.id] },
      { method: "POST", path: `/api/parameter-sets/${set.id}/versions/1/restore`, body: { version: 1 }, pathIds: [set.id, "/1/"] },
      {
        method: "PUT",
        path: `/api/parameter-sets/${set.id}/view-state`,
        body: { viewState: { xUnit: "nm", markersNm: [632.8] } },
        pathIds: [set.id],
      },
      { method: "PATCH", path: `/api/labs/${lab}/members/${account.userId}`, body: { role: "owner" }, pathIds: [lab, account.userId] },
      { method: "DELETE", path: `/api/labs/${lab}/members/${account.userId}`, pathIds: [lab, account.userId] },
      {
        method: "POST",
        path: `/api/labs/${lab}/invitations`,
        body: { email: "fuzz-invitee@integ.gyrolux.test", role: "viewer" },
        pathIds: [lab],
      },
      {
        method: "DELETE",
        path: `/api/labs/${lab}/invitations/00000000-0000-4000-8000-000000000000`,
        pathIds: [lab, "00000000-0000-4000-8000-000000000000"],
      },
      { method: "POST", path: "/api/invitations/accept", body: { token: "A".repeat(43) } },
      { method: "POST", path: "/api/tokens", body: { name: "fuzz token" } },
      { method: "DELETE", path: "/api/tokens/00000000-0000-4000-8000-000000000000", pathIds: ["00000000-0000-4000-8000-000000000000"] },
      { method: "POST", path: `/api/parameter-sets/${set.id}/share-links`, pathIds: [set.id] },
      {
        method: "DELETE",
        path: `/api/parameter-sets/${set.id}/share-links/00000000-0000-4000-8000-000000000000`,
        pathIds: [set.id, "00000000-0000-4000-8000-000000000000"],
      },
      { method: "POST", path: "/api/account/password", body: { currentPassword: account.password, newPassword: "fuzzed new passphrase" } },
      { method: "POST", path: `/api/users/${account.userId}/end-sessions`, pathIds: [account.userId] },
      {
        method: "POST",
        path: "/api/sign-up",
        body: { name: "Fuzz", email: uniqueEmail("fuzz"), password: "long enough pw" },
        anonymous: true,
      },
      { method: "POST", path: "/api/password-reset", body: { email: uniqueEmail("fuzz-reset") }, anonymous: true },
      {
        method: "POST",
        path: "/api/password-reset/confirm",
        body: { token: "A".repeat(43), newPassword: "long enough pw" },
        anonymous: true,
      },
    ];

    const r = seededRandom(SEED);
    const results: { route: string; status: number; request: FuzzRequest }[] = [];
    const queue: { route: string; client: Client; request: FuzzRequest }[] = [];
    for (const route of routes) {
      for (let i = 0; i < CASES_PER_ROUTE; i++) {
        queue.push({ route: `${route.method} ${route.path}`, client: route.anonymous ? new Client() : owner, request: hostile(r, route) });
      }
    }
    // Sign-in (Auth.js form posts): oversized, NUL, broken surrogates, broken percent-encoding.
    for (let i = 0; i < CASES_PER_ROUTE; i++) {
      const variant = pick(r, ["oversized", "nul", "surrogate", "percent", "deep"]);
      const email =
        variant === "nul"
          ? "a%00b%40c.test"
          : variant === "surrogate"
            ? "a%ED%A0%80%40c.test"
            : variant === "percent"
              ? "a%E0%A4%A%40c.test"
              : "a%40c.test";
      const password =
        variant === "oversized" ? "x".repeat(65 * 1024 + Math.floor(r() * 200_000)) : variant === "deep" ? "[".repeat(5000) : "pw%00";
      queue.push({
        route: "POST /api/auth/callback/credentials",
        client: new Client(),
        request: {
          method: "POST",
          path: "/api/auth/callback/credentials",
          body: `email=${email}&password=${password}`,
          contentType: "application/x-www-form-urlencoded",
        },
      });
    }

    const CONCURRENCY = 6;
    let next = 0;
    await Promise.all(
      Array.from({ length: CONCURRENCY }, async () => {
        while (next < queue.length) {
          const item = queue[next++]!;
          results.push({ route: item.route, status: await send(item.client, item.request), request: item.request });
        }
      }),
    );

    // Fixed cases of the second trust review (impossible cursors, integers beyond PostgreSQL's
    // integer, NUL in queries and uploads, physically impossible points, deep JSON inside a
    // multipart field): each must be a 400 that names its field.
    const fixed = await fixedCases({ owner, lab, setId: set.id });
    for (const item of fixed) {
      results.push({ route: item.label, status: item.status, request: { method: "FIXED", path: item.label } });
      if (item.status === 400)
        expect(item.field === undefined || item.fields.includes(item.field), `${item.label}: ${item.fields}`).toBe(true);
    }
    expect(fixed.filter((item) => item.status !== 400).map((item) => `${item.label} → ${item.status}`)).toEqual([]);

    const serverErrors = results.filter((result) => result.status >= 500 || result.status === 0);
    const accepted = results.filter((result) => result.status >= 200 && result.status < 300);
    console.log(
      `[fuzz] seed ${SEED}: ${results.length} cases on ${routes.length + 1} routes, ` +
        `${serverErrors.length} answers of 5xx, ${accepted.length} accepted`,
    );
    for (const failure of [...serverErrors, ...accepted].slice(0, 10)) {
      console.log(
        `[fuzz] ${failure.status} ${failure.route}: ` +
          `${failure.request.method} ${failure.request.path} ${String(failure.request.body).slice(0, 200)}`,
      );
    }
    expect(serverErrors).toEqual([]);
    expect(accepted.map((a) => `${a.route} ${a.status}`)).toEqual([]);
    expect(await snapshot()).toEqual(before);
  });
});

const ZERO_ID = "00000000-0000-4000-8000-000000000000";

/** A multipart upload of the demo's column layout, with one field made hostile. */
function uploadForm(options: { lab: string; name?: string; sample?: string; fileName?: string; mapping?: string; csv?: string }): FormData {
  const header = options.csv?.split("\n")[0] ?? "wavelength_nm,verdet,sigma";
  const form = new FormData();
  form.set("file", new File([options.csv ?? `${header}\n632.8,-134,2\n`], options.fileName ?? "fuzz.csv", { type: "text/csv" }));
  form.set("labId", options.lab);
  form.set("name", options.name ?? `fuzz upload ${Date.now()}`);
  form.set("sample", options.sample ?? "");
  form.set(
    "mapping",
    options.mapping ??
      JSON.stringify({
        wavelengthColumn: "wavelength_nm",
        wavelengthUnit: "nm",
        quantity: "verdet",
        valueColumn: "verdet",
        valueUnit: "rad/(T·m)",
        sigmaColumn: "sigma",
        temperatureColumn: null,
        fieldColumn: null,
        lengthColumn: null,
      }),
  );
  form.set("defaults", JSON.stringify({ temperatureK: 4.2, fieldT: 1, lengthM: 0.01 }));
  return form;
}

async function fixedCases(options: { owner: Client; lab: string; setId: string }) {
  const { owner, lab, setId } = options;
  const cases: { label: string; field?: string; send: () => Promise<Response> }[] = [];
  for (const stamp of ["2026-99-99 00:00:00+00", "0000-00-00 00:00:00", "2026-02-30 12:00:00+00"]) {
    const cursor = encodeCursor([stamp, ZERO_ID]);
    for (const path of [
      `/api/parameter-sets?labId=${lab}`,
      `/api/measurement-sets?labId=${lab}`,
      `/api/labs/${lab}/invitations?x=1`,
      "/api/tokens?x=1",
      `/api/labs/${lab}/audit?labId=${lab}`,
      `/api/parameter-sets/${setId}/share-links?x=1`,
    ]) {
      cases.push({ label: `GET ${path} cursor ${stamp}`, field: "cursor", send: () => owner.raw("GET", `${path}&cursor=${cursor}`) });
    }
  }
  cases.push({
    label: "GET versions cursor beyond int4",
    field: "cursor",
    send: () => owner.raw("GET", `/api/parameter-sets/${setId}/versions?cursor=${encodeCursor([3_000_000_000])}`),
  });
  for (const limit of ["0x10", "%205", "1e1", "99999999999"]) {
    cases.push({
      label: `GET limit=${limit}`,
      field: "limit",
      send: () => owner.raw("GET", `/api/parameter-sets?labId=${lab}&limit=${limit}`),
    });
  }
  cases.push({ label: "GET measurement-sets q with NUL", field: "q", send: () => owner.raw("GET", "/api/measurement-sets?q=a%00b") });
  const post = (form: FormData) => () => owner.raw("POST", "/api/measurement-sets", { body: form });
  cases.push({ label: "upload NUL in name", field: "name", send: post(uploadForm({ lab, name: "a\u0000b" })) });
  cases.push({ label: "upload NUL in sample", field: "sample", send: post(uploadForm({ lab, sample: "a\u0000b" })) });
  cases.push({ label: "upload NUL in file name", field: "file", send: post(uploadForm({ lab, fileName: "a\u0000b.csv" })) });
  cases.push({
    label: "upload NUL in a mapped header",
    // The mapping's JSON text holds the NUL, so the one JSON reader refuses the field as a whole.
    field: "mapping",
    send: post(
      uploadForm({
        lab,
        csv: "wave\u0000length,verdet,sigma\n632.8,-134,2\n",
        mapping: JSON.stringify({
          wavelengthColumn: "wave\u0000length",
          wavelengthUnit: "nm",
          quantity: "verdet",
          valueColumn: "verdet",
          valueUnit: "rad/(T·m)",
          sigmaColumn: "sigma",
          temperatureColumn: null,
          fieldColumn: null,
          lengthColumn: null,
        }),
      }),
    ),
  });
  for (const [label, row] of [
    ["wavelength 1e-300 nm", "1e-300,-134,2"],
    ["wavelength 1e300 nm", "1e300,-134,2"],
    ["σ 5e-324", "632.8,-134,5e-324"],
  ] as const) {
    cases.push({ label: `upload ${label}`, field: "file", send: post(uploadForm({ lab, csv: `wavelength_nm,verdet,sigma\n${row}\n` })) });
  }
  cases.push({
    label: "upload mapping nested 200,000 deep",
    field: "mapping",
    send: post(uploadForm({ lab, mapping: `${"[".repeat(200_000)}1${"]".repeat(200_000)}` })),
  });
  cases.push({
    label: "plan setVersion 3000000000",
    field: "setVersion",
    send: () =>
      owner.raw("POST", `/api/parameter-sets/${setId}/plans`, {
        body: JSON.stringify({ name: "p", setVersion: 3_000_000_000, request: {}, plan: {} }),
        headers: { "content-type": "application/json" },
      }),
  });
  cases.push({
    label: "PATCH version 3000000000",
    field: "version",
    send: () =>
      owner.raw("PATCH", `/api/parameter-sets/${setId}`, {
        body: JSON.stringify({ version: 3_000_000_000, name: "x" }),
        headers: { "content-type": "application/json" },
      }),
  });
  const out: { label: string; status: number; field?: string; fields: string[] }[] = [];
  for (const item of cases) {
    let status = 0;
    let fields: string[] = [];
    try {
      const response = await item.send();
      status = response.status;
      const body = (response.headers.get("content-type") ?? "").includes("json") ? ((await response.json()) as JsonBody) : null;
      fields = Object.keys(body?.error?.fields ?? {});
    } catch {
      status = 0;
    }
    out.push({ label: item.label, status, field: item.field, fields });
  }
  return out;
}
