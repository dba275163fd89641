import { sql } from "drizzle-orm";
import { connection } from "next/server";
import { db } from "@/db/client";
import { kickOutbox } from "@/lib/mail/outbox";
import { startObjectSweep } from "@/lib/storage/sweep";

const PROBE_TIMEOUT_MS = 3_000;

/** GET /api/health → 200 { status: "ok", database: "up" } or 503 { status: "degraded", database: "down" }. */
export async function GET(): Promise<Response> {
  // Never prerendered at build time: the answer is about this moment.
  await connection();
  try {
    await Promise.race([
      db.execute(sql`select 1`),
      new Promise((_, reject) => setTimeout(() => reject(new Error("health probe timed out")), PROBE_TIMEOUT_MS)),
    ]);
    // Mail queued before a restart waits for a sender, orphaned objects for the sweep: the first health check starts both.
    kickOutbox();
    startObjectSweep();
    return Response.json({ status: "ok", database: "up" }, { headers: { "Cache-Control": "no-store" } });
  } catch (error) {
    console.error("[api] GET /api/health: database down:", error instanceof Error ? error.message : error);
    return Response.json({ status: "degraded", database: "down" }, { status: 503, headers: { "Cache-Control": "no-store" } });
  }
}
