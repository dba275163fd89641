import type { z } from "zod";

/*
 * The one error model of the REST API (shared contract): every failure is
 * `{ error: { code, message, fields? } }` with the status fixed by the code.
 */

export const ERROR_STATUS = {
  bad_json: 400,
  validation: 400,
  unauthenticated: 401,
  forbidden: 403,
  not_found: 404,
  conflict: 409,
  stale_version: 409,
  payload_too_large: 413,
  unsupported_media_type: 415,
  rate_limited: 429,
  internal: 500,
  db_unavailable: 503,
  storage_unavailable: 503,
  busy: 503,
} as const;

export type ErrorCode = keyof typeof ERROR_STATUS;

export interface ApiErrorBody {
  error: { code: ErrorCode; message: string; fields?: Record<string, string> } & Record<string, unknown>;
}

export class ApiError extends Error {
  readonly code: ErrorCode;
  readonly fields?: Record<string, string>;
  /** Extra keys placed beside code/message (e.g. `current` for stale_version). */
  readonly extra?: Record<string, unknown>;
  readonly headers?: Record<string, string>;

  constructor(
    code: ErrorCode,
    message: string,
    options: { fields?: Record<string, string>; extra?: Record<string, unknown>; headers?: Record<string, string> } = {},
  ) {
    super(message);
    this.name = "ApiError";
    this.code = code;
    this.fields = options.fields;
    this.extra = options.extra;
    this.headers = options.headers;
  }

  get status(): number {
    return ERROR_STATUS[this.code];
  }

  toResponse(): Response {
    const body: ApiErrorBody = {
      error: { code: this.code, message: this.message, ...(this.fields ? { fields: this.fields } : {}), ...this.extra },
    };
    return Response.json(body, { status: this.status, headers: this.headers });
  }
}

export const notFound = (what = "Not found.") => new ApiError("not_found", what);
export const forbidden = (message = "Your role in this lab does not allow that.") => new ApiError("forbidden", message);
export const unauthenticated = () => new ApiError("unauthenticated", "Sign in first (or send a valid API token).");

/** zod issues → `fields` keyed by dotted path ("params.temperatureK"); the first message per field wins. */
export function zodFields(error: z.ZodError): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const issue of error.issues) {
    const key = issue.path.length > 0 ? issue.path.map(String).join(".") : "body";
    fields[key] ??= issue.message;
  }
  return fields;
}

export function validationError(error: z.ZodError): ApiError {
  const fields = zodFields(error);
  const count = Object.keys(fields).length;
  return new ApiError("validation", count === 1 ? "One field is invalid." : `${count} fields are invalid.`, { fields });
}
