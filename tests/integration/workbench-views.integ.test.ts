import { beforeAll, describe, expect, it } from "vitest";
import { Client, DEMO, OTHER_LAB_SET_ID, createSet, signIn } from "./support";

/*
 * Per-person workbench views: each member keeps their own view of a set, viewers included; the
 * lab's shared view (the set's view_state) changes only through an editor's explicit share, and
 * is where everyone without their own view starts.
 */

describe("per-person workbench views", () => {
  let owner: Client;
  let editor: Client;
  let viewer: Client;
  let outsider: Client;
  let setId: string;

  beforeAll(async () => {
    [owner, editor, viewer, outsider] = await Promise.all([
      signIn(DEMO.owner),
      signIn(DEMO.editor),
      signIn(DEMO.viewer),
      signIn(DEMO.outsider),
    ]);
    setId = (await createSet(editor)).id as string;
  });

  const myView = (id: string) => `/api/parameter-sets/${id}/my-view`;

  it("keeps each person's view to themselves and starts everyone from the lab's shared view", async () => {
    // Nothing saved yet: no own view, no shared view.
    const fresh = await viewer.get(myView(setId));
    expect(fresh.status).toBe(200);
    expect(fresh.body.item).toEqual({ setId, viewState: null, updatedAt: null, sharedViewState: null });

    // A viewer may save their own view; nobody else sees it, and the set does not change.
    const saved = await viewer.put(myView(setId), { viewState: { xUnit: "eV", markersNm: [1030] } });
    expect(saved.status).toBe(200);
    expect(saved.body.item.viewState).toEqual({ xUnit: "eV", markersNm: [1030] });
    expect(typeof saved.body.item.updatedAt).toBe("string");
    expect((await editor.get(myView(setId))).body.item.viewState).toBeNull();
    expect((await owner.get(myView(setId))).body.item.viewState).toBeNull();
    expect((await viewer.get(`/api/parameter-sets/${setId}`)).body.item.viewState).toBeNull();

    // Saving again replaces the view (one row per person and set).
    const again = await viewer.put(myView(setId), { viewState: { xUnit: "nm" } });
    expect(again.body.item.viewState).toEqual({ xUnit: "nm" });

    // A viewer cannot share with the lab; an editor can, and it becomes everyone's starting view.
    expect((await viewer.put(`/api/parameter-sets/${setId}/view-state`, { viewState: { yMode: "deg" } })).status).toBe(403);
    const shared = await editor.put(`/api/parameter-sets/${setId}/view-state`, { viewState: { yMode: "verdet" } });
    expect(shared.status).toBe(200);
    const ownerView = await owner.get(myView(setId));
    expect(ownerView.body.item).toMatchObject({ viewState: null, sharedViewState: { yMode: "verdet" } });
    // The viewer's own view is untouched by the share.
    expect((await viewer.get(myView(setId))).body.item).toMatchObject({ viewState: { xUnit: "nm" }, sharedViewState: { yMode: "verdet" } });

    // Reset: the own view is forgotten, the shared one applies again.
    const reset = await viewer.delete(myView(setId));
    expect(reset.status).toBe(200);
    expect(reset.body.item).toMatchObject({ viewState: null, updatedAt: null, sharedViewState: { yMode: "verdet" } });
    expect((await viewer.get(myView(setId))).body.item.viewState).toBeNull();
    // Resetting twice is harmless.
    expect((await viewer.delete(myView(setId))).status).toBe(200);
  });

  it("validates the body and hides other labs' sets", async () => {
    expect((await viewer.put(myView(setId), { viewState: "nope" })).status).toBe(400);
    expect((await viewer.put(myView(setId), {})).status).toBe(400);
    const tooBig = await viewer.put(myView(setId), { viewState: { blob: "x".repeat(40 * 1024) } });
    expect(tooBig.status).toBe(400);
    expect(tooBig.body.error.fields.viewState).toBeTruthy();

    // Not a member of the set's lab, unknown or malformed ids: 404 alike, for every method.
    expect((await outsider.get(myView(setId))).status).toBe(404);
    expect((await outsider.put(myView(setId), { viewState: {} })).status).toBe(404);
    expect((await outsider.delete(myView(setId))).status).toBe(404);
    expect((await viewer.get(myView(OTHER_LAB_SET_ID))).status).toBe(404);
    expect((await viewer.get(myView("00000000-0000-4000-8000-000000000000"))).status).toBe(404);
    expect((await viewer.get(myView("not-a-uuid"))).status).toBe(404);
    const anonymous = new Client();
    expect((await anonymous.get(myView(setId))).status).toBe(401);
    expect((await anonymous.put(myView(setId), { viewState: {} })).status).toBe(401);
    expect((await anonymous.delete(myView(setId))).status).toBe(401);
  });

  it("removes the views with the set", async () => {
    const id = (await createSet(editor)).id as string;
    expect((await editor.put(myView(id), { viewState: { xUnit: "THz" } })).status).toBe(200);
    expect((await editor.delete(`/api/parameter-sets/${id}`)).status).toBe(204);
    expect((await editor.get(myView(id))).status).toBe(404);
  });
});
