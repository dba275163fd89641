import { beforeAll, describe, expect, it } from "vitest";
import { type Client, DEMO, DEMO_LAB_ID, createSet, signIn, validParams } from "./support";

/** A save body as the workbench sends it after a fit (values invented for the test). */
let measurementSet = { id: "", name: "" };
const fitBody = (
  version: number,
  values: Record<string, number> = { gyrationPerT: 5.1e-3, magneticScale: 2.5 },
  sets = [measurementSet],
) => ({
  version,
  values,
  fit: {
    measurementSets: sets,
    pointCount: 24,
    free: [{ key: "gyrationPerT" }, { key: "magneticScale", min: 0, max: 10 }],
    sigmas: { gyrationPerT: 2e-5, magneticScale: 0.04 },
    sigmaScaledByChi2: false,
    correlation: [
      [1, 0.62],
      [0.62, 1],
    ],
    chi2: 21.3,
    dof: 22,
    reducedChi2: 21.3 / 22,
    separable: true,
    fittedAt: "2026-01-15T10:00:00.000Z",
  },
});

describe("saving a fit as a version", () => {
  let editor: Client;
  let viewer: Client;
  let outsider: Client;
  let setId: string;

  beforeAll(async () => {
    [editor, viewer, outsider] = await Promise.all([signIn(DEMO.editor), signIn(DEMO.viewer), signIn(DEMO.outsider)]);
    const created = await createSet(editor, { params: validParams() });
    setId = created.id;
    // The demo seed's measurement sets of the demo lab.
    const sets = await editor.get(`/api/measurement-sets?labId=${DEMO_LAB_ID}`);
    expect(sets.body.items.length).toBeGreaterThan(0);
    measurementSet = { id: sets.body.items[0].id, name: sets.body.items[0].name };
  });

  it("writes a new version with the fitted values and the fit as its provenance", async () => {
    const save = await editor.post(`/api/parameter-sets/${setId}/fits`, fitBody(1));
    expect(save.status).toBe(201);
    expect(save.body.item.version).toBe(2);
    expect(save.body.item.params.gyrationPerT).toBe(5.1e-3);
    expect(save.body.item.params.magneticScale).toBe(2.5);
    // The parameters not fitted keep their values.
    expect(save.body.item.params.oscillatorWavelengthNm).toBe(validParams().oscillatorWavelengthNm);

    const versions = await editor.get(`/api/parameter-sets/${setId}/versions`);
    expect(versions.status).toBe(200);
    const [latest, first] = versions.body.items;
    expect(first.provenance).toBeNull();
    expect(latest.version).toBe(2);
    expect(latest.provenance).toMatchObject({
      kind: "fit",
      values: { gyrationPerT: 5.1e-3, magneticScale: 2.5 },
      sigmas: { gyrationPerT: 2e-5, magneticScale: 0.04 },
      measurementSets: [measurementSet],
      chi2: 21.3,
      dof: 22,
      fittedAt: "2026-01-15T10:00:00.000Z",
    });
    // Viewers read the history, provenance included.
    const asViewer = await viewer.get(`/api/parameter-sets/${setId}/versions`);
    expect(asViewer.body.items[0].provenance.kind).toBe("fit");
  });

  it("answers 409 when the set moved on since the fit started", async () => {
    const stale = await editor.post(`/api/parameter-sets/${setId}/fits`, fitBody(1));
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe("stale_version");
    expect(stale.body.error.current.version).toBe(2);
  });

  it("refuses a body whose values do not match the free parameters, or make an invalid set, and stores nothing", async () => {
    const mismatch = await editor.post(`/api/parameter-sets/${setId}/fits`, fitBody(2, { gyrationPerT: 5e-3 }));
    expect(mismatch.status).toBe(400);
    expect(mismatch.body.error.fields.values).toMatch(/exactly the free parameters/);
    const invalid = await editor.post(`/api/parameter-sets/${setId}/fits`, fitBody(2, { gyrationPerT: 5e-3, magneticScale: -1 }));
    expect(invalid.status).toBe(400);
    expect(invalid.body.error.fields["values.magneticScale"]).toBeTruthy();
    const unknownSet = await editor.post(
      `/api/parameter-sets/${setId}/fits`,
      fitBody(2, undefined, [{ id: "6a1f0c2e-5b1d-4c1e-9f00-0000000fffff", name: "Nowhere" }]),
    );
    expect(unknownSet.status).toBe(400);
    expect(unknownSet.body.error.fields["fit.measurementSets.0.id"]).toMatch(/no such measurement set/);
    const after = await editor.get(`/api/parameter-sets/${setId}`);
    expect(after.body.item.version).toBe(2);
  });

  it("a viewer cannot save a fit (403); an outsider gets 404", async () => {
    const asViewer = await viewer.post(`/api/parameter-sets/${setId}/fits`, fitBody(2));
    expect(asViewer.status).toBe(403);
    const asOutsider = await outsider.post(`/api/parameter-sets/${setId}/fits`, fitBody(2));
    expect(asOutsider.status).toBe(404);
    const after = await editor.get(`/api/parameter-sets/${setId}`);
    expect(after.body.item.version).toBe(2);
  });
});
