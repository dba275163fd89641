import { randomUUID, createHash } from "node:crypto";
import { and, eq } from "drizzle-orm";
import { uniqueViolation } from "@/db/errors";
import { DomainError } from "@/lib/contracts/errors";
import type { ColumnMapping, FileDefaults, TableFormat } from "@/lib/measurements/parse";
import type { MeasuredPoint } from "@/lib/measurements/point";
import type { SignSource } from "@/lib/contracts/measurement-sets";
import type { ObjectStore } from "@/lib/storage/object-store";
import type { Executor } from "./executor";
import { recordAudit } from "./queries/audit";
import { measurementPoints, measurementSets, pendingObjectDeletes } from "./schema";

/*
 * Importing a measurement set as one unit: the original file into object storage first, then the
 * set and all its points in one database transaction.
 *   - storage fails → nothing was written to the database;
 *   - the transaction fails → the object is deleted again;
 *   - the process dies between the two → an object with no row (harmless, never read), but never
 *     a row that names a missing object.
 * No "server-only" marker: the demo seed imports its files through this same path.
 */

export interface MeasurementImport {
  labId: string;
  name: string;
  sample: string;
  fileName: string;
  contentType: string;
  bytes: Uint8Array;
  mapping: ColumnMapping;
  defaults: FileDefaults;
  /** How the file was read (detected or chosen); absent for the seed's plain CSV files. */
  format?: TableFormat;
  /** Already parsed and validated (lib/measurements/parse.ts), with their signs as stored. */
  points: MeasuredPoint[];
  /** Set when the values took the model's sign (the file held magnitudes). */
  signSource?: SignSource;
}

/** Rows per INSERT: 10 parameters each stays far below PostgreSQL's 65 535 bind parameters. */
const POINT_BATCH = 2000;

const distinct = (values: number[]) => [...new Set(values)].sort((a, b) => a - b);

/** Object names: the set's id keeps them unique; the file name (made safe) helps a person browsing the bucket. */
export function objectKeyFor(options: { labId: string; setId: string; fileName: string }): string {
  const safe = options.fileName.replace(/[^A-Za-z0-9._-]+/g, "_").slice(-120) || "original";
  return `labs/${options.labId}/measurement-sets/${options.setId}/${safe}`;
}

export function duplicateMeasurementName(name: string): DomainError {
  return new DomainError("conflict", `A measurement set named “${name}” already exists in this lab.`, {
    fields: { name: "This lab already has a measurement set with this name." },
  });
}

export async function importMeasurementSet(options: {
  db: Executor;
  store: ObjectStore;
  actorId: string;
  input: MeasurementImport;
  /** A fixed id (the demo seed); otherwise a new one. */
  id?: string;
}): Promise<string> {
  const { db, store, input } = options;
  if (input.points.length === 0) throw new DomainError("validation", "The file has no data rows.");
  const quantity = input.points[0]!.quantity;
  if (input.points.some((p) => p.quantity !== quantity))
    throw new DomainError("validation", "All points of a set must measure the same quantity.");

  // Checked before storing anything, so the common mistake costs no upload; the unique constraint
  // below still decides when two uploads race.
  const [taken] = await db
    .select({ id: measurementSets.id })
    .from(measurementSets)
    .where(and(eq(measurementSets.labId, input.labId), eq(measurementSets.name, input.name)))
    .limit(1);
  if (taken) throw duplicateMeasurementName(input.name);

  const id = options.id ?? randomUUID();
  const objectKey = objectKeyFor({ labId: input.labId, setId: id, fileName: input.fileName });
  // Recorded before the object exists and removed in the import's own transaction: if the process
  // dies in between, the sweep (db/queries/object-sweep.ts) removes the object no row names.
  await db.insert(pendingObjectDeletes).values({ objectKey, reason: "upload" }).onConflictDoNothing();
  await store.put({ key: objectKey, bytes: input.bytes, contentType: input.contentType });

  const wavelengths = input.points.map((p) => p.wavelengthNm);
  try {
    await db.transaction(async (tx) => {
      await tx.insert(measurementSets).values({
        id,
        labId: input.labId,
        name: input.name,
        sample: input.sample,
        quantity,
        rowCount: input.points.length,
        wavelengthMinNm: Math.min(...wavelengths),
        wavelengthMaxNm: Math.max(...wavelengths),
        temperaturesK: distinct(input.points.map((p) => p.temperatureK)),
        fieldsT: distinct(input.points.map((p) => p.fieldT)),
        lengthsM: distinct(input.points.map((p) => p.lengthM)),
        mapping: { ...input.mapping, defaults: input.defaults, ...(input.format ? { format: input.format } : {}) },
        fileName: input.fileName,
        fileBytes: input.bytes.byteLength,
        contentType: input.contentType,
        fileSha256: createHash("sha256").update(input.bytes).digest("hex"),
        objectKey,
        signSource: input.signSource ?? null,
        createdById: options.actorId,
      });
      for (let start = 0; start < input.points.length; start += POINT_BATCH) {
        await tx.insert(measurementPoints).values(
          input.points.slice(start, start + POINT_BATCH).map((p, i) => ({
            setId: id,
            ordinal: start + i,
            line: p.line,
            wavelengthNm: p.wavelengthNm,
            value: p.value,
            sigma: p.sigma,
            temperatureK: p.temperatureK,
            fieldT: p.fieldT,
            lengthM: p.lengthM,
            extra: p.extra ?? null,
          })),
        );
      }
      await tx.delete(pendingObjectDeletes).where(eq(pendingObjectDeletes.objectKey, objectKey));
      await recordAudit(tx, {
        entry: {
          actorId: options.actorId,
          action: "measurement_set.create",
          targetType: "measurement_set",
          targetId: id,
          labId: input.labId,
          details: {
            name: input.name,
            rows: input.points.length,
            fileName: input.fileName,
            fileBytes: input.bytes.byteLength,
            ...(input.signSource ? { signsFrom: input.signSource } : {}),
          },
        },
      });
    });
  } catch (error) {
    // Undo the object so a failed import leaves nothing behind; if even that fails, its pending
    // row stays and the sweep removes it later.
    await store
      .delete(objectKey)
      .then(() => db.delete(pendingObjectDeletes).where(eq(pendingObjectDeletes.objectKey, objectKey)))
      .catch((cleanup: unknown) => {
        console.error(
          `[measurements] could not remove ${objectKey} after a failed import (left for the sweep):`,
          cleanup instanceof Error ? cleanup.message : cleanup,
        );
      });
    throw uniqueViolation(error) === "measurement_sets_lab_name_unique" ? duplicateMeasurementName(input.name) : error;
  }
  return id;
}
