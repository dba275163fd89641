import { DrizzleQueryError } from "drizzle-orm/errors";
import { DatabaseError } from "pg";
import { afterEach, beforeEach, describe, expect, it, vi, type MockInstance } from "vitest";

// lib/api/route.ts is marked server-only; that marker throws outside React's server bundle.
vi.mock("server-only", () => ({}));

const { apiRoute } = await import("@/lib/api/route");

/*
 * "PostgreSQL is down", as the route wrapper sees it: the errors below are built the way pg and
 * Drizzle build them (a Node socket error or a pg DatabaseError, wrapped by Drizzle with the SQL
 * and its parameters in the message). Only the thrown error is made up; no ORM is mocked.
 */

const SQL = 'select "id", "password_hash" from "users" where lower("users"."email") = $1';
const PARAMS = ["lead@demo.gyrolux.test"];

function socketError(code: string, message: string): Error {
  // What net.connect rejects with (e.g. `connect ECONNREFUSED 127.0.0.1:54329`).
  return Object.assign(new Error(message), { code, errno: -111, syscall: "connect", address: "127.0.0.1", port: 54329 });
}

function serverError(code: string, message: string): DatabaseError {
  const error = new DatabaseError(message, message.length, "error");
  error.code = code;
  error.severity = "FATAL";
  return error;
}

const wrapped = (cause: Error) => new DrizzleQueryError(SQL, PARAMS, cause);

const DOWN: [string, Error][] = [
  ["connection refused (server not running)", wrapped(socketError("ECONNREFUSED", "connect ECONNREFUSED 127.0.0.1:54329"))],
  ["connection refused, not wrapped (pool checkout)", socketError("ECONNREFUSED", "connect ECONNREFUSED 127.0.0.1:54329")],
  ["connection reset", wrapped(socketError("ECONNRESET", "read ECONNRESET"))],
  ["57P01 admin shutdown", wrapped(serverError("57P01", "terminating connection due to administrator command"))],
  ["57P02 crash shutdown", wrapped(serverError("57P02", "terminating connection because of crash of another server process"))],
  ["57P03 cannot connect now", wrapped(serverError("57P03", "the database system is starting up"))],
  ["08006 connection failure", wrapped(serverError("08006", "connection failure"))],
  ["53300 too many connections", wrapped(serverError("53300", "sorry, too many clients already"))],
  ["connection lost mid-query (pg, no code)", wrapped(new Error("Connection terminated unexpectedly"))],
  ["new connection timed out (pg, no code)", new Error("Connection terminated due to connection timeout")],
];

async function call(thrown: unknown): Promise<Response> {
  const handler = apiRoute(async () => {
    throw thrown;
  });
  return handler(new Request("http://localhost/api/parameter-sets", { method: "GET" }), { params: Promise.resolve({}) });
}

/** Nothing of the driver's text (message, SQL, parameters, address) may reach the client. */
function expectNoLeak(text: string, error: Error) {
  let current: unknown = error;
  while (current instanceof Error) {
    expect(text).not.toContain(current.message);
    current = current.cause;
  }
  for (const secret of [SQL, "password_hash", PARAMS[0]!, "127.0.0.1", "54329", "Failed query"]) expect(text).not.toContain(secret);
}

describe("route wrapper: database unavailable", () => {
  let consoleError: MockInstance<typeof console.error>;
  beforeEach(() => {
    consoleError = vi.spyOn(console, "error").mockImplementation(() => undefined);
  });
  afterEach(() => {
    consoleError.mockRestore();
  });

  it.each(DOWN)("%s → 503 db_unavailable without the raw message", async (_label, error) => {
    const response = await call(error);
    expect(response.status).toBe(503);
    expect(response.headers.get("content-type")).toContain("application/json");
    expect(response.headers.get("retry-after")).toBe("5");
    const text = await response.text();
    const body = JSON.parse(text) as { error: Record<string, unknown> };
    expect(body).toEqual({ error: { code: "db_unavailable", message: expect.any(String) } });
    expectNoLeak(text, error);
    // The cause is logged on the server for the operator.
    expect(consoleError).toHaveBeenCalledTimes(1);
  });

  it("a full pool (checkout waited out) → 503 busy, told apart from a lost database", async () => {
    // pg-pool's pending-queue timer rejects with exactly this message and no code.
    const response = await call(new Error("timeout exceeded when trying to connect"));
    expect(response.status).toBe(503);
    expect(response.headers.get("retry-after")).toBe("1");
    expect(((await response.json()) as { error: { code: string } }).error.code).toBe("busy");
  });

  it("logs a failed query by code and constraint, never its SQL parameters", async () => {
    await call(wrapped(serverError("23505", 'duplicate key value violates unique constraint "users_email_lower_unique"')));
    const logged = consoleError.mock.calls.flat().map(String).join(" ");
    expect(logged).toContain("23505");
    for (const secret of [PARAMS[0]!, SQL, "password_hash"]) expect(logged).not.toContain(secret);
  });

  it("other database errors → 500 internal, also without the raw message", async () => {
    const error = wrapped(serverError("42P01", 'relation "users" does not exist'));
    const response = await call(error);
    expect(response.status).toBe(500);
    const text = await response.text();
    expect(JSON.parse(text)).toEqual({ error: { code: "internal", message: expect.any(String) } });
    expectNoLeak(text, error);
  });

  it("a unique violation that no query translated is a 500, not a 503", async () => {
    const response = await call(wrapped(serverError("23505", 'duplicate key value violates unique constraint "users_email_lower_unique"')));
    expect(response.status).toBe(500);
    expect(await response.text()).not.toContain("users_email_lower_unique");
  });
});
