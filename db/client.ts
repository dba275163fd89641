import "server-only";
import type { Pool } from "pg";
import { serverSettings } from "@/lib/settings/server";
import { createDb, createPool, type Database } from "./connection";

export type { Database } from "./connection";

// One pool per server process. Outside production the dev server re-evaluates modules on every
// edit, so the pool is cached on globalThis to avoid leaking connections.
const globalForDb = globalThis as unknown as { gyroluxPool?: Pool; gyroluxDb?: Database };

const pool = globalForDb.gyroluxPool ?? createPool({ url: serverSettings.database.url, max: serverSettings.database.pool });
export const db: Database = globalForDb.gyroluxDb ?? createDb(pool);

if (serverSettings.build.nodeEnv !== "production") {
  globalForDb.gyroluxPool = pool;
  globalForDb.gyroluxDb = db;
}

export { pool };
