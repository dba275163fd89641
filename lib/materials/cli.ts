import { MATERIALS, MATERIAL_LIBRARY_VERSION, type MaterialEntry, materialById } from "./library";
import { MATERIAL_SOURCES } from "./sources";

/*
 * The `material` command line as a pure function of its arguments (scripts/material.ts prints it):
 *   material list  → JSON array of { id, name }
 *   material ID    → { id, name, params, sources, validity }, params being a parameter file for
 *                    `npm run --silent spectrum` once wavelengthsNm is added.
 */

export interface CliOutcome {
  stdout: string;
  stderr: string;
  status: number;
}

/** The entry as the command line and the API export it: a parameter file plus where every value comes from. */
export function materialExport(m: MaterialEntry) {
  return {
    id: m.id,
    name: m.name,
    libraryVersion: MATERIAL_LIBRARY_VERSION,
    params: { ...m.params, method: "analytic" as const },
    sources: {
      byValue: m.valueSources,
      cited: m.sources.map((id) => MATERIAL_SOURCES[id]),
    },
    validity: { ...m.validity, windows: m.windows, avoid: m.avoid },
  };
}

const USAGE = "usage: npm run --silent material -- list | ID";

export function runMaterialCli(argv: readonly string[]): CliOutcome {
  const args = argv.filter((a) => a !== "--");
  if (args.length !== 1) return { stdout: "", stderr: `${USAGE}\n`, status: 2 };
  const arg = args[0]!;
  if (arg === "list") {
    return {
      stdout: `${JSON.stringify(
        MATERIALS.map((m) => ({ id: m.id, name: m.name })),
        null,
        2,
      )}\n`,
      stderr: "",
      status: 0,
    };
  }
  const m = materialById(arg);
  if (!m) {
    const ids = MATERIALS.map((x) => x.id).join(", ");
    return { stdout: "", stderr: `${arg}: no such material in the library (ids: ${ids})\n`, status: 2 };
  }
  return { stdout: `${JSON.stringify(materialExport(m), null, 2)}\n`, stderr: "", status: 0 };
}
