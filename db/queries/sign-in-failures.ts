import { and, desc, eq, gt, lt, notLike, sql } from "drizzle-orm";
import type { Executor } from "../executor";
import { signInFailures } from "../schema";

/*
 * The stored sign-in failures. A row's `ip` column holds the client key: `device:<id>` for a
 * browser that signed in to this e-mail before (lib/auth/device.ts), else the client address.
 * lib/auth/rate-limit.ts decides from the window how long the next attempt must wait.
 *
 * An attempt is reserved before its password is checked: under two advisory locks (the e-mail,
 * then the client address, always in that order) the window is read, the decision taken and a
 * provisional failure recorded, in one transaction. Simultaneous attempts therefore queue on the
 * lock and each sees the ones before it: 25 at once get exactly the free number of hash checks.
 * A success deletes the provisional row with the rest of this client's failures.
 */

export interface FailureWindow {
  /** This e-mail from this client key, newest first. */
  own: Date[];
  /** This e-mail from every client that is not a known device, newest first. */
  emailWide: Date[];
  /** This client address, every e-mail, newest first. */
  clientWide: Date[];
}

export interface AttemptKey {
  email: string;
  /** `device:<id>` or the address. */
  clientKey: string;
  address: string;
  since: Date;
}

const WINDOW_ROWS = 256;

async function readWindow(db: Executor, key: AttemptKey): Promise<FailureWindow> {
  const recent = gt(signInFailures.at, key.since);
  const [own, emailWide, clientWide] = await Promise.all([
    db
      .select({ at: signInFailures.at })
      .from(signInFailures)
      .where(and(eq(signInFailures.email, key.email), eq(signInFailures.ip, key.clientKey), recent))
      .orderBy(desc(signInFailures.at))
      .limit(WINDOW_ROWS),
    db
      .select({ at: signInFailures.at })
      .from(signInFailures)
      .where(and(eq(signInFailures.email, key.email), notLike(signInFailures.ip, "device:%"), recent))
      .orderBy(desc(signInFailures.at))
      .limit(WINDOW_ROWS),
    db
      .select({ at: signInFailures.at })
      .from(signInFailures)
      .where(and(eq(signInFailures.ip, key.address), recent))
      .orderBy(desc(signInFailures.at))
      .limit(WINDOW_ROWS),
  ]);
  const dates = (rows: { at: Date }[]) => rows.map((row) => row.at);
  return { own: dates(own), emailWide: dates(emailWide), clientWide: dates(clientWide) };
}

/** The window as it stands, without reserving anything (an early, friendlier answer). */
export function peekSignInFailures(db: Executor, key: AttemptKey): Promise<FailureWindow> {
  return readWindow(db, key);
}

/**
 * Reserves one attempt: `decide` gets the window and answers the milliseconds still to wait; at 0
 * a provisional failure is recorded and its id returned.
 */
export async function reserveSignInAttempt(
  db: Executor,
  key: AttemptKey,
  decide: (window: FailureWindow) => number,
): Promise<{ reserved: true; id: string } | { reserved: false; waitMs: number }> {
  return db.transaction(async (tx) => {
    await tx.execute(sql`select pg_advisory_xact_lock(hashtextextended(${`sign-in e ${key.email}`}, 0))`);
    await tx.execute(sql`select pg_advisory_xact_lock(hashtextextended(${`sign-in a ${key.address}`}, 0))`);
    const waitMs = decide(await readWindow(tx, key));
    if (waitMs > 0) return { reserved: false as const, waitMs };
    const [row] = await tx.insert(signInFailures).values({ email: key.email, ip: key.clientKey }).returning({ id: signInFailures.id });
    if (!row) throw new Error("insert into sign_in_failures returned no row");
    // Trimming here keeps the table small without a separate job.
    await tx.delete(signInFailures).where(lt(signInFailures.at, key.since));
    return { reserved: true as const, id: row.id };
  });
}

/** A successful sign-in forgets the failures of this e-mail from this client (the provisional one too). */
export async function clearSignInFailures(db: Executor, options: { email: string; clientKey: string }): Promise<void> {
  await db.delete(signInFailures).where(and(eq(signInFailures.email, options.email), eq(signInFailures.ip, options.clientKey)));
}
