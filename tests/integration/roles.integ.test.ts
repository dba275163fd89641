import { beforeAll, describe, expect, it } from "vitest";
import {
  Client,
  DEMO,
  DEMO_GARNET_SET_ID,
  DEMO_LAB_ID,
  OTHER_LAB_ID,
  OTHER_LAB_SET_ID,
  createSet,
  attemptSignIn,
  DEMO_PASSWORD,
  signIn,
  signUp,
  joinByInvitation,
  ADMIN_PASSWORD,
  uniqueName,
  validParams,
} from "./support";

describe("roles through the API", () => {
  let owner: Client;
  let editor: Client;
  let viewer: Client;
  let outsider: Client;

  beforeAll(async () => {
    [owner, editor, viewer, outsider] = await Promise.all([
      signIn(DEMO.owner),
      signIn(DEMO.editor),
      signIn(DEMO.viewer),
      signIn(DEMO.outsider),
    ]);
  });

  it("each demo account sees its role in its labs", async () => {
    const roles = async (client: Client) =>
      (await client.get("/api/labs")).body.items.map((lab: { id: string; role: string }) => [lab.id, lab.role]);
    expect(await roles(owner)).toContainEqual([DEMO_LAB_ID, "owner"]);
    expect(await roles(editor)).toContainEqual([DEMO_LAB_ID, "editor"]);
    expect(await roles(viewer)).toContainEqual([DEMO_LAB_ID, "viewer"]);
    const outsiderLabs = await roles(outsider);
    expect(outsiderLabs).toContainEqual([OTHER_LAB_ID, "owner"]);
    expect(outsiderLabs.map(([id]: [string]) => id)).not.toContain(DEMO_LAB_ID);
  });

  it("a viewer can read but gets 403 on POST, PATCH, DELETE, restore and view-state", async () => {
    const read = await viewer.get(`/api/parameter-sets/${DEMO_GARNET_SET_ID}`);
    expect(read.status).toBe(200);
    expect(read.body.item.role).toBe("viewer");
    const before = read.body.item;

    const create = await viewer.post("/api/parameter-sets", { labId: DEMO_LAB_ID, name: uniqueName("viewer try"), params: validParams() });
    expect(create.status).toBe(403);
    expect(create.body.error.code).toBe("forbidden");

    const patch = await viewer.patch(`/api/parameter-sets/${DEMO_GARNET_SET_ID}`, { version: before.version, name: "Hijacked" });
    expect(patch.status).toBe(403);
    expect((await viewer.delete(`/api/parameter-sets/${DEMO_GARNET_SET_ID}`)).status).toBe(403);
    expect((await viewer.post(`/api/parameter-sets/${DEMO_GARNET_SET_ID}/versions/1/restore`, {})).status).toBe(403);
    expect((await viewer.put(`/api/parameter-sets/${DEMO_GARNET_SET_ID}/view-state`, { viewState: {} })).status).toBe(403);

    const after = await viewer.get(`/api/parameter-sets/${DEMO_GARNET_SET_ID}`);
    expect(after.body.item.version).toBe(before.version);
    expect(after.body.item.name).toBe(before.name);
  });

  it("an outsider gets 404 for another lab's set, its versions, members and lab filter", async () => {
    for (const path of [
      `/api/parameter-sets/${DEMO_GARNET_SET_ID}`,
      `/api/parameter-sets/${DEMO_GARNET_SET_ID}/versions`,
      `/api/labs/${DEMO_LAB_ID}/members`,
      `/api/parameter-sets?labId=${DEMO_LAB_ID}`,
    ]) {
      const response = await outsider.get(path);
      expect(response.status, path).toBe(404);
      expect(response.body.error.code).toBe("not_found");
    }
    const patch = await outsider.patch(`/api/parameter-sets/${DEMO_GARNET_SET_ID}`, { version: 1, name: "x" });
    expect(patch.status).toBe(404);
    const create = await outsider.post("/api/parameter-sets", { labId: DEMO_LAB_ID, name: uniqueName("intruder"), params: validParams() });
    expect(create.status).toBe(404);

    const list = await outsider.get("/api/parameter-sets");
    expect(list.status).toBe(200);
    const ids = list.body.items.map((item: { id: string }) => item.id);
    expect(ids).toContain(OTHER_LAB_SET_ID);
    expect(ids).not.toContain(DEMO_GARNET_SET_ID);

    // The demo lab's members cannot see the other lab's set either.
    expect((await editor.get(`/api/parameter-sets/${OTHER_LAB_SET_ID}`)).status).toBe(404);
  });

  it("the unknown-set answer and the other-lab answer are the same", async () => {
    const foreign = await outsider.get(`/api/parameter-sets/${DEMO_GARNET_SET_ID}`);
    const unknown = await outsider.get("/api/parameter-sets/00000000-0000-4000-8000-000000000000");
    expect(foreign.status).toBe(unknown.status);
    expect(foreign.body).toEqual(unknown.body);
  });

  it("an editor's stale PATCH gets 409 stale_version with the current set and changes nothing", async () => {
    const created = await createSet(editor);
    const first = await editor.patch(`/api/parameter-sets/${created.id}`, { version: 1, description: "second save" });
    expect(first.status).toBe(200);
    expect(first.body.item.version).toBe(2);

    const stale = await editor.patch(`/api/parameter-sets/${created.id}`, { version: 1, description: "lost update" });
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe("stale_version");
    expect(stale.body.error.current.version).toBe(2);
    expect(stale.body.error.current.description).toBe("second save");

    const stored = await editor.get(`/api/parameter-sets/${created.id}`);
    expect(stored.body.item.version).toBe(2);
    expect(stored.body.item.description).toBe("second save");
    expect((await editor.get(`/api/parameter-sets/${created.id}/versions`)).body.items).toHaveLength(2);
  });

  it("the owner manages members; editors cannot; the last owner stays", async () => {
    const fresh = await signUp();
    await joinByInvitation({ owner, labId: DEMO_LAB_ID, account: fresh, role: "viewer", inviteAs: fresh.email.toUpperCase() });

    expect((await editor.post(`/api/labs/${DEMO_LAB_ID}/invitations`, { email: fresh.email, role: "editor" })).status).toBe(403);
    expect((await editor.patch(`/api/labs/${DEMO_LAB_ID}/members/${fresh.userId}`, { role: "editor" })).status).toBe(403);

    const promoted = await owner.patch(`/api/labs/${DEMO_LAB_ID}/members/${fresh.userId}`, { role: "editor" });
    expect(promoted.status).toBe(200);
    expect(promoted.body.item.role).toBe("editor");

    const members = await viewer.get(`/api/labs/${DEMO_LAB_ID}/members`);
    expect(members.status).toBe(200);
    expect(members.body.items.map((m: { email: string }) => m.email)).toContain(fresh.email);

    expect((await owner.delete(`/api/labs/${DEMO_LAB_ID}/members/${fresh.userId}`)).status).toBe(204);
    expect((await owner.delete(`/api/labs/${DEMO_LAB_ID}/members/${fresh.userId}`)).status).toBe(404);

    // The fresh user owns their personal lab alone: they cannot demote or remove themselves.
    const self = await signIn(fresh.email, fresh.password);
    const demote = await self.patch(`/api/labs/${fresh.labId}/members/${fresh.userId}`, { role: "viewer" });
    expect(demote.status).toBe(409);
    expect((await self.delete(`/api/labs/${fresh.labId}/members/${fresh.userId}`)).status).toBe(409);
  });

  it.skipIf(!ADMIN_PASSWORD)("a site admin sees every lab as owner; the admin has no demo password", async () => {
    expect((await attemptSignIn(new Client(), DEMO.admin, DEMO_PASSWORD)).headers.get("location")).toContain("error=");
    const admin = await signIn(DEMO.admin, ADMIN_PASSWORD);
    const labs = (await admin.get("/api/labs")).body.items;
    expect(labs.map((l: { id: string }) => l.id)).toEqual(expect.arrayContaining([DEMO_LAB_ID, OTHER_LAB_ID]));
    expect(new Set(labs.map((l: { role: string }) => l.role))).toEqual(new Set(["owner"]));
    const set = await admin.get(`/api/parameter-sets/${OTHER_LAB_SET_ID}`);
    expect(set.status).toBe(200);
    expect(set.body.item.role).toBe("owner");
  });
});
