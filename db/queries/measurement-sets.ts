import "server-only";
import { and, asc, desc, eq, ilike, or, type SQL } from "drizzle-orm";
import type { MeasurementSetSummary } from "@/lib/contracts/measurement-sets";
import type { MeasuredPoint } from "@/lib/measurements/point";
import { objectStore } from "@/lib/storage/server";
import { db } from "../client";
import { importMeasurementSet, type MeasurementImport } from "../measurement-import";
import { labMemberships, labs, measurementPoints, measurementSets, users } from "../schema";
import { type LabRole } from "@/lib/contracts/roles";
import { recordAudit } from "./audit";
import type { Caller } from "@/lib/contracts/access";

/*
 * Measurement sets of a lab. Callers pass the lab they were authorized for (requireLabRole) and
 * every query filters on it, so an id from another lab finds nothing.
 */

const summaryColumns = {
  id: measurementSets.id,
  labId: measurementSets.labId,
  labName: labs.name,
  name: measurementSets.name,
  sample: measurementSets.sample,
  quantity: measurementSets.quantity,
  rowCount: measurementSets.rowCount,
  wavelengthMinNm: measurementSets.wavelengthMinNm,
  wavelengthMaxNm: measurementSets.wavelengthMaxNm,
  temperaturesK: measurementSets.temperaturesK,
  fieldsT: measurementSets.fieldsT,
  lengthsM: measurementSets.lengthsM,
  fileName: measurementSets.fileName,
  fileBytes: measurementSets.fileBytes,
  createdAt: measurementSets.createdAt,
  uploadedById: users.id,
  uploadedByName: users.name,
};

type SummaryRow = { [K in keyof typeof summaryColumns]: (typeof summaryColumns)[K]["_"]["data"] };

function toSummary(row: SummaryRow, role: LabRole): MeasurementSetSummary {
  return {
    id: row.id,
    labId: row.labId,
    labName: row.labName,
    name: row.name,
    sample: row.sample,
    quantity: row.quantity,
    rowCount: row.rowCount,
    wavelengthSpanNm: { min: row.wavelengthMinNm, max: row.wavelengthMaxNm },
    temperaturesK: row.temperaturesK,
    fieldsT: row.fieldsT,
    lengthsM: row.lengthsM,
    fileName: row.fileName,
    fileBytes: row.fileBytes,
    uploadedBy: { id: row.uploadedById, name: row.uploadedByName },
    createdAt: row.createdAt.toISOString(),
    role,
  };
}

const escapeLike = (text: string) => text.replace(/[\\%_]/g, (c) => `\\${c}`);

/** Sets in the caller's labs (every lab for a site admin), newest first. */
export async function listMeasurementSets(options: { caller: Caller; labId?: string; q?: string }): Promise<MeasurementSetSummary[]> {
  const isAdmin = options.caller.siteRole === "admin";
  const conditions: (SQL | undefined)[] = [];
  if (!isAdmin) conditions.push(eq(labMemberships.userId, options.caller.id));
  if (options.labId) conditions.push(eq(measurementSets.labId, options.labId));
  if (options.q) {
    const pattern = `%${escapeLike(options.q)}%`;
    conditions.push(
      or(ilike(measurementSets.name, pattern), ilike(measurementSets.sample, pattern), ilike(measurementSets.fileName, pattern)),
    );
  }
  const rows = await db
    .select({ ...summaryColumns, memberRole: labMemberships.role })
    .from(measurementSets)
    .innerJoin(labs, eq(labs.id, measurementSets.labId))
    .innerJoin(users, eq(users.id, measurementSets.createdById))
    .leftJoin(labMemberships, and(eq(labMemberships.labId, measurementSets.labId), eq(labMemberships.userId, options.caller.id)))
    .where(and(...conditions))
    .orderBy(desc(measurementSets.createdAt), desc(measurementSets.id));
  return rows.flatMap((row) => {
    const role: LabRole | null = isAdmin ? "owner" : row.memberRole;
    return role ? [toSummary(row, role)] : [];
  });
}

/** The lab a set belongs to (for requireLabRole), or null when there is no such set. */
export async function findMeasurementSetLabId(options: { id: string }): Promise<string | null> {
  const [row] = await db.select({ labId: measurementSets.labId }).from(measurementSets).where(eq(measurementSets.id, options.id)).limit(1);
  return row?.labId ?? null;
}

export async function getMeasurementSet(options: { id: string; labId: string; role: LabRole }): Promise<MeasurementSetSummary | null> {
  const [row] = await db
    .select(summaryColumns)
    .from(measurementSets)
    .innerJoin(labs, eq(labs.id, measurementSets.labId))
    .innerJoin(users, eq(users.id, measurementSets.createdById))
    .where(and(eq(measurementSets.id, options.id), eq(measurementSets.labId, options.labId)))
    .limit(1);
  return row ? toSummary(row, options.role) : null;
}

export async function getMeasurementPoints(options: { id: string; labId: string }): Promise<MeasuredPoint[] | null> {
  const [set] = await db
    .select({ quantity: measurementSets.quantity })
    .from(measurementSets)
    .where(and(eq(measurementSets.id, options.id), eq(measurementSets.labId, options.labId)));
  if (!set) return null;
  const rows = await db
    .select({
      line: measurementPoints.line,
      wavelengthNm: measurementPoints.wavelengthNm,
      value: measurementPoints.value,
      sigma: measurementPoints.sigma,
      temperatureK: measurementPoints.temperatureK,
      fieldT: measurementPoints.fieldT,
      lengthM: measurementPoints.lengthM,
    })
    .from(measurementPoints)
    .where(eq(measurementPoints.setId, options.id))
    .orderBy(asc(measurementPoints.ordinal));
  return rows.map((row) => ({
    line: row.line,
    wavelengthNm: row.wavelengthNm,
    quantity: set.quantity,
    value: row.value,
    sigma: row.sigma,
    temperatureK: row.temperatureK,
    fieldT: row.fieldT,
    lengthM: row.lengthM,
  }));
}

/** The original file's bytes and name, byte for byte as uploaded; null when the set is unknown. */
export async function getMeasurementOriginal(options: {
  id: string;
  labId: string;
}): Promise<{ fileName: string; contentType: string; bytes: Uint8Array } | null> {
  const [row] = await db
    .select({ fileName: measurementSets.fileName, contentType: measurementSets.contentType, objectKey: measurementSets.objectKey })
    .from(measurementSets)
    .where(and(eq(measurementSets.id, options.id), eq(measurementSets.labId, options.labId)));
  if (!row) return null;
  const object = await objectStore.get(row.objectKey);
  if (!object) throw new Error(`measurement set ${options.id}: object ${row.objectKey} is missing from storage`);
  return { fileName: row.fileName, contentType: row.contentType, bytes: object.bytes };
}

export async function createMeasurementSet(options: {
  caller: Caller;
  role: LabRole;
  input: MeasurementImport;
}): Promise<MeasurementSetSummary> {
  const id = await importMeasurementSet({ db, store: objectStore, actorId: options.caller.id, input: options.input });
  const item = await getMeasurementSet({ id, labId: options.input.labId, role: options.role });
  if (!item) throw new Error(`measurement set ${id} missing right after import`);
  return item;
}

/**
 * Deletes the rows (with an audit entry) in one transaction, then the object. A failure after the
 * commit leaves an orphan object, never a row without its file.
 */
export async function deleteMeasurementSet(options: { caller: Caller; id: string; labId: string }): Promise<boolean> {
  const deleted = await db.transaction(async (tx) => {
    const [row] = await tx
      .delete(measurementSets)
      .where(and(eq(measurementSets.id, options.id), eq(measurementSets.labId, options.labId)))
      .returning({
        name: measurementSets.name,
        rowCount: measurementSets.rowCount,
        fileName: measurementSets.fileName,
        objectKey: measurementSets.objectKey,
      });
    if (!row) return null;
    await recordAudit(tx, {
      entry: {
        actorId: options.caller.id,
        action: "measurement_set.delete",
        targetType: "measurement_set",
        targetId: options.id,
        labId: options.labId,
        details: { name: row.name, rows: row.rowCount, fileName: row.fileName },
      },
    });
    return row;
  });
  if (!deleted) return false;
  await objectStore.delete(deleted.objectKey).catch((error: unknown) => {
    console.error(
      `[measurements] could not remove ${deleted.objectKey} after deleting its set:`,
      error instanceof Error ? error.message : error,
    );
  });
  return true;
}
