import "server-only";
import { ZodError } from "zod";
import { isDbError, isDbUnavailable } from "./db-errors";
import { ApiError, validationError } from "./errors";

/*
 * Wraps every API route handler: turns thrown ApiErrors into the contract's JSON, a lost database
 * into 503 db_unavailable, and anything else into a logged 500 whose body says nothing about the
 * cause (database errors carry SQL and values).
 */

export interface RouteContext<P> {
  params: Promise<P>;
}

type Handler<P> = (request: Request, context: RouteContext<P>) => Promise<Response>;

export function apiRoute<P = Record<string, never>>(handler: Handler<P>): Handler<P> {
  return async (request, context) => {
    try {
      return await handler(request, context);
    } catch (error) {
      return errorResponse(error, request);
    }
  };
}

export function errorResponse(error: unknown, request?: Request): Response {
  if (error instanceof ApiError) return error.toResponse();
  if (error instanceof ZodError) return validationError(error).toResponse();
  const where = request ? `${request.method} ${new URL(request.url).pathname}` : "api";
  if (isDbUnavailable(error)) {
    console.error(`[api] ${where}: database unavailable:`, describe(error));
    return new ApiError("db_unavailable", "The database is unavailable; try again shortly.", {
      headers: { "Retry-After": "5" },
    }).toResponse();
  }
  console.error(`[api] ${where}: ${isDbError(error) ? "database error" : "unexpected error"}:`, error);
  return new ApiError("internal", "Something went wrong on our side.").toResponse();
}

function describe(error: unknown): string {
  const parts: string[] = [];
  let current: unknown = error;
  for (let depth = 0; depth < 4 && current instanceof Error; depth++) {
    parts.push(current.message);
    current = current.cause;
  }
  return parts.join(" ← ");
}

export function json(data: unknown, status = 200): Response {
  return Response.json(data, { status });
}

export function noContent(): Response {
  return new Response(null, { status: 204 });
}
