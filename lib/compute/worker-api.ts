/*
 * The object the spectrum worker exposes (workers/spectrum.worker.ts), kept here so it can be
 * tested without a Worker. No DOM, no React.
 */
import { transfer } from "comlink";
import { computeSpectrumArraysAsync } from "../physics/spectrum";
import { computeSpinTrace } from "../physics/spin-trace";
import { computeMapBlock, mapBlockTransferables, warmUpAndMeasure } from "./map-block";
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

/**
 * A yield to the event loop through a message to itself, for the browser's worker: it lets queued
 * messages (cancel) run, without the 4 ms minimum that nested zero-delay timers get in browsers
 * (HTML standard, timers). Measured in Chromium's worker: a 1 ms busy loop with a yield after each
 * step made 69 steps in 189 ms with this yield, 29 in 214 ms with setTimeout(0), and a cancel
 * message posted after 200 ms reached both. Node's ports drain before timers run, so tests use
 * the default timer yield.
 */
export function messageYield(): () => Promise<void> {
  const channel = new MessageChannel();
  const waiting: (() => void)[] = [];
  channel.port1.onmessage = () => waiting.shift()?.();
  return () =>
    new Promise<void>((resolve) => {
      waiting.push(resolve);
      channel.port2.postMessage(null);
    });
}

export interface WorkerApiOptions {
  /** Wall-clock budget per chunk before yielding to the event loop (ms). */
  chunkMs?: number;
  /** How to yield between chunks (default a zero-delay timer). */
  yieldToEventLoop?: () => Promise<void>;
}

export function createSpectrumWorkerApi(opts: WorkerApiOptions = {}): SpectrumWorkerApi {
  // Every call gets an id; cancel() cancels all ids issued so far, so a stale cancel never hits a
  // job started after it, and two overlapping jobs never share one flag.
  let issued = 0;
  let cancelledUpTo = 0;
  const { yieldToEventLoop } = opts;
  return {
    async spectrum(request, onProgress) {
      const id = ++issued;
      const arrays = await computeSpectrumArraysAsync(request, {
        chunkMs: opts.chunkMs,
        yieldToEventLoop,
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
    async mapBlock(request) {
      const id = ++issued;
      const block = await computeMapBlock(request, { chunkMs: opts.chunkMs, yieldToEventLoop, shouldCancel: () => id <= cancelledUpTo });
      return transfer(block, mapBlockTransferables(block));
    },
    async warmUp() {
      return warmUpAndMeasure();
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
