import { and, desc, eq, gte, like, lt, sql } from "drizzle-orm";
import type { ResourceAccess } from "@/lib/contracts/access";
import type { AuditAction, AuditEntry, AuditKind, AuditTarget } from "@/lib/contracts/audit";
import type { Page, PageQuery } from "@/lib/contracts/paging";
import type { Executor } from "../executor";
import { decodeCursor, timeIdCursor, toPage } from "../paging";
import { auditLog, type NewAuditLogEntry, users } from "../schema";

/** One audit entry as a writer records it: its action and target kind are the contract's. */
export type NewAuditEntry = Omit<NewAuditLogEntry, "action" | "targetType"> & { action: AuditAction; targetType: AuditTarget };

/** Writes one audit entry; pass the transaction so the record commits or rolls back with the change. */
export async function recordAudit(db: Executor, options: { entry: NewAuditEntry }): Promise<void>;
/** Transitional form for the writers that do not pass the executor first yet; removed once none is left. */
export async function recordAudit(options: { tx: Pick<Executor, "insert">; entry: NewAuditLogEntry }): Promise<void>;
export async function recordAudit(
  ...args: [Executor, { entry: NewAuditEntry }] | [{ tx: Pick<Executor, "insert">; entry: NewAuditLogEntry }]
): Promise<void> {
  const [executor, entry] = args.length === 2 ? [args[0], args[1].entry] : [args[0].tx, args[0].entry];
  await executor.insert(auditLog).values(entry);
}

const DAY_MS = 24 * 60 * 60 * 1000;

/** A lab's audit trail, newest first, filtered by set, person, kind and date (UTC days, inclusive). */
export async function listAudit(
  db: Executor,
  options: {
    access: ResourceAccess<"lab">;
    setId?: string;
    actorId?: string;
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
      cursorAt: sql<string>`${auditLog.at}::text`,
    })
    .from(auditLog)
    .leftJoin(users, eq(users.id, auditLog.actorId))
    .where(
      and(
        eq(auditLog.labId, options.access.labId),
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
