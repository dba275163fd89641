import bcrypt from "bcryptjs";

/*
 * bcrypt with cost 10: about 60 ms per hash on these machines, enough to make offline guessing
 * slow while keeping sign-in and the seed quick. No "server-only" marker: db/seed.ts uses it.
 */
const COST = 10;

export function hashPassword(password: string): Promise<string> {
  return bcrypt.hash(password, COST);
}

export function verifyPassword(password: string, hash: string): Promise<boolean> {
  return bcrypt.compare(password, hash);
}

// A real hash of a random string, so an unknown e-mail costs the same compare as a wrong password
// and response time does not tell whether the account exists.
const DUMMY_HASH = "$2b$10$k9ZDkD8Xipb9pEcgtanhwOuhqWnTp6tb2deFyn0f/cqaiJBNyywju";

export async function dummyVerify(password: string): Promise<false> {
  await bcrypt.compare(password, DUMMY_HASH);
  return false;
}
