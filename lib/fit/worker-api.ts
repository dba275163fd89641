/*
 * The object the fit worker exposes (workers/fit.worker.ts), kept here so it can be tested
 * without a Worker. The fit runs synchronously inside the worker, so the page cancels it by
 * terminating the worker (see components/workbench/use-fit-run.ts); progress is posted as it goes.
 */
import { type FitProgress, type FitResult, fitMeasurements } from "./fit";
import type { FitRequestInput } from "./schema";

export interface FitWorkerApi {
  fit(request: FitRequestInput, onProgress?: (progress: FitProgress) => void): Promise<FitResult>;
}

export function createFitWorkerApi(): FitWorkerApi {
  return {
    async fit(request, onProgress) {
      return fitMeasurements(request, {
        onProgress: onProgress
          ? (p) => {
              // Through comlink this returns a promise; progress is fire-and-forget.
              Promise.resolve(onProgress(p) as unknown).catch(() => undefined);
            }
          : undefined,
      });
    },
  };
}
