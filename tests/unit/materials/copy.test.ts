import { describe, expect, it } from "vitest";
import { DEMO_GARNET_SET_ID, DEMO_SETS } from "@/db/demo-data";
import { asMaterialProvenance, copyMaterialSchema, describeMaterialProvenance } from "@/lib/contracts/materials";
import { DESCRIPTION_MAX, createParameterSetSchema } from "@/lib/contracts/parameter-sets";
import { materialCopy } from "@/lib/materials/copy";
import { MATERIALS, MATERIAL_LIBRARY_VERSION, materialById } from "@/lib/materials/library";

describe("new parameter set from a library material", () => {
  it.each(MATERIALS.map((m) => [m.id, m] as const))("%s: the copy is a valid new set with its provenance", (_id, m) => {
    const copy = materialCopy(m);
    const parsed = createParameterSetSchema.safeParse({ labId: "00000000-0000-4000-8000-000000000000", ...copy });
    expect(parsed.success).toBe(true);
    expect(copy.description.length).toBeLessThanOrEqual(DESCRIPTION_MAX);
    expect(copy.description).toContain(`library version ${MATERIAL_LIBRARY_VERSION}`);
    expect(describeMaterialProvenance(asMaterialProvenance(copy.provenance)!)).toBe(
      `from material ${m.name}, library version ${MATERIAL_LIBRARY_VERSION}`,
    );
    // A copy is the library's values, not a shared object the lab could mutate.
    expect(copy.params).toEqual(m.params);
    expect(copy.params).not.toBe(m.params);
  });

  it("the request names its field when the lab is missing or the name is empty", () => {
    const r = copyMaterialSchema.safeParse({ name: "" });
    expect(r.success).toBe(false);
    expect(r.error!.issues.map((i) => i.path[0]).sort()).toEqual(["labId", "name"]);
  });

  it("a fit's provenance is not read as a library copy", () => {
    expect(asMaterialProvenance({ kind: "fit", chi2: 1 })).toBeNull();
    expect(asMaterialProvenance(null)).toBeNull();
  });

  it("the demo's handbook garnet set is, in its current version, the library's garnet with its provenance", () => {
    const set = DEMO_SETS.find((s) => s.id === DEMO_GARNET_SET_ID)!;
    const last = set.versions[set.versions.length - 1]!;
    expect(last.params).toEqual(materialById("tgg")!.params);
    expect(asMaterialProvenance(last.provenance)?.materialId).toBe("tgg");
  });
});
