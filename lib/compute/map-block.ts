/*
 * A block of map rows computed on one thread (the spectrum worker, or a test), packed into typed
 * arrays that travel to the page as transferred buffers. No DOM, no comlink.
 */
import { TERBIUM_GARNET_DEFAULTS } from "../model/defaults";
import { type AsyncSpectrumOptions, SpectrumCancelledError, computeSpectrumArrays, createSpectrumJob } from "../physics/spectrum";
import { MAP_BLOCK_QUANTITIES, type MapBlockArrays, type MapBlockRequest, type SpectrumRequest } from "./protocol";

/** The request of one map row: the base with its temperature or field replaced. */
export function mapRowRequest(block: MapBlockRequest, y: number): SpectrumRequest {
  return block.axis === "temperature" ? { ...block.base, temperatureK: y } : { ...block.base, fieldT: y };
}

/**
 * Every row of the block, one spectrum each. The rows run back to back within a time budget of
 * chunkMs (default 30 ms) and yield to the event loop (where a cancel arrives) only when it is
 * spent: a yield per row would cost each short row a timer's minimum delay (4 ms in browsers).
 */
export async function computeMapBlock(block: MapBlockRequest, opts: AsyncSpectrumOptions = {}): Promise<MapBlockArrays> {
  const t0 = performance.now();
  const chunkMs = opts.chunkMs ?? 30;
  const yieldNow = opts.yieldToEventLoop ?? (() => new Promise<void>((resolve) => setTimeout(resolve, 0)));
  const rows = block.rowValues.length;
  const columns = block.base.wavelengthsNm.length;
  const values = Object.fromEntries(MAP_BLOCK_QUANTITIES.map((q) => [q, new Float64Array(rows * columns)])) as MapBlockArrays["values"];
  const deviation = new Float64Array(rows).fill(Number.NaN);
  const warnings = new Set<string>();
  let sliceStart = performance.now();
  for (let r = 0; r < rows; r++) {
    const job = createSpectrumJob(mapRowRequest(block, block.rowValues[r]!));
    for (let i = 0; i < job.length; i++) {
      if (performance.now() - sliceStart > chunkMs) {
        await yieldNow();
        sliceStart = performance.now();
      }
      if (opts.shouldCancel?.()) throw new SpectrumCancelledError();
      job.computeRange(i, i + 1);
    }
    const a = job.finish();
    for (const q of MAP_BLOCK_QUANTITIES) values[q].set(a[q], r * columns);
    if (a.maxRelDeviationFromAnalytic !== undefined) deviation[r] = a.maxRelDeviationFromAnalytic;
    for (const w of a.warnings) warnings.add(w);
  }
  return { rows, columns, values, deviation, warnings: [...warnings], computeMs: performance.now() - t0 };
}

/** The buffers of a block, to transfer rather than copy. */
export function mapBlockTransferables(b: MapBlockArrays): ArrayBuffer[] {
  return [...MAP_BLOCK_QUANTITIES.map((q) => b.values[q].buffer as ArrayBuffer), b.deviation.buffer as ArrayBuffer];
}

/**
 * Wavelengths of the warm-up spectrum. Measured in Node 20 (same V8 family as Chromium): a fresh
 * thread needs about 250–300 numerical wavelengths before the per-wavelength time settles at its
 * warm value (3 ms each for the first 16, ~0.09 ms once compiled), so the warm-up runs 320.
 */
export const WARM_UP_WAVELENGTHS = 320;
/** Wavelengths of the timed run after the warm-up (a few ms warm). */
const RATE_WAVELENGTHS = 48;

function warmUpRequest(n: number): SpectrumRequest {
  // The terbium-garnet defaults at 293.15 K and 1 T (the product's demo material), 300–3000 nm.
  return {
    ...TERBIUM_GARNET_DEFAULTS,
    method: "llg",
    wavelengthsNm: Array.from({ length: n }, (_, i) => 300 * 10 ** (i / Math.max(1, n - 1))),
  };
}

/** Compiles the hot path, then times a warm run: numerical cells per second on this thread. */
export function warmUpAndMeasure(): number {
  computeSpectrumArrays(warmUpRequest(WARM_UP_WAVELENGTHS));
  const t0 = performance.now();
  computeSpectrumArrays(warmUpRequest(RATE_WAVELENGTHS));
  const ms = Math.max(performance.now() - t0, 0.01);
  return (RATE_WAVELENGTHS * 1000) / ms;
}
