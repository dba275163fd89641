import { describe, expect, it } from "vitest";
import { Client, DEMO, DEMO_LAB_ID, createApiToken, signIn, uniqueName, validParams } from "./support";

describe("API tokens", () => {
  it("a bearer token acts as its user until revoked", async () => {
    const editor = await signIn(DEMO.editor);
    const name = uniqueName("script token");
    const { id, token } = await createApiToken(editor, name);
    expect(token).toMatch(/^glx_[A-Za-z0-9_-]{40,}$/);

    const listed = await editor.get("/api/tokens");
    const entry = listed.body.items.find((t: { id: string }) => t.id === id);
    expect(entry).toMatchObject({ id, name, lastUsedAt: null });
    expect(JSON.stringify(listed.body)).not.toContain(token);

    const script = new Client(token);
    const labs = await script.get("/api/labs");
    expect(labs.status).toBe(200);
    expect(labs.body.items).toContainEqual(expect.objectContaining({ id: DEMO_LAB_ID, role: "editor" }));
    const created = await script.post("/api/parameter-sets", { labId: DEMO_LAB_ID, name: uniqueName("via token"), params: validParams() });
    expect(created.status).toBe(201);
    expect((await script.delete(`/api/parameter-sets/${created.body.item.id}`)).status).toBe(204);

    const used = (await editor.get("/api/tokens")).body.items.find((t: { id: string }) => t.id === id);
    expect(used.lastUsedAt).not.toBeNull();

    expect((await editor.delete(`/api/tokens/${id}`)).status).toBe(204);
    const revoked = await script.get("/api/labs");
    expect(revoked.status).toBe(401);
    expect(revoked.body.error.code).toBe("unauthenticated");
    expect((await editor.get("/api/tokens")).body.items.map((t: { id: string }) => t.id)).not.toContain(id);
    expect((await editor.delete(`/api/tokens/${id}`)).status).toBe(404);
  });

  it("a viewer's token carries the viewer's role; another user cannot revoke it", async () => {
    const viewer = await signIn(DEMO.viewer);
    const { id, token } = await createApiToken(viewer);
    const script = new Client(token);
    const create = await script.post("/api/parameter-sets", {
      labId: DEMO_LAB_ID,
      name: uniqueName("viewer token"),
      params: validParams(),
    });
    expect(create.status).toBe(403);

    const editor = await signIn(DEMO.editor);
    expect((await editor.delete(`/api/tokens/${id}`)).status).toBe(404);
    expect((await script.get("/api/labs")).status).toBe(200);
    expect((await viewer.delete(`/api/tokens/${id}`)).status).toBe(204);
  });

  it("unknown or malformed bearer tokens → 401", async () => {
    expect((await new Client("glx_thisTokenWasNeverIssued0000000000000000000").get("/api/labs")).status).toBe(401);
    const malformed = await new Client().get("/api/labs", { headers: { authorization: "Bearer not-a-gyrolux-token" } });
    expect(malformed.status).toBe(401);
  });

  it("token names are validated", async () => {
    const editor = await signIn(DEMO.editor);
    const response = await editor.post("/api/tokens", { name: "" });
    expect(response.status).toBe(400);
    expect(response.body.error.fields.name).toBeTruthy();
  });
});
