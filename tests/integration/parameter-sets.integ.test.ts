import { beforeAll, describe, expect, it } from "vitest";
import { type Client, DEMO, DEMO_LAB_ID, createSet, signIn, uniqueName, validParams } from "./support";

describe("parameter sets: lifecycle", () => {
  let editor: Client;
  let viewer: Client;

  beforeAll(async () => {
    [editor, viewer] = await Promise.all([signIn(DEMO.editor), signIn(DEMO.viewer)]);
  });

  it("create → get → patch → versions → restore → view-state → delete", async () => {
    const name = uniqueName("Lifecycle garnet");
    const created = await editor.post("/api/parameter-sets", {
      labId: DEMO_LAB_ID,
      name,
      description: "  trimmed  ",
      tags: ["integ", "integ", "TGG"],
      params: validParams({ temperatureK: 300 }),
    });
    expect(created.status).toBe(201);
    const item = created.body.item;
    expect(item).toMatchObject({
      labId: DEMO_LAB_ID,
      name,
      description: "trimmed",
      tags: ["integ", "TGG"],
      version: 1,
      role: "editor",
      viewState: null,
    });
    expect(item.params.temperatureK).toBe(300);
    expect(item.createdBy.name).toBe(item.updatedBy.name);
    expect(Date.parse(item.createdAt)).not.toBeNaN();

    const fetched = await viewer.get(`/api/parameter-sets/${item.id}`);
    expect(fetched.status).toBe(200);
    expect(fetched.body.item).toMatchObject({ id: item.id, name, role: "viewer" });

    const listed = await viewer.get(`/api/parameter-sets?labId=${DEMO_LAB_ID}&q=${encodeURIComponent(name)}`);
    expect(listed.body.items.map((s: { id: string }) => s.id)).toEqual([item.id]);
    expect(listed.body.items[0]).not.toHaveProperty("params");
    const byTag = await viewer.get(`/api/parameter-sets?tag=TGG&q=${encodeURIComponent(name)}`);
    expect(byTag.body.items).toHaveLength(1);
    const noTag = await viewer.get(`/api/parameter-sets?tag=nonexistent-tag&q=${encodeURIComponent(name)}`);
    expect(noTag.body.items).toHaveLength(0);

    const patched = await editor.patch(`/api/parameter-sets/${item.id}`, {
      version: 1,
      params: validParams({ temperatureK: 77 }),
      tags: ["cold"],
    });
    expect(patched.status).toBe(200);
    expect(patched.body.item).toMatchObject({ version: 2, name, tags: ["cold"] });
    expect(patched.body.item.params.temperatureK).toBe(77);

    const versions = await viewer.get(`/api/parameter-sets/${item.id}/versions`);
    expect(versions.status).toBe(200);
    expect(versions.body.items.map((v: { version: number }) => v.version)).toEqual([2, 1]);
    expect(versions.body.items[1].params.temperatureK).toBe(300);
    expect(versions.body.items[0].createdBy.name).toBeTruthy();

    const stale = await editor.post(`/api/parameter-sets/${item.id}/versions/1/restore`, { version: 1 });
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe("stale_version");

    const restored = await editor.post(`/api/parameter-sets/${item.id}/versions/1/restore`, { version: 2 });
    expect(restored.status).toBe(200);
    expect(restored.body.item.version).toBe(3);
    expect(restored.body.item.params.temperatureK).toBe(300);
    expect(restored.body.item.tags).toEqual(["integ", "TGG"]);

    // A restore without the version it starts from would be a blind write: refused, nothing saved.
    const bare = await editor.request("POST", `/api/parameter-sets/${item.id}/versions/2/restore`);
    expect(bare.status).toBe(415);
    const noVersion = await editor.post(`/api/parameter-sets/${item.id}/versions/2/restore`, {});
    expect(noVersion.status).toBe(400);
    expect(noVersion.body.error.fields.version).toBeTruthy();
    const again = await editor.post(`/api/parameter-sets/${item.id}/versions/2/restore`, { version: 3 });
    expect(again.status).toBe(200);
    expect(again.body.item.version).toBe(4);

    expect((await editor.post(`/api/parameter-sets/${item.id}/versions/99/restore`, { version: 4 })).status).toBe(404);
    expect((await editor.post(`/api/parameter-sets/${item.id}/versions/abc/restore`, { version: 4 })).status).toBe(404);
    const history = await viewer.get(`/api/parameter-sets/${item.id}/versions`);
    expect(history.body.items.map((v: { version: number }) => v.version)).toEqual([4, 3, 2, 1]);

    const view = await editor.put(`/api/parameter-sets/${item.id}/view-state`, { viewState: { plot: "verdet", range: [400, 1100] } });
    expect(view.status).toBe(200);
    expect(view.body.item.viewState).toEqual({ plot: "verdet", range: [400, 1100] });
    expect(view.body.item.version).toBe(4);
    expect((await editor.put(`/api/parameter-sets/${item.id}/view-state`, { viewState: "nope" })).status).toBe(400);
    const tooBig = await editor.put(`/api/parameter-sets/${item.id}/view-state`, { viewState: { blob: "x".repeat(40 * 1024) } });
    expect(tooBig.status).toBe(400);
    expect(tooBig.body.error.fields.viewState).toBeTruthy();

    // The history says which version a restore copied, and keeps a save's note.
    expect(history.body.items.map((v: { restoredFrom: number | null }) => v.restoredFrom)).toEqual([2, 1, null, null]);
    const noted = await editor.patch(`/api/parameter-sets/${item.id}`, { version: 4, description: "noted", note: "  cooled to 77 K  " });
    expect(noted.status).toBe(200);
    const newest = await viewer.get(`/api/parameter-sets/${item.id}/versions?limit=1`);
    expect(newest.body.items[0]).toMatchObject({ version: 5, restoredFrom: null, note: "cooled to 77 K" });
    const tooLong = await editor.patch(`/api/parameter-sets/${item.id}`, { version: 5, description: "x", note: "n".repeat(501) });
    expect(tooLong.status).toBe(400);
    expect(tooLong.body.error.fields.note).toBeTruthy();

    expect((await editor.delete(`/api/parameter-sets/${item.id}`)).status).toBe(204);
    expect((await viewer.get(`/api/parameter-sets/${item.id}`)).status).toBe(404);
    expect((await editor.delete(`/api/parameter-sets/${item.id}`)).status).toBe(404);
    expect((await viewer.get(`/api/parameter-sets/${item.id}/versions`)).status).toBe(404);
  });

  it("a PATCH that changes nothing → 200 with the item as it was and no new version", async () => {
    const set = await createSet(editor, { params: validParams({ temperatureK: 250 }) });

    const onlyVersion = await editor.patch(`/api/parameter-sets/${set.id}`, { version: 1 });
    expect(onlyVersion.status).toBe(200);
    expect(onlyVersion.body.item).toEqual(set);

    // The same values sent back (parameters in another key order, as a form might) are no change either.
    const reordered = Object.fromEntries(Object.entries(set.params).reverse());
    const sameValues = await editor.patch(`/api/parameter-sets/${set.id}`, {
      version: 1,
      name: set.name,
      description: set.description,
      tags: set.tags,
      params: reordered,
    });
    expect(sameValues.status).toBe(200);
    expect(sameValues.body.item).toMatchObject({ version: 1, updatedAt: set.updatedAt });

    const versions = await viewer.get(`/api/parameter-sets/${set.id}/versions`);
    expect(versions.body.items.map((v: { version: number }) => v.version)).toEqual([1]);

    // A stale version is still a conflict, and a real change still makes version 2.
    const real = await editor.patch(`/api/parameter-sets/${set.id}`, { version: 1, description: "changed" });
    expect(real.body.item.version).toBe(2);
    const stale = await editor.patch(`/api/parameter-sets/${set.id}`, { version: 1 });
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe("stale_version");
  });

  it("duplicate names in a lab → 409 conflict with fields.name (create, rename and restore)", async () => {
    const first = await createSet(editor);
    const duplicate = await editor.post("/api/parameter-sets", { labId: DEMO_LAB_ID, name: first.name, params: validParams() });
    expect(duplicate.status).toBe(409);
    expect(duplicate.body.error.code).toBe("conflict");
    expect(duplicate.body.error.fields.name).toBeTruthy();

    const second = await createSet(editor);
    const rename = await editor.patch(`/api/parameter-sets/${second.id}`, { version: 1, name: first.name });
    expect(rename.status).toBe(409);
    expect(rename.body.error.fields.name).toBeTruthy();
    const unchanged = await editor.get(`/api/parameter-sets/${second.id}`);
    expect(unchanged.body.item).toMatchObject({ name: second.name, version: 1 });
    expect((await editor.get(`/api/parameter-sets/${second.id}/versions`)).body.items).toHaveLength(1);
  });

  it("unknown and malformed ids → 404", async () => {
    for (const path of [
      "/api/parameter-sets/00000000-0000-4000-8000-000000000000",
      "/api/parameter-sets/not-a-uuid",
      "/api/parameter-sets/1;drop table users",
      "/api/parameter-sets/not-a-uuid/versions",
      "/api/labs/not-a-uuid/members",
    ]) {
      const response = await editor.get(path);
      expect(response.status, path).toBe(404);
      expect(response.body.error.code).toBe("not_found");
    }
    expect((await editor.patch("/api/parameter-sets/not-a-uuid", { version: 1 })).status).toBe(404);
    expect((await editor.get("/api/parameter-sets?labId=not-a-uuid")).status).toBe(404);
  });
});

describe("parameter sets: bad input changes nothing", () => {
  let editor: Client;
  let set: { id: string; params: unknown };

  beforeAll(async () => {
    editor = await signIn(DEMO.editor);
    set = await createSet(editor);
  });

  const expectUnchanged = async () => {
    const stored = await editor.get(`/api/parameter-sets/${set.id}`);
    expect(stored.body.item.version).toBe(1);
    expect(stored.body.item.params).toEqual(set.params);
    expect((await editor.get(`/api/parameter-sets/${set.id}/versions`)).body.items).toHaveLength(1);
  };

  it("malformed JSON → 400 bad_json", async () => {
    for (const body of ['{"version": 1, "name": ', "{'version': 1}", "NaN", "[1,2"]) {
      const response = await editor.request("PATCH", `/api/parameter-sets/${set.id}`, {
        body,
        headers: { "content-type": "application/json" },
      });
      expect(response.status, body).toBe(400);
      expect(response.body.error.code).toBe("bad_json");
    }
    const empty = await editor.request("POST", "/api/parameter-sets", { body: "", headers: { "content-type": "application/json" } });
    expect(empty.status).toBe(400);
    await expectUnchanged();
  });

  it("a non-JSON content type → 415", async () => {
    const response = await editor.request("PATCH", `/api/parameter-sets/${set.id}`, {
      body: JSON.stringify({ version: 1, name: "form post" }),
      headers: { "content-type": "text/plain" },
    });
    expect(response.status).toBe(415);
    expect(response.body.error.code).toBe("unsupported_media_type");
    await expectUnchanged();
  });

  it('"NaN", 1e999 (→ Infinity) and out-of-range parameters → 400 validation with fields', async () => {
    const raw = `{"version":1,"params":${JSON.stringify(validParams()).replace(/"fieldT":1/, '"fieldT":1e999')}}`;
    const infinity = await editor.request("PATCH", `/api/parameter-sets/${set.id}`, {
      body: raw,
      headers: { "content-type": "application/json" },
    });
    expect(infinity.status).toBe(400);
    expect(infinity.body.error.code).toBe("validation");
    // zod rejects Infinity as "not a number"; either way it is named by its field.
    expect(infinity.body.error.fields["params.fieldT"]).toBeTruthy();

    const nan = await editor.patch(`/api/parameter-sets/${set.id}`, { version: 1, params: { ...validParams(), landeG: "NaN" } });
    expect(nan.status).toBe(400);
    expect(nan.body.error.fields["params.landeG"]).toBeTruthy();

    const outOfRange = await editor.patch(`/api/parameter-sets/${set.id}`, {
      version: 1,
      params: validParams({ temperatureK: -5, totalJ: 2.3, landeG: 0 }),
    });
    expect(outOfRange.status).toBe(400);
    expect(Object.keys(outOfRange.body.error.fields)).toEqual(
      expect.arrayContaining(["params.temperatureK", "params.totalJ", "params.landeG"]),
    );

    const unknownKey = await editor.patch(`/api/parameter-sets/${set.id}`, { version: 1, params: { ...validParams(), bogus: 1 } });
    expect(unknownKey.status).toBe(400);

    const missing = await editor.post("/api/parameter-sets", { labId: DEMO_LAB_ID, name: "" });
    expect(missing.status).toBe(400);
    expect(Object.keys(missing.body.error.fields)).toEqual(expect.arrayContaining(["name", "params"]));

    const noVersion = await editor.patch(`/api/parameter-sets/${set.id}`, { name: "no version" });
    expect(noVersion.status).toBe(400);
    expect(noVersion.body.error.fields.version).toBeTruthy();
    await expectUnchanged();
  });

  it("a body over 64 KiB → 413", async () => {
    const response = await editor.patch(`/api/parameter-sets/${set.id}`, { version: 1, description: "x".repeat(70 * 1024) });
    expect(response.status).toBe(413);
    expect(response.body.error.code).toBe("payload_too_large");
    const created = await editor.post("/api/parameter-sets", {
      labId: DEMO_LAB_ID,
      name: uniqueName("huge"),
      params: validParams(),
      padding: "y".repeat(100 * 1024),
    });
    expect(created.status).toBe(413);
    await expectUnchanged();
  });
});
