import type { NumericParamKey } from "@/lib/fit/model";
import type { PlanCriterion } from "./schema";

/* The shapes the measurement planner hands back (plan.ts builds them; the planner screen shows them). */

export interface PlanCandidate {
  index: number;
  lineName: string;
  wavelengthNm: number;
  temperatureK: number;
  fieldT: number;
}

export interface PlanPoint extends PlanCandidate {
  /** How many measurements at this point. */
  count: number;
  /** Predicted rotation of the sample, rad. */
  rotationRad: number;
  /** |θm|/(|θe|+|θm|) there; NaN when both are 0. */
  magneticShare: number;
  /** |rotation| / σ of one measurement. */
  signalToNoise: number;
  /** |rotation| is below the σ of one measurement. */
  belowNoise: boolean;
}

export interface RankedPlan {
  rank: number;
  points: PlanPoint[];
  /**
   * Expected standard error of the criterion (unit in PlanResult.criterionUnit); Infinity when the points cannot separate the
   * free parameters.
   */
  expectedSigma: number;
  separable: boolean;
  /**
   * Correlation of the electric (gyrationPerT) and magnetic (magneticScale) amplitudes; null unless both are free and the plan
   * separates them.
   */
  partsCorrelation: number | null;
  /** Expected standard error of each free parameter, in its own unit. */
  parameterSigma: Record<string, number>;
}

export interface LineRatio {
  lineName: string;
  wavelengthNm: number;
  electricRad: number;
  magneticRad: number;
  /** θm/θe at the set's temperature and field; null when θe = 0. */
  magneticOverElectric: number | null;
}

export interface PlanResult {
  criterion: PlanCriterion;
  criterionLabel: string;
  criterionUnit: string;
  freeKeys: NumericParamKey[];
  candidateCount: number;
  method: "exhaustive" | "greedy";
  /** Designs whose criterion was evaluated. */
  designsEvaluated: number;
  sigmaPerPointRad: number;
  plans: RankedPlan[];
  /** Best expected σ found for 1…N points (Infinity where the points cannot separate the parameters). */
  sigmaVsPoints: { points: number; sigma: number }[];
  lineRatios: LineRatio[];
  notes: string[];
}
