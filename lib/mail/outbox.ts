import "server-only";
import { db } from "@/db/client";
import { claimDueMail, markMailFailed, markMailSent, secondsUntilNextMail } from "@/db/queries/mail-outbox";
import { sendMail } from "./send";

/*
 * The web server's sender of the mail outbox (db/queries/mail-outbox.ts). A change that causes
 * mail writes it to the outbox in its own transaction and then kicks the sender, which delivers
 * what is due in the background, off the request path; failures are retried with a doubling
 * delay, also across restarts (the first request that loads this module starts the loop again).
 * Several server processes may run it at once: claims skip rows another one holds.
 */

const BATCH = 20;
/** The longest the loop sleeps, so mail queued by another process is picked up soon. */
const IDLE_CHECK_S = 30;

let draining: Promise<void> | null = null;
let timer: NodeJS.Timeout | null = null;

async function deliver(rows: Awaited<ReturnType<typeof claimDueMail>>): Promise<number> {
  let sent = 0;
  for (const row of rows) {
    try {
      await sendMail({ to: row.recipient, subject: row.subject, text: row.body });
      await markMailSent(db, { id: row.id });
      sent++;
    } catch (error) {
      await markMailFailed(db, { row, error: error instanceof Error ? error.message : String(error) });
    }
  }
  return sent;
}

async function drain(): Promise<void> {
  for (;;) {
    const rows = await claimDueMail(db, { limit: BATCH });
    if (rows.length === 0) break;
    if ((await deliver(rows)) === 0) break;
  }
}

function schedule(seconds: number): void {
  if (timer) clearTimeout(timer);
  timer = setTimeout(() => kickOutbox(), Math.max(0.2, Math.min(seconds, IDLE_CHECK_S)) * 1000);
  // The loop never keeps a process alive on its own.
  timer.unref();
}

/** Delivers what is due now, in the background, and keeps the retry loop going. */
export function kickOutbox(): void {
  if (draining) return;
  draining = drain()
    .then(() => secondsUntilNextMail(db))
    .then((next) => schedule(next ?? IDLE_CHECK_S))
    .catch((error) => {
      // A lost database: try again later; the rows are still there.
      console.error("[mail] outbox:", error instanceof Error ? error.message : String(error));
      schedule(IDLE_CHECK_S);
    })
    .finally(() => {
      draining = null;
    });
}

/**
 * Tries one queued message right away, within the request (an owner inviting someone wants to know
 * whether the mail left). "sent" or "queued": queued mail is retried by the loop.
 */
export async function sendQueuedNow(id: string): Promise<"sent" | "queued"> {
  try {
    const rows = await claimDueMail(db, { limit: 1, id });
    const sent = rows.length > 0 ? await deliver(rows) : 0;
    return sent > 0 ? "sent" : "queued";
  } finally {
    kickOutbox();
  }
}
