"use client";

import { type Remote, proxy, wrap } from "comlink";
import { useCallback, useEffect, useRef, useState } from "react";
import type { FitReport } from "@/lib/fit/report";
import type { FitRequestInput } from "@/lib/fit/schema";
import type { FitRunOptions, FitRunProgress, FitWorkerApi } from "@/lib/fit/worker-api";

/*
 * Runs a fit and its report in its own Web Worker, so the page never blocks. The fit is one synchronous loop in
 * the worker, so Cancel terminates the worker (nothing is lost: a fit stores nothing) and the
 * next fit starts a fresh one.
 */

export type FitStatus = "idle" | "running" | "done" | "cancelled" | "failed";

export interface FitRunState {
  status: FitStatus;
  /** The last iteration of the first fit, then the report's stage. */
  progress: FitRunProgress | null;
  result: FitReport | null;
  /** The request of the result on screen (what was fitted). */
  request: FitRequestInput | null;
  /** The report options of the result on screen. */
  options: FitRunOptions | null;
  error: string | null;
  start: (request: FitRequestInput, options: FitRunOptions) => void;
  cancel: () => void;
}

interface Handle {
  worker: Worker;
  api: Remote<FitWorkerApi>;
}

export function useFitRun(): FitRunState {
  const [status, setStatus] = useState<FitStatus>("idle");
  const [progress, setProgress] = useState<FitRunProgress | null>(null);
  const [result, setResult] = useState<FitReport | null>(null);
  const [request, setRequest] = useState<FitRequestInput | null>(null);
  const [options, setOptions] = useState<FitRunOptions | null>(null);
  const [error, setError] = useState<string | null>(null);
  const handle = useRef<Handle | null>(null);
  const runId = useRef(0);

  const stopWorker = useCallback(() => {
    handle.current?.worker.terminate();
    handle.current = null;
  }, []);

  useEffect(() => stopWorker, [stopWorker]);

  const start = useCallback(
    (next: FitRequestInput, nextOptions: FitRunOptions) => {
      stopWorker();
      const id = ++runId.current;
      const worker = new Worker(new URL("../../workers/fit.worker.ts", import.meta.url), { type: "module" });
      const api = wrap<FitWorkerApi>(worker);
      handle.current = { worker, api };
      setStatus("running");
      setProgress(null);
      setError(null);
      api
        .fit(
          next,
          nextOptions,
          proxy((p: FitRunProgress) => {
            if (runId.current === id) setProgress(p);
          }),
        )
        .then((fitted) => {
          if (runId.current !== id) return;
          setResult(fitted);
          setRequest(next);
          setOptions(nextOptions);
          setStatus("done");
        })
        .catch((err: unknown) => {
          if (runId.current !== id) return;
          setError(err instanceof Error && err.message ? err.message : String(err));
          setStatus("failed");
        })
        .finally(() => {
          if (runId.current === id) stopWorker();
        });
    },
    [stopWorker],
  );

  const cancel = useCallback(() => {
    runId.current++;
    stopWorker();
    setStatus("cancelled");
    setProgress(null);
  }, [stopWorker]);

  return { status, progress, result, request, options, error, start, cancel };
}
