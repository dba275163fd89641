import { arraysToResult, computeSpectrum, computeSpectrumArraysAsync } from "@/lib/physics/spectrum";
import { computeSpinTrace } from "@/lib/physics/spin-trace";
import type { SpectrumRequest, SpinTraceRequest } from "@/lib/physics/schema";
import type { SpectrumResult, SpinTraceResult } from "@/lib/physics/types";

/*
 * The workbench's one door to the physics engine and the worker pool. Everything else in the
 * workbench speaks these names, so a change in the engine's surface touches this file only.
 */

export type { SpinTraceRequest, SpinTraceResult };

export interface RunOptions {
  onProgress?: (fractionDone: number) => void;
  signal?: AbortSignal;
}

export interface WorkbenchPool {
  spectrum(request: SpectrumRequest, opts?: RunOptions): Promise<SpectrumResult>;
  spinTrace(request: SpinTraceRequest, opts?: RunOptions): Promise<SpinTraceResult>;
  dispose(): void;
}

/** Synchronous analytic spectrum on the calling thread; only for small requests (≤ a few hundred points). */
export function computeAnalyticNow(request: SpectrumRequest): SpectrumResult {
  return computeSpectrum({ ...request, method: "analytic" });
}

function abortError(): DOMException {
  return new DOMException("The run was cancelled.", "AbortError");
}

/**
 * Stand-in until lib/compute/spectrum-pool.ts lands: the same contract, computed on this thread in
 * short chunks. Replace the body of createPool with `new SpectrumPool()` then.
 */
function createChunkedPool(): WorkbenchPool {
  return {
    async spectrum(request, opts = {}) {
      const { signal, onProgress } = opts;
      if (signal?.aborted) throw abortError();
      try {
        const arrays = await computeSpectrumArraysAsync(request, { chunkMs: 8, onProgress, shouldCancel: () => signal?.aborted === true });
        return arraysToResult(arrays);
      } catch (e) {
        if (signal?.aborted) throw abortError();
        throw e;
      }
    },
    async spinTrace(request, opts = {}) {
      if (opts.signal?.aborted) throw abortError();
      await new Promise((r) => setTimeout(r, 0));
      return computeSpinTrace(request);
    },
    dispose() {},
  };
}

export function createPool(): WorkbenchPool {
  return createChunkedPool();
}

export function isAbortError(error: unknown): boolean {
  return (error instanceof DOMException || error instanceof Error) && (error.name === "AbortError" || error.name === "SpectrumCancelledError");
}
