import { readFileSync } from "node:fs";
import path from "node:path";
import { eq, sql } from "drizzle-orm";
import { parseMeasurementTable, proposeMapping, readTable, type ColumnMapping, type FileDefaults } from "@/lib/measurements/parse";
import { scriptSettings } from "@/lib/settings/scripts";
import { createObjectStore } from "@/lib/storage/object-store";
import { DEMO_LAB, DEMO_USERS } from "./demo-data";
import type { Executor } from "./executor";
import { importMeasurementSet } from "./measurement-import";
import { measurementSets, users } from "./schema";

/*
 * The demo lab's measurement sets: the generated files in db/demo/ (scripts/generate-demo-measurements.ts),
 * imported through the same path as an upload, so their originals sit in the object store.
 * Idempotent: a set that exists is left alone, and its original is put back if the store lost it.
 */

interface DemoMeasurementSet {
  id: string;
  file: string;
  name: string;
  sample: string;
  contentType: string;
  mapping: (headers: string[]) => ColumnMapping;
  defaults: FileDefaults;
}

export const DEMO_MEASUREMENT_SETS: DemoMeasurementSet[] = [
  {
    id: "6a1f0c2e-5b1d-4c1e-9f00-00000000d001",
    file: "generated-garnet-LM-T4-verdet.csv",
    name: "Garnet rod LM-T4 — Verdet spectrum, 293 K (generated)",
    sample: "LM-T4 terbium gallium garnet rod, 10 mm",
    contentType: "text/csv",
    mapping: (headers) => proposeMapping(headers),
    defaults: {},
  },
  {
    id: "6a1f0c2e-5b1d-4c1e-9f00-00000000d003",
    file: "generated-garnet-LM-T4-verdet-77K.csv",
    name: "Garnet rod LM-T4 — Verdet spectrum, 77 K (generated)",
    sample: "LM-T4 terbium gallium garnet rod, 10 mm, in a nitrogen cryostat",
    contentType: "text/csv",
    mapping: (headers) => proposeMapping(headers),
    defaults: {},
  },
  {
    id: "6a1f0c2e-5b1d-4c1e-9f00-00000000d002",
    file: "generated-glass-LM-B7-rotation.tsv",
    name: "Borate glass LM-B7 — rotation at 77 K and 293 K (generated)",
    sample: "LM-B7 Tb-doped borate glass, 20 mm",
    contentType: "text/tab-separated-values",
    mapping: (headers) => proposeMapping(headers),
    defaults: { fieldT: 0.5, lengthM: 0.02 },
  },
];

export async function seedDemoMeasurements(db: Executor): Promise<number> {
  const store = createObjectStore(scriptSettings.storage);
  await store.ensureBucket();
  // The uploader is the demo postdoc, by address: an account made before the seed keeps its own id.
  const [uploader] = await db
    .select({ id: users.id })
    .from(users)
    .where(eq(sql`lower(${users.email})`, DEMO_USERS.postdoc.email));
  if (!uploader) throw new Error("demo postdoc missing; seed the users first");
  let created = 0;
  for (const set of DEMO_MEASUREMENT_SETS) {
    const bytes = new Uint8Array(readFileSync(path.resolve(import.meta.dirname, "demo", set.file)));
    const [existing] = await db
      .select({ objectKey: measurementSets.objectKey })
      .from(measurementSets)
      .where(eq(measurementSets.id, set.id));
    if (existing) {
      if (!(await store.get(existing.objectKey))) await store.put({ key: existing.objectKey, bytes, contentType: set.contentType });
      continue;
    }
    const text = new TextDecoder("utf-8", { fatal: true }).decode(bytes);
    const mapping = set.mapping(readTable(text).headers);
    const parsed = parseMeasurementTable(text, mapping, set.defaults);
    if (parsed.errors.length > 0) throw new Error(`demo file ${set.file}: ${parsed.errors.join("; ")}`);
    await importMeasurementSet({
      db,
      store,
      actorId: uploader.id,
      id: set.id,
      input: {
        labId: DEMO_LAB.id,
        name: set.name,
        sample: set.sample,
        fileName: set.file,
        contentType: set.contentType,
        bytes,
        mapping,
        defaults: set.defaults,
        points: parsed.points,
      },
    });
    created++;
  }
  return created;
}
