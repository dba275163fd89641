import { and, eq, inArray, isNull, lte, sql } from "drizzle-orm";
import type { Executor } from "../executor";
import { type MailOutboxRow, mailOutbox } from "../schema";

/*
 * The mail outbox (db/schema.ts mailOutbox). enqueueMail runs inside the transaction of the
 * change that causes the mail. Senders claim due rows with FOR UPDATE SKIP LOCKED and push their
 * next attempt out by a lease, so two senders never take the same row; a failure schedules the
 * next attempt with a doubling delay, and after MAX_ATTEMPTS the row is given up (kept, with the
 * last error, for the operator).
 */

export const MAX_MAIL_ATTEMPTS = 12;
const LEASE_S = 60;
const FIRST_RETRY_S = 5;
const LONGEST_RETRY_S = 30 * 60;

export interface OutgoingMail {
  kind: string;
  to: string;
  subject: string;
  text: string;
}

export async function enqueueMail(db: Executor, mail: OutgoingMail): Promise<string> {
  const [row] = await db
    .insert(mailOutbox)
    .values({ kind: mail.kind, recipient: mail.to, subject: mail.subject, body: mail.text })
    .returning({ id: mailOutbox.id });
  if (!row) throw new Error("insert into mail_outbox returned no row");
  return row.id;
}

/** Claims up to `limit` due messages (or just `id` when given), counting the attempt. */
export async function claimDueMail(db: Executor, options: { limit: number; id?: string }): Promise<MailOutboxRow[]> {
  const due = db
    .select({ id: mailOutbox.id })
    .from(mailOutbox)
    .where(
      and(
        isNull(mailOutbox.sentAt),
        isNull(mailOutbox.gaveUpAt),
        lte(mailOutbox.nextAttemptAt, sql`now()`),
        options.id ? eq(mailOutbox.id, options.id) : undefined,
      ),
    )
    .orderBy(mailOutbox.nextAttemptAt)
    .limit(options.limit)
    .for("update", { skipLocked: true });
  return db
    .update(mailOutbox)
    .set({ attempts: sql`${mailOutbox.attempts} + 1`, nextAttemptAt: sql`now() + make_interval(secs => ${LEASE_S})` })
    .where(inArray(mailOutbox.id, due))
    .returning();
}

export async function markMailSent(db: Executor, options: { id: string }): Promise<void> {
  // The body carries a secret link; once delivered it is nobody's to keep.
  await db.update(mailOutbox).set({ sentAt: new Date(), body: "", lastError: null }).where(eq(mailOutbox.id, options.id));
}

/** Delay before attempt n + 1 after n failed ones: 5 s, 10 s, 20 s, … at most 30 minutes. */
export function retryDelayS(attempts: number): number {
  return Math.min(LONGEST_RETRY_S, FIRST_RETRY_S * 2 ** Math.max(0, attempts - 1));
}

export async function markMailFailed(db: Executor, options: { row: MailOutboxRow; error: string }): Promise<void> {
  const { row } = options;
  const giveUp = row.attempts >= MAX_MAIL_ATTEMPTS;
  await db
    .update(mailOutbox)
    .set({
      lastError: options.error.slice(0, 500),
      nextAttemptAt: sql`now() + make_interval(secs => ${retryDelayS(row.attempts)})`,
      gaveUpAt: giveUp ? new Date() : null,
    })
    .where(eq(mailOutbox.id, row.id));
}

/** Seconds until the next message is due (null when nothing waits), so a sender can sleep until then. */
export async function secondsUntilNextMail(db: Executor): Promise<number | null> {
  const [row] = await db
    .select({ s: sql<number>`extract(epoch from min(${mailOutbox.nextAttemptAt}) - now())::float8` })
    .from(mailOutbox)
    .where(and(isNull(mailOutbox.sentAt), isNull(mailOutbox.gaveUpAt)));
  return row?.s === null || row?.s === undefined ? null : Math.max(0, Number(row.s));
}
