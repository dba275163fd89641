import { and, desc, eq, gt, lt } from "drizzle-orm";
import type { Executor } from "../executor";
import { signInFailures } from "../schema";

/*
 * The stored sign-in failures per (e-mail, client address); lib/auth/rate-limit.ts decides from
 * them how long the next attempt must wait. E-mails arrive normalised.
 */

/** The e-mail's failures since `since`, from every address, newest first (at most 256). */
export async function listSignInFailures(db: Executor, options: { email: string; since: Date }): Promise<{ at: Date; ip: string }[]> {
  return db
    .select({ at: signInFailures.at, ip: signInFailures.ip })
    .from(signInFailures)
    .where(and(eq(signInFailures.email, options.email), gt(signInFailures.at, options.since)))
    .orderBy(desc(signInFailures.at))
    .limit(256);
}

/** Records a failure and drops the rows from before `keepSince`, which no longer count. */
export async function recordSignInFailure(db: Executor, options: { email: string; ip: string; keepSince: Date }): Promise<void> {
  await db.insert(signInFailures).values({ email: options.email, ip: options.ip });
  // Trimming here keeps the table small without a separate job.
  await db.delete(signInFailures).where(lt(signInFailures.at, options.keepSince));
}

/** A successful sign-in forgets the failures of this e-mail from this address. */
export async function clearSignInFailures(db: Executor, options: { email: string; ip: string }): Promise<void> {
  await db.delete(signInFailures).where(and(eq(signInFailures.email, options.email), eq(signInFailures.ip, options.ip)));
}
