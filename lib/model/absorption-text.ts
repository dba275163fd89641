import type { AbsorptionRow } from "@/lib/physics/schema";
import { MAX_ABSORPTION_ROWS } from "@/lib/physics/schema";

/*
 * The measured absorption table as a person pastes it: one row per line, the vacuum wavelength in
 * nm and the absorption coefficient α in 1/cm (the unit data sheets and papers print), separated by
 * spaces, a tab, a comma or a semicolon. Lines starting with "#" and empty lines are skipped. Stored
 * in SI (1/m) as the model's absorptionTable.
 */

export type AbsorptionTextResult = { ok: true; rows: AbsorptionRow[] | undefined } | { ok: false; error: string };

export function parseAbsorptionText(text: string): AbsorptionTextResult {
  const rows: AbsorptionRow[] = [];
  const lines = text.split(/\r?\n/);
  for (let i = 0; i < lines.length; i++) {
    const line = lines[i]!.trim();
    if (line === "" || line.startsWith("#")) continue;
    const cells = line.split(/[\s,;]+/).filter(Boolean);
    const where = `line ${i + 1}`;
    if (cells.length !== 2) return { ok: false, error: `${where}: expected two numbers, the wavelength (nm) and α (1/cm)` };
    const [nm, perCm] = cells.map(Number) as [number, number];
    if (!Number.isFinite(nm) || nm <= 0) return { ok: false, error: `${where}: the wavelength must be a number > 0 nm` };
    if (!Number.isFinite(perCm) || perCm < 0) return { ok: false, error: `${where}: α must be a number ≥ 0 /cm` };
    const last = rows[rows.length - 1];
    if (last && !(nm > last.wavelengthNm))
      return { ok: false, error: `${where}: wavelengths must be strictly increasing (${nm} nm after ${last.wavelengthNm} nm)` };
    // 1 /cm = 100 /m; rounded to 15 digits so 0.0017 /cm is stored as 0.17 /m, not 0.16999999999999998.
    rows.push({ wavelengthNm: nm, absorptionPerM: Number((perCm * 100).toPrecision(15)) });
  }
  if (rows.length === 0) return { ok: true, rows: undefined };
  if (rows.length < 2) return { ok: false, error: "a table needs at least two rows" };
  if (rows.length > MAX_ABSORPTION_ROWS) return { ok: false, error: `at most ${MAX_ABSORPTION_ROWS} rows` };
  return { ok: true, rows };
}

/** The stored table back as text, α in 1/cm with enough digits to read back the same numbers. */
export function formatAbsorptionText(rows: readonly AbsorptionRow[] | undefined): string {
  if (!rows) return "";
  return rows.map((r) => `${r.wavelengthNm} ${Number((r.absorptionPerM / 100).toPrecision(12))}`).join("\n");
}
