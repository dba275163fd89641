/*
 * The contract between the page and the spectrum web worker (comlink). The workbench builds
 * against these names; the physics types live in lib/physics and are re-exported here.
 */
import type { SpectrumRequest, SpinTraceRequest } from "../physics/schema";
import type { SpectrumArrays, SpinTraceResult } from "../physics/types";

export { spinTraceRequestSchema } from "../physics/schema";
export type { SpectrumRequest, SpinTraceRequest, SpectrumArrays, SpinTraceResult };

export interface SpectrumWorkerApi {
  /**
   * Computes the spectrum of `request` (validated again in the worker). Progress is the fraction
   * done, 0…1. Resolves with transferred typed arrays; rejects with an Error named "CancelledError"
   * after cancel(), "SpectrumInputError" for invalid input, "NonFiniteResultError" for a singular result.
   */
  spectrum(request: SpectrumRequest, onProgress?: (fractionDone: number) => void): Promise<SpectrumArrays>;
  /** Cancels every job started so far; each throws soon after (checked between chunks of ~30 ms). */
  cancel(): void;
  /** Time trace of u under the "+" drive at one wavelength, with χ± from both drives. */
  spinTrace(request: SpinTraceRequest): Promise<SpinTraceResult>;
}

/** Name of the error a cancelled job rejects with inside the worker. */
export const CANCELLED_ERROR_NAME = "CancelledError";
