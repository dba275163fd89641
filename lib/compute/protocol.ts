/*
 * The contract between the page and the spectrum web worker (comlink). The workbench builds
 * against these names; the physics types live in lib/physics and are re-exported here.
 */
import type { SpectrumRequest, SpinTraceRequest } from "../physics/schema";
import type { SpectrumArrays, SpinTraceResult } from "../physics/types";

export { spinTraceRequestSchema } from "../physics/schema";
export type { SpectrumRequest, SpinTraceRequest, SpectrumArrays, SpinTraceResult };

/**
 * A block of map rows for one worker: every row is `base` with its temperature (K) or field (T)
 * replaced by one of `rowValues`. Sent as one message, answered with packed typed arrays, so a
 * map costs a few messages per worker instead of one round trip (and one result object) per row.
 */
export interface MapBlockRequest {
  base: SpectrumRequest;
  axis: "temperature" | "field";
  rowValues: number[];
}

/** The quantities a map shows, one value per cell, row-major (row r, column i at r·columns + i). */
export const MAP_BLOCK_QUANTITIES = ["magneticShare", "thetaRad", "thetaElectricRad", "thetaMagneticRad", "verdetRadPerTm"] as const;
export type MapBlockQuantity = (typeof MAP_BLOCK_QUANTITIES)[number];

export interface MapBlockArrays {
  rows: number;
  columns: number;
  /** NaN where the quantity is undefined (a share or Verdet constant without rotation). */
  values: Record<MapBlockQuantity, Float64Array>;
  /** Per row, the largest numerical-vs-analytic deviation of χ±; NaN where not reported (analytic). */
  deviation: Float64Array;
  warnings: string[];
  /** Time the worker spent computing the block (ms), for the page's running rate estimate. */
  computeMs: number;
}

export interface SpectrumWorkerApi {
  /**
   * Computes the spectrum of `request` (validated again in the worker). Progress is the fraction
   * done, 0…1. Resolves with transferred typed arrays; rejects with an Error named "CancelledError"
   * after cancel(), "SpectrumInputError" for invalid input, "NonFiniteResultError" for a singular result.
   */
  spectrum(request: SpectrumRequest, onProgress?: (fractionDone: number) => void): Promise<SpectrumArrays>;
  /** Cancels every job started so far; each throws soon after (checked between chunks of ~30 ms). */
  cancel(): void;
  /** Computes a block of map rows (see MapBlockRequest); cancelled by cancel() like a spectrum. */
  mapBlock(request: MapBlockRequest): Promise<MapBlockArrays>;
  /**
   * Runs a small numerical spectrum twice: the first compiles the integrator's hot code (the JIT
   * warm-up that otherwise lands on the user's first run), the second is timed. Resolves with the
   * warm rate, in numerical cells (wavelengths) per second on this worker.
   */
  warmUp(): Promise<number>;
  /** Time trace of u under the "+" drive at one wavelength, with χ± from both drives. */
  spinTrace(request: SpinTraceRequest): Promise<SpinTraceResult>;
}

/** Name of the error a cancelled job rejects with inside the worker. */
export const CANCELLED_ERROR_NAME = "CancelledError";
