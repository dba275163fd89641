/*
 * A small pool of spectrum web workers (browser only, no React). A numerical spectrum is split
 * into contiguous wavelength chunks, one per worker; progress is aggregated by chunk size; the
 * chunks are merged back in order. The analytic path runs in one worker (it takes ~1 ms). A map
 * goes out in blocks of rows (about MAP_BLOCK_CELLS cells each), handed to whichever worker is
 * free, and comes back as transferred typed arrays. The workers live as long as the pool (one
 * per page) and can be warmed up once, which also measures their rate for the time estimates.
 */
import { type Remote, proxy, wrap } from "comlink";
import { arraysToResult, spectrumWarnings } from "../physics/spectrum";
import type { SpectrumResult } from "../physics/types";
import {
  MAP_BLOCK_QUANTITIES,
  type MapBlockArrays,
  type MapBlockRequest,
  type SpectrumArrays,
  type SpectrumRequest,
  type SpectrumWorkerApi,
  type SpinTraceRequest,
  type SpinTraceResult,
} from "./protocol";

export { arraysToResult };

/** Contiguous [start, end) ranges covering 0…n in at most `parts` non-empty chunks whose sizes differ by ≤ 1. */
export function splitRanges(n: number, parts: number): [number, number][] {
  const k = Math.max(1, Math.min(Math.floor(parts), n));
  const ranges: [number, number][] = [];
  const base = Math.floor(n / k);
  const extra = n % k;
  let start = 0;
  for (let i = 0; i < k && start < n; i++) {
    const end = start + base + (i < extra ? 1 : 0);
    ranges.push([start, end]);
    start = end;
  }
  return ranges;
}

/** One sub-request per range: the same parameters with a slice of the wavelength list. */
export function splitRequest(request: SpectrumRequest, parts: number): { request: SpectrumRequest; range: [number, number] }[] {
  return splitRanges(request.wavelengthsNm.length, parts).map((range) => ({
    request: { ...request, wavelengthsNm: request.wavelengthsNm.slice(range[0], range[1]) },
    range,
  }));
}

/** Overall fraction done: chunk fractions weighted by chunk size. */
export function aggregateProgress(fractions: readonly number[], sizes: readonly number[]): number {
  let done = 0;
  let total = 0;
  sizes.forEach((size, i) => {
    done += Math.min(1, Math.max(0, fractions[i] ?? 0)) * size;
    total += size;
  });
  return total === 0 ? 1 : done / total;
}

function concat(parts: (Float64Array | undefined)[]): Float64Array | undefined {
  if (parts.some((p) => p === undefined)) return undefined;
  const total = parts.reduce((s, p) => s + p!.length, 0);
  const out = new Float64Array(total);
  let offset = 0;
  for (const p of parts) {
    out.set(p!, offset);
    offset += p!.length;
  }
  return out;
}

/**
 * Merges chunk results (in wavelength order) into one: columns concatenated, the largest
 * deviation kept, warnings rebuilt from the merged per-wavelength flags (chunk warnings without
 * flags are kept, deduplicated).
 */
export function mergeArrays(request: SpectrumRequest, parts: SpectrumArrays[]): SpectrumArrays {
  if (parts.length === 0) throw new Error("mergeArrays: no chunks");
  const col = (
    key:
      | "wavelengthNm"
      | "thetaRad"
      | "thetaElectricRad"
      | "thetaMagneticRad"
      | "thetaCrossRad"
      | "ellipticityRad"
      | "magneticShare"
      | "verdetRadPerTm"
      | "absorptionPlusPerM"
      | "absorptionMinusPerM"
      | "transmissionPlus"
      | "transmissionMinus"
      | "ellipticityAngleRad",
  ) => concat(parts.map((p) => p[key]))!;
  const merged: SpectrumArrays = {
    magnetizationAPerM: parts[0]!.magnetizationAPerM,
    wavelengthNm: col("wavelengthNm"),
    thetaRad: col("thetaRad"),
    thetaElectricRad: col("thetaElectricRad"),
    thetaMagneticRad: col("thetaMagneticRad"),
    thetaCrossRad: col("thetaCrossRad"),
    ellipticityRad: col("ellipticityRad"),
    magneticShare: col("magneticShare"),
    verdetRadPerTm: col("verdetRadPerTm"),
    absorptionPlusPerM: col("absorptionPlusPerM"),
    absorptionMinusPerM: col("absorptionMinusPerM"),
    transmissionPlus: col("transmissionPlus"),
    transmissionMinus: col("transmissionMinus"),
    ellipticityAngleRad: col("ellipticityAngleRad"),
    warnings: [],
  };
  const dia = concat(parts.map((p) => p.thetaDiamagneticRad));
  if (dia) merged.thetaDiamagneticRad = dia;
  const dPlus = concat(parts.map((p) => p.deltaMzPlusAPerM));
  const dMinus = concat(parts.map((p) => p.deltaMzMinusAPerM));
  if (dPlus && dMinus) {
    merged.deltaMzPlusAPerM = dPlus;
    merged.deltaMzMinusAPerM = dMinus;
  }
  const deviations = parts.map((p) => p.maxRelDeviationFromAnalytic).filter((d): d is number => d !== undefined);
  if (deviations.length > 0) merged.maxRelDeviationFromAnalytic = Math.max(...deviations);
  if (parts.every((p) => p.flags !== undefined)) {
    const flags = new Uint8Array(merged.wavelengthNm.length);
    let offset = 0;
    for (const p of parts) {
      flags.set(p.flags!, offset);
      offset += p.flags!.length;
    }
    merged.flags = flags;
    merged.warnings = spectrumWarnings(request, merged);
  } else {
    merged.warnings = [...new Set(parts.flatMap((p) => p.warnings))];
  }
  return merged;
}

/**
 * Cells per map block: about 0.1 s of numerical work on a warm worker (~90 µs a cell), so
 * progress moves a few times a second and a cancel or a free worker waits at most that long, while
 * the messages stay few (32 blocks for 256 × 128).
 */
export const MAP_BLOCK_CELLS = 1024;

/** Row ranges [start, end) of about `cellsPerBlock` cells each, at least one row each. */
export function blockRanges(rows: number, columns: number, cellsPerBlock = MAP_BLOCK_CELLS): [number, number][] {
  const per = Math.max(1, Math.floor(cellsPerBlock / Math.max(1, columns)));
  const out: [number, number][] = [];
  for (let start = 0; start < rows; start += per) out.push([start, Math.min(rows, start + per)]);
  return out;
}

/** A whole map for the pool: the rows of MapBlockRequest, all of them. */
export type MapJob = MapBlockRequest;
export type MapArrays = Omit<MapBlockArrays, "computeMs">;

/** Copies a block's arrays into the whole map at its first row. */
export function placeBlock(map: MapArrays, block: MapBlockArrays, firstRow: number): void {
  for (const q of MAP_BLOCK_QUANTITIES) map.values[q].set(block.values[q], firstRow * map.columns);
  map.deviation.set(block.deviation, firstRow);
  for (const w of block.warnings) if (!map.warnings.includes(w)) map.warnings.push(w);
}

function emptyMap(rows: number, columns: number): MapArrays {
  const values = Object.fromEntries(MAP_BLOCK_QUANTITIES.map((q) => [q, new Float64Array(rows * columns)])) as MapArrays["values"];
  return { rows, columns, values, deviation: new Float64Array(rows).fill(Number.NaN), warnings: [] };
}

const abortError = () => new DOMException("Cancelled", "AbortError");

interface PoolWorker {
  worker: Worker;
  api: Remote<SpectrumWorkerApi>;
}

export interface SpectrumPoolOptions {
  size?: number;
  createWorker?: () => Worker;
}

/**
 * Workers for a machine with `cores` logical cores: one core stays with the page's own thread so
 * that input and drawing keep up while a spectrum is computed (on 2 cores, two busy workers made
 * the page's tasks stretch past 50 ms); at most 4, since a 256-point spectrum is only ~50 ms of work.
 */
export function defaultPoolSize(cores: number | undefined): number {
  return Math.max(1, Math.min((cores || 2) - 1, 4));
}

export interface PoolRunOptions {
  onProgress?: (fractionDone: number) => void;
  signal?: AbortSignal;
}

export class SpectrumPool {
  readonly size: number;
  private readonly createWorker: () => Worker;
  private workers: (PoolWorker | undefined)[] = [];
  private disposed = false;
  private warming: Promise<number | null> | null = null;
  /** The latest measured numerical rate of one worker (cells/s), from the warm-up and from map blocks. */
  private rate: number | null = null;

  constructor(opts: SpectrumPoolOptions = {}) {
    this.size = Math.max(
      1,
      Math.floor(opts.size ?? defaultPoolSize(typeof navigator !== "undefined" ? navigator.hardwareConcurrency : undefined)),
    );
    this.createWorker =
      opts.createWorker ?? (() => new Worker(new URL("../../workers/spectrum.worker.ts", import.meta.url), { type: "module" }));
  }

  private worker(i: number): PoolWorker {
    if (this.disposed) throw new Error("SpectrumPool: disposed");
    let w = this.workers[i];
    if (!w) {
      const worker = this.createWorker();
      w = { worker, api: wrap<SpectrumWorkerApi>(worker) };
      this.workers[i] = w;
    }
    return w;
  }

  /** Computes a spectrum across the pool; rejects with DOMException("Cancelled", "AbortError") on abort. */
  spectrum(request: SpectrumRequest, opts: PoolRunOptions = {}): Promise<SpectrumResult> {
    const { signal, onProgress } = opts;
    if (signal?.aborted) return Promise.reject(abortError());
    const parts = request.method === "llg" ? this.size : 1;
    const chunks = splitRequest(request, parts);
    const sizes = chunks.map((c) => c.range[1] - c.range[0]);
    const fractions = chunks.map(() => 0);
    const used = chunks.map((_, i) => this.worker(i));
    return new Promise<SpectrumResult>((resolve, reject) => {
      let settled = false;
      const onAbort = () => {
        if (settled) return;
        settled = true;
        for (const w of used) w.api.cancel().catch(() => undefined);
        reject(abortError());
      };
      signal?.addEventListener("abort", onAbort, { once: true });
      Promise.all(
        chunks.map((chunk, i) =>
          used[i]!.api.spectrum(
            chunk.request,
            proxy((f: number) => {
              fractions[i] = f;
              if (!settled) onProgress?.(aggregateProgress(fractions, sizes));
            }),
          ),
        ),
      ).then(
        (arrays) => {
          signal?.removeEventListener("abort", onAbort);
          if (settled) return;
          settled = true;
          try {
            const result = arraysToResult(mergeArrays(request, arrays));
            // Progress messages travel separately from results and may lag; finish at 1.
            onProgress?.(1);
            resolve(result);
          } catch (err) {
            reject(err);
          }
        },
        (err: unknown) => {
          signal?.removeEventListener("abort", onAbort);
          if (settled) return;
          settled = true;
          // Stop the other chunks: one failure fails the whole spectrum.
          for (const w of used) w.api.cancel().catch(() => undefined);
          reject(err);
        },
      );
    });
  }

  /**
   * Starts every worker and warms it up once (see SpectrumWorkerApi.warmUp); resolves with the
   * measured rate of one worker in numerical cells/s, or null when the warm-up failed. Later
   * calls return the same promise.
   */
  warmUp(): Promise<number | null> {
    if (this.disposed) return Promise.resolve(null);
    if (!this.warming) {
      const all = Array.from({ length: this.size }, (_, i) => this.worker(i).api.warmUp());
      this.warming = Promise.all(all).then(
        (rates) => {
          this.rate ??= Math.min(...rates);
          return this.rate;
        },
        () => null,
      );
    }
    return this.warming;
  }

  /** The latest measured numerical rate of the whole pool (cells/s), or null before any measurement. */
  numericalCellsPerSecond(): number | null {
    return this.rate === null ? null : this.rate * this.size;
  }

  /**
   * Computes a map over the pool in blocks of rows; progress is the fraction of cells done, once
   * per finished block. Rejects with DOMException("Cancelled", "AbortError") on abort; one failed
   * block fails the map and stops the others.
   */
  map(job: MapJob, opts: PoolRunOptions = {}): Promise<MapArrays> {
    const { signal, onProgress } = opts;
    if (signal?.aborted) return Promise.reject(abortError());
    const columns = job.base.wavelengthsNm.length;
    const rows = job.rowValues.length;
    const blocks = blockRanges(rows, columns);
    const used = Array.from({ length: Math.min(this.size, blocks.length) }, (_, i) => this.worker(i));
    const out = emptyMap(rows, columns);
    const numerical = job.base.method === "llg";
    let next = 0;
    let doneRows = 0;
    let settled = false;
    return new Promise<MapArrays>((resolve, reject) => {
      const stop = () => {
        for (const w of used) w.api.cancel().catch(() => undefined);
      };
      const onAbort = () => {
        if (settled) return;
        settled = true;
        stop();
        reject(abortError());
      };
      signal?.addEventListener("abort", onAbort, { once: true });
      // Each worker takes the next block as soon as it is free, so a slower worker takes fewer.
      const loop = async (w: PoolWorker) => {
        while (!settled && next < blocks.length) {
          const [start, end] = blocks[next++]!;
          const block = await w.api.mapBlock({ ...job, rowValues: job.rowValues.slice(start, end) });
          if (settled) return;
          placeBlock(out, block, start);
          if (numerical && block.computeMs > 0) this.rate = (block.rows * block.columns * 1000) / block.computeMs;
          doneRows += end - start;
          onProgress?.(doneRows / rows);
        }
      };
      Promise.all(used.map(loop)).then(
        () => {
          signal?.removeEventListener("abort", onAbort);
          if (settled) return;
          settled = true;
          resolve(out);
        },
        (err: unknown) => {
          signal?.removeEventListener("abort", onAbort);
          if (settled) return;
          settled = true;
          stop();
          reject(err);
        },
      );
    });
  }

  /** Spin trace on the first worker. On abort the worker is terminated (a trace cannot be interrupted). */
  spinTrace(request: SpinTraceRequest, opts: PoolRunOptions = {}): Promise<SpinTraceResult> {
    const { signal } = opts;
    if (signal?.aborted) return Promise.reject(abortError());
    const w = this.worker(0);
    return new Promise<SpinTraceResult>((resolve, reject) => {
      const onAbort = () => {
        w.worker.terminate();
        if (this.workers[0] === w) this.workers[0] = undefined;
        reject(abortError());
      };
      signal?.addEventListener("abort", onAbort, { once: true });
      w.api.spinTrace(request).then(
        (r) => {
          signal?.removeEventListener("abort", onAbort);
          opts.onProgress?.(1);
          resolve(r);
        },
        (err: unknown) => {
          signal?.removeEventListener("abort", onAbort);
          reject(err);
        },
      );
    });
  }

  /** Terminates every worker; the pool cannot be used afterwards. */
  dispose(): void {
    this.disposed = true;
    for (const w of this.workers) w?.worker.terminate();
    this.workers = [];
  }
}
