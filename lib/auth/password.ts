import { hash, verify } from "@node-rs/bcrypt";
import pLimit from "p-limit";

/*
 * bcrypt with cost 10 (about 60 ms per hash here), enough to make offline guessing slow while
 * keeping sign-in and the seed quick. @node-rs/bcrypt hashes on libuv's thread pool, so the event
 * loop keeps serving other requests while a hash runs; its hashes are ordinary $2b$ strings, so
 * accounts hashed earlier by bcryptjs still verify. At most HASH_CONCURRENCY hashes run at once:
 * on a small machine a burst of anonymous sign-ins would otherwise take every core from the people
 * already working; the rest wait their turn. No "server-only" marker: db/seed.ts uses it.
 */
const COST = 10;
export const HASH_CONCURRENCY = 1;

const gate = pLimit(HASH_CONCURRENCY);

export function hashPassword(password: string): Promise<string> {
  return gate(() => hash(password, COST));
}

export function verifyPassword(password: string, passwordHash: string): Promise<boolean> {
  return gate(() => verify(password, passwordHash).catch(() => false));
}

// A real hash of a random string, so an unknown e-mail costs the same compare as a wrong password
// and response time does not tell whether the account exists.
const DUMMY_HASH = "$2b$10$k9ZDkD8Xipb9pEcgtanhwOuhqWnTp6tb2deFyn0f/cqaiJBNyywju";

export async function dummyVerify(password: string): Promise<false> {
  await verifyPassword(password, DUMMY_HASH);
  return false;
}

/** Hashes waiting for their turn (the sign-in path refuses new anonymous work past a bound). */
export function pendingHashes(): number {
  return gate.pendingCount + gate.activeCount;
}
