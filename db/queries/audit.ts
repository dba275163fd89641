import "server-only";
import type { Database } from "../client";
import { auditLog, type NewAuditLogEntry } from "../schema";

type Executor = Pick<Database, "insert">;

/** Writes one audit entry; pass the transaction so the record commits or rolls back with the change. */
export async function recordAudit(options: { tx: Executor; entry: NewAuditLogEntry }): Promise<void> {
  await options.tx.insert(auditLog).values(options.entry);
}
