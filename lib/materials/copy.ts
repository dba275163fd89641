import type { MaterialProvenance } from "@/lib/contracts/materials";
import { DESCRIPTION_MAX } from "@/lib/contracts/parameter-sets";
import type { ModelParams } from "@/lib/physics/schema";
import { MATERIAL_LIBRARY_VERSION, type MaterialEntry } from "./library";
import { MATERIAL_SOURCES } from "./sources";

/*
 * What "new parameter set from this material" stores: the library's values, a description that
 * says where they come from, and the provenance of version 1 ("from material X, library version Y").
 * Shared by the API route and the demo seed, so both copy a material the same way.
 */

export interface MaterialCopy {
  name: string;
  description: string;
  tags: string[];
  params: ModelParams;
  provenance: MaterialProvenance;
}

export function materialProvenance(m: MaterialEntry): MaterialProvenance {
  return { kind: "material", materialId: m.id, materialName: m.name, libraryVersion: MATERIAL_LIBRARY_VERSION };
}

/** The description of a copied set: the summary, then one line per value source and the references. */
export function materialDescription(m: MaterialEntry): string {
  const lines = [
    `From material ${m.name} (${m.formula}), library version ${MATERIAL_LIBRARY_VERSION}. ${m.summary}`,
    "",
    ...Object.entries(m.valueSources)
      .filter(([key]) => key !== "absorptionTable" || m.params.absorptionTable)
      .map(([key, text]) => `${key}: ${text}`),
    "",
    ...m.sources.map((id) => `[${id}] ${MATERIAL_SOURCES[id].citation}`),
  ];
  const text = lines.join("\n");
  return text.length <= DESCRIPTION_MAX ? text : `${text.slice(0, DESCRIPTION_MAX - 1)}…`;
}

export function materialCopy(m: MaterialEntry, name?: string): MaterialCopy {
  return {
    name: name ?? m.name,
    description: materialDescription(m),
    tags: ["library", m.id],
    params: structuredClone(m.params),
    provenance: materialProvenance(m),
  };
}
