"use client";

import { type Remote, proxy, wrap } from "comlink";
import { useCallback, useEffect, useRef, useState } from "react";
import type { FitProgress, FitResult } from "@/lib/fit/fit";
import type { FitRequestInput } from "@/lib/fit/schema";
import type { FitWorkerApi } from "@/lib/fit/worker-api";

/*
 * Runs a fit in its own Web Worker, so the page never blocks. The fit is one synchronous loop in
 * the worker, so Cancel terminates the worker (nothing is lost: a fit stores nothing) and the
 * next fit starts a fresh one.
 */

export type FitStatus = "idle" | "running" | "done" | "cancelled" | "failed";

export interface FitRunState {
  status: FitStatus;
  progress: FitProgress | null;
  result: FitResult | null;
  /** The request of the result on screen (what was fitted). */
  request: FitRequestInput | null;
  error: string | null;
  start: (request: FitRequestInput) => void;
  cancel: () => void;
}

interface Handle {
  worker: Worker;
  api: Remote<FitWorkerApi>;
}

export function useFitRun(): FitRunState {
  const [status, setStatus] = useState<FitStatus>("idle");
  const [progress, setProgress] = useState<FitProgress | null>(null);
  const [result, setResult] = useState<FitResult | null>(null);
  const [request, setRequest] = useState<FitRequestInput | null>(null);
  const [error, setError] = useState<string | null>(null);
  const handle = useRef<Handle | null>(null);
  const runId = useRef(0);

  const stopWorker = useCallback(() => {
    handle.current?.worker.terminate();
    handle.current = null;
  }, []);

  useEffect(() => stopWorker, [stopWorker]);

  const start = useCallback(
    (next: FitRequestInput) => {
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
          proxy((p: FitProgress) => {
            if (runId.current === id) setProgress(p);
          }),
        )
        .then((fitted) => {
          if (runId.current !== id) return;
          setResult(fitted);
          setRequest(next);
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

  return { status, progress, result, request, error, start, cancel };
}
