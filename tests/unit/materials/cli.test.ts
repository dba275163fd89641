import { spawnSync } from "node:child_process";
import { describe, expect, it } from "vitest";
import { runMaterialCli } from "@/lib/materials/cli";
import { MATERIALS } from "@/lib/materials/library";
import { spectrumRequestSchema } from "@/lib/physics/schema";

describe("material command line", () => {
  it("npm run --silent material -- list prints a JSON array of { id, name } (spawned as users type it)", () => {
    const r = spawnSync("npm", ["run", "--silent", "material", "--", "list"], { cwd: process.cwd(), encoding: "utf8" });
    expect(r.status).toBe(0);
    expect(r.stderr).toBe("");
    expect(JSON.parse(r.stdout)).toEqual(MATERIALS.map((m) => ({ id: m.id, name: m.name })));
  });

  it("ID prints id, name, params, sources, validity; params plus wavelengthsNm is a valid spectrum file", () => {
    const r = spawnSync(process.execPath, ["scripts/run-built.mjs", "material", "tgg"], { cwd: process.cwd(), encoding: "utf8" });
    expect(r.status).toBe(0);
    const out = JSON.parse(r.stdout);
    for (const key of ["id", "name", "params", "sources", "validity"]) expect(out).toHaveProperty(key);
    expect(out.params.wavelengthsNm).toBeUndefined();
    expect(spectrumRequestSchema.safeParse({ ...out.params, wavelengthsNm: [632.8] }).success).toBe(true);
    expect(out.sources.byValue.gyrationPerT).toMatch(/fitted here to wikiVerdet/);
  });

  it("an unknown id or bad usage: one line on stderr, status 2", () => {
    const unknown = runMaterialCli(["--", "unobtainium"]);
    expect(unknown.status).toBe(2);
    expect(unknown.stderr).toMatch(/^unobtainium: no such material in the library \(ids: tgg, /);
    expect(runMaterialCli([]).status).toBe(2);
    expect(runMaterialCli(["a", "b"]).stderr).toMatch(/^usage: /);
  });
});
