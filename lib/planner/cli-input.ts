import { DEFAULT_FREE_KEYS, FREEABLE_KEYS, type FreeableKey, NATURAL_LOWER, type Prior } from "@/lib/analysis/definition";
import { zodIssueLines } from "@/lib/contracts/validation";
import { parseParameterFile } from "@/lib/fit/cli-input";
import { type PlanResult, planMeasurements } from "./plan";
import { type PlanCriterion, type PlanRequestInput, planRequestSchema } from "./schema";
import { TextInputError, parsePriorText } from "./text-input";

/*
 * The inputs of the plan command line, pure so they can be tested without a process: the
 * parameter file (the spectrum command line's file without wavelengthsNm, read as the fit's
 * command line reads it) and the flags. Every problem is one line.
 */

export class PlanInputError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "PlanInputError";
  }
}

export const PLAN_USAGE =
  "usage: npm run --silent plan -- --params P.json [--points N] [--free a,b,c] [--prior KEY=MEAN:SIGMA] " +
  "[--criterion detect|share|scale|d-optimal] [--lines 405,532,…] [--temperatures 293.15,77] [--fields 0.5,1] " +
  "[--noise-rad X] [--relative-floor X] [--min-transmission X]";

/** Ordinary laser lines (common practice, no source) when --lines is not given. */
export const DEFAULT_CLI_LINES_NM = [405, 532, 632.8, 800, 1064, 1550];
/** Polarimeter noise per point at full transmission when --noise-rad is not given: 1 µrad. */
export const DEFAULT_CLI_NOISE_RAD = 1e-6;
/** The wavelength of the share criterion (the Nd:YAG line). */
const SHARE_WAVELENGTH_NM = 1064;

export interface PlanArgs {
  paramsFile: string;
  points: number;
  free: FreeableKey[];
  priors: Prior[];
  criterion: "detect" | "share" | "scale" | "d-optimal";
  linesNm: number[] | null;
  temperaturesK: number[] | null;
  fieldsT: number[] | null;
  noiseRad: number;
  relativeFloor: number;
  minTransmission: number;
}

const CRITERIA = ["detect", "share", "scale", "d-optimal"] as const;

function numberList(flag: string, text: string): number[] {
  const parts = text.split(",").map((s) => s.trim());
  return parts.map((s) => {
    const x = Number(s);
    if (s === "" || !Number.isFinite(x)) throw new PlanInputError(`${flag}: "${s}" is not a number (give a comma-separated list)`);
    return x;
  });
}

function oneNumber(flag: string, text: string): number {
  const x = Number(text);
  if (text.trim() === "" || !Number.isFinite(x)) throw new PlanInputError(`${flag}: "${text}" is not a number`);
  return x;
}

const isFreeable = (key: string): key is FreeableKey => (FREEABLE_KEYS as readonly string[]).includes(key);

function parsePrior(text: string): Prior {
  try {
    return parsePriorText(text);
  } catch (err) {
    if (err instanceof TextInputError) throw new PlanInputError(`--prior: ${err.message}`);
    throw err;
  }
}

export function parsePlanArgs(argv: readonly string[]): PlanArgs {
  const args = argv.filter((a) => a !== "--");
  const out: Partial<PlanArgs> & { priors: Prior[] } = { priors: [] };
  let freeList: string | undefined;
  for (let i = 0; i < args.length; i++) {
    const a = args[i]!;
    const [flag, inline] =
      a.startsWith("--") && a.includes("=") && !a.startsWith("--prior=")
        ? [a.slice(0, a.indexOf("=")), a.slice(a.indexOf("=") + 1)]
        : a.startsWith("--prior=")
          ? ["--prior", a.slice("--prior=".length)]
          : [a, undefined];
    const value = () => {
      const v = inline ?? args[++i];
      if (v === undefined || v === "") throw new PlanInputError(`${flag}: needs a value; ${PLAN_USAGE}`);
      return v;
    };
    if (flag === "--params") out.paramsFile = value();
    else if (flag === "--points") {
      const n = oneNumber(flag, value());
      if (!Number.isInteger(n) || n < 1) throw new PlanInputError("--points: must be a whole number ≥ 1");
      out.points = n;
    } else if (flag === "--free") freeList = value();
    else if (flag === "--prior") out.priors.push(parsePrior(value()));
    else if (flag === "--criterion") {
      const c = value();
      if (!(CRITERIA as readonly string[]).includes(c))
        throw new PlanInputError(`--criterion: "${c}" is not one of ${CRITERIA.join(", ")}`);
      out.criterion = c as PlanArgs["criterion"];
    } else if (flag === "--lines") out.linesNm = numberList(flag, value());
    else if (flag === "--temperatures") out.temperaturesK = numberList(flag, value());
    else if (flag === "--fields") out.fieldsT = numberList(flag, value());
    else if (flag === "--noise-rad") out.noiseRad = oneNumber(flag, value());
    else if (flag === "--relative-floor") out.relativeFloor = oneNumber(flag, value());
    else if (flag === "--min-transmission") out.minTransmission = oneNumber(flag, value());
    else throw new PlanInputError(`${a}: unknown argument; ${PLAN_USAGE}`);
  }
  if (!out.paramsFile) throw new PlanInputError(`--params is required; ${PLAN_USAGE}`);
  const keys = freeList === undefined ? DEFAULT_FREE_KEYS : freeList.split(",").map((k) => k.trim());
  for (const key of keys) {
    if (!isFreeable(key)) {
      throw new PlanInputError(`--free: "${key}" is not a model parameter that a fit can free (choose from ${FREEABLE_KEYS.join(", ")})`);
    }
  }
  if (new Set(keys).size !== keys.length) throw new PlanInputError("--free: a parameter is listed twice");
  return {
    paramsFile: out.paramsFile,
    points: out.points ?? 6,
    free: keys as FreeableKey[],
    priors: out.priors,
    criterion: out.criterion ?? "detect",
    linesNm: out.linesNm ?? null,
    temperaturesK: out.temperaturesK ?? null,
    fieldsT: out.fieldsT ?? null,
    noiseRad: out.noiseRad ?? DEFAULT_CLI_NOISE_RAD,
    relativeFloor: out.relativeFloor ?? 0,
    minTransmission: out.minTransmission ?? 0.01,
  };
}

const criterionOf = (c: PlanArgs["criterion"]): PlanCriterion =>
  c === "detect"
    ? { kind: "detect" }
    : c === "share"
      ? { kind: "share", wavelengthNm: SHARE_WAVELENGTH_NM }
      : c === "scale"
        ? { kind: "magneticScale" }
        : { kind: "dOptimal" };

/** The planner request of the command line (the set's own temperature and field when none are given). */
export function planRequestFromArgs(args: PlanArgs, params: ReturnType<typeof parseParameterFile>): PlanRequestInput {
  return {
    params,
    lines: (args.linesNm ?? DEFAULT_CLI_LINES_NM).map((w) => ({ name: `${w} nm`, wavelengthNm: w })),
    temperatures: { valuesK: args.temperaturesK ?? [params.temperatureK] },
    fields: { valuesT: args.fieldsT ?? [params.fieldT] },
    lengthM: params.lengthM,
    noise: { kind: "sigma", sigmaRad: args.noiseRad },
    optics: { relativeFloor: args.relativeFloor, minTransmission: args.minTransmission },
    points: args.points,
    criterion: criterionOf(args.criterion),
    definition: {
      free: args.free.map((key) => (NATURAL_LOWER[key] === undefined ? { key } : { key, min: NATURAL_LOWER[key] })),
      priors: args.priors,
    },
  };
}

const finiteOrNull = (x: number | undefined) => (x !== undefined && Number.isFinite(x) ? x : null);

/** The command line's JSON: exactly the documented keys, for the best plan. */
export function planOutput(result: PlanResult, criterion: PlanArgs["criterion"]) {
  const best = result.plans[0]!;
  return {
    free: result.freeKeys,
    criterion,
    points: best.points.map((p) => ({
      wavelengthNm: p.wavelengthNm,
      temperatureK: p.temperatureK,
      fieldT: p.fieldT,
      repeats: p.count,
      predictedThetaRad: p.rotationRad,
      transmission: p.transmission,
      flags: p.flags,
    })),
    expected: {
      sigmas: Object.fromEntries(result.freeKeys.map((k) => [k, finiteOrNull(best.parameterSigma[k])])),
      detectionSigma: finiteOrNull(best.detection?.significance),
    },
  };
}

const oneLine = (s: string) => s.replace(/\s*[\r\n]+\s*/g, " ").trim();

export interface CommandRun {
  status: number;
  stdout: string;
  stderr: string;
}

/**
 * The whole command, with the file system passed in: status 0 and the JSON on stdout, the
 * planner's notes as "note:" lines on stderr; status 2 and one line for bad input; 1 for anything
 * unexpected.
 */
export function runPlanCommand(argv: readonly string[], readText: (path: string) => string): CommandRun {
  try {
    const args = parsePlanArgs(argv);
    let text: string;
    try {
      text = readText(args.paramsFile);
    } catch (err) {
      const code = (err as { code?: string }).code;
      throw new PlanInputError(
        `${args.paramsFile}: cannot read the parameter file (${code === "ENOENT" ? "no such file" : (code ?? "error")})`,
      );
    }
    let json: unknown;
    try {
      json = JSON.parse(text);
    } catch (err) {
      throw new PlanInputError(`${args.paramsFile}: malformed JSON (${(err as Error).message})`);
    }
    let params: ReturnType<typeof parseParameterFile>;
    try {
      params = parseParameterFile(json);
    } catch (err) {
      throw new PlanInputError(`${args.paramsFile}: ${(err as Error).message}`);
    }
    const parsed = planRequestSchema.safeParse(planRequestFromArgs(args, params));
    if (!parsed.success) throw new PlanInputError(zodIssueLines(parsed.error.issues, { rootLabel: "(request)" })[0]!);
    const result = planMeasurements(parsed.data);
    if (result.plans.length === 0) {
      throw new PlanInputError(
        `no candidate point passes the minimum transmission of ${args.minTransmission} (in this model): ` +
          "lower --min-transmission, use other --lines or a shorter sample",
      );
    }
    return {
      status: 0,
      stdout: `${JSON.stringify(planOutput(result, args.criterion), null, 2)}\n`,
      stderr: result.notes.map((n) => `note: ${oneLine(n)}\n`).join(""),
    };
  } catch (err) {
    if (err instanceof PlanInputError) return { status: 2, stdout: "", stderr: `${oneLine(err.message)}\n` };
    return { status: 1, stdout: "", stderr: `internal error: ${oneLine((err as Error).message)}\n` };
  }
}
