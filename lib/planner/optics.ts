import { type ModelCondition, evaluateModel, forEachConditionGroup } from "@/lib/fit/model";
import type { ModelParams } from "@/lib/physics/schema";

/*
 * What the light does at each candidate point, from the spectrum engine itself: the predicted
 * rotation, and the transmission of the sample (linear light is the sum of the two circular
 * components, so the transmitted intensity is the mean of T+ and T−; physics-model.md §5.3). Any
 * absorption band the engine knows (the oscillator, a material's absorption windows) is in that
 * transmission, so a point inside a band is dim here and the planner's noise and minimum
 * transmission see it.
 */

export interface CandidateOptics {
  /** Predicted rotation, rad. */
  thetaRad: Float64Array;
  /** Fraction of the light that leaves the sample, 0…1 (gain is clipped to 1: it does not lower the noise below the stated figure). */
  transmission: Float64Array;
}

/** Rotation and transmission of every point; points sharing T, B and L are one spectrum call. */
export function candidateOptics(params: ModelParams, points: readonly ModelCondition[]): CandidateOptics {
  const thetaRad = new Float64Array(points.length);
  const transmission = new Float64Array(points.length);
  forEachConditionGroup(params, points, (arrays, members) => {
    for (const { index, column } of members) {
      thetaRad[index] = arrays.thetaRad[column]!;
      const t = 0.5 * (arrays.transmissionPlus[column]! + arrays.transmissionMinus[column]!);
      transmission[index] = Number.isFinite(t) ? Math.min(1, Math.max(0, t)) : 1;
    }
  });
  return { thetaRad, transmission };
}

/** Relative step of the temperature derivative (central difference; the model is smooth in T above the Curie–Weiss point). */
const TEMPERATURE_RELATIVE_STEP = 1e-4;

/** ∂θ/∂T at every point, rad/K, by a central difference of the shared forward model. */
export function temperatureDerivative(params: ModelParams, points: readonly ModelCondition[]): Float64Array {
  const shifted = (sign: number) =>
    evaluateModel(
      params,
      points.map((p) => ({ ...p, temperatureK: p.temperatureK * (1 + sign * TEMPERATURE_RELATIVE_STEP) })),
    ).value;
  const plus = shifted(1);
  const minus = shifted(-1);
  return plus.map((v, i) => (v - minus[i]!) / (2 * TEMPERATURE_RELATIVE_STEP * points[i]!.temperatureK));
}
