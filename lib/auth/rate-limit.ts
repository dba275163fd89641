import "server-only";
import { db } from "@/db/client";
import * as failures from "@/db/queries/sign-in-failures";
import type { FailureWindow } from "@/db/queries/sign-in-failures";
import { serverSettings } from "@/lib/settings/server";
import { clientIp } from "./client-ip";
import { cookieValue, DEVICE_COOKIE, verifiedDeviceId } from "./device";

/*
 * Slows repeated sign-in failures. Counts live in PostgreSQL, not in memory, so they survive
 * restarts and hold across several server processes; every attempt is reserved atomically before
 * its password is checked (db/queries/sign-in-failures.ts). A success clears the client's failures.
 *
 * Three windows of 15 minutes, each free up to a number of failures, after which the next attempt
 * must wait 30 s × 2^(n − free) after the latest failure, capped at 15 minutes:
 *  - own: this e-mail from this client (a known device, else the client address), 5 free;
 *  - e-mail: this e-mail from every unknown client, 20 free, against guessing spread over many
 *    addresses; it applies only to a client that has itself failed recently, so strangers never
 *    block the owner signing in from a clean address, and never to a known device;
 *  - client: this address across every e-mail, 100 free (GYROLUX_SIGN_IN_FAILURES_PER_CLIENT),
 *    against password spraying.
 * A browser that signed in to the account before carries a device cookie (lib/auth/device.ts):
 * strangers' failures never lock it out, only its own.
 */

export const FAILURE_WINDOW_MS = 15 * 60 * 1000;
export const FREE_FAILURES = 5;
export const FREE_FAILURES_ANY_ADDRESS = 20;
/** The default of GYROLUX_SIGN_IN_FAILURES_PER_CLIENT. */
export const FREE_FAILURES_PER_CLIENT = 100;
const BASE_DELAY_MS = 30 * 1000;

/** Who is trying: the address (socket peer or trusted proxy's view) and, if any, a known device. */
export interface SignInClient {
  address: string;
  deviceId: string | null;
}

function normalise(email: string): string {
  return email.trim().toLowerCase().slice(0, 320);
}

/** The client of a request trying this e-mail. */
export function signInClient(headers: Headers, email: string): SignInClient {
  const secret = serverSettings.auth.secret;
  const cookie = cookieValue(headers.get("cookie"), DEVICE_COOKIE);
  return { address: clientIp(headers), deviceId: secret ? verifiedDeviceId(secret, normalise(email), cookie) : null };
}

function key(email: string, client: SignInClient): failures.AttemptKey {
  return {
    email: normalise(email),
    clientKey: client.deviceId ? `device:${client.deviceId}` : client.address,
    address: client.address,
    since: new Date(Date.now() - FAILURE_WINDOW_MS),
  };
}

function waitMs(failures: Date[], free: number, now: number): number {
  const latest = failures[0];
  if (failures.length < free || !latest) return 0;
  const delayMs = Math.min(FAILURE_WINDOW_MS, BASE_DELAY_MS * 2 ** (failures.length - free));
  return latest.getTime() + delayMs - now;
}

/** The decision itself, on the window's failures (newest first): milliseconds still to wait. */
export function signInWaitMs(window: FailureWindow, options: { knownDevice: boolean; now: number; freePerClient?: number }): number {
  const own = waitMs(window.own, FREE_FAILURES, options.now);
  if (options.knownDevice) return Math.max(own, 0);
  const email = window.own.length > 0 ? waitMs(window.emailWide, FREE_FAILURES_ANY_ADDRESS, options.now) : 0;
  const client = waitMs(window.clientWide, options.freePerClient ?? FREE_FAILURES_PER_CLIENT, options.now);
  return Math.max(own, email, client, 0);
}

const seconds = (ms: number) => (ms > 0 ? Math.ceil(ms / 1000) : 0);

/** Seconds the client must still wait, or 0 when an attempt is allowed (a read, nothing reserved). */
export async function signInWaitSeconds(email: string, client: SignInClient): Promise<number> {
  const window = await failures.peekSignInFailures(db, key(email, client));
  const freePerClient = serverSettings.auth.signInFailuresPerClient;
  return seconds(signInWaitMs(window, { knownDevice: client.deviceId !== null, now: Date.now(), freePerClient }));
}

/**
 * Reserves one password check: `{ waitS }` when the client must wait, else a provisional failure
 * is on record and `succeeded()` clears it (and the client's other failures) after a right password.
 */
export async function reserveSignInAttempt(
  email: string,
  client: SignInClient,
): Promise<{ allowed: false; waitS: number } | { allowed: true; succeeded: () => Promise<void> }> {
  const attemptKey = key(email, client);
  const knownDevice = client.deviceId !== null;
  const freePerClient = serverSettings.auth.signInFailuresPerClient;
  const outcome = await failures.reserveSignInAttempt(db, attemptKey, (window) =>
    signInWaitMs(window, { knownDevice, now: Date.now(), freePerClient }),
  );
  if (!outcome.reserved) return { allowed: false, waitS: Math.max(1, seconds(outcome.waitMs)) };
  return {
    allowed: true,
    succeeded: () => failures.clearSignInFailures(db, { email: attemptKey.email, clientKey: attemptKey.clientKey }),
  };
}

export function rateLimitMessage(waitSeconds: number): string {
  return `Too many failed sign-in attempts. Wait ${waitSeconds} s and try again.`;
}
