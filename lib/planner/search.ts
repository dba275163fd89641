import { type CriterionSpec, addScaled, criterionOf } from "./information";

/*
 * The planner's search over designs (multisets of candidate points). Every multiset of the
 * requested size while their number is small (exhaustive), else greedy addition of the point that
 * most improves the criterion, followed by single-point exchanges (a Fedorov-type exchange; common
 * practice, no source) until none helps.
 */

/** Largest number of designs (summed over 1…N points) that is searched exhaustively. */
export const EXHAUSTIVE_LIMIT = 300_000;

/** Number of multisets of size k from n, as a float (may be huge). */
export function multisetCount(n: number, k: number): number {
  let c = 1;
  for (let i = 1; i <= k; i++) c = (c * (n + i - 1)) / i;
  return c;
}

export interface Design {
  indices: number[];
  value: number;
}

/** Keeps the K best designs (lowest value), without duplicates. */
export class TopK {
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

/**
 * What a search needs: the per-candidate information (information.ts layout) and the criterion.
 * A candidate's block is one p×p information per parameter sample (the robust design evaluates a
 * design at several samples of the prior ranges at once); a design's criterion aggregates the
 * samples' criteria by `aggregate`.
 */
export interface SearchProblem {
  /** Row-major p×p information per sample, samples after each other, candidate after candidate. */
  info: Float64Array;
  candidateCount: number;
  /** Number of varied parameters (free ones and nuisances). */
  p: number;
  /** Information every design starts from (the priors), one p×p per sample; absent: zero. */
  base?: Float64Array;
  /** 1 where a candidate may be chosen; absent: all. */
  allowed?: Uint8Array;
  /** Per-sample criteria, one per block; absent: `spec` for one sample. */
  specs?: CriterionSpec[];
  /** How the samples' criteria combine (default "average"). */
  aggregate?: "average" | "worst";
  /** Points per design. */
  points: number;
  /** How many ranked designs to keep. */
  topPlans: number;
  spec: CriterionSpec;
  /** Called between steps; throws to cancel. */
  checkCancel: () => void;
  /** Fraction of the search done, 0…1. */
  progress: (fractionDone: number) => void;
}

export interface SearchResult {
  method: "exhaustive" | "greedy";
  top: TopK;
  /** Best criterion found for 1…N points. */
  sigmaVsPoints: { points: number; sigma: number }[];
  /** Designs whose criterion was evaluated. */
  evaluated: number;
}

/** The criterion of a summed information, with scratch of its own (one per search). */
type Evaluate = (f: Float64Array, floor?: number) => number;

function evaluator(problem: SearchProblem): Evaluate {
  const { p } = problem;
  const pp = p * p;
  const specs = problem.specs ?? [problem.spec];
  const work = new Float64Array(2 * p * p + 2 * p);
  if (specs.length === 1) return (f, floor) => criterionOf(f, p, specs[0]!, work, floor);
  const worst = problem.aggregate === "worst";
  return (f, floor) => {
    let acc = 0;
    for (let s = 0; s < specs.length; s++) {
      const v = criterionOf(f.subarray(s * pp, (s + 1) * pp), p, specs[s]!, work, floor);
      if (!Number.isFinite(v)) return Infinity;
      acc = worst ? Math.max(acc, v) : acc + v / specs.length;
    }
    return acc;
  };
}

/** Length of one candidate's information block (p² per sample). */
export const blockLength = (problem: SearchProblem) => problem.p * problem.p * (problem.specs?.length ?? 1);

const isAllowed = (problem: SearchProblem, c: number) => problem.allowed === undefined || problem.allowed[c] === 1;

/** Exhaustive when the designs of 1…N points number at most `exhaustiveLimit`, else greedy with exchanges. */
export function searchDesigns(problem: SearchProblem, exhaustiveLimit = EXHAUSTIVE_LIMIT): SearchResult {
  let totalDesigns = 0;
  const n = problem.allowed ? problem.allowed.reduce((a, b) => a + b, 0) : problem.candidateCount;
  for (let k = 1; k <= problem.points; k++) totalDesigns += multisetCount(n, k);
  return totalDesigns <= exhaustiveLimit ? exhaustiveSearch(problem, totalDesigns) : greedySearch(problem);
}

/** Every multiset of 1…N points, depth first, the information summed along the way. */
function exhaustiveSearch(problem: SearchProblem, totalDesigns: number): SearchResult {
  const { info, candidateCount: C, points: N, checkCancel, progress } = problem;
  const pp = blockLength(problem);
  const evaluate = evaluator(problem);
  let evaluated = 0;
  const top = new TopK(problem.topPlans);
  const sigmaVsPoints: { points: number; sigma: number }[] = [];
  const levels = Array.from({ length: N + 1 }, () => new Float64Array(pp));
  if (problem.base) levels[0]!.set(problem.base);
  const stack = new Array<number>(N).fill(0);
  for (let size = 1; size <= N; size++) {
    const bestOfSize = new TopK(size === N ? problem.topPlans : 1);
    const dfs = (start: number, depth: number) => {
      const parent = levels[depth]!;
      const child = levels[depth + 1]!;
      for (let c = start; c < C; c++) {
        if (!isAllowed(problem, c)) continue;
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
    if (size === N) for (const d of bestOfSize.items) top.offer(d.indices, d.value);
  }
  return { method: "exhaustive", top, sigmaVsPoints, evaluated };
}

/** Scratch and running state of the greedy search, shared by its phases. */
interface GreedyState {
  problem: SearchProblem;
  evaluate: Evaluate;
  pp: number;
  /** Information of the chosen design. */
  current: Float64Array;
  trial: Float64Array;
  without: Float64Array;
  chosen: number[];
  evaluated: number;
  /** Progress steps: N·C for the addition, 3·N·C for at most three exchange passes. */
  steps: number;
}

/** Greedy addition, exchange passes, then the best plan with one point exchanged as the alternatives. */
function greedySearch(problem: SearchProblem): SearchResult {
  const pp = blockLength(problem);
  const { candidateCount: C, points: N } = problem;
  if (problem.allowed && !problem.allowed.some((a) => a === 1))
    return { method: "greedy", top: new TopK(problem.topPlans), sigmaVsPoints: [], evaluated: 0 };
  const state: GreedyState = {
    problem,
    evaluate: evaluator(problem),
    pp,
    current: new Float64Array(pp),
    trial: new Float64Array(pp),
    without: new Float64Array(pp),
    chosen: [],
    evaluated: 0,
    steps: N * C + 3 * N * C,
  };
  if (problem.base) state.current.set(problem.base);
  const sigmaVsPoints = greedyAddition(state);
  const bestValue = exchangePasses(state);
  const last = sigmaVsPoints[N - 1];
  if (last) last.sigma = Math.min(last.sigma, bestValue);
  const top = new TopK(problem.topPlans);
  top.offer(state.chosen, bestValue);
  offerOneExchangeAlternatives(state, top);
  return { method: "greedy", top, sigmaVsPoints, evaluated: state.evaluated };
}

/**
 * Adds, N times, the candidate that lowers the criterion most, ranked under a tiny ridge (so the
 * first p − 1 points, singular on their own, are still ranked). The ridge is 1e-9 of the largest
 * single-point information. Returns the criterion after each addition.
 */
function greedyAddition(s: GreedyState): { points: number; sigma: number }[] {
  const { info, candidateCount: C, points: N, p, checkCancel, progress } = s.problem;
  const { pp, current, trial } = s;
  const ridge = new Float64Array(pp);
  for (let b = 0; b < pp; b += p * p) {
    for (let k = 0; k < p; k++) {
      let max = 0;
      for (let c = 0; c < C; c++) max = Math.max(max, info[c * pp + b + k * p + k]!);
      ridge[b + k * p + k] = 1e-9 * max;
    }
  }
  const sigmaVsPoints: { points: number; sigma: number }[] = [];
  for (let k = 1; k <= N; k++) {
    let bestC = -1;
    let bestV = Infinity;
    for (let c = 0; c < C; c++) {
      if (!isAllowed(s.problem, c)) continue;
      trial.set(current);
      addScaled(trial, info, c * pp, pp);
      addScaled(trial, ridge, 0, pp);
      s.evaluated++;
      const v = s.evaluate(trial, 0);
      if (v < bestV || bestC < 0) {
        bestV = v;
        bestC = c;
      }
    }
    if (bestC < 0) break;
    s.chosen.push(bestC);
    addScaled(current, info, bestC * pp, pp);
    sigmaVsPoints.push({ points: k, sigma: s.evaluate(current) });
    checkCancel();
    progress((k * C) / s.steps);
  }
  return sigmaVsPoints;
}

/** Sets `without` to the chosen design less its point at `pos`. */
function removeChosen(s: GreedyState, pos: number): void {
  s.without.set(s.current);
  addScaled(s.without, s.problem.info, s.chosen[pos]! * s.pp, s.pp, -1);
}

/** The criterion of `without` plus candidate c (left in `trial`). */
function withCandidate(s: GreedyState, c: number): number {
  s.trial.set(s.without);
  addScaled(s.trial, s.problem.info, c * s.pp, s.pp);
  s.evaluated++;
  return s.evaluate(s.trial);
}

/** Replaces one point at a time by the candidate that lowers the criterion most, for at most three passes; returns the final criterion. */
function exchangePasses(s: GreedyState): number {
  const { candidateCount: C, points: N, checkCancel, progress } = s.problem;
  const { current, trial, chosen } = s;
  let bestValue = s.evaluate(current);
  for (let pass = 0; pass < 3 && Number.isFinite(bestValue); pass++) {
    let improved = false;
    for (let pos = 0; pos < N; pos++) {
      removeChosen(s, pos);
      for (let c = 0; c < C; c++) {
        if (c === chosen[pos] || !isAllowed(s.problem, c)) continue;
        const v = withCandidate(s, c);
        if (v < bestValue * (1 - 1e-12)) {
          bestValue = v;
          chosen[pos] = c;
          current.set(trial);
          improved = true;
          removeChosen(s, pos);
        }
      }
      checkCancel();
      progress((N * C + (pass * N + pos + 1) * C) / s.steps);
    }
    if (!improved) break;
  }
  return bestValue;
}

/** Ranked alternatives: the best plan with one point exchanged. */
function offerOneExchangeAlternatives(s: GreedyState, top: TopK): void {
  const { candidateCount: C, points: N } = s.problem;
  const { chosen } = s;
  for (let pos = 0; pos < N; pos++) {
    removeChosen(s, pos);
    for (let c = 0; c < C; c++) {
      if (c === chosen[pos] || !isAllowed(s.problem, c)) continue;
      const v = withCandidate(s, c);
      if (v < top.worst()) {
        const alt = [...chosen];
        alt[pos] = c;
        top.offer(alt, v);
      }
    }
  }
}
