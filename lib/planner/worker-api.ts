import { zodIssueLines } from "@/lib/contracts/validation";
import { planMeasurements, type PlanResult } from "./plan";
import { planRequestSchema } from "./schema";

/*
 * What the planner worker exposes. The request is parsed again with the shared schema (worker
 * messages are a boundary). The search is one synchronous loop, so Cancel terminates the worker
 * (see components/planner/use-plan-run.ts); progress is fire-and-forget through comlink.
 */

export type PlanRunResult = { ok: true; result: PlanResult } | { ok: false; issues: string[] };

export interface PlannerWorkerApi {
  plan(request: unknown, onProgress?: (fractionDone: number) => void): Promise<PlanRunResult>;
}

export function createPlannerWorkerApi(): PlannerWorkerApi {
  return {
    async plan(request, onProgress) {
      const parsed = planRequestSchema.safeParse(request);
      if (!parsed.success) return { ok: false, issues: zodIssueLines(parsed.error.issues, { rootLabel: "(request)" }) };
      let last = 0;
      const result = planMeasurements(parsed.data, {
        onProgress: onProgress
          ? (f) => {
              // Throttle: a message per 2 % is plenty for a progress bar.
              if (f - last < 0.02 && f < 1) return;
              last = f;
              Promise.resolve(onProgress(f) as unknown).catch(() => undefined);
            }
          : undefined,
      });
      return { ok: true, result };
    },
  };
}
