import { beforeAll, describe, expect, it } from "vitest";
import { materialById } from "@/lib/materials/library";
import { Client, DEMO, DEMO_LAB_ID, OTHER_LAB_ID, signIn, uniqueName } from "./support";

describe("material library through the API", () => {
  let editor: Client;
  let viewer: Client;

  beforeAll(async () => {
    [editor, viewer] = await Promise.all([signIn(DEMO.editor), signIn(DEMO.viewer)]);
  });

  it("lists the library for any signed-in caller, and refuses anonymous callers", async () => {
    const list = await viewer.get("/api/materials");
    expect(list.status).toBe(200);
    expect(list.body.items.map((m: { id: string }) => m.id)).toContain("tgg");
    expect(list.body.items[0].sources.byValue).toBeDefined();
    expect((await new Client().get("/api/materials")).status).toBe(401);
  });

  it("an editor copies a material into the lab: the set holds the library's values and version 1 says where they came from", async () => {
    const name = uniqueName("TGG from library");
    const created = await editor.post("/api/materials/tgg/parameter-sets", { labId: DEMO_LAB_ID, name });
    expect(created.status).toBe(201);
    expect(created.body.item.name).toBe(name);
    expect(created.body.item.params).toEqual(materialById("tgg")!.params);
    const versions = await editor.get(`/api/parameter-sets/${created.body.item.id}/versions`);
    expect(versions.body.items[0].provenance).toMatchObject({ kind: "material", materialId: "tgg" });
  });

  it("a viewer gets 403, an unknown material 404, a bad body 400 naming the field, a foreign lab 404", async () => {
    expect((await viewer.post("/api/materials/tgg/parameter-sets", { labId: DEMO_LAB_ID, name: uniqueName("v") })).status).toBe(403);
    expect((await editor.post("/api/materials/unobtainium/parameter-sets", { labId: DEMO_LAB_ID })).status).toBe(404);
    const bad = await editor.post("/api/materials/tgg/parameter-sets", { labId: "not-a-uuid" });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields ?? {})).toContain("labId");
    expect((await editor.post("/api/materials/tgg/parameter-sets", { labId: OTHER_LAB_ID, name: uniqueName("x") })).status).toBe(404);
  });
});
