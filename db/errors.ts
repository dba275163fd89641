/*
 * Classifies errors thrown by pg / Drizzle. Drizzle 0.45 wraps driver errors in DrizzleQueryError
 * with the original in `cause`, so every check walks the cause chain.
 */

interface PgLikeError {
  code?: unknown;
  constraint?: unknown;
  message?: unknown;
  cause?: unknown;
}

function* causes(error: unknown): Generator<PgLikeError> {
  let current: unknown = error;
  for (let depth = 0; depth < 5 && current && typeof current === "object"; depth++) {
    yield current as PgLikeError;
    current = (current as PgLikeError).cause;
  }
}

// Node socket errors and PostgreSQL's "connection exception" / "operator intervention" classes.
const UNAVAILABLE_CODES = new Set([
  "ECONNREFUSED",
  "ECONNRESET",
  "ETIMEDOUT",
  "EHOSTUNREACH",
  "ENOTFOUND",
  "EPIPE",
  "57P01",
  "57P02",
  "57P03",
  "53300",
]);
const UNAVAILABLE_MESSAGES = [
  "Connection terminated",
  "connect ECONNREFUSED",
  "Client has encountered a connection error",
  "Connection terminated unexpectedly",
];

export function isDbUnavailable(error: unknown): boolean {
  for (const e of causes(error)) {
    if (typeof e.code === "string" && (UNAVAILABLE_CODES.has(e.code) || e.code.startsWith("08"))) return true;
    if (typeof e.message === "string" && UNAVAILABLE_MESSAGES.some((m) => (e.message as string).includes(m))) return true;
  }
  return false;
}

/** The violated unique constraint's name, when the error is a unique violation (23505). */
export function uniqueViolation(error: unknown): string | null {
  for (const e of causes(error)) {
    if (e.code === "23505") return typeof e.constraint === "string" ? e.constraint : "";
  }
  return null;
}

/** Whether the error comes from the database at all (to log it without sending it). */
export function isDbError(error: unknown): boolean {
  for (const e of causes(error)) {
    if (typeof e.code === "string" && /^[0-9A-Z]{5}$/.test(e.code)) return true;
    if (e instanceof Error && e.name === "DrizzleQueryError") return true;
  }
  return isDbUnavailable(error);
}

// pg-pool's own message when a checkout waited connectionTimeoutMillis for a free client of a full
// pool (pg-pool/index.js, the pending-queue timer). A new connection that times out says
// "Connection terminated due to connection timeout" instead, so the two are told apart.
const POOL_WAIT_MESSAGE = "timeout exceeded when trying to connect";

/** Every pooled connection was busy for the whole wait: the database itself may be healthy. */
export function isPoolBusy(error: unknown): boolean {
  for (const e of causes(error)) {
    if (e.message === POOL_WAIT_MESSAGE) return true;
  }
  return false;
}

/** What of a database error may be logged: its code and constraint, never its SQL or parameters. */
export function dbErrorSummary(error: unknown): string {
  const parts: string[] = [];
  for (const e of causes(error)) {
    if (typeof e.code === "string") parts.push(`code ${e.code}`);
    if (typeof e.constraint === "string") parts.push(`constraint ${e.constraint}`);
  }
  return parts.length > 0 ? [...new Set(parts)].join(", ") : "no code";
}
