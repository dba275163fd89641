import "server-only";
import { ZodError } from "zod";
import { dbErrorSummary, isDbError, isDbUnavailable, isPoolBusy } from "@/db/errors";
import { DomainError, validationError } from "@/lib/contracts/errors";
import { domainErrorResponse } from "./errors";

/*
 * Wraps every API route handler: turns thrown DomainErrors into the contract's JSON, a lost database
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
  if (error instanceof DomainError) return domainErrorResponse(error);
  if (error instanceof ZodError) return domainErrorResponse(validationError(error));
  const where = request ? `${request.method} ${new URL(request.url).pathname}` : "api";
  if (isPoolBusy(error)) {
    console.error(`[api] ${where}: every database connection stayed busy for the whole wait`);
    return domainErrorResponse(new DomainError("busy", "The server is busy; try again in a moment.", { retryAfterS: 1 }));
  }
  if (isDbUnavailable(error)) {
    console.error(`[api] ${where}: database unavailable:`, dbErrorSummary(error));
    return domainErrorResponse(
      new DomainError("db_unavailable", "The database is unavailable; try again shortly.", {
        retryAfterS: 5,
      }),
    );
  }
  // Drizzle's message carries the SQL and its parameters (password hashes, e-mails, token
  // hashes): a database error is logged by code and constraint only.
  if (isDbError(error)) console.error(`[api] ${where}: database error:`, dbErrorSummary(error));
  else console.error(`[api] ${where}: unexpected error:`, error instanceof Error ? (error.stack ?? error.message) : String(error));
  return domainErrorResponse(new DomainError("internal", "Something went wrong on our side."));
}

export function json(data: unknown, status = 200): Response {
  return Response.json(data, { status });
}

export function noContent(): Response {
  return new Response(null, { status: 204 });
}
