import type { RunSettings } from "@/lib/settings/runs";

/*
 * The lab-run queue as the web server (which sends jobs) and the workers (which take them) both
 * name it; its timings come from the settings (lib/settings/runs.ts).
 */

/** The pg-boss queue every worker serves. */
export const RUN_QUEUE = "lab-runs";

/** pg-boss send options of one run, from the settings. */
export function sendOptions(s: RunSettings, id: string) {
  return {
    id,
    retryLimit: s.retryLimit,
    retryDelay: s.retryDelaySeconds,
    retryBackoff: true,
    expireInSeconds: s.expireSeconds,
  };
}
