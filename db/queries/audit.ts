import "server-only";
import { and, desc, eq, gte, like, lt, sql } from "drizzle-orm";
import { decodeCursor, timeIdCursor, toPage } from "@/db/paging";
import { type Page } from "@/lib/contracts/paging";
import type { PageQuery } from "@/lib/contracts/paging";
import { db, type Database } from "../client";
import { auditLog, users, type NewAuditLogEntry } from "../schema";

type Executor = Pick<Database, "insert">;

/** Writes one audit entry; pass the transaction so the record commits or rolls back with the change. */
export async function recordAudit(options: { tx: Executor; entry: NewAuditLogEntry }): Promise<void> {
  await options.tx.insert(auditLog).values(options.entry);
}

export type AuditKind = "parameter_set" | "member" | "invitation" | "share_link";

export interface AuditEntrySummary {
  id: string;
  at: string;
  action: string;
  actor: { id: string; name: string } | null;
  targetType: string;
  targetId: string;
  details: Record<string, unknown>;
}

const DAY_MS = 24 * 60 * 60 * 1000;

/** A lab's audit trail, newest first, filtered by set, person, kind and date (UTC days, inclusive). */
export async function listAudit(options: {
  labId: string;
  setId?: string;
  actorId?: string;
  kind?: AuditKind;
  from?: string;
  to?: string;
  page: PageQuery;
}): Promise<Page<AuditEntrySummary>> {
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
      cursorAt: sql<string>`${auditLog.at}::text`,
    })
    .from(auditLog)
    .leftJoin(users, eq(users.id, auditLog.actorId))
    .where(
      and(
        eq(auditLog.labId, options.labId),
        options.setId ? and(eq(auditLog.targetType, "parameter_set"), eq(auditLog.targetId, options.setId)) : undefined,
        options.actorId ? eq(auditLog.actorId, options.actorId) : undefined,
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
      details: row.details,
    }),
    (row) => [row.cursorAt, row.id],
  );
}
