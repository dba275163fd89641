import { drizzle, type NodePgDatabase } from "drizzle-orm/node-postgres";
import { Pool } from "pg";
import * as schema from "./schema";

/*
 * Pool and Drizzle construction shared by the app (db/client.ts) and the command-line scripts
 * (db/migrate.ts, db/seed.ts). It has no "server-only" marker because those scripts run under
 * plain Node, where that marker throws.
 */

export type Database = NodePgDatabase<typeof schema>;

export function createPool(options: { url: string; max?: number }): Pool {
  const pool = new Pool({
    connectionString: options.url,
    max: options.max ?? 10,
    // Fail fast when PostgreSQL is down so routes answer 503 instead of hanging.
    connectionTimeoutMillis: 2_000,
    idleTimeoutMillis: 30_000,
  });
  // An idle client losing its connection (server restart) emits 'error' on the pool; without a
  // listener Node would crash the whole server.
  pool.on("error", (error) => {
    console.error("[db] idle client error:", error.message);
  });
  return pool;
}

export function createDb(pool: Pool): Database {
  return drizzle(pool, { schema });
}
