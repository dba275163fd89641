import { type MapArrays, type MapJob, SpectrumPool } from "@/lib/compute/spectrum-pool";
import { computeSpectrum } from "@/lib/physics/spectrum";
import type { SpectrumRequest, SpinTraceRequest } from "@/lib/physics/schema";
import type { SpectrumResult, SpinTraceResult } from "@/lib/physics/types";

/*
 * The workbench's one door to the physics engine and the worker pool. Everything else in the
 * workbench speaks these names, so a change in the engine's surface touches this file only.
 */

export type { MapArrays, MapJob, SpinTraceRequest, SpinTraceResult };

export interface RunOptions {
  onProgress?: (fractionDone: number) => void;
  signal?: AbortSignal;
}

export interface WorkbenchPool {
  spectrum(request: SpectrumRequest, opts?: RunOptions): Promise<SpectrumResult>;
  spinTrace(request: SpinTraceRequest, opts?: RunOptions): Promise<SpinTraceResult>;
  /** A map in blocks of rows across the pool's workers. */
  map(job: MapJob, opts?: RunOptions): Promise<MapArrays>;
  /** Starts and warms up every worker once; resolves with a worker's numerical rate (cells/s) or null. */
  warmUp(): Promise<number | null>;
  /** The pool's latest measured numerical rate (cells/s), or null before the warm-up has finished. */
  numericalCellsPerSecond(): number | null;
  dispose(): void;
}

/** Synchronous analytic spectrum on the calling thread; only for small requests (≤ a few hundred points). */
export function computeAnalyticNow(request: SpectrumRequest): SpectrumResult {
  return computeSpectrum({ ...request, method: "analytic" });
}

/**
 * A worker pool. The pool's cancel reaches every job on a worker, so the workbench keeps the main
 * spectrum and the side panels (maps, compare, spin trace) in separate pools: cancelling the
 * main run must not kill a map.
 */
export function createPool(opts: { size?: number } = {}): WorkbenchPool {
  const pool = new SpectrumPool(opts);
  return {
    spectrum: (request, runOpts) => pool.spectrum(request, runOpts ?? {}),
    spinTrace: (request, runOpts) => pool.spinTrace(request, runOpts ?? {}),
    map: (job, runOpts) => pool.map(job, runOpts ?? {}),
    warmUp: () => pool.warmUp(),
    numericalCellsPerSecond: () => pool.numericalCellsPerSecond(),
    dispose: () => pool.dispose(),
  };
}

export function isAbortError(error: unknown): boolean {
  return (
    (error instanceof DOMException || error instanceof Error) && (error.name === "AbortError" || error.name === "SpectrumCancelledError")
  );
}
