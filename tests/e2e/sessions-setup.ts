import { rmSync } from "node:fs";
import { SESSION_DIR } from "./browser";

/*
 * Global setup of the browser tests. A stored session is good for one run only (scripts/test.sh
 * gives each run a new AUTH_SECRET and database), so the run starts without any; each demo
 * account then signs in once, when the first test file asks for it (support.ts).
 */
export default function clearStoredSessions(): void {
  rmSync(SESSION_DIR, { recursive: true, force: true });
}
