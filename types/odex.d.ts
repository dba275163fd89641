// odex ships no usable declarations (its own src/odex.ts fails strict checks); this covers what we use.
export type Derivative = (x: number, y: number[]) => number[];
// biome-ignore lint/suspicious/noConfusingVoidType: odex stops only on an explicit `false`; callbacks without a return must type-check.
export type OutputFunction = (nr: number, xold: number, x: number, y: number[], dense?: (c: number, x: number) => number) => boolean | void;
export interface SolverResult {
  y: number[];
  outcome: number;
  nStep: number;
  xEnd: number;
  nAccept: number;
  nReject: number;
  nEval: number;
}
export declare class Solver {
  constructor(n: number);
  n: number;
  uRound: number;
  maxSteps: number;
  initialStepSize: number;
  maxStepSize: number;
  maxExtrapolationColumns: number;
  stepSizeSequence: number;
  stabilityCheckCount: number;
  stabilityCheckTableLines: number;
  denseOutput: boolean;
  denseOutputErrorEstimator: boolean;
  denseComponents: number[] | undefined;
  interpolationFormulaDegree: number;
  stepSizeReductionFactor: number;
  stepSizeFac1: number;
  stepSizeFac2: number;
  stepSizeFac3: number;
  stepSizeFac4: number;
  stepSafetyFactor1: number;
  stepSafetyFactor2: number;
  relativeTolerance: number | number[];
  absoluteTolerance: number | number[];
  debug: boolean;
  solve(f: Derivative, x: number, y0: number[], xEnd: number, solOut?: OutputFunction): SolverResult;
  grid(dt: number, out: (x: number, y: number[]) => void): OutputFunction;
}
export declare enum Outcome {
  Converged = 0,
  MaxStepsExceeded = 1,
  EarlyReturn = 2,
}
