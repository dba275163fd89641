import { z } from "zod";
import { finiteNumber } from "@/lib/physics/number-fields";

/*
 * Text that PostgreSQL can store unchanged and that round-trips through UTF-8. A NUL (U+0000) is
 * refused by PostgreSQL's text and jsonb types, and a lone UTF-16 surrogate has no UTF-8 encoding
 * (it would be stored as U+FFFD, silently changed). Both are refused with a field message instead.
 */

// A high surrogate not followed by a low one, or a low one not preceded by a high one.
const UNPAIRED_SURROGATE = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;

export const TEXT_PROBLEM = "Contains a character that cannot be stored (a NUL byte or a broken Unicode surrogate).";

export function isStorableText(value: string): boolean {
  return !value.includes("\u0000") && !UNPAIRED_SURROGATE.test(value);
}

/** A string schema that refuses NUL and unpaired surrogates before any other rule runs. */
export function safeString(params?: { error?: string }) {
  return z.string(params).refine(isStorableText, { message: TEXT_PROBLEM, abort: true });
}

/** First problem in a JSON value: a non-storable string (key or value) or nesting deeper than maxDepth. */
export function jsonProblem(value: unknown, maxDepth: number): string | null {
  // Iterative, so a hostile depth cannot overflow the stack while being checked.
  const stack: { value: unknown; depth: number }[] = [{ value, depth: 0 }];
  while (stack.length > 0) {
    const { value: current, depth } = stack.pop()!;
    if (typeof current === "string") {
      if (!isStorableText(current)) return TEXT_PROBLEM;
      continue;
    }
    if (current === null || typeof current !== "object") continue;
    if (depth >= maxDepth) return `Nested deeper than ${maxDepth} levels.`;
    if (Array.isArray(current)) {
      for (const item of current) stack.push({ value: item, depth: depth + 1 });
    } else {
      for (const [key, item] of Object.entries(current)) {
        if (!isStorableText(key)) return TEXT_PROBLEM;
        stack.push({ value: item, depth: depth + 1 });
      }
    }
  }
  return null;
}

const uuid = z.uuid();

/** Whether a path or query value can be an id at all (a malformed one names nothing: 404, never a SQL cast error). */
export function isUuid(value: string): boolean {
  return uuid.safeParse(value).success;
}

/** A required one-line name: trimmed, not empty, at most `max` characters. */
export function nameSchema(options: { max: number; missing?: string }) {
  const missing = options.missing ?? "Enter a name.";
  return safeString({ error: missing }).trim().min(1, missing).max(options.max, `At most ${options.max} characters.`);
}

/** Free text that may be empty: trimmed, at most `max` characters. */
export function textSchema(options: { max: number }) {
  return safeString({ error: "Must be text." }).trim().max(options.max, `At most ${options.max} characters.`);
}

/** The search term of a list query (?q=): trimmed, at most 200 characters. */
export const searchTermSchema = safeString().trim().max(200, "At most 200 characters.");

/** An e-mail address, trimmed and lower-cased (how accounts and invitations store it). */
export function emailField(missing = "Enter an e-mail address.") {
  return safeString({ error: missing })
    .trim()
    .toLowerCase()
    .max(320, "That e-mail address is too long.")
    .pipe(z.email({ error: "Enter a valid e-mail address." }));
}

export const emailSchema = emailField();

/*
 * Whole numbers. PostgreSQL's integer holds −2 147 483 648 … 2 147 483 647; a larger value bound to
 * an integer column or compared with one is a database error (a 500), so every whole number that
 * reaches a query is bounded here first.
 */
export const INT4_MAX = 2_147_483_647;

/** A whole number that fits PostgreSQL's integer, at least `min`. */
export function int4Field(what: string, min = 0) {
  return finiteNumber(what)
    .int(`${what} must be a whole number`)
    .min(min, `${what} must be at least ${min}`)
    .max(INT4_MAX, `${what} must be at most ${INT4_MAX}`);
}

/**
 * A whole number written in a query string: decimal digits only, so "0x10", " 5", "5 ", "1e3" and
 * "+5" are refused rather than coerced (Number() would take them all).
 */
export function queryInteger(what: string, range: { min: number; max: number }) {
  const message = `${what} must be a whole number from ${range.min} to ${range.max}, written in digits.`;
  return z
    .string({ error: message })
    .regex(/^[0-9]{1,10}$/, message)
    .transform(Number)
    .pipe(z.number().min(range.min, message).max(range.max, message));
}

/**
 * A timestamp as PostgreSQL prints it (`2026-12-02 05:01:02.123456+00`), which names a real
 * instant: month 1–12, a day the month has, hour < 24 and so on. "2026-99-99" or "0000-00-00"
 * would match a pattern but make PostgreSQL fail the cast.
 */
const TIMESTAMP_TEXT = /^(\d{4})-(\d\d)-(\d\d)[ T](\d\d):(\d\d):(\d\d)(\.\d{1,6})?([+-](\d\d)(:?(\d\d))?|Z)?$/;

export function isTimestampText(value: string): boolean {
  const m = TIMESTAMP_TEXT.exec(value);
  if (!m) return false;
  const [year, month, day, hour, minute, second] = m.slice(1, 7).map(Number) as [number, number, number, number, number, number];
  if (year < 1 || month < 1 || month > 12 || day < 1 || hour > 23 || minute > 59 || second > 59) return false;
  const offsetHours = m[9] === undefined ? 0 : Number(m[9]);
  const offsetMinutes = m[11] === undefined ? 0 : Number(m[11]);
  if (offsetHours > 15 || offsetMinutes > 59) return false;
  // Day 31 in a 30-day month (or 29 February in a common year) rolls over into the next month.
  const date = new Date(Date.UTC(year, month - 1, day));
  date.setUTCFullYear(year);
  return date.getUTCMonth() === month - 1 && date.getUTCDate() === day;
}

export const timestampTextSchema = z.string().refine(isTimestampText, { message: "Not a timestamp." });

/**
 * Text of a file name as stored and sent back in Content-Disposition: control characters removed,
 * at most 255 UTF-8 bytes (what file systems allow), cut on a character boundary.
 */
export const FILE_NAME_MAX_BYTES = 255;

export function cleanFileName(name: string, fallback: string): string {
  // biome-ignore lint/suspicious/noControlCharactersInRegex: removing control characters is the point
  const stripped = name.replace(/[\u0000-\u001f\u007f-\u009f]/g, "").trim();
  const encoder = new TextEncoder();
  let out = "";
  let bytes = 0;
  for (const char of stripped) {
    const size = encoder.encode(char).length;
    if (bytes + size > FILE_NAME_MAX_BYTES) break;
    out += char;
    bytes += size;
  }
  return isStorableText(out) && out !== "" ? out : fallback;
}

// The one formatter of zod issues lives beside the physics, which may import nothing from here.
export { zodIssueFields, zodIssueLines } from "@/lib/physics/zod-issues";
export { finiteNumber, positiveNumber } from "@/lib/physics/number-fields";
