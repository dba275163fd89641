import { and, asc, desc, eq, ilike, or, sql, type SQL } from "drizzle-orm";
import type { MeasurementSetSummary, PointsResponse, SignSource, StoredPoint } from "@/lib/contracts/measurement-sets";
import type { Page, PageQuery } from "@/lib/contracts/paging";
import { decodeCursor, timeIdCursor, toPage } from "../paging";
import type { MeasuredPoint } from "@/lib/measurements/point";
import type { ObjectStore } from "@/lib/storage/object-store";
import type { Executor } from "../executor";
import { importMeasurementSet, type MeasurementImport } from "../measurement-import";
import { labMemberships, labs, measurementPoints, measurementSets, pendingObjectDeletes, users } from "../schema";
import { sweepObjects } from "./object-sweep";
import type { LabRole } from "@/lib/contracts/roles";
import { recordAudit } from "./audit";
import type { Caller, ResourceAccess } from "@/lib/contracts/access";

/*
 * Measurement sets of a lab. Every query of one set takes the proof lib/auth/access.ts authorize()
 * made for it and filters on both the set's id and its lab, so a proof can never reach a set of
 * another lab. The original files live in the object store the caller passes (the server's own, or
 * a script's), beside the database.
 */

type MeasurementAccess = ResourceAccess<"measurement_set">;

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
  revision: measurementSets.revision,
  maskedCount: measurementSets.maskedCount,
  signSource: measurementSets.signSource,
  uploadedById: users.id,
  uploadedByName: users.name,
};

type SummaryRow = { [K in Exclude<keyof typeof summaryColumns, "signSource">]: (typeof summaryColumns)[K]["_"]["data"] } & {
  // The one nullable column: "_"["data"] is the type without its null.
  signSource: SignSource | null;
};

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
    revision: row.revision,
    maskedCount: row.maskedCount,
    signSource: row.signSource ?? null,
    role,
  };
}

const escapeLike = (text: string) => text.replace(/[\\%_]/g, (c) => `\\${c}`);

/** Sets in the caller's labs (every lab for a site admin), newest first, a page at a time; `lab` narrows to one of them. */
export async function listMeasurementSets(
  db: Executor,
  options: { caller: Caller; lab?: ResourceAccess<"lab">; q?: string; page: PageQuery },
): Promise<Page<MeasurementSetSummary>> {
  const isAdmin = options.caller.siteRole === "admin";
  const conditions: (SQL | undefined)[] = [];
  if (!isAdmin) conditions.push(eq(labMemberships.userId, options.caller.id));
  if (options.lab) conditions.push(eq(measurementSets.labId, options.lab.labId));
  if (options.q) {
    const pattern = `%${escapeLike(options.q)}%`;
    conditions.push(
      or(ilike(measurementSets.name, pattern), ilike(measurementSets.sample, pattern), ilike(measurementSets.fileName, pattern)),
    );
  }
  const after = decodeCursor(options.page.cursor, timeIdCursor);
  if (after) conditions.push(sql`(${measurementSets.createdAt}, ${measurementSets.id}) < (${after[0]}::timestamptz, ${after[1]}::uuid)`);
  // Non-members' sets are filtered in SQL (not after the fetch), so every page is full.
  if (!isAdmin) conditions.push(sql`${labMemberships.role} is not null`);
  const rows = await db
    .select({ ...summaryColumns, memberRole: labMemberships.role, cursorAt: sql<string>`${measurementSets.createdAt}::text` })
    .from(measurementSets)
    .innerJoin(labs, eq(labs.id, measurementSets.labId))
    .innerJoin(users, eq(users.id, measurementSets.createdById))
    .leftJoin(labMemberships, and(eq(labMemberships.labId, measurementSets.labId), eq(labMemberships.userId, options.caller.id)))
    .where(and(...conditions))
    .orderBy(desc(measurementSets.createdAt), desc(measurementSets.id))
    .limit(options.page.limit + 1);
  return toPage(
    rows,
    options.page.limit,
    (row) => toSummary(row, isAdmin ? "owner" : (row.memberRole ?? "viewer")),
    (row) => [row.cursorAt, row.id],
  );
}

async function loadSummary(db: Executor, options: { id: string; labId: string; role: LabRole }): Promise<MeasurementSetSummary | null> {
  const [row] = await db
    .select(summaryColumns)
    .from(measurementSets)
    .innerJoin(labs, eq(labs.id, measurementSets.labId))
    .innerJoin(users, eq(users.id, measurementSets.createdById))
    .where(and(eq(measurementSets.id, options.id), eq(measurementSets.labId, options.labId)))
    .limit(1);
  return row ? toSummary(row, options.role) : null;
}

/** The set the proof is for; null when it was deleted since. */
export async function getMeasurementSet(db: Executor, options: { access: MeasurementAccess }): Promise<MeasurementSetSummary | null> {
  return loadSummary(db, options.access);
}

const pointColumns = {
  ordinal: measurementPoints.ordinal,
  line: measurementPoints.line,
  wavelengthNm: measurementPoints.wavelengthNm,
  value: measurementPoints.value,
  sigma: measurementPoints.sigma,
  temperatureK: measurementPoints.temperatureK,
  fieldT: measurementPoints.fieldT,
  lengthM: measurementPoints.lengthM,
  extra: measurementPoints.extra,
  masked: measurementPoints.masked,
  maskReason: measurementPoints.maskReason,
  note: measurementPoints.note,
  original: measurementPoints.original,
};
const selectPoints = (db: Executor, setId: string) =>
  db.select(pointColumns).from(measurementPoints).where(eq(measurementPoints.setId, setId)).orderBy(asc(measurementPoints.ordinal));

function toStoredPoint(row: Awaited<ReturnType<typeof selectPoints>>[number], quantity: MeasuredPoint["quantity"]): StoredPoint {
  const { extra, original, ...rest } = row;
  return { ...rest, quantity, ...(extra ? { extra } : {}), original: original ?? null };
}

/** The set's points in file order, in SI, with the set's revision; null when the set was deleted since. */
export async function getMeasurementPoints(db: Executor, options: { access: MeasurementAccess }): Promise<PointsResponse | null> {
  const { access } = options;
  const [set] = await db
    .select({ quantity: measurementSets.quantity, revision: measurementSets.revision })
    .from(measurementSets)
    .where(and(eq(measurementSets.id, access.id), eq(measurementSets.labId, access.labId)));
  if (!set) return null;
  const rows = await selectPoints(db, access.id);
  return { revision: set.revision, points: rows.map((row) => toStoredPoint(row, set.quantity)) };
}

/** The original file's bytes and name, byte for byte as uploaded; null when the set is unknown. */
export async function getMeasurementOriginal(
  db: Executor,
  options: { access: MeasurementAccess; store: ObjectStore },
): Promise<{ fileName: string; contentType: string; bytes: Uint8Array } | null> {
  const { access } = options;
  const [row] = await db
    .select({ fileName: measurementSets.fileName, contentType: measurementSets.contentType, objectKey: measurementSets.objectKey })
    .from(measurementSets)
    .where(and(eq(measurementSets.id, access.id), eq(measurementSets.labId, access.labId)));
  if (!row) return null;
  const object = await options.store.get(row.objectKey);
  if (!object) throw new Error(`measurement set ${access.id}: object ${row.objectKey} is missing from storage`);
  return { fileName: row.fileName, contentType: row.contentType, bytes: object.bytes };
}

/** Imports an upload into the lab the proof is for, uploaded by the proof's caller. */
export async function createMeasurementSet(
  db: Executor,
  options: { access: ResourceAccess<"lab">; store: ObjectStore; input: Omit<MeasurementImport, "labId"> },
): Promise<MeasurementSetSummary> {
  const { access } = options;
  const input: MeasurementImport = { ...options.input, labId: access.labId };
  const id = await importMeasurementSet({ db, store: options.store, actorId: access.caller.id, input });
  const item = await loadSummary(db, { id, labId: access.labId, role: access.role });
  if (!item) throw new Error(`measurement set ${id} missing right after import`);
  return item;
}

/**
 * Deletes the rows (with an audit entry) in one transaction, then the object. A failure after the
 * commit leaves an orphan object, never a row without its file.
 */
export async function deleteMeasurementSet(db: Executor, options: { access: MeasurementAccess; store: ObjectStore }): Promise<boolean> {
  const { access } = options;
  const deleted = await db.transaction(async (tx) => {
    const [row] = await tx
      .delete(measurementSets)
      .where(and(eq(measurementSets.id, access.id), eq(measurementSets.labId, access.labId)))
      .returning({
        name: measurementSets.name,
        rowCount: measurementSets.rowCount,
        fileName: measurementSets.fileName,
        objectKey: measurementSets.objectKey,
      });
    if (!row) return null;
    // The object goes after the commit; recorded here so a store that is down cannot leave it for good.
    await tx.insert(pendingObjectDeletes).values({ objectKey: row.objectKey, reason: "delete" }).onConflictDoNothing();
    await recordAudit(tx, {
      entry: {
        actorId: access.caller.id,
        action: "measurement_set.delete",
        targetType: "measurement_set",
        targetId: access.id,
        labId: access.labId,
        details: { name: row.name, rows: row.rowCount, fileName: row.fileName },
      },
    });
    return row;
  });
  if (!deleted) return false;
  await sweepObjects(db, { store: options.store, keys: [deleted.objectKey] }).catch((error: unknown) => {
    console.error(
      `[measurements] could not remove ${deleted.objectKey} after deleting its set (left for the sweep):`,
      error instanceof Error ? error.message : error,
    );
  });
  return true;
}
