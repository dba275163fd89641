"use client";

import { proxy, wrap, type Remote } from "comlink";
import { useCallback, useEffect, useRef, useState } from "react";
import type { PlanResult } from "@/lib/planner/plan";
import type { PlanRequest } from "@/lib/planner/schema";
import type { PlannerWorkerApi } from "@/lib/planner/worker-api";

export type PlanRunState =
  | { status: "idle" }
  | { status: "running"; progress: number; startedAt: number }
  | { status: "done"; result: PlanResult; elapsedMs: number }
  | { status: "cancelled" }
  | { status: "error"; message: string };

/**
 * Runs the planner in a Web Worker (one per run). The search is a synchronous loop in the worker,
 * so Cancel terminates the worker; nothing half-done reaches the page.
 */
export function usePlanRun() {
  const [state, setState] = useState<PlanRunState>({ status: "idle" });
  const workerRef = useRef<Worker | null>(null);
  const runId = useRef(0);

  const stop = useCallback(() => {
    workerRef.current?.terminate();
    workerRef.current = null;
  }, []);

  useEffect(() => stop, [stop]);

  const run = useCallback(
    async (request: PlanRequest) => {
      stop();
      const id = ++runId.current;
      const worker = new Worker(new URL("../../workers/planner.worker.ts", import.meta.url), { type: "module" });
      workerRef.current = worker;
      const api: Remote<PlannerWorkerApi> = wrap<PlannerWorkerApi>(worker);
      const startedAt = performance.now();
      setState({ status: "running", progress: 0, startedAt });
      try {
        const out = await api.plan(
          request,
          proxy((f: number) => {
            if (runId.current === id) setState((s) => (s.status === "running" ? { ...s, progress: f } : s));
          }),
        );
        if (runId.current !== id) return;
        if (out.ok) setState({ status: "done", result: out.result, elapsedMs: performance.now() - startedAt });
        else setState({ status: "error", message: out.issues.join("; ") });
      } catch (error) {
        if (runId.current !== id) return;
        setState({ status: "error", message: error instanceof Error ? error.message : "The planner stopped unexpectedly." });
      } finally {
        if (runId.current === id) stop();
      }
    },
    [stop],
  );

  const cancel = useCallback(() => {
    runId.current++;
    stop();
    setState({ status: "cancelled" });
  }, [stop]);

  return { state, run, cancel };
}
