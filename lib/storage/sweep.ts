import "server-only";
import { db } from "@/db/client";
import { sweepObjects } from "@/db/queries/object-sweep";
import { objectStore } from "./server";

/*
 * The periodic job of the web server that removes objects no measurement set refers to
 * (db/queries/object-sweep.ts): every SWEEP_INTERVAL_S, started by the first health check or
 * measurement request of the process. Several processes may sweep; a delete is idempotent.
 */

const SWEEP_INTERVAL_S = 5 * 60;
let started = false;

async function sweepOnce(): Promise<void> {
  try {
    const removed = await sweepObjects(db, { store: objectStore });
    if (removed > 0) console.log(`[storage] swept ${removed} orphaned object${removed === 1 ? "" : "s"}`);
  } catch (error) {
    console.error("[storage] sweep:", error instanceof Error ? error.message : String(error));
  }
}

export function startObjectSweep(): void {
  if (started) return;
  started = true;
  void sweepOnce();
  setInterval(() => void sweepOnce(), SWEEP_INTERVAL_S * 1000).unref();
}
