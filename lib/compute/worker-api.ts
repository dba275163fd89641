/*
 * The object the spectrum worker exposes (workers/spectrum.worker.ts), kept here so it can be
 * tested without a Worker. No DOM, no React.
 */
import { transfer } from "comlink";
import { computeSpectrumArraysAsync } from "../physics/spectrum";
import { computeSpinTrace } from "../physics/spin-trace";
import type { SpectrumArrays, SpectrumWorkerApi, SpinTraceResult } from "./protocol";

function spectrumTransferables(a: SpectrumArrays): ArrayBuffer[] {
  const arrays = [
    a.wavelengthNm,
    a.thetaRad,
    a.thetaElectricRad,
    a.thetaMagneticRad,
    a.thetaCrossRad,
    a.ellipticityRad,
    a.magneticShare,
    a.verdetRadPerTm,
    a.deltaMzPlusAPerM,
    a.deltaMzMinusAPerM,
    a.thetaDiamagneticRad,
    a.absorptionPlusPerM,
    a.absorptionMinusPerM,
    a.transmissionPlus,
    a.transmissionMinus,
    a.ellipticityAngleRad,
    a.flags,
  ];
  return arrays.filter((x): x is Float64Array | Uint8Array => x !== undefined).map((x) => x.buffer as ArrayBuffer);
}

function traceTransferables(r: SpinTraceResult): ArrayBuffer[] {
  return [r.timePeriods, r.ux, r.uy, r.uz].map((x) => x.buffer as ArrayBuffer);
}

export interface WorkerApiOptions {
  /** Wall-clock budget per chunk before yielding to the event loop (ms). */
  chunkMs?: number;
}

export function createSpectrumWorkerApi(opts: WorkerApiOptions = {}): SpectrumWorkerApi {
  // Every call gets an id; cancel() cancels all ids issued so far, so a stale cancel never hits a
  // job started after it, and two overlapping jobs never share one flag.
  let issued = 0;
  let cancelledUpTo = 0;
  return {
    async spectrum(request, onProgress) {
      const id = ++issued;
      const arrays = await computeSpectrumArraysAsync(request, {
        chunkMs: opts.chunkMs,
        shouldCancel: () => id <= cancelledUpTo,
        onProgress: onProgress
          ? (f) => {
              // Through comlink this returns a promise; progress is fire-and-forget.
              Promise.resolve(onProgress(f) as unknown).catch(() => undefined);
            }
          : undefined,
      });
      return transfer(arrays, spectrumTransferables(arrays));
    },
    cancel() {
      cancelledUpTo = issued;
    },
    async spinTrace(request) {
      const result = computeSpinTrace(request);
      return transfer(result, traceTransferables(result));
    },
  };
}
