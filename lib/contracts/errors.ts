import type { z } from "zod";
import { zodIssueFields } from "./validation";

/*
 * The one error model, below every layer that can fail: queries, authorization and route handlers
 * throw a DomainError with a code; only the route layer (lib/api/errors.ts) turns a code into an
 * HTTP status and the JSON body `{ error: { code, message, fields? } }`. The browser reads the same
 * body back (lib/query/fetcher.ts), so screens react to codes, never to strings.
 */

export const ERROR_CODES = [
  "bad_json",
  "validation",
  "unauthenticated",
  "forbidden",
  "not_found",
  "conflict",
  "stale_version",
  "payload_too_large",
  "unsupported_media_type",
  "rate_limited",
  "internal",
  "db_unavailable",
  "storage_unavailable",
  "busy",
] as const;

export type ErrorCode = (typeof ERROR_CODES)[number];

/** The JSON body of every failed API request. */
export interface ErrorBody {
  error: { code: ErrorCode; message: string; fields?: Record<string, string> } & Record<string, unknown>;
}

export interface DomainErrorOptions {
  /** Per-field messages keyed by dotted path ("params.temperatureK"). */
  fields?: Record<string, string>;
  /** Extra keys placed beside code/message (e.g. `current` for stale_version). */
  extra?: Record<string, unknown>;
  /** When the caller may try again (rate limits, a busy or lost service). */
  retryAfterS?: number;
}

export class DomainError extends Error {
  readonly code: ErrorCode;
  readonly fields?: Record<string, string>;
  readonly extra?: Record<string, unknown>;
  readonly retryAfterS?: number;

  constructor(code: ErrorCode, message: string, options: DomainErrorOptions = {}) {
    super(message);
    this.name = "DomainError";
    this.code = code;
    this.fields = options.fields;
    this.extra = options.extra;
    this.retryAfterS = options.retryAfterS;
  }

  body(): ErrorBody {
    return { error: { code: this.code, message: this.message, ...(this.fields ? { fields: this.fields } : {}), ...this.extra } };
  }
}

export const notFound = (message = "Not found.") => new DomainError("not_found", message);
export const forbidden = (message = "Your role in this lab does not allow that.") => new DomainError("forbidden", message);
export const unauthenticated = () => new DomainError("unauthenticated", "Sign in first (or send a valid API token).");

/** A zod failure as the contract's validation error, one message per field. */
export function validationError(error: z.ZodError): DomainError {
  const fields = zodIssueFields(error.issues);
  const count = Object.keys(fields).length;
  return new DomainError("validation", count === 1 ? "One field is invalid." : `${count} fields are invalid.`, { fields });
}
