import { describe, expect, it } from "vitest";
import { decodeChunk, encodeChunk } from "@/lib/lab-runs/encoding";
import { ENGINE_VERSION, engineCompatible, engineMajor } from "@/lib/lab-runs/engine";
import { type MapPayload, mapRun, spectrumRun, type SpectrumPayload } from "@/lib/lab-runs/kinds";
import { runExpireSeconds } from "@/lib/lab-runs/queue-options";
import { TERBIUM_GARNET_DEFAULTS } from "@/lib/model/defaults";

const spectrum: SpectrumPayload = spectrumRun.payloadSchema.parse({
  params: TERBIUM_GARNET_DEFAULTS,
  method: "analytic",
  wavelengths: { fromNm: 300, toNm: 3000, count: 600 },
});
const map: MapPayload = mapRun.payloadSchema.parse({
  params: TERBIUM_GARNET_DEFAULTS,
  method: "analytic",
  axis: "temperature",
  wavelengths: { fromNm: 400, toNm: 1600, count: 16 },
  rows: { from: 20, to: 300, count: 6 },
});

describe("checkpoints", () => {
  it("a chunk saved and read back assembles into the same result, bit for bit, as the chunks computed here", () => {
    for (const [handler, payload] of [
      [spectrumRun, spectrum],
      [mapRun, map],
    ] as const) {
      const h = handler as typeof spectrumRun | typeof mapRun;
      // biome-ignore lint/suspicious/noExplicitAny: one loop over two handlers of different payload types.
      const p = payload as any;
      const direct = h.chunks(p).map((c) => h.compute(p, c));
      const restored = direct.map((o) => {
        const { meta, data } = encodeChunk(o);
        return decodeChunk(JSON.parse(JSON.stringify(meta)), new Uint8Array(data));
      });
      const a = h.assemble(p, direct);
      const b = h.assemble(p, restored);
      expect(b.meta).toEqual(a.meta);
      for (const [name, col] of Object.entries(a.columns)) {
        const other = b.columns[name]!;
        expect(other.length, name).toBe(col.length);
        expect(
          col.every((v, i) => Object.is(v, other[i])),
          name,
        ).toBe(true);
      }
    }
  });
});

describe("engine version", () => {
  it("a worker takes jobs of its own major version only", () => {
    expect(engineMajor("3.12.0")).toBe(3);
    expect(engineMajor("3.x")).toBeNaN();
    const major = engineMajor(ENGINE_VERSION);
    expect(engineCompatible(`${major}.99.1`)).toBe(true);
    expect(engineCompatible(`${major + 1}.0.0`)).toBe(false);
    expect(engineCompatible("garbage")).toBe(false);
  });
});

describe("queue expiry per run", () => {
  it("a small run gets the least expiry; a large numerical map three times its slow-core estimate", () => {
    const settings = { expireSeconds: 900 };
    expect(runExpireSeconds(settings, "spectrum", spectrum)).toBe(900);
    const big = { ...map, method: "llg", wavelengths: { ...map.wavelengths, count: 512 }, rows: { ...map.rows, count: 256 } };
    // 131,072 cells at 700 cells/s on a slow core ≈ 187 s; three times: 562 s < 900 s.
    expect(runExpireSeconds(settings, "map", big)).toBe(900);
    expect(runExpireSeconds({ expireSeconds: 60 }, "map", big)).toBe(Math.ceil((3 * 131_072) / 700));
    expect(runExpireSeconds(settings, "map", { method: "llg" })).toBe(900);
  });
});
