import type { MeasuredPoint } from "@/lib/measurements/point";
import { type ModelCondition, evaluateModel } from "@/lib/fit/model";
import type { ModelParams } from "@/lib/physics/schema";

/** Seeded uniform generator on [0, 1) (mulberry32; common practice, no source). */
export function seededRandom(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** Standard normal deviates by the Box–Muller transform (common practice, no source). */
export function seededGaussian(seed: number): () => number {
  const uniform = seededRandom(seed);
  return () => {
    const u1 = 1 - uniform();
    const u2 = uniform();
    return Math.sqrt(-2 * Math.log(u1)) * Math.cos(2 * Math.PI * u2);
  };
}

export const verdetAt = (wavelengthNm: number, over: Partial<ModelCondition> = {}): ModelCondition => ({
  wavelengthNm,
  temperatureK: 293.15,
  fieldT: 1,
  lengthM: 0.01,
  quantity: "verdet",
  ...over,
});

/** Synthetic points: the model at `truth` plus Gaussian noise of standard deviation sigma. */
export function syntheticPoints(truth: ModelParams, conditions: ModelCondition[], sigma: number, gauss: () => number): MeasuredPoint[] {
  const clean = evaluateModel(truth, conditions).value;
  return conditions.map((c, i) => ({ line: i + 2, ...c, value: clean[i]! + sigma * gauss(), sigma }));
}

export const evenly = (from: number, to: number, count: number) => Array.from({ length: count }, (_, i) => from + ((to - from) * i) / (count - 1));
