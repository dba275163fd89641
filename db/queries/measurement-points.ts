import { and, desc, eq, inArray, sql } from "drizzle-orm";
import type { ResourceAccess } from "@/lib/contracts/access";
import { DomainError } from "@/lib/contracts/errors";
import type { EditablePointField, EditPointsInput, PointChangeEntry } from "@/lib/contracts/measurement-sets";
import { EDITABLE_POINT_FIELDS } from "@/lib/measurements/point";
import type { Executor } from "../executor";
import { measurementPointChanges, measurementPoints, measurementSets, users } from "../schema";
import { recordAudit } from "./audit";

/*
 * Edits of a measurement set's points: masking with a reason, a note, a corrected value. One
 * request is one new revision of the set, in one transaction: the points, the per-point history
 * (measurement_point_changes), the set's summary columns and an audit entry. The original file in
 * object storage is never touched; a point's first edit of a field keeps the imported value.
 */

type MeasurementAccess = ResourceAccess<"measurement_set">;

const distinct = (values: number[]) => [...new Set(values)].sort((a, b) => a - b);

/** Applies the changes as the next revision; returns it. A stale revision answers stale_version, an unknown ordinal 400. */
export async function editMeasurementPoints(
  db: Executor,
  options: { access: MeasurementAccess; input: EditPointsInput },
): Promise<{ revision: number; changedPoints: number }> {
  const { access, input } = options;
  return db.transaction(async (tx) => {
    const [set] = await tx
      .select({ revision: measurementSets.revision, name: measurementSets.name })
      .from(measurementSets)
      .where(and(eq(measurementSets.id, access.id), eq(measurementSets.labId, access.labId)))
      .for("update");
    if (!set) throw new DomainError("not_found", "No such measurement set.");
    if (set.revision !== input.revision) {
      throw new DomainError(
        "stale_version",
        `Someone saved revision ${set.revision} after the revision ${input.revision} you edited. Reload and apply your changes again.`,
        { extra: { currentRevision: set.revision } },
      );
    }
    const ordinals = [...new Set(input.changes.map((c) => c.ordinal))];
    const rows = await tx
      .select()
      .from(measurementPoints)
      .where(and(eq(measurementPoints.setId, access.id), inArray(measurementPoints.ordinal, ordinals)));
    const byOrdinal = new Map(rows.map((row) => [row.ordinal, row]));
    const unknown = input.changes.findIndex((c) => !byOrdinal.has(c.ordinal));
    if (unknown >= 0) {
      throw new DomainError("validation", "One field is invalid.", {
        fields: { [`changes.${unknown}.ordinal`]: "No such point in this set." },
      });
    }

    const revision = set.revision + 1;
    const history: { ordinal: number; changes: Record<string, { from: unknown; to: unknown }> }[] = [];
    for (const change of input.changes) {
      const row = byOrdinal.get(change.ordinal)!;
      const diff: Record<string, { from: unknown; to: unknown }> = {};
      const patch: Partial<typeof row> = {};
      if (change.masked !== undefined && change.masked !== row.masked) {
        diff.masked = { from: row.masked, to: change.masked };
        patch.masked = change.masked;
      }
      const reason = change.masked === false ? null : (change.maskReason ?? row.maskReason);
      if ((change.masked !== undefined || change.maskReason !== undefined) && reason !== row.maskReason) {
        diff.maskReason = { from: row.maskReason, to: reason };
        patch.maskReason = reason;
      }
      if (change.note !== undefined && change.note !== row.note) {
        diff.note = { from: row.note, to: change.note };
        patch.note = change.note;
      }
      const original: Record<string, number> = { ...(row.original ?? {}) };
      for (const field of EDITABLE_POINT_FIELDS) {
        const next = change.values?.[field];
        if (next === undefined || next === row[field]) continue;
        diff[field] = { from: row[field], to: next };
        (patch as Record<EditablePointField, number>)[field] = next;
        if (!(field in original)) original[field] = row[field];
      }
      if (Object.keys(diff).length === 0) continue;
      if (EDITABLE_POINT_FIELDS.some((f) => f in diff)) patch.original = original;
      await tx
        .update(measurementPoints)
        .set(patch)
        .where(and(eq(measurementPoints.setId, access.id), eq(measurementPoints.ordinal, change.ordinal)));
      Object.assign(row, patch);
      history.push({ ordinal: change.ordinal, changes: diff });
    }
    if (history.length === 0) return { revision: set.revision, changedPoints: 0 };

    await tx
      .insert(measurementPointChanges)
      .values(history.map((h) => ({ setId: access.id, revision, ordinal: h.ordinal, changes: h.changes, actorId: access.caller.id })));
    // The summary columns describe the points as they are now (a corrected temperature moves the set in the list).
    const all = await tx
      .select({
        wavelengthNm: measurementPoints.wavelengthNm,
        temperatureK: measurementPoints.temperatureK,
        fieldT: measurementPoints.fieldT,
        lengthM: measurementPoints.lengthM,
        masked: measurementPoints.masked,
      })
      .from(measurementPoints)
      .where(eq(measurementPoints.setId, access.id));
    await tx
      .update(measurementSets)
      .set({
        revision,
        maskedCount: all.filter((p) => p.masked).length,
        wavelengthMinNm: Math.min(...all.map((p) => p.wavelengthNm)),
        wavelengthMaxNm: Math.max(...all.map((p) => p.wavelengthNm)),
        temperaturesK: distinct(all.map((p) => p.temperatureK)),
        fieldsT: distinct(all.map((p) => p.fieldT)),
        lengthsM: distinct(all.map((p) => p.lengthM)),
      })
      .where(eq(measurementSets.id, access.id));
    const fields = [...new Set(history.flatMap((h) => Object.keys(h.changes)))].sort();
    await recordAudit(tx, {
      entry: {
        actorId: access.caller.id,
        action: "measurement_set.revise",
        targetType: "measurement_set",
        targetId: access.id,
        labId: access.labId,
        details: { name: set.name, revision, points: history.length, fields },
      },
    });
    return { revision, changedPoints: history.length };
  });
}

/** The set's point history, newest revision first (at most `limit` changes). */
export async function listPointChanges(db: Executor, options: { access: MeasurementAccess; limit: number }): Promise<PointChangeEntry[]> {
  const { access } = options;
  const rows = await db
    .select({
      revision: measurementPointChanges.revision,
      ordinal: measurementPointChanges.ordinal,
      line: measurementPoints.line,
      changes: measurementPointChanges.changes,
      actorId: users.id,
      actorName: users.name,
      at: measurementPointChanges.createdAt,
    })
    .from(measurementPointChanges)
    .innerJoin(measurementSets, eq(measurementSets.id, measurementPointChanges.setId))
    .innerJoin(
      measurementPoints,
      and(eq(measurementPoints.setId, measurementPointChanges.setId), eq(measurementPoints.ordinal, measurementPointChanges.ordinal)),
    )
    .leftJoin(users, eq(users.id, measurementPointChanges.actorId))
    .where(and(eq(measurementPointChanges.setId, access.id), eq(measurementSets.labId, access.labId)))
    .orderBy(desc(measurementPointChanges.revision), sql`${measurementPointChanges.ordinal} asc`)
    .limit(options.limit);
  return rows.map((row) => ({
    revision: row.revision,
    ordinal: row.ordinal,
    line: row.line,
    changes: row.changes,
    actor: row.actorId && row.actorName !== null ? { id: row.actorId, name: row.actorName } : null,
    at: row.at.toISOString(),
  }));
}
