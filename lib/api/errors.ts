import type { DomainError, ErrorCode } from "@/lib/contracts/errors";

/*
 * The route layer's half of the error model: the HTTP status of each error code, and the
 * response built from a DomainError. Nothing below the route layer knows a status code.
 */

export const ERROR_STATUS: Record<ErrorCode, number> = {
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
};

export function errorStatus(error: DomainError): number {
  return ERROR_STATUS[error.code];
}

export function domainErrorResponse(error: DomainError): Response {
  const headers = error.retryAfterS !== undefined ? { "Retry-After": String(error.retryAfterS) } : undefined;
  return Response.json(error.body(), { status: errorStatus(error), headers });
}
