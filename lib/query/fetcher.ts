/*
 * The one way the browser talks to our API: JSON in, JSON out, and every failure turned into an
 * RequestError carrying the contract's error code, so screens can react to codes instead of strings.
 */

export class RequestError extends Error {
  readonly status: number;
  readonly code: string;
  readonly fields?: Record<string, string>;
  readonly body: unknown;

  constructor(options: { status: number; code: string; message: string; fields?: Record<string, string>; body?: unknown }) {
    super(options.message);
    this.name = "RequestError";
    this.status = options.status;
    this.code = options.code;
    this.fields = options.fields;
    this.body = options.body;
  }
}

export interface ApiFetchInit extends Omit<RequestInit, "body"> {
  /** Sent as JSON with the matching content type. */
  json?: unknown;
  /** Sent as multipart/form-data (the browser sets the boundary). */
  form?: FormData;
}

interface ErrorBody {
  error?: { code?: unknown; message?: unknown; fields?: unknown };
}

function isRecordOfStrings(value: unknown): value is Record<string, string> {
  return typeof value === "object" && value !== null && Object.values(value).every((v) => typeof v === "string");
}

function toRequestError(status: number, body: unknown): RequestError {
  const error = (body as ErrorBody | null)?.error;
  const code = typeof error?.code === "string" ? error.code : status >= 500 ? "internal" : "http_error";
  const message =
    typeof error?.message === "string" && error.message.length > 0 ? error.message : `The server answered with status ${status}.`;
  const fields = isRecordOfStrings(error?.fields) ? error.fields : undefined;
  return new RequestError({ status, code, message, fields, body });
}

export async function apiFetch<T>(path: string, init: ApiFetchInit = {}): Promise<T> {
  const { json, form, headers, ...rest } = init;
  let response: Response;
  try {
    response = await fetch(path, {
      ...rest,
      headers: { Accept: "application/json", ...(json !== undefined ? { "Content-Type": "application/json" } : {}), ...headers },
      body: json !== undefined ? JSON.stringify(json) : form,
      credentials: "same-origin",
    });
  } catch {
    throw new RequestError({
      status: 0,
      code: "network",
      message: "Could not reach the Gyrolux server. Check your connection and try again.",
    });
  }

  if (response.status === 204) return undefined as T;

  const text = await response.text();
  let body: unknown = null;
  if (text.length > 0) {
    try {
      body = JSON.parse(text);
    } catch {
      body = text;
    }
  }
  if (!response.ok) throw toRequestError(response.status, body);
  return body as T;
}

const PLAIN_MESSAGES: Record<string, string> = {
  db_unavailable: "The database is not reachable right now, so nothing can be loaded or saved. Try again in a minute.",
  unauthenticated: "Your session has ended. Sign in again to continue.",
  forbidden: "Your role in this lab does not allow this.",
  not_found: "This item does not exist or you have no access to it.",
  rate_limited: "Too many requests in a short time. Wait a moment and try again.",
  payload_too_large: "The data sent is too large.",
  internal: "Something went wrong on the server. Try again; if it keeps happening, tell your lab's admin.",
};

/** A sentence a scientist can act on, for any thrown value. */
export function describeError(error: unknown): string {
  if (error instanceof RequestError) {
    if (error.code === "validation" || error.code === "conflict" || error.code === "stale_version" || error.code === "network") {
      return error.message;
    }
    return PLAIN_MESSAGES[error.code] ?? error.message;
  }
  if (error instanceof Error) return error.message;
  return "Something went wrong.";
}
