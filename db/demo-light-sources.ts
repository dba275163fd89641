import { DEMO_LAB } from "./demo-data";
import type { Executor } from "./executor";
import { lightSources, type NewLightSourceRow } from "./schema";

/*
 * The invented lines of the demo lab (Lindqvist Moor Faraday Laboratory). Names and powers are
 * made up; the wavelengths are ordinary laser lines. Fixed ids keep the seed idempotent.
 */

export const DEMO_LIGHT_SOURCES: NewLightSourceRow[] = [
  { id: "6a1f0c2e-5b1d-4c1e-9f00-00000000d001", labId: DEMO_LAB.id, name: "Bench diode “Heron” 405", wavelengthNm: 405, powerW: 0.02 },
  { id: "6a1f0c2e-5b1d-4c1e-9f00-00000000d002", labId: DEMO_LAB.id, name: "Green DPSS “Moss”", wavelengthNm: 532, powerW: 0.05 },
  { id: "6a1f0c2e-5b1d-4c1e-9f00-00000000d003", labId: DEMO_LAB.id, name: "HeNe on table 2", wavelengthNm: 632.8, powerW: 0.005 },
  {
    id: "6a1f0c2e-5b1d-4c1e-9f00-00000000d004",
    labId: DEMO_LAB.id,
    name: "Ti:sapphire “Curlew”",
    wavelengthNm: 800,
    tunableMinNm: 700,
    tunableMaxNm: 1000,
    powerW: 1.5,
  },
  { id: "6a1f0c2e-5b1d-4c1e-9f00-00000000d005", labId: DEMO_LAB.id, name: "Nd:YAG “Old Faithful”", wavelengthNm: 1064, powerW: 2 },
  { id: "6a1f0c2e-5b1d-4c1e-9f00-00000000d006", labId: DEMO_LAB.id, name: "Telecom DFB 1550", wavelengthNm: 1550, powerW: 0.01 },
];

/** Inserts the demo lab's lines; existing ids are left as they are. Returns how many were new. */
export async function seedDemoLightSources(db: Executor): Promise<number> {
  const inserted = await db.insert(lightSources).values(DEMO_LIGHT_SOURCES).onConflictDoNothing().returning({ id: lightSources.id });
  return inserted.length;
}
