import type { MeasuredPoint } from "@/lib/measurements/point";
import { type ModelCondition, evaluateModel } from "@/lib/fit/model";
import type { ModelParams } from "@/lib/physics/schema";

export { seededGaussian, seededRandom } from "@/lib/random";

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

export const evenly = (from: number, to: number, count: number) =>
  Array.from({ length: count }, (_, i) => from + ((to - from) * i) / (count - 1));
