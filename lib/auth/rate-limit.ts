import "server-only";
import { db } from "@/db/client";
import * as failures from "@/db/queries/sign-in-failures";

/*
 * Slows repeated sign-in failures per (e-mail, client address). Counts live in PostgreSQL, not in
 * memory, so they survive restarts and hold across several server processes. Only failures are
 * counted; a success clears them, so tests and demos that sign in often are never limited.
 *
 * From the 5th failure within 15 minutes on, the next attempt must wait 30 s × 2^(n−5) after the
 * latest failure, capped at 15 minutes. A second, looser cap counts the e-mail's failures from
 * every address (20 free), against guessing spread over many addresses; it applies only to an
 * address that has itself failed recently, so another address's failures never block the real
 * owner signing in from a clean one. The address is the one lib/auth/client-ip.ts trusts.
 */

export const FAILURE_WINDOW_MS = 15 * 60 * 1000;
export const FREE_FAILURES = 5;
export const FREE_FAILURES_ANY_ADDRESS = 20;
const BASE_DELAY_MS = 30 * 1000;

function normalise(email: string): string {
  return email.trim().toLowerCase().slice(0, 320);
}

function waitMs(failures: Date[], free: number, now: number): number {
  const latest = failures[0];
  if (failures.length < free || !latest) return 0;
  const delayMs = Math.min(FAILURE_WINDOW_MS, BASE_DELAY_MS * 2 ** (failures.length - free));
  return latest.getTime() + delayMs - now;
}

/** Seconds the caller must still wait, or 0 when an attempt is allowed. */
export async function signInWaitSeconds(options: { email: string; ip: string }): Promise<number> {
  const now = Date.now();
  const rows = await failures.listSignInFailures(db, { email: normalise(options.email), since: new Date(now - FAILURE_WINDOW_MS) });
  return signInWaitFor({ rows, ip: options.ip, now });
}

/** The decision itself, on the window's failures (newest first). */
export function signInWaitFor(options: { rows: { at: Date; ip: string }[]; ip: string; now: number }): number {
  const fromHere = options.rows.filter((row) => row.ip === options.ip).map((row) => row.at);
  const anywhere = options.rows.map((row) => row.at);
  const own = waitMs(fromHere, FREE_FAILURES, options.now);
  const shared = fromHere.length > 0 ? waitMs(anywhere, FREE_FAILURES_ANY_ADDRESS, options.now) : 0;
  const wait = Math.max(own, shared);
  return wait > 0 ? Math.ceil(wait / 1000) : 0;
}

export async function recordSignInFailure(options: { email: string; ip: string }): Promise<void> {
  await failures.recordSignInFailure(db, {
    email: normalise(options.email),
    ip: options.ip,
    keepSince: new Date(Date.now() - FAILURE_WINDOW_MS),
  });
}

export async function clearSignInFailures(options: { email: string; ip: string }): Promise<void> {
  await failures.clearSignInFailures(db, { email: normalise(options.email), ip: options.ip });
}

export function rateLimitMessage(waitSeconds: number): string {
  return `Too many failed sign-in attempts. Wait ${waitSeconds} s and try again.`;
}
