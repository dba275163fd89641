import { describe, expect, it } from "vitest";
import { inProcessPools } from "./in-process-pool";
import { createSpectrumWorkerApi } from "@/lib/compute/worker-api";
import { aggregateProgress, defaultPoolSize, arraysToResult, mergeArrays, splitRanges, splitRequest } from "@/lib/compute/spectrum-pool";
import type { SpectrumRequest } from "@/lib/physics/schema";
import { computeSpectrum, computeSpectrumArrays } from "@/lib/physics/spectrum";
import { TGG } from "../physics/fixtures";

const request = (over: Partial<SpectrumRequest> = {}): SpectrumRequest => ({
  ...TGG,
  method: "analytic",
  wavelengthsNm: Array.from({ length: 23 }, (_, i) => 230 + 40 * i),
  temperatureK: 4,
  fieldT: 5,
  ...over,
});

describe("split and merge helpers", () => {
  it("splits into contiguous, non-empty, balanced ranges", () => {
    expect(splitRanges(10, 4)).toEqual([
      [0, 3],
      [3, 6],
      [6, 8],
      [8, 10],
    ]);
    expect(splitRanges(3, 8)).toEqual([
      [0, 1],
      [1, 2],
      [2, 3],
    ]);
    expect(splitRanges(5, 1)).toEqual([[0, 5]]);
    for (const [n, k] of [
      [1, 4],
      [256, 3],
      [5000, 4],
    ] as const) {
      const r = splitRanges(n, k);
      expect(r[0]![0]).toBe(0);
      expect(r[r.length - 1]![1]).toBe(n);
      r.forEach(([a, b], i) => {
        expect(b).toBeGreaterThan(a);
        if (i > 0) expect(a).toBe(r[i - 1]![1]);
      });
      const sizes = r.map(([a, b]) => b - a);
      expect(Math.max(...sizes) - Math.min(...sizes)).toBeLessThanOrEqual(1);
    }
  });

  it("aggregates progress weighted by chunk size", () => {
    expect(aggregateProgress([1, 0], [3, 1])).toBe(0.75);
    expect(aggregateProgress([0.5, 0.5, 1], [2, 2, 4])).toBe(0.75);
    expect(aggregateProgress([], [])).toBe(1);
  });

  it("merging chunk results reproduces the single-run result, warnings included", () => {
    // Cold, high field: the passivity warning fires below a limit inside the list (§5.3).
    const req = request({ oscillatorStrength: 0.005, intensityWPerM2: 1e12 });
    const whole = computeSpectrum(req);
    expect(whole.warnings).toHaveLength(1);
    const parts = splitRequest(req, 3).map((c) => computeSpectrumArrays(c.request));
    // Each chunk alone sees only its own wavelengths.
    expect(parts.filter((p) => p.warnings.length > 0).length).toBeGreaterThanOrEqual(1);
    const merged = arraysToResult(mergeArrays(req, parts));
    expect(merged).toEqual(whole);
  });

  it("keeps the largest deviation over chunks and maps NaN to null", () => {
    const req = request({ method: "llg", wavelengthsNm: [300, 600, 1200, 2400] });
    const parts = splitRequest(req, 2).map((c) => computeSpectrumArrays(c.request));
    const merged = mergeArrays(req, parts);
    expect(merged.maxRelDeviationFromAnalytic).toBe(
      Math.max(parts[0]!.maxRelDeviationFromAnalytic!, parts[1]!.maxRelDeviationFromAnalytic!),
    );
    const zeroField = arraysToResult(computeSpectrumArrays(request({ fieldT: 0, wavelengthsNm: [500] })));
    expect(zeroField.points[0]!.magneticShare).toBeNull();
    expect(zeroField.points[0]!.verdetRadPerTm).toBeNull();
  });
});

describe("pool size", () => {
  it("leaves one core to the page, keeps at least one worker and uses at most four", () => {
    expect(defaultPoolSize(1)).toBe(1);
    expect(defaultPoolSize(2)).toBe(1);
    expect(defaultPoolSize(3)).toBe(2);
    expect(defaultPoolSize(16)).toBe(4);
    // navigator.hardwareConcurrency may be missing (0 or undefined): assume 2 cores.
    expect(defaultPoolSize(undefined)).toBe(1);
    expect(defaultPoolSize(0)).toBe(1);
  });
});

describe("worker API (without a Worker)", () => {
  it("reports progress up to 1 and can be cancelled between chunks", async () => {
    const api = createSpectrumWorkerApi({ chunkMs: 1 });
    const progress: number[] = [];
    const a = await api.spectrum(request({ method: "llg", wavelengthsNm: [300, 400, 500, 600] }), (f) => progress.push(f));
    expect(progress[progress.length - 1]).toBe(1);
    expect(a.maxRelDeviationFromAnalytic!).toBeLessThan(1e-4);

    const big = request({ method: "llg", wavelengthsNm: Array.from({ length: 400 }, (_, i) => 300 + i) });
    const job = api.spectrum(big);
    setTimeout(() => api.cancel(), 5);
    await expect(job).rejects.toMatchObject({ name: "CancelledError" });
    // A cancel issued before a job does not cancel that job.
    await expect(api.spectrum(request())).resolves.toBeDefined();
  });
});

describe("SpectrumPool over in-process message channels", () => {
  const makePool = inProcessPools();

  it("returns the same result as a single synchronous run, with monotone progress", async () => {
    const req = request({ method: "llg", wavelengthsNm: Array.from({ length: 17 }, (_, i) => 300 + 100 * i) });
    const progress: number[] = [];
    const r = await makePool(3).spectrum(req, { onProgress: (f) => progress.push(f) });
    expect(r).toEqual(computeSpectrum(req));
    expect(progress[progress.length - 1]).toBe(1);
    progress.forEach((f, i) => {
      if (i > 0) expect(f).toBeGreaterThanOrEqual(progress[i - 1]!);
    });
  });

  it("rejects with an AbortError when aborted", async () => {
    const req = request({ method: "llg", wavelengthsNm: Array.from({ length: 600 }, (_, i) => 300 + i) });
    const controller = new AbortController();
    const job = makePool(2).spectrum(req, { signal: controller.signal });
    setTimeout(() => controller.abort(), 5);
    await expect(job).rejects.toMatchObject({ name: "AbortError" });
  });

  it("passes input errors through", async () => {
    await expect(makePool(2).spectrum(request({ temperatureK: -1 }))).rejects.toThrow(/temperatureK/);
  });

  it("runs a spin trace", async () => {
    const r = await makePool(1).spinTrace({ ...TGG, wavelengthNm: 800, intensityWPerM2: 0, periods: 2 });
    expect(r.ux.length).toBe(r.timePeriods.length);
    expect(r.chiPlus.im).toBeLessThan(0);
  });
});
