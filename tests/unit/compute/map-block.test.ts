import { describe, expect, it } from "vitest";
import { inProcessPools } from "./in-process-pool";
import { computeMapBlock, mapRowRequest, warmUpAndMeasure } from "@/lib/compute/map-block";
import { MAP_BLOCK_QUANTITIES, type MapBlockRequest } from "@/lib/compute/protocol";
import { blockRanges, MAP_BLOCK_CELLS } from "@/lib/compute/spectrum-pool";
import { computeSpectrumArrays } from "@/lib/physics/spectrum";
import { TGG } from "../physics/fixtures";

const wavelengthsNm = [400, 633, 1064, 1550, 2500];
const job = (over: Partial<MapBlockRequest> = {}): MapBlockRequest => ({
  base: { ...TGG, method: "llg", wavelengthsNm },
  axis: "temperature",
  rowValues: [50, 120, 293.15],
  ...over,
});

/** The same map, one synchronous spectrum per row: what the blocks must reproduce exactly. */
function rowByRow(j: MapBlockRequest) {
  return j.rowValues.map((y) => computeSpectrumArrays(mapRowRequest(j, y)));
}

describe("a block of map rows", () => {
  it("packs each row's spectrum, row-major, with the row's deviation and the warnings", async () => {
    for (const axis of ["temperature", "field"] as const) {
      const j = job({ axis, rowValues: axis === "field" ? [0.1, 1, -3] : [50, 120, 293.15] });
      const block = await computeMapBlock(j, { chunkMs: 1 });
      const rows = rowByRow(j);
      expect(block.rows).toBe(3);
      expect(block.columns).toBe(wavelengthsNm.length);
      rows.forEach((a, r) => {
        for (const q of MAP_BLOCK_QUANTITIES) {
          expect(Array.from(block.values[q].subarray(r * 5, r * 5 + 5))).toEqual(Array.from(a[q]));
        }
        expect(block.deviation[r]).toBe(a.maxRelDeviationFromAnalytic);
      });
      expect(block.computeMs).toBeGreaterThan(0);
    }
  });

  it("reports no deviation for the analytic method and an undefined share as NaN", async () => {
    const block = await computeMapBlock(job({ base: { ...TGG, method: "analytic", wavelengthsNm }, axis: "field", rowValues: [0, 1] }));
    expect(Number.isNaN(block.deviation[0]!)).toBe(true);
    // B0 = 0: no rotation, so the share is undefined in the first row.
    expect(Number.isNaN(block.values.magneticShare[0]!)).toBe(true);
    expect(Number.isNaN(block.values.magneticShare[5]!)).toBe(false);
  });

  it("stops between wavelengths once cancelled", async () => {
    let calls = 0;
    const big = job({ rowValues: Array.from({ length: 40 }, (_, i) => 20 + i) });
    await expect(computeMapBlock(big, { chunkMs: 0, shouldCancel: () => ++calls > 3 })).rejects.toMatchObject({ name: "CancelledError" });
    expect(calls).toBe(4);
  });

  it("measures a warm rate after the warm-up", () => {
    expect(warmUpAndMeasure()).toBeGreaterThan(0);
  });
});

describe("blocks of a map", () => {
  it("cover every row once, about MAP_BLOCK_CELLS cells each, at least a row each", () => {
    expect(blockRanges(64, 128)).toEqual(Array.from({ length: 8 }, (_, k) => [8 * k, 8 * k + 8]));
    expect(blockRanges(5, 4096)).toEqual([
      [0, 1],
      [1, 2],
      [2, 3],
      [3, 4],
      [4, 5],
    ]);
    const r = blockRanges(128, 256);
    expect(r[0]).toEqual([0, MAP_BLOCK_CELLS / 256]);
    expect(r[r.length - 1]![1]).toBe(128);
    expect(blockRanges(0, 64)).toEqual([]);
  });
});

describe("maps over a pool of in-process workers", () => {
  const makePool = inProcessPools();

  it("assembles the blocks of several workers into the row-by-row map, with progress up to 1", async () => {
    // 300 columns: three rows a block, so 17 rows make six blocks over two workers.
    const wl = Array.from({ length: 300 }, (_, i) => 400 + 5 * i);
    const j = job({
      base: { ...TGG, method: "analytic", wavelengthsNm: wl },
      rowValues: Array.from({ length: 17 }, (_, i) => 10 + 20 * i),
    });
    const progress: number[] = [];
    const pool = makePool(2);
    const map = await pool.map(j, { onProgress: (f) => progress.push(f) });
    const rows = rowByRow(j);
    rows.forEach((a, r) => {
      expect(Array.from(map.values.thetaRad.subarray(r * 300, r * 300 + 300))).toEqual(Array.from(a.thetaRad));
      expect(Array.from(map.values.verdetRadPerTm.subarray(r * 300, r * 300 + 300))).toEqual(Array.from(a.verdetRadPerTm));
    });
    expect(progress).toHaveLength(6);
    expect(progress[progress.length - 1]).toBe(1);
    progress.forEach((f, i) => {
      if (i > 0) expect(f).toBeGreaterThan(progress[i - 1]!);
    });
  });

  it("warms its workers once and then knows a numerical rate", async () => {
    const pool = makePool(2);
    expect(pool.numericalCellsPerSecond()).toBeNull();
    const first = pool.warmUp();
    expect(pool.warmUp()).toBe(first);
    const perWorker = await first;
    expect(perWorker).toBeGreaterThan(0);
    expect(pool.numericalCellsPerSecond()).toBe(2 * perWorker!);
  });

  it("rejects with an AbortError when aborted and passes input errors through", async () => {
    const pool = makePool(2);
    const controller = new AbortController();
    const big = pool.map(job({ rowValues: Array.from({ length: 200 }, (_, i) => 20 + i) }), { signal: controller.signal });
    setTimeout(() => controller.abort(), 5);
    await expect(big).rejects.toMatchObject({ name: "AbortError" });
    await expect(pool.map(job({ rowValues: [-5] }))).rejects.toThrow(/temperatureK/);
  });
});
