"use client";

import { startTransition, useCallback, useEffect, useRef, useState } from "react";
import type { ModelParams, SpectrumRequest } from "@/lib/physics/schema";
import type { SpectrumResult } from "@/lib/physics/types";
import { computeAnalyticNow, isAbortError, type WorkbenchPool } from "@/lib/workbench/engine";
import { wavelengthGrid } from "@/lib/workbench/units";

/*
 * The edit → preview → numerical run cycle. A valid request, after a 300 ms pause in typing, gets
 * an instant analytic preview on the main thread (capped at PREVIEW_POINTS so it stays ~1 ms) and
 * then a numerical LLG run in the worker pool with progress and cancel. A new request aborts the
 * run in flight. A failed run keeps whatever was last shown and says why.
 */

export const DEBOUNCE_MS = 300;
const PREVIEW_POINTS = 256;

export type RunStatus = "idle" | "running" | "done" | "cancelled" | "failed";

export interface ComputedSpectrum {
  key: string;
  method: "analytic" | "llg";
  result: SpectrumResult;
  /**
   * The model parameters this result was computed from. While an edit is pending, invalid or its
   * run failed, the screen keeps an older result, so its labels (magneticScale, B0, L) and exports
   * must come from here, not from the inputs as they are now.
   */
  params: ModelParams;
  /** Grid points of the full request; the preview may use fewer. */
  requestedPoints: number;
}

export interface SpectrumRunState {
  status: RunStatus;
  progress: number;
  error: string | null;
  preview: ComputedSpectrum | null;
  numerical: ComputedSpectrum | null;
  /** What the plots show: the numerical result when it belongs to the current inputs, else the preview. */
  shown: ComputedSpectrum | null;
  /** True while the inputs changed but the debounce has not fired yet. */
  pending: boolean;
  cancel: () => void;
  rerun: () => void;
}

export interface RunInputs {
  /** Full validated request for the grid, or null while the inputs are invalid. */
  request: SpectrumRequest | null;
  pool: WorkbenchPool | null;
}

function previewGrid(request: SpectrumRequest): number[] {
  const w = request.wavelengthsNm;
  if (w.length <= PREVIEW_POINTS) return w;
  return wavelengthGrid(w[0]!, w[w.length - 1]!, PREVIEW_POINTS, "log");
}

function paramsOf(request: SpectrumRequest): ModelParams {
  const { wavelengthsNm: _w, method: _m, intensityWPerM2: _i, ...params } = request;
  return params;
}

function errorText(error: unknown): string {
  if (error instanceof Error && error.message) return error.message;
  return String(error);
}

export function useSpectrumRun({ request, pool }: RunInputs): SpectrumRunState {
  const [status, setStatus] = useState<RunStatus>("idle");
  const [progress, setProgress] = useState(0);
  const [error, setError] = useState<string | null>(null);
  const [preview, setPreview] = useState<ComputedSpectrum | null>(null);
  const [numerical, setNumerical] = useState<ComputedSpectrum | null>(null);
  const [nonce, setNonce] = useState(0);
  const [firedKey, setFiredKey] = useState<string | null>(null);

  const controller = useRef<AbortController | null>(null);
  const userCancelled = useRef(false);
  const progressFrame = useRef<number | null>(null);
  const latestFraction = useRef(0);

  // Markers are not part of the run: they read their values from the result (use-marker-values),
  // so adding one never restarts a spectrum.
  const key = request ? JSON.stringify(request) : null;

  useEffect(() => {
    if (!request || !key) return;
    const timer = setTimeout(() => {
      setFiredKey(key);
      // 1. Instant analytic preview on this thread.
      try {
        const grid = previewGrid(request);
        const result = computeAnalyticNow({ ...request, wavelengthsNm: grid, method: "analytic" });
        // Redrawing every plot is the heavy part of a result; as a transition React renders it in
        // short slices, so typing and the progress bar stay responsive (no main-thread task > 50 ms).
        startTransition(() => {
          setPreview({ key, method: "analytic", result, params: paramsOf(request), requestedPoints: request.wavelengthsNm.length });
        });
        setError(null);
      } catch (e) {
        setStatus("failed");
        setError(`The analytic preview failed: ${errorText(e)}`);
        return;
      }
      if (!pool) return;

      // 2. Numerical run in the worker pool.
      controller.current?.abort();
      const ac = new AbortController();
      controller.current = ac;
      userCancelled.current = false;
      latestFraction.current = 0;
      setStatus("running");
      setProgress(0);
      const onProgress = (f: number) => {
        latestFraction.current = Math.max(latestFraction.current, Math.min(1, f));
        // Coalesce progress messages to one React update per frame.
        if (progressFrame.current === null) {
          progressFrame.current = requestAnimationFrame(() => {
            progressFrame.current = null;
            if (!ac.signal.aborted) setProgress(latestFraction.current);
          });
        }
      };
      const llg: SpectrumRequest = { ...request, method: "llg" };
      pool.spectrum(llg, { onProgress, signal: ac.signal }).then(
        (result) => {
          if (ac.signal.aborted) return;
          // One transition, so "done" and the result it describes appear together.
          startTransition(() => {
            setNumerical({ key, method: "llg", result, params: paramsOf(request), requestedPoints: request.wavelengthsNm.length });
            setProgress(1);
            setStatus("done");
          });
        },
        (e: unknown) => {
          if (controller.current !== ac) return; // superseded by a newer run
          if (isAbortError(e) || ac.signal.aborted) {
            setStatus(userCancelled.current ? "cancelled" : "idle");
            return;
          }
          setStatus("failed");
          setError(`The numerical run failed: ${errorText(e)}. The last good result stays on screen.`);
        },
      );
    }, DEBOUNCE_MS);
    return () => clearTimeout(timer);
    // `request` is captured through `key`, which changes whenever it does.
  }, [key, pool, nonce]);

  // Abort on unmount.
  useEffect(
    () => () => {
      controller.current?.abort();
      if (progressFrame.current !== null) cancelAnimationFrame(progressFrame.current);
    },
    [],
  );

  const cancel = useCallback(() => {
    if (!controller.current) return;
    userCancelled.current = true;
    controller.current.abort();
  }, []);

  const rerun = useCallback(() => setNonce((n) => n + 1), []);

  const shown = numerical && numerical.key === key ? numerical : preview && preview.key === key ? preview : (numerical ?? preview);
  const pending = key !== null && key !== firedKey;

  return { status, progress, error, preview, numerical, shown, pending, cancel, rerun };
}
