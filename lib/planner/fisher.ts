import { Matrix, determinant, inverse } from "ml-matrix";
import { type ModelCondition, type NumericParamKey, modelJacobian } from "@/lib/fit/model";
import type { CriterionSpec } from "./information";
import type { PlanCandidate } from "./plan-result";
import type { PlanRequest } from "./schema";

/*
 * The Fisher information of the planner's candidate points and the σ it implies. Each candidate
 * is one measured rotation (rad) with the request's σ; its information is JᵢᵀJᵢ/σ² with Jᵢ the row
 * of the shared forward model's Jacobian (lib/fit/model.ts) at the parameter set's values, in
 * scaled parameters. The search adds these up (information.ts evaluates the criterion of a sum);
 * the figures of the final plans are recomputed here with ml-matrix as the Cramér–Rao bound of a
 * least-squares fit (linearized; common practice, no source).
 */

/** Candidates per Jacobian call: points sharing T and B are one spectrum call, so slices follow the candidate order. */
const JACOBIAN_SLICE = 512;

/** The candidate points as conditions of the forward model (measured rotation). */
export function candidateConditions(request: PlanRequest, candidates: readonly PlanCandidate[]): ModelCondition[] {
  return candidates.map((c) => ({
    wavelengthNm: c.wavelengthNm,
    temperatureK: c.temperatureK,
    fieldT: c.fieldT,
    lengthM: request.lengthM,
    quantity: "rotation",
  }));
}

/** The Jacobian of every candidate, the parameter scale and the per-candidate information. */
export interface CandidateInformation {
  /** ∂rotation/∂parameter, one row per candidate, in the parameters' own units. */
  valueJacobian: Matrix;
  /** Each free parameter's value, or 1 where the value is 0, so F is well conditioned in any units. */
  scale: number[];
  /** Row-major p×p information of each candidate in scaled parameters, candidate after candidate. */
  info: Float64Array;
}

/**
 * The Jacobian in slices (for progress and Cancel between them: `afterSlice` gets the number of
 * candidates done and may throw), then JᵢᵀJᵢ/σ² per candidate in scaled parameters.
 */
export function candidateInformation(
  params: PlanRequest["params"],
  keys: readonly NumericParamKey[],
  conditions: readonly ModelCondition[],
  sigmaRad: number,
  afterSlice: (candidatesDone: number) => void,
): CandidateInformation {
  const C = conditions.length;
  const p = keys.length;
  const pp = p * p;
  const valueJacobian = new Matrix(C, p);
  for (let start = 0; start < C; start += JACOBIAN_SLICE) {
    const part = modelJacobian(params, keys, conditions.slice(start, start + JACOBIAN_SLICE));
    for (let i = 0; i < part.valueJacobian.rows; i++)
      for (let j = 0; j < p; j++) valueJacobian.set(start + i, j, part.valueJacobian.get(i, j));
    afterSlice(Math.min(C, start + JACOBIAN_SLICE));
  }
  const scale = keys.map((k) => Math.abs(params[k] as number) || 1);
  const info = new Float64Array(C * pp);
  for (let c = 0; c < C; c++) {
    for (let i = 0; i < p; i++) {
      const ji = valueJacobian.get(c, i) * scale[i]!;
      for (let j = 0; j < p; j++) info[c * pp + i * p + j] = (ji * valueJacobian.get(c, j) * scale[j]!) / (sigmaRad * sigmaRad);
    }
  }
  return { valueJacobian, scale, info };
}

/** The criterion as a linear functional h of the scaled parameters, or D-optimal. */
export function criterionSpec(request: PlanRequest, keys: NumericParamKey[], scale: number[]): CriterionSpec {
  const { criterion, params } = request;
  if (criterion.kind === "dOptimal") return { kind: "dOptimal" };
  const h = new Float64Array(keys.length);
  if (criterion.kind === "magneticScale") {
    const k = keys.indexOf("magneticScale");
    h[k] = scale[k]!;
    return { kind: "linear", h };
  }
  // Share at the chosen wavelength, at the set's temperature and field: its gradient from the
  // same Jacobian module (the share does not depend on T or B unless the diamagnetic term is on).
  const at = modelJacobian(params, keys, [
    {
      wavelengthNm: criterion.wavelengthNm,
      temperatureK: params.temperatureK,
      fieldT: params.fieldT || 1,
      lengthM: request.lengthM,
      quantity: "rotation",
    },
  ]);
  keys.forEach((_, i) => {
    h[i] = at.shareJacobian.get(0, i) * scale[i]!;
  });
  return { kind: "linear", h };
}

/** The σ figures of one plan (RankedPlan's). */
export interface PlanSigmas {
  expectedSigma: number;
  partsCorrelation: number | null;
  parameterSigma: Record<string, number>;
}

/**
 * The reported figures of a separable plan from ml-matrix: F = Jsᵀ W Js over its distinct points,
 * W = count/σ², Cov = F⁻¹ in scaled parameters. The rows follow `points` in the order given.
 */
export function planSigmas(o: {
  keys: readonly NumericParamKey[];
  information: Pick<CandidateInformation, "valueJacobian" | "scale">;
  sigmaRad: number;
  points: readonly { index: number; count: number }[];
  spec: CriterionSpec;
}): PlanSigmas {
  const { keys, sigmaRad } = o;
  const { valueJacobian, scale } = o.information;
  const rows = o.points.map((pt) => keys.map((_, i) => valueJacobian.get(pt.index, i) * scale[i]!));
  const js = new Matrix(rows);
  const w = Matrix.diag(o.points.map((pt) => pt.count / (sigmaRad * sigmaRad)));
  const fisher = js.transpose().mmul(w).mmul(js);
  const covScaled = inverse(fisher);
  const parameterSigma: Record<string, number> = {};
  keys.forEach((k, i) => {
    parameterSigma[k] = Math.sqrt(covScaled.get(i, i)) * scale[i]!;
  });
  let partsCorrelation: number | null = null;
  const ie = keys.indexOf("gyrationPerT");
  const im = keys.indexOf("magneticScale");
  if (ie >= 0 && im >= 0) partsCorrelation = covScaled.get(ie, im) / Math.sqrt(covScaled.get(ie, ie) * covScaled.get(im, im));
  let expectedSigma: number;
  if (o.spec.kind === "linear") {
    const h = Matrix.columnVector(Array.from(o.spec.h));
    expectedSigma = Math.sqrt(h.transpose().mmul(covScaled).mmul(h).get(0, 0));
  } else {
    expectedSigma = determinant(covScaled) ** (1 / (2 * keys.length));
  }
  return { expectedSigma, partsCorrelation, parameterSigma };
}
