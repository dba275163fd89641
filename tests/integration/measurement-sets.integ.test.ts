import { readFileSync } from "node:fs";
import { createServer, type Server } from "node:http";
import type { AddressInfo } from "node:net";
import path from "node:path";
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createDb, createPool } from "@/db/connection";
import { DEMO_MEASUREMENT_SETS } from "@/db/demo-measurements";
import { importMeasurementSet } from "@/db/measurement-import";
import { auditLog, measurementSets, pendingObjectDeletes, users } from "@/db/schema";
import { deleteMeasurementSet } from "@/db/queries/measurement-sets";
import { sweepObjects } from "@/db/queries/object-sweep";
import { parseMeasurementTable, proposeMapping, readTable } from "@/lib/measurements/parse";
import { createObjectStore } from "@/lib/storage/object-store";
import { storageEnvSchema } from "@/lib/settings/storage";
import { Client, DEMO, DEMO_GARNET_SET_ID, DEMO_LAB_ID, type JsonBody, OTHER_LAB_SET_ID, signIn, uniqueName } from "./support";

/*
 * Measurement sets over HTTP against the running server, plus the import's failure paths run
 * in-process against the same PostgreSQL and object store (scripts/test.sh exports DATABASE_URL
 * and the GYROLUX_S3_* settings of the fake it started).
 */

const DEMO_FILE = path.resolve(import.meta.dirname, "../../db/demo/generated-garnet-LM-T4-verdet.csv");
const HEADER = "wavelength_nm,verdet_rad_per_T_m,sigma,temperature_K,field_T,length_m";
const DEMO_SET_ID = DEMO_MEASUREMENT_SETS.find((set) => set.file === path.basename(DEMO_FILE))!.id;

const store = createObjectStore(storageEnvSchema.parse(process.env));
const pool = createPool({ url: process.env.DATABASE_URL ?? "", max: 2 });
const db = createDb(pool);
afterAll(() => pool.end());
const safeName = (prefix: string) => `${uniqueName(prefix).replace(/[^A-Za-z0-9]+/g, "-")}.csv`;
/** Every stored object key whose file part is this name. */
const objectsNamed = async (fileName: string) => (await store.list("labs/")).filter((key) => key.endsWith(`/${fileName}`));

async function upload(
  client: Client,
  options: {
    bytes: Uint8Array | string;
    fileName: string;
    name?: string;
    labId?: string;
    mapping?: unknown;
    defaults?: unknown;
    signsFrom?: unknown;
    type?: string;
  },
) {
  const bytes = typeof options.bytes === "string" ? new TextEncoder().encode(options.bytes) : options.bytes;
  const form = new FormData();
  form.set("file", new File([bytes as BlobPart], options.fileName, { type: options.type ?? "text/csv" }));
  form.set("labId", options.labId ?? DEMO_LAB_ID);
  form.set("name", options.name ?? uniqueName("Integ measurements"));
  form.set("sample", "integration sample");
  form.set("mapping", JSON.stringify(options.mapping ?? proposeMapping(readTable(new TextDecoder().decode(bytes)).headers)));
  form.set("defaults", JSON.stringify(options.defaults ?? {}));
  if (options.signsFrom !== undefined) form.set("signsFrom", JSON.stringify(options.signsFrom));
  const response = await client.raw("POST", "/api/measurement-sets", { body: form });
  const body = (response.headers.get("content-type") ?? "").includes("json") ? await response.json() : await response.text();
  return { status: response.status, body: body as JsonBody };
}

describe("measurement sets", () => {
  let editor: Client;
  let viewer: Client;
  let outsider: Client;

  beforeAll(async () => {
    [editor, viewer, outsider] = await Promise.all([signIn(DEMO.editor), signIn(DEMO.viewer), signIn(DEMO.outsider)]);
  });

  it("stores magnitudes with the sign of a parameter set's model and records which version gave it", async () => {
    // The demo file with its minus signs dropped: magnitudes, as many vendor sheets print |V|.
    const magnitudes = readFileSync(DEMO_FILE, "utf8").replace(/^(\d[^,]*),-/gm, "$1,");
    const garnet = (await editor.get(`/api/parameter-sets/${DEMO_GARNET_SET_ID}`)).body.item;
    const fileName = safeName("magnitudes");

    // A version other than the set's current one is refused, and nothing is stored.
    const stale = await upload(editor, {
      bytes: magnitudes,
      fileName,
      signsFrom: { parameterSetId: DEMO_GARNET_SET_ID, version: garnet.version + 1 },
    });
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe("stale_version");
    expect(stale.body.error.fields.signsFrom).toBe(`Now at version ${garnet.version}.`);
    expect(await objectsNamed(fileName)).toEqual([]);
    // A set the caller cannot see is not found; a malformed one is a field error.
    const hidden = await upload(editor, { bytes: magnitudes, fileName, signsFrom: { parameterSetId: OTHER_LAB_SET_ID, version: 1 } });
    expect(hidden.status).toBe(404);
    const malformed = await upload(editor, { bytes: magnitudes, fileName, signsFrom: { parameterSetId: "garnet", version: 1 } });
    expect(malformed.status).toBe(400);
    expect(Object.keys(malformed.body.error.fields)).toEqual(["signsFrom.parameterSetId"]);

    const created = await upload(editor, {
      bytes: magnitudes,
      fileName,
      signsFrom: { parameterSetId: DEMO_GARNET_SET_ID, version: garnet.version },
    });
    expect(created.status).toBe(201);
    expect(created.body.item.signSource).toEqual({
      parameterSetId: DEMO_GARNET_SET_ID,
      parameterSetName: garnet.name,
      version: garnet.version,
      changedCount: 24,
    });
    const points = (await viewer.get(`/api/measurement-sets/${created.body.item.id}/points`)).body.points;
    // The garnet model's Verdet constant is negative over the file's 420–1600 nm (terbium garnets: V < 0, physics-model.md §1).
    expect(points.map((p: JsonBody) => Math.sign(p.value))).toEqual(Array(24).fill(-1));
    expect(points[0].value).toBe(-390.03);
    // The file is kept as uploaded: its magnitudes.
    const original = await viewer.raw("GET", `/api/measurement-sets/${created.body.item.id}/original`);
    expect(await original.text()).toBe(magnitudes);
    // A plain upload records no sign source.
    const plain = await upload(editor, { bytes: readFileSync(DEMO_FILE), fileName: safeName("plain") });
    expect(plain.body.item.signSource).toBeNull();
  });

  it("refuses a file with bad rows, names every line, and stores neither rows nor the object", async () => {
    const fileName = safeName("bad-rows");
    const name = uniqueName("Bad rows");
    const text = [
      "# comment line",
      HEADER,
      "632.8,-134,2,293.15,1,0.01",
      "700,,2,293.15,1,0.01",
      "800,-80,2,293.15,1,0.01",
      "900,-60,two,293.15,1,0.01",
      "1000,-50,2,293.15,1",
    ].join("\n");
    const response = await upload(editor, { bytes: text, fileName, name });
    expect(response.status).toBe(400);
    expect(response.body.error.code).toBe("validation");
    expect(response.body.error.message).toBe("The file has 3 problems; nothing was stored.");
    expect(response.body.error.problems).toEqual([
      "line 4: Verdet constant is empty",
      "line 6: σ “two” is not a number",
      "line 7: has 5 fields, the header has 6",
    ]);
    const list = await editor.get(`/api/measurement-sets?labId=${DEMO_LAB_ID}&q=${encodeURIComponent(name)}`);
    expect(list.status).toBe(200);
    expect(list.body.items).toEqual([]);
    expect(await objectsNamed(fileName)).toEqual([]);
  });

  it("imports a good file, answers its summary and SI points, and returns the original byte for byte", async () => {
    // CRLF line ends, a UTF-8 comment and no final newline: the download must keep all of it.
    const demo = readFileSync(DEMO_FILE, "utf8").replace(/\n/g, "\r\n").trimEnd();
    const bytes = new TextEncoder().encode(`# measured at 20 °C — Δλ ≈ 1 nm\r\n${demo}`);
    const fileName = safeName("round-trip");
    const name = uniqueName("Round trip");
    const created = await upload(editor, { bytes, fileName, name });
    expect(created.status).toBe(201);
    const item = created.body.item;
    expect(item).toMatchObject({
      labId: DEMO_LAB_ID,
      name,
      sample: "integration sample",
      quantity: "verdet",
      rowCount: 24,
      wavelengthSpanNm: { min: 420, max: 1600 },
      temperaturesK: [293.15],
      fieldsT: [1],
      lengthsM: [0.01],
      fileName,
      fileBytes: bytes.byteLength,
      role: "editor",
    });
    expect(item.uploadedBy.name).toBe("Dr. Tomasz Elbrecht");
    expect(await objectsNamed(fileName)).toHaveLength(1);

    const points = await viewer.get(`/api/measurement-sets/${item.id}/points`);
    expect(points.status).toBe(200);
    expect(points.body.points).toHaveLength(24);
    // Line 1 is the added comment, lines 2–4 the generator's comments, line 5 the header.
    expect(points.body.revision).toBe(1);
    expect(points.body.points[0]).toEqual({
      ordinal: 0,
      line: 6,
      wavelengthNm: 420,
      quantity: "verdet",
      value: -390.03,
      sigma: 6.2,
      temperatureK: 293.15,
      fieldT: 1,
      lengthM: 0.01,
      masked: false,
      maskReason: null,
      note: "",
      original: null,
    });

    const original = await viewer.raw("GET", `/api/measurement-sets/${item.id}/original`);
    expect(original.status).toBe(200);
    expect(original.headers.get("content-disposition")).toContain(`filename="${fileName}"`);
    expect(Buffer.compare(Buffer.from(await original.arrayBuffer()), Buffer.from(bytes))).toBe(0);

    const one = await viewer.get(`/api/measurement-sets/${item.id}`);
    expect(one.body.item).toMatchObject({ id: item.id, role: "viewer", rowCount: 24 });
    const found = await viewer.get(`/api/measurement-sets?labId=${DEMO_LAB_ID}&q=${encodeURIComponent(name)}`);
    expect(found.body.items.map((s: { id: string }) => s.id)).toEqual([item.id]);

    const again = await upload(editor, { bytes, fileName: safeName("same-name"), name });
    expect(again.status).toBe(409);
  });

  it("converts units and takes whole-file values from the form", async () => {
    const text = "energy_eV\trotation_deg\n1.959\t-7.6\n1.165\t-2.2\n";
    const mapping = proposeMapping(["energy_eV", "rotation_deg"]);
    const missing = await upload(editor, { bytes: text, fileName: safeName("defaults"), mapping });
    expect(missing.status).toBe(400);
    expect(missing.body.error.problems).toContain("Temperature: choose a column or enter one value for the whole file.");
    const created = await upload(editor, {
      bytes: text,
      fileName: safeName("defaults"),
      mapping,
      defaults: { relativeSigma: 0.05, temperatureK: 77, fieldT: 0.5, lengthM: 0.02 },
    });
    expect(created.status).toBe(201);
    expect(created.body.item).toMatchObject({ quantity: "rotation", temperaturesK: [77], fieldsT: [0.5], lengthsM: [0.02] });
    const points = (await editor.get(`/api/measurement-sets/${created.body.item.id}/points`)).body.points;
    // 180° = π rad; hc = 1239.84198 eV·nm (CODATA 2018).
    expect(points[0].value).toBeCloseTo((-7.6 * Math.PI) / 180, 12);
    expect(points[0].wavelengthNm).toBeCloseTo(1239.84198 / 1.959, 6);
  });

  it("refuses files over the size limit and requests without a file", async () => {
    const big = new Uint8Array(5 * 1024 * 1024 + 1).fill(0x31);
    // An explicit mapping: proposing one would read the 5 MiB header line first, and a pause of
    // seconds lets the server close the idle keep-alive connection under the request.
    const tooBig = await upload(editor, { bytes: big, fileName: safeName("big"), mapping: proposeMapping(HEADER.split(",")) });
    expect(tooBig.status).toBe(413);
    const form = new FormData();
    form.set("labId", DEMO_LAB_ID);
    form.set("name", uniqueName("No file"));
    form.set("mapping", JSON.stringify(proposeMapping(HEADER.split(","))));
    const noFile = await editor.raw("POST", "/api/measurement-sets", { body: form });
    expect(noFile.status).toBe(400);
    expect((await noFile.json()).error.fields.file).toBe("Choose a file.");
  });

  it("lets a viewer read but not upload or delete, and hides the sets from outsiders", async () => {
    const fileName = safeName("viewer-try");
    const refused = await upload(viewer, { bytes: readFileSync(DEMO_FILE), fileName });
    expect(refused.status).toBe(403);
    expect(await objectsNamed(fileName)).toEqual([]);
    expect((await viewer.get(`/api/measurement-sets/${DEMO_SET_ID}`)).status).toBe(200);
    expect((await viewer.delete(`/api/measurement-sets/${DEMO_SET_ID}`)).status).toBe(403);

    for (const suffix of ["", "/points", "/original"]) {
      const response = await outsider.get(`/api/measurement-sets/${DEMO_SET_ID}${suffix}`);
      expect(response.status, suffix).toBe(404);
    }
    expect((await outsider.delete(`/api/measurement-sets/${DEMO_SET_ID}`)).status).toBe(404);
    expect((await outsider.get(`/api/measurement-sets?labId=${DEMO_LAB_ID}`)).status).toBe(404);
    expect((await outsider.get("/api/measurement-sets")).body.items.map((s: { id: string }) => s.id)).not.toContain(DEMO_SET_ID);
    expect((await upload(outsider, { bytes: readFileSync(DEMO_FILE), fileName: safeName("outsider") })).status).toBe(404);
    expect((await new Client().get("/api/measurement-sets")).status).toBe(401);
  });

  it("deletes a set with its object and an audit entry", async () => {
    const fileName = safeName("to-delete");
    const created = await upload(editor, { bytes: readFileSync(DEMO_FILE), fileName });
    expect(created.status).toBe(201);
    const id = created.body.item.id;
    expect(await objectsNamed(fileName)).toHaveLength(1);
    expect((await editor.delete(`/api/measurement-sets/${id}`)).status).toBe(204);
    expect((await editor.get(`/api/measurement-sets/${id}`)).status).toBe(404);
    expect((await editor.get(`/api/measurement-sets/${id}/points`)).status).toBe(404);
    expect(await objectsNamed(fileName)).toEqual([]);
    const audit = await db.select({ action: auditLog.action, details: auditLog.details }).from(auditLog).where(eq(auditLog.targetId, id));
    expect(audit.map((a) => a.action).sort()).toEqual(["measurement_set.create", "measurement_set.delete"]);
    expect(audit.find((a) => a.action === "measurement_set.delete")?.details).toMatchObject({ rows: 24, fileName });
  });
});

describe("measurement import as one unit", () => {
  const text = readFileSync(DEMO_FILE, "utf8");
  const mapping = proposeMapping(readTable(text).headers);
  const { points } = parseMeasurementTable(text, mapping);
  let failing: Server;
  let failingUrl = "";
  let editorId = "";

  beforeAll(async () => {
    // An S3 endpoint that takes the first part of an upload and then drops the connection.
    failing = createServer((request, response) => {
      request.once("data", () => request.socket.destroy());
      request.once("end", () => response.destroy());
    });
    await new Promise<void>((resolve) => failing.listen(0, "127.0.0.1", resolve));
    failingUrl = `http://127.0.0.1:${(failing.address() as AddressInfo).port}`;
    const [row] = await db.select({ id: users.id }).from(users).where(eq(users.email, DEMO.editor));
    editorId = row?.id ?? "";
  });

  afterAll(async () => {
    await new Promise((resolve) => failing.close(resolve));
  });

  const input = (name: string, labId = DEMO_LAB_ID) => ({
    labId,
    name,
    sample: "",
    fileName: safeName("unit"),
    contentType: "text/csv",
    bytes: new TextEncoder().encode(text),
    mapping,
    defaults: {},
    points,
  });

  it("leaves no rows behind when object storage fails in the middle of the upload", async () => {
    expect(editorId).not.toBe("");
    const brokenStore = createObjectStore({ ...storageEnvSchema.parse(process.env), endpoint: failingUrl });
    const name = uniqueName("Storage fails");
    await expect(importMeasurementSet({ db, store: brokenStore, actorId: editorId, input: input(name) })).rejects.toThrow(/object storage/);
    expect(await db.select().from(measurementSets).where(eq(measurementSets.name, name))).toEqual([]);
  });

  it("removes the stored object again when the database refuses the rows", async () => {
    // A lab id that does not exist: the object is stored, then the foreign key rejects the set.
    const labId = "6a1f0c2e-5b1d-4c1e-9f00-0000000fffff";
    const name = uniqueName("Rows fail");
    await expect(importMeasurementSet({ db, store, actorId: editorId, input: input(name, labId) })).rejects.toThrow();
    expect(await store.list(`labs/${labId}/`)).toEqual([]);
    expect(await db.select().from(measurementSets).where(eq(measurementSets.name, name))).toEqual([]);
  });

  it("17: a delete while the store is down leaves a pending delete, and the sweep removes the object later", async () => {
    const name = uniqueName("Sweep later");
    const id = await importMeasurementSet({ db, store, actorId: editorId, input: input(name) });
    const [row] = await db.select({ objectKey: measurementSets.objectKey }).from(measurementSets).where(eq(measurementSets.id, id));
    const objectKey = row!.objectKey;
    // The import's own pending row went with its transaction.
    expect(await db.select().from(pendingObjectDeletes).where(eq(pendingObjectDeletes.objectKey, objectKey))).toEqual([]);
    const brokenStore = createObjectStore({ ...storageEnvSchema.parse(process.env), endpoint: failingUrl });
    const access = { caller: { id: editorId, siteRole: "member" }, kind: "measurement_set", id, labId: DEMO_LAB_ID } as never;
    expect(await deleteMeasurementSet(db, { access, store: brokenStore })).toBe(true);
    expect(await objectsNamed(objectKey.split("/").pop()!)).toHaveLength(1);
    expect(await db.select().from(pendingObjectDeletes).where(eq(pendingObjectDeletes.objectKey, objectKey))).toHaveLength(1);
    expect(await sweepObjects(db, { store, keys: [objectKey] })).toBe(1);
    expect(await objectsNamed(objectKey.split("/").pop()!)).toEqual([]);
    expect(await db.select().from(pendingObjectDeletes).where(eq(pendingObjectDeletes.objectKey, objectKey))).toEqual([]);
  });
});
