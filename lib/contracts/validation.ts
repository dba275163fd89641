import { z } from "zod";

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

// The one formatter of zod issues lives beside the physics, which may import nothing from here.
export { zodIssueFields, zodIssueLines } from "@/lib/physics/zod-issues";
export { finiteNumber, positiveNumber } from "@/lib/physics/number-fields";
