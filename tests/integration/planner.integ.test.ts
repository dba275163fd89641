import { beforeAll, describe, expect, it } from "vitest";
import { planMeasurements } from "@/lib/planner/plan";
import { planRequestSchema } from "@/lib/planner/schema";
import { type Client, DEMO, DEMO_LAB_ID, createSet, signIn, uniqueName, validParams } from "./support";

describe("light sources and plans through the API", () => {
  let editor: Client;
  let viewer: Client;
  let outsider: Client;

  beforeAll(async () => {
    [editor, viewer, outsider] = await Promise.all([signIn(DEMO.editor), signIn(DEMO.viewer), signIn(DEMO.outsider)]);
  });

  it("a viewer reads the demo lab's lines; an outsider gets 404", async () => {
    const list = await viewer.get(`/api/light-sources?labId=${DEMO_LAB_ID}`);
    expect(list.status).toBe(200);
    expect(list.body.items.map((l: { wavelengthNm: number }) => l.wavelengthNm)).toEqual(expect.arrayContaining([405, 632.8, 1064, 1550]));
    const other = await outsider.get(`/api/light-sources?labId=${DEMO_LAB_ID}`);
    expect(other.status).toBe(404);
    const one = list.body.items[0];
    expect((await outsider.get(`/api/light-sources/${one.id}`)).status).toBe(404);
    expect((await viewer.get(`/api/light-sources/${one.id}`)).status).toBe(200);
    expect((await viewer.get("/api/light-sources?labId=not-a-lab")).status).toBe(400);
  });

  it("an editor creates, edits and deletes a line; a viewer and an outsider cannot", async () => {
    const name = uniqueName("Integ laser");
    const create = await editor.post("/api/light-sources", {
      labId: DEMO_LAB_ID,
      name,
      wavelengthNm: 780,
      tunableMinNm: 760,
      tunableMaxNm: 800,
      powerW: 0.1,
    });
    expect(create.status).toBe(201);
    const id = create.body.item.id as string;
    expect(create.body.item).toMatchObject({ name, wavelengthNm: 780, tunableMinNm: 760, tunableMaxNm: 800, powerW: 0.1 });

    expect(
      (await viewer.post("/api/light-sources", { labId: DEMO_LAB_ID, name: uniqueName("viewer laser"), wavelengthNm: 500 })).status,
    ).toBe(403);
    expect(
      (await outsider.post("/api/light-sources", { labId: DEMO_LAB_ID, name: uniqueName("outsider laser"), wavelengthNm: 500 })).status,
    ).toBe(404);
    expect((await viewer.patch(`/api/light-sources/${id}`, { wavelengthNm: 790 })).status).toBe(403);
    expect((await outsider.patch(`/api/light-sources/${id}`, { wavelengthNm: 790 })).status).toBe(404);
    expect((await viewer.delete(`/api/light-sources/${id}`)).status).toBe(403);

    // Out of the tunable range: a field error, and nothing changes.
    const bad = await editor.patch(`/api/light-sources/${id}`, { wavelengthNm: 900 });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.wavelengthNm).toMatch(/tunable range 760–800 nm/);
    const dup = await editor.post("/api/light-sources", { labId: DEMO_LAB_ID, name, wavelengthNm: 500 });
    expect(dup.status).toBe(409);
    const half = await editor.post("/api/light-sources", {
      labId: DEMO_LAB_ID,
      name: uniqueName("half range"),
      wavelengthNm: 500,
      tunableMinNm: 400,
    });
    expect(half.status).toBe(400);
    expect(half.body.error.fields.tunableMaxNm).toMatch(/both ends/);

    const edit = await editor.patch(`/api/light-sources/${id}`, { wavelengthNm: 790, powerW: null });
    expect(edit.status).toBe(200);
    expect(edit.body.item).toMatchObject({ wavelengthNm: 790, powerW: null, tunableMinNm: 760 });

    expect((await editor.delete(`/api/light-sources/${id}`)).status).toBe(204);
    expect((await editor.get(`/api/light-sources/${id}`)).status).toBe(404);
  });

  it("plans: an editor saves, a viewer lists but cannot save or delete, an outsider gets 404", async () => {
    const set = await createSet(editor);
    const request = planRequestSchema.parse({
      params: validParams(),
      lines: [
        { name: "HeNe", wavelengthNm: 632.8 },
        { name: "YAG", wavelengthNm: 1064 },
      ],
      temperatures: { minK: 77, maxK: 293, stepK: 216 },
      fields: { minT: 1, maxT: 1, stepT: 1 },
      lengthM: 0.01,
      noise: { kind: "sigma", sigmaRad: 1e-5 },
      points: 2,
      criterion: { kind: "share", wavelengthNm: 1064 },
      // The two amplitudes, and every line usable: this test is about storing a plan.
      definition: { free: [{ key: "gyrationPerT" }, { key: "magneticScale", min: 0 }] },
      optics: { minTransmission: 1e-9 },
    });
    const result = planMeasurements(request);
    const best = result.plans[0]!;
    const body = {
      name: uniqueName("Integ plan"),
      setVersion: set.version,
      request,
      plan: {
        criterionLabel: result.criterionLabel,
        criterionUnit: result.criterionUnit,
        expectedSigma: Number.isFinite(best.expectedSigma) ? best.expectedSigma : null,
        method: result.method,
        candidateCount: result.candidateCount,
        sigmaPerPointRad: result.sigmaPerPointRad,
        partsCorrelation: best.partsCorrelation,
        points: best.points.map((p) => ({
          lineName: p.lineName,
          wavelengthNm: p.wavelengthNm,
          temperatureK: p.temperatureK,
          fieldT: p.fieldT,
          count: p.count,
          rotationRad: p.rotationRad,
          belowNoise: p.belowNoise,
          transmission: p.transmission,
          flags: p.flags,
        })),
        notes: result.notes,
        costHours: best.costHours,
        noise: result.noise,
      },
    };
    // A plan names a version the set has: one it never had, or one beyond PostgreSQL's integer, is 400 with the field.
    for (const setVersion of [set.version + 50, 3_000_000_000]) {
      const refused = await editor.post(`/api/parameter-sets/${set.id}/plans`, { ...body, setVersion });
      expect(refused.status, `setVersion ${setVersion}`).toBe(400);
      expect(refused.body.error.fields.setVersion).toBeTruthy();
    }
    expect((await viewer.post(`/api/parameter-sets/${set.id}/plans`, body)).status).toBe(403);
    expect((await outsider.post(`/api/parameter-sets/${set.id}/plans`, body)).status).toBe(404);
    const saved = await editor.post(`/api/parameter-sets/${set.id}/plans`, body);
    expect(saved.status).toBe(201);
    const planId = saved.body.item.id as string;
    expect(saved.body.item.plan.points).toHaveLength(best.points.length);
    // The saved plan records the analysis definition it was made for, the noise model and the cost.
    expect(saved.body.item.request.definition.free.map((f: { key: string }) => f.key)).toEqual(["gyrationPerT", "magneticScale"]);
    expect(saved.body.item.plan.noise).toEqual(result.noise);
    expect(saved.body.item.plan.costHours).toBeCloseTo(best.costHours, 12);

    const list = await viewer.get(`/api/parameter-sets/${set.id}/plans`);
    expect(list.status).toBe(200);
    expect(list.body.items.map((p: { id: string }) => p.id)).toContain(planId);
    expect((await outsider.get(`/api/parameter-sets/${set.id}/plans`)).status).toBe(404);

    const noLines = await editor.post(`/api/parameter-sets/${set.id}/plans`, { ...body, request: { ...request, lines: [] } });
    expect(noLines.status).toBe(400);
    expect(JSON.stringify(noLines.body.error)).toMatch(/no lines: add at least one light source/);

    expect((await viewer.delete(`/api/parameter-sets/${set.id}/plans/${planId}`)).status).toBe(403);
    expect((await outsider.delete(`/api/parameter-sets/${set.id}/plans/${planId}`)).status).toBe(404);
    expect((await editor.delete(`/api/parameter-sets/${set.id}/plans/${planId}`)).status).toBe(204);
    expect((await editor.get(`/api/parameter-sets/${set.id}/plans/${planId}`)).status).toBe(404);
  });
});
