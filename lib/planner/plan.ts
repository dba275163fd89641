import { Matrix, determinant, inverse } from "ml-matrix";
import { type ModelCondition, type NumericParamKey, evaluateModel, modelJacobian } from "@/lib/fit/model";
import type { ModelParams } from "@/lib/physics/schema";
import { computeSpectrumArrays } from "@/lib/physics/spectrum";
import { type CriterionSpec, addScaled, criterionOf } from "./information";
import { type PlanCriterion, type PlanRequest, rangeValues, sigmaPerPointRad } from "./schema";

/*
 * The measurement planner: which line × temperature × field points, and how often each, pin down
 * the chosen quantity best. Each candidate point is a measured rotation (rad) with the noise σ of
 * the request; the design's Fisher information is JᵀWJ, W = diag(count/σ²), with J the Jacobian
 * of the shared forward model (lib/fit/model.ts) at the parameter set's values, the same Jacobian
 * the fit uses. The expected standard error is then the Cramér–Rao bound of a least-squares fit
 * (linearized; valid when the errors are small against the parameters; common practice, no
 * source).
 *
 * Search: every multiset of the requested size while their number is small (exhaustive), else
 * greedy addition of the point that most improves the criterion, followed by single-point
 * exchanges (a Fedorov-type exchange; common practice, no source) until none helps.
 */

/** Largest number of designs (summed over 1…N points) that is searched exhaustively. */
export const EXHAUSTIVE_LIMIT = 300_000;

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
  /** Expected standard error of the criterion (unit in PlanResult.criterionUnit); Infinity when the points cannot separate the free parameters. */
  expectedSigma: number;
  separable: boolean;
  /** Correlation of the electric (gyrationPerT) and magnetic (magneticScale) amplitudes; null unless both are free and the plan separates them. */
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

export class PlanCancelledError extends Error {
  constructor() {
    super("The plan search was cancelled.");
    this.name = "PlanCancelledError";
  }
}

export interface PlanOptions {
  onProgress?: (fractionDone: number) => void;
  shouldCancel?: () => boolean;
  /** Override of EXHAUSTIVE_LIMIT (tests compare both searches on one problem). */
  exhaustiveLimit?: number;
}

export function criterionText(criterion: PlanCriterion): { label: string; unit: string } {
  switch (criterion.kind) {
    case "share":
      return { label: `σ of the magnetic share at ${criterion.wavelengthNm} nm`, unit: "(fraction)" };
    case "magneticScale":
      return { label: "σ of magneticScale", unit: "(×)" };
    case "dOptimal":
      return { label: "D-optimal: geometric mean of the relative σ of the free parameters", unit: "(relative)" };
  }
}

/** Number of multisets of size k from n, as a float (may be huge). */
export function multisetCount(n: number, k: number): number {
  let c = 1;
  for (let i = 1; i <= k; i++) c = (c * (n + i - 1)) / i;
  return c;
}

export function buildCandidates(request: PlanRequest): PlanCandidate[] {
  const temps = rangeValues(request.temperatures.minK, request.temperatures.maxK, request.temperatures.stepK);
  const fields = rangeValues(request.fields.minT, request.fields.maxT, request.fields.stepT).filter((b) => b !== 0);
  const out: PlanCandidate[] = [];
  // Temperature and field outermost: the lines at one (T, B) are one spectrum call of the model.
  for (const temperatureK of temps)
    for (const fieldT of fields)
      for (const line of request.lines)
        out.push({ index: out.length, lineName: line.name, wavelengthNm: line.wavelengthNm, temperatureK, fieldT });
  return out;
}

const hasDiamagneticTerm = (params: ModelParams) => (params as Record<string, unknown>).diamagneticTerm === true;

interface Design {
  indices: number[];
  value: number;
}

/** Keeps the K best designs (lowest value), without duplicates. */
class TopK {
  readonly items: Design[] = [];
  private readonly keys = new Set<string>();
  constructor(readonly capacity: number) {}
  worst(): number {
    return this.items.length < this.capacity ? Infinity : this.items[this.items.length - 1]!.value;
  }
  offer(indices: readonly number[], value: number): void {
    if (this.items.length >= this.capacity && !(value < this.worst())) return;
    const sorted = [...indices].sort((a, b) => a - b);
    const key = sorted.join(",");
    if (this.keys.has(key)) return;
    const at = this.items.findIndex((d) => value < d.value);
    this.items.splice(at < 0 ? this.items.length : at, 0, { indices: sorted, value });
    this.keys.add(key);
    if (this.items.length > this.capacity) {
      const dropped = this.items.pop()!;
      this.keys.delete(dropped.indices.join(","));
    }
  }
}

/** The pure planner. Throws PlanCancelledError when shouldCancel() turns true. */
export function planMeasurements(request: PlanRequest, opts: PlanOptions = {}): PlanResult {
  const { params, criterion } = request;
  const keys = request.freeKeys as NumericParamKey[];
  const p = keys.length;
  const pp = p * p;
  const sigma = sigmaPerPointRad(request.noise);
  const candidates = buildCandidates(request);
  const C = candidates.length;
  const N = request.points;
  const { label, unit } = criterionText(criterion);

  const conditions: ModelCondition[] = candidates.map((c) => ({
    wavelengthNm: c.wavelengthNm,
    temperatureK: c.temperatureK,
    fieldT: c.fieldT,
    lengthM: request.lengthM,
    quantity: "rotation",
  }));
  const checkCancel = () => {
    if (opts.shouldCancel?.()) throw new PlanCancelledError();
  };
  // Share of the progress bar taken by the Jacobian (most of the time when candidates are many).
  const JACOBIAN_SHARE = 0.4;
  const progress = (f: number) => opts.onProgress?.(Math.min(1, Math.max(0, JACOBIAN_SHARE + (1 - JACOBIAN_SHARE) * f)));
  // The Jacobian in slices (points sharing T and B are one spectrum call, so slices follow the
  // candidate order), for progress and Cancel between them.
  const valueJacobian = new Matrix(C, p);
  const SLICE = 512;
  for (let start = 0; start < C; start += SLICE) {
    const part = modelJacobian(params, keys, conditions.slice(start, start + SLICE));
    for (let i = 0; i < part.valueJacobian.rows; i++)
      for (let j = 0; j < p; j++) valueJacobian.set(start + i, j, part.valueJacobian.get(i, j));
    checkCancel();
    opts.onProgress?.((JACOBIAN_SHARE * Math.min(C, start + SLICE)) / C);
  }
  const jac = { valueJacobian };
  // Scaled parameters (value, or 1 where the value is 0) so F is well conditioned in any units.
  const scale = keys.map((k) => Math.abs(params[k] as number) || 1);
  const info = new Float64Array(C * pp);
  for (let c = 0; c < C; c++) {
    for (let i = 0; i < p; i++) {
      const ji = jac.valueJacobian.get(c, i) * scale[i]!;
      for (let j = 0; j < p; j++) info[c * pp + i * p + j] = (ji * jac.valueJacobian.get(c, j) * scale[j]!) / (sigma * sigma);
    }
  }

  const spec = criterionSpec(request, keys, scale);
  const work = new Float64Array(2 * pp + 2 * p);
  const evaluate = (f: Float64Array, floor?: number) => criterionOf(f, p, spec, work, floor);

  let evaluated = 0;

  let totalDesigns = 0;
  for (let k = 1; k <= N; k++) totalDesigns += multisetCount(C, k);
  const method: PlanResult["method"] = totalDesigns <= (opts.exhaustiveLimit ?? EXHAUSTIVE_LIMIT) ? "exhaustive" : "greedy";

  const top = new TopK(request.topPlans);
  const sigmaVsPoints: { points: number; sigma: number }[] = [];

  if (method === "exhaustive") {
    const levels = Array.from({ length: N + 1 }, () => new Float64Array(pp));
    const stack = new Array<number>(N).fill(0);
    for (let size = 1; size <= N; size++) {
      const bestOfSize = new TopK(size === N ? request.topPlans : 1);
      const dfs = (start: number, depth: number) => {
        const parent = levels[depth]!;
        const child = levels[depth + 1]!;
        for (let c = start; c < C; c++) {
          child.set(parent);
          addScaled(child, info, c * pp, pp);
          stack[depth] = c;
          if (depth + 1 === size) {
            evaluated++;
            const v = evaluate(child);
            if (v < bestOfSize.worst() || bestOfSize.items.length < bestOfSize.capacity) bestOfSize.offer(stack.slice(0, size), v);
            if ((evaluated & 8191) === 0) {
              checkCancel();
              progress(evaluated / totalDesigns);
            }
          } else {
            dfs(c, depth + 1);
          }
        }
      };
      dfs(0, 0);
      sigmaVsPoints.push({ points: size, sigma: bestOfSize.items[0]?.value ?? Infinity });
      if (size === N) bestOfSize.items.forEach((d) => top.offer(d.indices, d.value));
    }
  } else {
    // Greedy addition under a tiny ridge (so the first p − 1 points, singular on their own, are
    // still ranked), then exchange. The ridge is 1e-9 of the largest single-point information.
    const ridge = new Float64Array(pp);
    for (let k = 0; k < p; k++) {
      let max = 0;
      for (let c = 0; c < C; c++) max = Math.max(max, info[c * pp + k * p + k]!);
      ridge[k * p + k] = 1e-9 * max;
    }
    const current = new Float64Array(pp);
    const trial = new Float64Array(pp);
    const chosen: number[] = [];
    const steps = N * C + 3 * N * C;
    for (let k = 1; k <= N; k++) {
      let bestC = 0;
      let bestV = Infinity;
      for (let c = 0; c < C; c++) {
        trial.set(current);
        addScaled(trial, info, c * pp, pp);
        addScaled(trial, ridge, 0, pp);
        evaluated++;
        const v = evaluate(trial, 0);
        if (v < bestV) {
          bestV = v;
          bestC = c;
        }
      }
      chosen.push(bestC);
      addScaled(current, info, bestC * pp, pp);
      sigmaVsPoints.push({ points: k, sigma: evaluate(current) });
      checkCancel();
      progress((k * C) / steps);
    }
    // Exchange: replace one point at a time by the candidate that lowers the criterion most.
    let bestValue = evaluate(current);
    const without = new Float64Array(pp);
    for (let pass = 0; pass < 3 && Number.isFinite(bestValue); pass++) {
      let improved = false;
      for (let pos = 0; pos < N; pos++) {
        without.set(current);
        addScaled(without, info, chosen[pos]! * pp, pp, -1);
        for (let c = 0; c < C; c++) {
          if (c === chosen[pos]) continue;
          trial.set(without);
          addScaled(trial, info, c * pp, pp);
          evaluated++;
          const v = evaluate(trial);
          if (v < bestValue * (1 - 1e-12)) {
            bestValue = v;
            chosen[pos] = c;
            current.set(trial);
            improved = true;
            without.set(current);
            addScaled(without, info, c * pp, pp, -1);
          }
        }
        checkCancel();
        progress((N * C + (pass * N + pos + 1) * C) / steps);
      }
      if (!improved) break;
    }
    const last = sigmaVsPoints[N - 1];
    if (last) last.sigma = Math.min(last.sigma, bestValue);
    top.offer(chosen, bestValue);
    // Ranked alternatives: the best plan with one point exchanged.
    for (let pos = 0; pos < N; pos++) {
      without.set(current);
      addScaled(without, info, chosen[pos]! * pp, pp, -1);
      for (let c = 0; c < C; c++) {
        if (c === chosen[pos]) continue;
        trial.set(without);
        addScaled(trial, info, c * pp, pp);
        evaluated++;
        const v = evaluate(trial);
        if (v < top.worst()) {
          const alt = [...chosen];
          alt[pos] = c;
          top.offer(alt, v);
        }
      }
    }
  }
  progress(1);

  const evaluation = evaluateModel(params, conditions);
  const plans = top.items.map((d, i) =>
    describePlan({ request, keys, scale, candidates, jac: jac.valueJacobian, evaluation, sigma, design: d, rank: i + 1, spec }),
  );
  const lineRatios = computeLineRatios(request);
  return {
    criterion,
    criterionLabel: label,
    criterionUnit: unit,
    freeKeys: keys,
    candidateCount: C,
    method,
    designsEvaluated: evaluated,
    sigmaPerPointRad: sigma,
    plans,
    sigmaVsPoints,
    lineRatios,
    notes: planNotes({ request, candidates, plans, lineRatios }),
  };
}

/** The criterion as a linear functional h of the scaled parameters, or D-optimal. */
function criterionSpec(request: PlanRequest, keys: NumericParamKey[], scale: number[]): CriterionSpec {
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

function describePlan(o: {
  request: PlanRequest;
  keys: NumericParamKey[];
  scale: number[];
  candidates: PlanCandidate[];
  jac: Matrix;
  evaluation: { value: Float64Array; magneticShare: Float64Array };
  sigma: number;
  design: Design;
  rank: number;
  spec: CriterionSpec;
}): RankedPlan {
  const counts = new Map<number, number>();
  for (const c of o.design.indices) counts.set(c, (counts.get(c) ?? 0) + 1);
  const points: PlanPoint[] = [...counts.entries()].map(([c, count]) => {
    const rotationRad = o.evaluation.value[c]!;
    const snr = Math.abs(rotationRad) / o.sigma;
    return {
      ...o.candidates[c]!,
      count,
      rotationRad,
      magneticShare: o.evaluation.magneticShare[c]!,
      signalToNoise: snr,
      belowNoise: snr < 1,
    };
  });
  const p = o.keys.length;
  const separable = Number.isFinite(o.design.value);
  let partsCorrelation: number | null = null;
  const parameterSigma: Record<string, number> = {};
  let expectedSigma = o.design.value;
  if (separable) {
    // The reported figures from ml-matrix: F = Jsᵀ W Js over the distinct points, W = count/σ².
    const rows = points.map((pt) => o.keys.map((_, i) => o.jac.get(pt.index, i) * o.scale[i]!));
    const js = new Matrix(rows);
    const w = Matrix.diag(points.map((pt) => pt.count / (o.sigma * o.sigma)));
    const fisher = js.transpose().mmul(w).mmul(js);
    const covScaled = inverse(fisher);
    o.keys.forEach((k, i) => {
      parameterSigma[k] = Math.sqrt(covScaled.get(i, i)) * o.scale[i]!;
    });
    const ie = o.keys.indexOf("gyrationPerT");
    const im = o.keys.indexOf("magneticScale");
    if (ie >= 0 && im >= 0) partsCorrelation = covScaled.get(ie, im) / Math.sqrt(covScaled.get(ie, ie) * covScaled.get(im, im));
    if (o.spec.kind === "linear") {
      const h = Matrix.columnVector(Array.from(o.spec.h));
      expectedSigma = Math.sqrt(h.transpose().mmul(covScaled).mmul(h).get(0, 0));
    } else {
      expectedSigma = Math.pow(determinant(covScaled), 1 / (2 * p));
    }
  }
  points.sort((a, b) => a.wavelengthNm - b.wavelengthNm || a.temperatureK - b.temperatureK || a.fieldT - b.fieldT);
  return { rank: o.rank, points, expectedSigma: separable ? expectedSigma : Infinity, separable, partsCorrelation, parameterSigma };
}

function computeLineRatios(request: PlanRequest): LineRatio[] {
  const { params } = request;
  const distinct = [...new Set(request.lines.map((l) => l.wavelengthNm))].sort((a, b) => a - b);
  const arrays = computeSpectrumArrays({
    ...params,
    fieldT: params.fieldT || 1,
    lengthM: request.lengthM,
    wavelengthsNm: distinct,
    method: "analytic",
  });
  return request.lines.map((line) => {
    const j = distinct.indexOf(line.wavelengthNm);
    const electricRad = arrays.thetaElectricRad[j]!;
    const magneticRad = arrays.thetaMagneticRad[j]!;
    return {
      lineName: line.name,
      wavelengthNm: line.wavelengthNm,
      electricRad,
      magneticRad,
      magneticOverElectric: electricRad === 0 ? null : magneticRad / electricRad,
    };
  });
}

const fmt = (x: number, digits = 3) => (Number.isFinite(x) ? Number(x.toPrecision(digits)).toString() : "∞");

/** What the model implies for this request, in words. */
export function planNotes(o: {
  request: PlanRequest;
  candidates: PlanCandidate[];
  plans: RankedPlan[];
  lineRatios: LineRatio[];
}): string[] {
  const { request } = o;
  const notes: string[] = [];
  const diamagnetic = hasDiamagneticTerm(request.params);
  const keys = new Set(request.freeKeys);
  const separatesParts = keys.has("gyrationPerT") && keys.has("magneticScale");
  if (!diamagnetic) {
    notes.push(
      "In this model both parts scale with the static magnetization M0, so a lower temperature and a higher field raise the signal but do not by themselves separate the parts: the wavelength span does.",
    );
  } else {
    notes.push(
      "The diamagnetic term is on: it does not scale with M0, so temperature and field also change the magnetic share and carry some separating information; the wavelength span still does most of it.",
    );
  }
  const wavelengths = new Set(request.lines.map((l) => l.wavelengthNm));
  if (wavelengths.size === 1 && separatesParts && !diamagnetic) {
    notes.push(
      `Only one wavelength (${[...wavelengths][0]} nm): at one wavelength every temperature and field gives the two parts in the same ratio, so no set of points can tell them apart. Add a second line.`,
    );
  }
  const ratios = o.lineRatios.filter((r) => r.magneticOverElectric !== null);
  if (ratios.length >= 2) {
    const sorted = [...ratios].sort((a, b) => a.magneticOverElectric! - b.magneticOverElectric!);
    const lo = sorted[0]!;
    const hi = sorted[sorted.length - 1]!;
    notes.push(
      `The ratio of the magnetic to the electric part runs from ${fmt(lo.magneticOverElectric!)} (${lo.lineName}, ${lo.wavelengthNm} nm) to ${fmt(hi.magneticOverElectric!)} (${hi.lineName}, ${hi.wavelengthNm} nm); the wider that spread between the chosen lines, the better the parts separate.`,
    );
  }
  const best = o.plans[0];
  if (best && !best.separable) {
    notes.push(
      `No plan of ${request.points} point(s) separates the free parameters (${request.freeKeys.join(", ")}): their effects on the rotation are proportional at every candidate point.`,
    );
  }
  if (best && best.separable && o.candidates.length > 0 && !diamagnetic) {
    const minT = Math.min(...o.candidates.map((c) => c.temperatureK));
    const maxAbsB = Math.max(...o.candidates.map((c) => Math.abs(c.fieldT)));
    if (best.points.every((pt) => pt.temperatureK === minT && Math.abs(pt.fieldT) === maxAbsB)) {
      notes.push(
        `Every point of the best plan sits at the lowest temperature (${minT} K) and the highest field (${maxAbsB} T): there M0, and so the signal, is largest.`,
      );
    }
  }
  if (best && best.points.some((pt) => pt.belowNoise)) {
    notes.push(
      "Some points of the best plan are below the noise of one measurement (flagged): they still add information through repetition, but check the noise figure.",
    );
  }
  return notes;
}
