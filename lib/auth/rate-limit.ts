import "server-only";
import { and, desc, eq, gt, lt } from "drizzle-orm";
import { db } from "@/db/client";
import { signInFailures } from "@/db/schema";

/*
 * Slows repeated sign-in failures per (e-mail, client address). Counts live in PostgreSQL, not in
 * memory, so they survive restarts and hold across several server processes. Only failures are
 * counted; a success clears them, so tests and demos that sign in often are never limited.
 *
 * From the 5th failure within 15 minutes on, the next attempt must wait 30 s × 2^(n−5) after the
 * latest failure, capped at 15 minutes.
 */

export const FAILURE_WINDOW_MS = 15 * 60 * 1000;
export const FREE_FAILURES = 5;
const BASE_DELAY_MS = 30 * 1000;

function normalise(email: string): string {
  return email.trim().toLowerCase().slice(0, 320);
}

/** Seconds the caller must still wait, or 0 when an attempt is allowed. */
export async function signInWaitSeconds(options: { email: string; ip: string }): Promise<number> {
  const since = new Date(Date.now() - FAILURE_WINDOW_MS);
  const rows = await db
    .select({ at: signInFailures.at })
    .from(signInFailures)
    .where(and(eq(signInFailures.email, normalise(options.email)), eq(signInFailures.ip, options.ip), gt(signInFailures.at, since)))
    .orderBy(desc(signInFailures.at))
    .limit(64);
  const latest = rows[0];
  if (rows.length < FREE_FAILURES || !latest) return 0;
  const delayMs = Math.min(FAILURE_WINDOW_MS, BASE_DELAY_MS * 2 ** (rows.length - FREE_FAILURES));
  const waitMs = latest.at.getTime() + delayMs - Date.now();
  return waitMs > 0 ? Math.ceil(waitMs / 1000) : 0;
}

export async function recordSignInFailure(options: { email: string; ip: string }): Promise<void> {
  await db.insert(signInFailures).values({ email: normalise(options.email), ip: options.ip });
  // Old rows no longer count; trimming here keeps the table small without a separate job.
  await db.delete(signInFailures).where(lt(signInFailures.at, new Date(Date.now() - FAILURE_WINDOW_MS)));
}

export async function clearSignInFailures(options: { email: string; ip: string }): Promise<void> {
  await db
    .delete(signInFailures)
    .where(and(eq(signInFailures.email, normalise(options.email)), eq(signInFailures.ip, options.ip)));
}

export function rateLimitMessage(waitSeconds: number): string {
  return `Too many failed sign-in attempts. Wait ${waitSeconds} s and try again.`;
}
