/*
 * The object the fit worker exposes (workers/fit.worker.ts), kept here so it can be tested
 * without a Worker. The fit and its report run synchronously inside the worker, so the page
 * cancels by terminating the worker (see components/workbench/use-fit-run.ts); the fit's
 * iterations and the report's later stages are posted as they go.
 */
import type { FitProgress } from "./fit";
import { type FitReport, type ReportStage, analyseFit } from "./report";
import type { FitRequestInput } from "./schema";

/** What the page asks of the report beyond the request (the per-point share profiles cost a few dozen refits each). */
export interface FitRunOptions {
  shareProfiles: boolean;
  shareWavelengthsNm: number[];
}

export type FitRunProgress = ({ kind: "fit" } & FitProgress) | ({ kind: "stage" } & ReportStage);

export interface FitWorkerApi {
  fit(request: FitRequestInput, options: FitRunOptions, onProgress?: (progress: FitRunProgress) => void): Promise<FitReport>;
}

export function createFitWorkerApi(): FitWorkerApi {
  return {
    async fit(request, options, onProgress) {
      // Through comlink the callback returns a promise; progress is fire-and-forget.
      const post = onProgress
        ? (p: FitRunProgress) => {
            Promise.resolve(onProgress(p) as unknown).catch(() => undefined);
          }
        : undefined;
      return analyseFit(request, {
        shareProfiles: options.shareProfiles,
        shareWavelengthsNm: options.shareWavelengthsNm,
        onProgress: post ? (p) => post({ kind: "fit", ...p }) : undefined,
        onStage: post ? (s) => post({ kind: "stage", ...s }) : undefined,
      });
    },
  };
}
