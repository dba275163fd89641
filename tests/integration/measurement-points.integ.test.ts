import { beforeAll, describe, expect, it } from "vitest";
import { type Client, DEMO, DEMO_LAB_ID, type JsonBody, signIn, uniqueName } from "./support";

/*
 * The measurement-set page's API: the formats the upload reads, extra text columns kept per
 * point, and edits (mask with a reason, note, corrected value) as audited revisions that leave the
 * original file as it was.
 */

const MAPPING = {
  wavelengthColumn: "wavelength_nm",
  wavelengthUnit: "nm",
  quantity: "verdet",
  valueColumn: "verdet_rad_per_T_m",
  valueUnit: "rad/(T·m)",
  sigmaColumn: "sigma",
  temperatureColumn: "temperature_K",
  fieldColumn: null,
  lengthColumn: null,
};

async function upload(client: Client, text: string, extra: Record<string, string> = {}): Promise<{ status: number; body: JsonBody }> {
  const form = new FormData();
  form.set("file", new File([text], "points.txt", { type: "text/plain" }));
  form.set("labId", DEMO_LAB_ID);
  form.set("name", uniqueName("Points"));
  form.set("mapping", JSON.stringify(MAPPING));
  form.set("defaults", JSON.stringify({ fieldT: 1, lengthM: 0.01 }));
  for (const [key, value] of Object.entries(extra)) form.set(key, value);
  const response = await client.raw("POST", "/api/measurement-sets", { body: form });
  return { status: response.status, body: await response.json() };
}

// numpy.savetxt's default output with header= (spaces, "%.18e", "# " before the header), plus a text column.
const SAVETXT = [
  "# wavelength_nm verdet_rad_per_T_m sigma temperature_K source",
  "6.328000000000000000e+02 -1.340000000000000000e+02 2.000000000000000000e+00 2.931500000000000000e+02 HeNe",
  "1.064000000000000000e+03 -4.000000000000000000e+01 1.000000000000000000e+00 7.700000000000000000e+01 Nd:YAG",
  "1.550000000000000000e+03 -1.500000000000000000e+01 1.000000000000000000e+00 2.931500000000000000e+02 diode",
].join("\n");

describe("measurement points", () => {
  let editor: Client;
  let viewer: Client;
  let setId: string;
  let original: ArrayBuffer;

  beforeAll(async () => {
    [editor, viewer] = await Promise.all([signIn(DEMO.editor), signIn(DEMO.viewer)]);
    const created = await upload(editor, SAVETXT);
    expect(created.status, JSON.stringify(created.body)).toBe(201);
    setId = created.body.item.id;
    original = await (await editor.raw("GET", `/api/measurement-sets/${setId}/original`)).arrayBuffer();
  });

  it("reads numpy.savetxt's file with its # header: every row, and the text column per point", async () => {
    const { body } = await viewer.get(`/api/measurement-sets/${setId}/points`);
    expect(body.points.map((p: JsonBody) => [p.line, p.wavelengthNm, p.temperatureK, p.extra])).toEqual([
      [2, 632.8, 293.15, { source: "HeNe" }],
      [3, 1064, 77, { source: "Nd:YAG" }],
      [4, 1550, 293.15, { source: "diode" }],
    ]);
  });

  it("reads semicolons with decimal commas, and a forced format wins over the detection", async () => {
    const text = "wavelength_nm;verdet_rad_per_T_m;sigma;temperature_K\n632,8;-134,5;2;293,15\n";
    const created = await upload(editor, text);
    expect(created.status, JSON.stringify(created.body)).toBe(201);
    const points = (await editor.get(`/api/measurement-sets/${created.body.item.id}/points`)).body.points;
    expect([points[0].wavelengthNm, points[0].value, points[0].temperatureK]).toEqual([632.8, -134.5, 293.15]);
    const forced = await upload(editor, text, { format: JSON.stringify({ delimiter: ";", decimal: "." }) });
    expect(forced.status).toBe(400);
    expect(forced.body.error.problems[0]).toMatch(/^line 2: wavelength “632,8” is not a number/);
  });

  it("masks a point with a reason, notes and corrects another: one revision, audited, the file untouched", async () => {
    const refused = await editor.patch(`/api/measurement-sets/${setId}/points`, { revision: 1, changes: [{ ordinal: 1, masked: true }] });
    expect(refused.status).toBe(400);
    expect(refused.body.error.fields["changes.0.maskReason"]).toBe("Say why the point is masked.");

    const saved = await editor.patch(`/api/measurement-sets/${setId}/points`, {
      revision: 1,
      changes: [
        { ordinal: 1, masked: true, maskReason: "cryostat not settled" },
        { ordinal: 2, note: "σ from the lock-in", values: { sigma: 1.5 } },
      ],
    });
    expect(saved.status, JSON.stringify(saved.body)).toBe(200);
    expect(saved.body).toEqual({ revision: 2, changedPoints: 2 });

    const { body } = await viewer.get(`/api/measurement-sets/${setId}/points`);
    expect(body.revision).toBe(2);
    expect(body.points[1]).toMatchObject({ masked: true, maskReason: "cryostat not settled", original: null });
    expect(body.points[2]).toMatchObject({ sigma: 1.5, note: "σ from the lock-in", original: { sigma: 1 } });
    const item = (await viewer.get(`/api/measurement-sets/${setId}`)).body.item;
    expect(item).toMatchObject({ revision: 2, maskedCount: 1 });

    const history = (await viewer.get(`/api/measurement-sets/${setId}/history`)).body.items;
    expect(history.map((h: JsonBody) => [h.revision, h.line, Object.keys(h.changes).sort()])).toEqual([
      [2, 3, ["maskReason", "masked"]],
      [2, 4, ["note", "sigma"]],
    ]);
    expect(history[0].actor.name).toBe("Dr. Tomasz Elbrecht");

    const after = await (await editor.raw("GET", `/api/measurement-sets/${setId}/original`)).arrayBuffer();
    expect(Buffer.compare(Buffer.from(after), Buffer.from(original))).toBe(0);

    const owner = await signIn(DEMO.owner);
    const audit = (await owner.get(`/api/labs/${DEMO_LAB_ID}/audit?limit=20`)).body.items;
    expect(audit.find((e: JsonBody) => e.action === "measurement_set.revise" && e.targetId === setId)?.details).toMatchObject({
      revision: 2,
      points: 2,
    });
  });

  it("refuses an edit of an older revision, a viewer's edit and an unknown point", async () => {
    const stale = await editor.patch(`/api/measurement-sets/${setId}/points`, { revision: 1, changes: [{ ordinal: 0, note: "late" }] });
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe("stale_version");
    const byViewer = await viewer.patch(`/api/measurement-sets/${setId}/points`, { revision: 2, changes: [{ ordinal: 0, note: "x" }] });
    expect(byViewer.status).toBe(403);
    const unknown = await editor.patch(`/api/measurement-sets/${setId}/points`, { revision: 2, changes: [{ ordinal: 99, note: "x" }] });
    expect(unknown.status).toBe(400);
    expect(unknown.body.error.fields["changes.0.ordinal"]).toBe("No such point in this set.");
  });
});
