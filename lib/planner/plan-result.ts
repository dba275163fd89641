import type { AnalysisDefinition, FreeableKey, NoiseModel } from "@/lib/analysis/definition";
import type { DetectionFigures } from "./fisher";
import type { PlanCriterion } from "./schema";

/* The shapes the measurement planner hands back (plan.ts builds them; the planner screen shows them). */

export interface PlanCandidate {
  index: number;
  lineName: string;
  wavelengthNm: number;
  temperatureK: number;
  fieldT: number;
  /** The line's power, W, when known. */
  powerW: number | null;
}

/** phase-wrap: |θ| > π/2, the point needs a field sweep to unwrap; below-noise: |θ| below one measurement's σ. */
export type PlanPointFlag = "phase-wrap" | "below-noise";

export interface PlanPoint extends PlanCandidate {
  /** How many measurements at this point. */
  count: number;
  /** Predicted rotation of the sample, rad. */
  rotationRad: number;
  /** Fraction of the light that leaves the sample. */
  transmission: number;
  /** σ of one measurement there (noise model and calibration), rad. */
  sigmaRad: number;
  /** |θm|/(|θe|+|θm|) there; NaN when both are 0. */
  magneticShare: number;
  /** |rotation| / σ of one measurement. */
  signalToNoise: number;
  /** |rotation| is below the σ of one measurement. */
  belowNoise: boolean;
  flags: PlanPointFlag[];
}

export interface RankedPlan {
  rank: number;
  points: PlanPoint[];
  /**
   * Expected standard error of the criterion at the set's values (unit in PlanResult.criterionUnit); Infinity when the points
   * cannot separate the varied parameters.
   */
  expectedSigma: number;
  /** The criterion the search ranked by: expectedSigma, or its average / worst case over the robust sample. */
  rankedValue: number;
  separable: boolean;
  /**
   * Correlation of the electric (gyrationPerT) and magnetic (magneticScale) amplitudes; null unless both vary and the plan
   * separates them.
   */
  partsCorrelation: number | null;
  /** Expected standard error of each varied parameter (and the calibration nuisance), in its own unit. */
  parameterSigma: Record<string, number>;
  /** Detection of the magnetic-dipole part; null unless magneticScale varies and the plan determines it. */
  detection: DetectionFigures | null;
  /** Measurements in all (the sum of the counts). */
  measurements: number;
  /** Cool-downs to temperatures other than ambient. */
  cooldowns: number;
  /** Lab time: measurements × time per point + cool-downs × time per cool-down, hours. */
  costHours: number;
}

export interface LineRatio {
  lineName: string;
  wavelengthNm: number;
  electricRad: number;
  magneticRad: number;
  /** θm/θe at the set's temperature and field; null when θe = 0. */
  magneticOverElectric: number | null;
}

/** The chosen plan at one end of a robust range (the other parameters at the set's values). */
export interface RangeEnd {
  key: FreeableKey;
  end: "min" | "max";
  value: number;
  expectedSigma: number;
  detectionSignificance: number | null;
}

export interface PlanResult {
  criterion: PlanCriterion;
  criterionLabel: string;
  criterionUnit: string;
  /** The analysis the plan is made for. */
  definition: AnalysisDefinition;
  /** The varied parameters (free, with a prior, then the calibration nuisance). */
  freeKeys: string[];
  /** The laboratory noise the plan assumes (absoluteRad at full transmission). */
  noise: NoiseModel;
  candidateCount: number;
  /** Candidates never proposed: below the minimum transmission, or past a quarter turn when those are excluded. */
  excluded: { lowTransmission: number; wrapped: number };
  method: "exhaustive" | "greedy";
  /** Designs whose criterion was evaluated. */
  designsEvaluated: number;
  /** Polarimeter noise of one measurement at full transmission, rad. */
  sigmaPerPointRad: number;
  /** The robust design, when asked for: how the chosen plan fares at each range's ends. */
  robust: { mode: "average" | "worst"; samples: number; ends: RangeEnd[] } | null;
  plans: RankedPlan[];
  /** Best ranked criterion found for 1…N points (Infinity where the points cannot separate the parameters). */
  sigmaVsPoints: { points: number; sigma: number }[];
  lineRatios: LineRatio[];
  notes: string[];
}
