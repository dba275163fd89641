import { and, desc, eq, gte, like, lt, sql } from "drizzle-orm";
import type { AnyPgColumn } from "drizzle-orm/pg-core";
import type { ResourceAccess } from "@/lib/contracts/access";
import type { AuditAction, AuditEntry, AuditKind, AuditTarget } from "@/lib/contracts/audit";
import type { Page, PageQuery } from "@/lib/contracts/paging";
import type { Executor } from "../executor";
import { decodeCursor, timeIdCursor, toPage } from "../paging";
import {
  auditLog,
  invitations,
  labRuns,
  lightSources,
  measurementSets,
  type NewAuditLogEntry,
  parameterSets,
  plans,
  users,
} from "../schema";

/** One audit entry as a writer records it: its action and target kind are the contract's. */
export type NewAuditEntry = Omit<NewAuditLogEntry, "action" | "targetType"> & { action: AuditAction; targetType: AuditTarget };

/** Writes one audit entry; pass the transaction so the record commits or rolls back with the change. */
export async function recordAudit(db: Executor, options: { entry: NewAuditEntry }): Promise<void> {
  await db.insert(auditLog).values(options.entry);
}

const DAY_MS = 24 * 60 * 60 * 1000;

/*
 * The target's present name, looked up by its kind (audit_log has no foreign key, so a deleted
 * target finds nothing and the name recorded in the details stands in). Lab-owned targets are
 * looked up within the entry's lab only.
 */
const sameLab = (labId: AnyPgColumn) => sql`${labId} = ${auditLog.labId}`;
const targetName = sql<string | null>`coalesce(case ${auditLog.targetType}
  when 'user' then (select ${users.name} from ${users} where ${users.id}::text = ${auditLog.targetId})
  when 'parameter_set' then (select ${parameterSets.name} from ${parameterSets}
    where ${parameterSets.id}::text = ${auditLog.targetId} and ${sameLab(parameterSets.labId)})
  when 'measurement_set' then (select ${measurementSets.name} from ${measurementSets}
    where ${measurementSets.id}::text = ${auditLog.targetId} and ${sameLab(measurementSets.labId)})
  when 'plan' then (select ${plans.name} from ${plans} where ${plans.id}::text = ${auditLog.targetId})
  when 'light_source' then (select ${lightSources.name} from ${lightSources}
    where ${lightSources.id}::text = ${auditLog.targetId} and ${sameLab(lightSources.labId)})
  when 'invitation' then (select ${invitations.email} from ${invitations}
    where ${invitations.id}::text = ${auditLog.targetId} and ${sameLab(invitations.labId)})
  when 'lab_run' then (select ${labRuns.kind} from ${labRuns} where ${labRuns.id}::text = ${auditLog.targetId})
  end, ${auditLog.details}->>'name', ${auditLog.details}->>'email')`;
/** The set an entry about a plan concerns (details.setId), with its present name. */
const contextSetName = sql<string | null>`(select ${parameterSets.name} from ${parameterSets}
  where ${parameterSets.id}::text = ${auditLog.details}->>'setId' and ${sameLab(parameterSets.labId)})`;

/** A lab's audit trail, newest first, filtered by set, person, kind and date (UTC days, inclusive). */
export async function listAudit(
  db: Executor,
  options: {
    access: ResourceAccess<"lab">;
    setId?: string;
    actorId?: string;
    subjectId?: string;
    kind?: AuditKind;
    from?: string;
    to?: string;
    page: PageQuery;
  },
): Promise<Page<AuditEntry>> {
  const after = decodeCursor(options.page.cursor, timeIdCursor);
  const rows = await db
    .select({
      id: auditLog.id,
      at: auditLog.at,
      action: auditLog.action,
      actorId: auditLog.actorId,
      actorName: users.name,
      targetType: auditLog.targetType,
      targetId: auditLog.targetId,
      details: auditLog.details,
      targetName,
      contextSetId: sql<string | null>`${auditLog.details}->>'setId'`,
      contextSetName,
      cursorAt: sql<string>`${auditLog.at}::text`,
    })
    .from(auditLog)
    .leftJoin(users, eq(users.id, auditLog.actorId))
    .where(
      and(
        eq(auditLog.labId, options.access.labId),
        // A set's entries: about the set itself (saves, fits, share links) or about its plans.
        options.setId
          ? sql`((${auditLog.targetType} = 'parameter_set' and ${auditLog.targetId} = ${options.setId})
              or ${auditLog.details}->>'setId' = ${options.setId})`
          : undefined,
        options.actorId ? eq(auditLog.actorId, options.actorId) : undefined,
        options.subjectId ? and(eq(auditLog.targetType, "user"), eq(auditLog.targetId, options.subjectId)) : undefined,
        options.kind ? like(auditLog.action, `${options.kind}.%`) : undefined,
        options.from ? gte(auditLog.at, new Date(`${options.from}T00:00:00Z`)) : undefined,
        options.to ? lt(auditLog.at, new Date(new Date(`${options.to}T00:00:00Z`).getTime() + DAY_MS)) : undefined,
        after ? sql`(${auditLog.at}, ${auditLog.id}) < (${after[0]}::timestamptz, ${after[1]}::uuid)` : undefined,
      ),
    )
    .orderBy(desc(auditLog.at), desc(auditLog.id))
    .limit(options.page.limit + 1);
  return toPage(
    rows,
    options.page.limit,
    (row) => ({
      id: row.id,
      at: row.at.toISOString(),
      action: row.action,
      actor: row.actorId ? { id: row.actorId, name: row.actorName ?? "(deleted account)" } : null,
      targetType: row.targetType,
      targetId: row.targetId,
      targetName: row.targetName,
      set: row.contextSetId ? { id: row.contextSetId, name: row.contextSetName } : null,
      details: row.details,
    }),
    (row) => [row.cursorAt, row.id],
  );
}
