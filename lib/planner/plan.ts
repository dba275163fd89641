import type { NoiseModel } from "@/lib/analysis/definition";
import type { ModelCondition } from "@/lib/fit/model";
import type { ModelParams } from "@/lib/physics/schema";
import { computeSpectrumArrays } from "@/lib/physics/spectrum";
import { seededRandom } from "@/lib/random";
import {
  type AnalysisLayout,
  type NoiseInputs,
  analysisLayout,
  criterionSpec,
  detectionAlternative,
  planFigures,
  pointInformation,
  priorInformation,
} from "./fisher";
import type { CriterionSpec } from "./information";
import { criterionText, planNotes } from "./notes";
import { candidateOptics } from "./optics";
import type { LineRatio, PlanCandidate, PlanPoint, PlanPointFlag, PlanResult, RangeEnd, RankedPlan } from "./plan-result";
import { type Design, type SearchProblem, type SearchResult, TopK, searchDesigns } from "./search";
import { type PlanRequest, fieldValues, sigmaPerPointRad, temperatureValues } from "./schema";

/*
 * The measurement planner: which line × temperature × field points, and how often each, serve the
 * analysis the fit will run (the request's analysis definition) best, under the laboratory's noise
 * and the light that gets through. Candidates below the minimum transmission are dropped before
 * the search (and, if asked, those past a quarter turn); the Fisher information of the rest is
 * fisher.ts, the search over designs search.ts, the words notes.ts. With a robust range the
 * criterion is averaged (or its worst case taken) over a seeded Latin-hypercube sample of it
 * (common practice, no source), and the chosen plan is shown at the range's ends.
 */

export type { LineRatio, PlanCandidate, PlanPoint, PlanResult, RankedPlan } from "./plan-result";
export { EXHAUSTIVE_LIMIT, multisetCount } from "./search";
export { criterionText, planNotes } from "./notes";

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

/** Every line × temperature × field of the request (0 T dropped: it rotates nothing). */
export function buildCandidates(request: PlanRequest): PlanCandidate[] {
  const temps = temperatureValues(request.temperatures);
  const fields = fieldValues(request.fields).filter((b) => b !== 0);
  const out: PlanCandidate[] = [];
  // Temperature and field outermost: the lines at one (T, B) are one spectrum call of the model.
  for (const temperatureK of temps)
    for (const fieldT of fields)
      for (const line of request.lines)
        out.push({
          index: out.length,
          lineName: line.name,
          wavelengthNm: line.wavelengthNm,
          temperatureK,
          fieldT,
          powerW: line.powerW ?? null,
        });
  return out;
}

/** The laboratory noise of a request (the shared noise model). */
export function requestNoiseModel(request: PlanRequest): NoiseModel {
  return {
    absoluteRad: sigmaPerPointRad(request.noise),
    relativeFloor: request.optics.relativeFloor,
    minTransmission: request.optics.minTransmission,
  };
}

const conditionsOf = (request: PlanRequest, candidates: readonly PlanCandidate[]): ModelCondition[] =>
  candidates.map((c) => ({
    wavelengthNm: c.wavelengthNm,
    temperatureK: c.temperatureK,
    fieldT: c.fieldT,
    lengthM: request.lengthM,
    quantity: "rotation",
  }));

/** Detected light relative to the reference power (1 when either is unknown). */
const powerFactors = (request: PlanRequest, candidates: readonly PlanCandidate[]) =>
  candidates.map((c) => (request.optics.referencePowerW && c.powerW ? c.powerW / request.optics.referencePowerW : 1));

/** Share of the progress bar taken by the Jacobians (most of the time when candidates are many). */
const JACOBIAN_SHARE = 0.4;

/** The candidates the search may propose: above the minimum transmission and, if asked, within a quarter turn. */
function feasibleCandidates(request: PlanRequest, all: PlanCandidate[]) {
  const optics = candidateOptics(request.params, conditionsOf(request, all));
  let lowTransmission = 0;
  let wrapped = 0;
  const kept = all.filter((_, i) => {
    if (!(optics.transmission[i]! >= request.optics.minTransmission)) {
      lowTransmission++;
      return false;
    }
    if (request.optics.excludeWrapped && Math.abs(optics.thetaRad[i]!) > Math.PI / 2) {
      wrapped++;
      return false;
    }
    return true;
  });
  return { kept: kept.map((c, index) => ({ ...c, index })), excluded: { lowTransmission, wrapped } };
}

/** The parameter samples of the robust design: a seeded Latin hypercube over the ranges, the rest at the set's values. */
export function robustSamples(request: PlanRequest): ModelParams[] {
  const robust = request.robust;
  if (!robust) return [request.params];
  const random = seededRandom(robust.seed);
  const n = robust.samples;
  const samples: Record<string, unknown>[] = Array.from({ length: n }, () => ({ ...request.params }));
  for (const range of robust.ranges) {
    const strata = Array.from({ length: n }, (_, i) => i);
    for (let i = n - 1; i > 0; i--) {
      const j = Math.floor(random() * (i + 1));
      [strata[i], strata[j]] = [strata[j]!, strata[i]!];
    }
    strata.forEach((stratum, i) => {
      samples[i]![range.key] = range.min + ((stratum + random()) / n) * (range.max - range.min);
    });
  }
  return samples as ModelParams[];
}

/** The pure planner. Throws PlanCancelledError when shouldCancel() turns true. */
export function planMeasurements(request: PlanRequest, opts: PlanOptions = {}): PlanResult {
  const { params, criterion, definition } = request;
  const noise = requestNoiseModel(request);
  const { label, unit } = criterionText(criterion);
  const all = buildCandidates(request);
  const { kept: candidates, excluded } = feasibleCandidates(request, all);
  const C = candidates.length;
  const layout = analysisLayout(definition, params);
  const alternative = detectionAlternative(criterion, definition, params);
  const conditions = conditionsOf(request, candidates);
  const noiseInputs: NoiseInputs = { noise, powerFactor: powerFactors(request, candidates) };
  const checkCancel = () => {
    if (opts.shouldCancel?.()) throw new PlanCancelledError();
  };

  const samples = robustSamples(request);
  const S = samples.length;
  const pp = layout.p * layout.p;
  const info = new Float64Array(C * S * pp);
  samples.forEach((sample, s) => {
    const part = pointInformation(sample, layout, conditions, noiseInputs, (done) => {
      checkCancel();
      opts.onProgress?.((JACOBIAN_SHARE * (s * C + done)) / Math.max(1, S * C));
    });
    for (let c = 0; c < C; c++) info.set(part.info.subarray(c * pp, (c + 1) * pp), (c * S + s) * pp);
  });
  const specs = samples.map((sample) => criterionSpec(criterion, layout, sample, request.lengthM, alternative));
  const prior = priorInformation(layout, criterion.kind === "detect");
  const base = new Float64Array(S * pp);
  for (let s = 0; s < S; s++) base.set(prior, s * pp);

  const progress = (f: number) => opts.onProgress?.(Math.min(1, Math.max(0, JACOBIAN_SHARE + (1 - JACOBIAN_SHARE) * f)));
  const problem: SearchProblem = {
    info,
    candidateCount: C,
    p: layout.p,
    points: request.points,
    topPlans: request.topPlans,
    spec: specs[0]!,
    specs,
    base,
    aggregate: request.robust?.mode ?? "average",
    checkCancel,
    progress,
  };
  const { search, designs } = C === 0 ? emptySearch() : diverseSearch(problem, candidates, request.topPlans, opts.exhaustiveLimit);
  progress(1);

  const nominalSpec = criterionSpec(criterion, layout, params, request.lengthM, alternative);
  const describe = (d: Design, rank: number) =>
    describePlan({ request, layout, candidates, noiseInputs, design: d, rank, spec: nominalSpec, alternative });
  const plans = designs.map((d, i) => describe(d, i + 1));
  const ends = request.robust && plans[0] ? rangeEnds(request, layout, candidates, noiseInputs, plans[0], alternative) : [];
  const usable = new Set(candidates.map((c) => c.wavelengthNm));
  const lineRatios = computeLineRatios(request).filter((r) => usable.has(r.wavelengthNm));
  const result: PlanResult = {
    criterion,
    criterionLabel: label,
    criterionUnit: unit,
    definition,
    freeKeys: layout.names,
    noise,
    candidateCount: all.length,
    excluded,
    method: search.method,
    designsEvaluated: search.evaluated,
    sigmaPerPointRad: noise.absoluteRad,
    robust: request.robust ? { mode: request.robust.mode, samples: S, ends } : null,
    plans,
    sigmaVsPoints: search.sigmaVsPoints,
    lineRatios,
    notes: [],
  };
  result.notes = planNotes({ request, candidates, result });
  return result;
}

function emptySearch(): { search: SearchResult; designs: Design[] } {
  return { search: { method: "exhaustive", top: new TopK(1), sigmaVsPoints: [], evaluated: 0 }, designs: [] };
}

/** Two plans are near-duplicates when they use the same lines at the same temperatures. */
const diversityKey = (d: Design, candidates: readonly PlanCandidate[]) => {
  const lines = [...new Set(d.indices.map((c) => candidates[c]!.wavelengthNm))].sort((a, b) => a - b);
  const temps = [...new Set(d.indices.map((c) => candidates[c]!.temperatureK))].sort((a, b) => a - b);
  return `${lines.join(",")}|${temps.join(",")}`;
};

/**
 * The best plan and diverse alternatives: the search's own runners-up, and the best plan found
 * with each of the best plan's lines withheld in turn; of the plans using the same lines at the
 * same temperatures only the best is kept, so the list is not five near-copies of one plan.
 */
function diverseSearch(
  problem: SearchProblem,
  candidates: readonly PlanCandidate[],
  topPlans: number,
  exhaustiveLimit: number | undefined,
): { search: SearchResult; designs: Design[] } {
  const search = searchDesigns({ ...problem, topPlans: topPlans * 10 }, exhaustiveLimit);
  const pool: Design[] = [...search.top.items];
  const best = pool[0];
  if (best && Number.isFinite(best.value) && topPlans > 1) {
    const lines = [...new Set(best.indices.map((c) => candidates[c]!.wavelengthNm))];
    for (const withheld of lines.slice(0, topPlans - 1)) {
      const allowed = Uint8Array.from(candidates, (c) => (c.wavelengthNm === withheld ? 0 : 1));
      const alt = searchDesigns({ ...problem, allowed, topPlans: 1, progress: () => undefined }, exhaustiveLimit);
      search.evaluated += alt.evaluated;
      pool.push(...alt.top.items);
    }
  }
  const byKey = new Map<string, Design>();
  for (const d of pool) {
    const key = diversityKey(d, candidates);
    const seen = byKey.get(key);
    if (!seen || d.value < seen.value) byKey.set(key, d);
  }
  const ranked = [...byKey.values()].sort((a, b) => a.value - b.value);
  // Plans that cannot separate the parameters are shown only when no plan can.
  const finite = ranked.filter((d) => Number.isFinite(d.value));
  const designs = (finite.length > 0 ? finite : ranked).slice(0, topPlans);
  return { search, designs };
}

const WRAP_RAD = Math.PI / 2;

/** The plan's distinct points with counts, as positions in `candidates`. */
const countsOf = (d: Design) => {
  const counts = new Map<number, number>();
  for (const c of d.indices) counts.set(c, (counts.get(c) ?? 0) + 1);
  return [...counts.entries()].map(([at, count]) => ({ at, count }));
};

/** A design as the results show it: its distinct points with predictions and flags, σ figures, detection and cost. */
function describePlan(o: {
  request: PlanRequest;
  layout: AnalysisLayout;
  candidates: readonly PlanCandidate[];
  noiseInputs: NoiseInputs;
  design: Design;
  rank: number;
  spec: CriterionSpec;
  alternative: number;
}): RankedPlan {
  const counted = countsOf(o.design);
  const chosen = counted.map((c) => o.candidates[c.at]!);
  const local = pointInformation(o.request.params, o.layout, conditionsOf(o.request, chosen), {
    noise: o.noiseInputs.noise,
    powerFactor: counted.map((c) => o.noiseInputs.powerFactor[c.at]!),
  });
  const figures = planFigures({
    layout: o.layout,
    info: local.info,
    points: counted.map((c, i) => ({ at: i, count: c.count })),
    spec: o.spec,
    alternative: o.alternative,
    asimov: { params: o.request.params, conditions: conditionsOf(o.request, chosen), sigma: local.sigmaRad },
  });
  const points: PlanPoint[] = counted.map((c, i) => {
    const rotationRad = local.thetaRad[i]!;
    const snr = Math.abs(rotationRad) / local.sigmaRad[i]!;
    const flags: PlanPointFlag[] = [];
    if (Math.abs(rotationRad) > WRAP_RAD) flags.push("phase-wrap");
    if (snr < 1) flags.push("below-noise");
    return {
      ...chosen[i]!,
      count: c.count,
      rotationRad,
      transmission: local.transmission[i]!,
      sigmaRad: local.sigmaRad[i]!,
      magneticShare: local.magneticShare[i]!,
      signalToNoise: snr,
      belowNoise: snr < 1,
      flags,
    };
  });
  points.sort((a, b) => a.wavelengthNm - b.wavelengthNm || a.temperatureK - b.temperatureK || a.fieldT - b.fieldT);
  const measurements = o.design.indices.length;
  const { perPointS, perCooldownS, ambientK } = o.request.labTime;
  // A temperature within half a kelvin of the room's needs no cryostat (common practice, no source).
  const cooldowns = new Set(points.map((p) => p.temperatureK).filter((t) => Math.abs(t - ambientK) > 0.5)).size;
  return {
    rank: o.rank,
    points,
    expectedSigma: figures.expectedSigma,
    rankedValue: o.design.value,
    separable: figures.separable,
    partsCorrelation: figures.partsCorrelation,
    parameterSigma: figures.parameterSigma,
    detection: figures.detection,
    measurements,
    cooldowns,
    costHours: (measurements * perPointS + cooldowns * perCooldownS) / 3600,
  };
}

/** The chosen plan at both ends of every robust range, the other parameters at the set's values. */
function rangeEnds(
  request: PlanRequest,
  layout: AnalysisLayout,
  candidates: readonly PlanCandidate[],
  noiseInputs: NoiseInputs,
  plan: RankedPlan,
  alternative: number,
): RangeEnd[] {
  const byIndex = new Map(candidates.map((c, i) => [c.index, i]));
  const indices = plan.points.flatMap((p) => Array.from({ length: p.count }, () => byIndex.get(p.index)!));
  const out: RangeEnd[] = [];
  for (const range of request.robust?.ranges ?? []) {
    for (const end of ["min", "max"] as const) {
      const value = range[end];
      const params = { ...request.params, [range.key]: value } as ModelParams;
      // At an end of the magneticScale range the alternative the detection faces is that end.
      const alt = range.key === "magneticScale" ? value : alternative;
      const spec = criterionSpec(request.criterion, layout, params, request.lengthM, alt > 0 ? alt : alternative);
      const described = describePlan({
        request: { ...request, params },
        layout,
        candidates,
        noiseInputs,
        design: { indices, value: Number.NaN },
        rank: 1,
        spec,
        alternative: alt > 0 ? alt : alternative,
      });
      out.push({
        key: range.key,
        end,
        value,
        expectedSigma: described.expectedSigma,
        detectionSignificance: alt > 0 ? (described.detection?.significance ?? null) : 0,
      });
    }
  }
  return out;
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
