import { z } from "zod";
import type { MeasuredPoint } from "@/lib/measurements/point";
import { type ColumnMapping, DEFAULT_COLUMNS, parseMeasurementTable, readTable } from "@/lib/measurements/parse";
import { type ModelParams, conditionsShape, formatIssues, materialShape, modelParamsSchema } from "@/lib/physics/schema";
import { zodIssueLines } from "@/lib/contracts/validation";
import { DEFAULT_FREE_KEYS, FREEABLE_KEYS, type FreeParam, type FreeableKey, type Prior, priorSchema } from "@/lib/analysis/definition";
import { FitError } from "./least-squares";
import { fitOutput } from "./output";
import { analyseFit } from "./report";
import { MAX_FIT_STARTS } from "./schema";

/*
 * The inputs of the fit's command line, pure so they can be tested without a process:
 * the parameter file (the spectrum command line's file without wavelengthsNm), the data file
 * (a header with the upload's default column names) and the flags. Every problem is one line.
 */

export class FitInputError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "FitInputError";
  }
}

/**
 * The spectrum file's keys minus wavelengthsNm. `method` is accepted and ignored (the fit always
 * uses the analytic path); so is `intensityWPerM2`, which leaves the analytic rotations unchanged
 * (physics-model.md §4.5).
 */
const parameterFileSchema = z
  .strictObject({
    ...materialShape,
    ...conditionsShape,
    method: z.enum(["analytic", "llg"], { error: 'must be "analytic" or "llg"' }).optional(),
    intensityWPerM2: z.number().optional(),
  })
  .transform(({ method: _method, intensityWPerM2: _intensity, ...params }) => params);

export function parseParameterFile(input: unknown): ModelParams {
  if (typeof input === "object" && input !== null && "wavelengthsNm" in input) {
    throw new FitInputError("wavelengthsNm: not used by the fit (the wavelengths come from the data file); remove it");
  }
  const file = parameterFileSchema.safeParse(input);
  if (!file.success) throw new FitInputError(formatIssues(file.error).join("; "));
  const params = modelParamsSchema.safeParse(file.data);
  if (!params.success) throw new FitInputError(formatIssues(params.error).join("; "));
  return params.data;
}

/**
 * Reads D.csv: wavelength_nm, one of verdet_rad_per_T_m or rotation_rad, sigma (same unit), and
 * optionally temperature_K, field_T, length_m; a missing condition column takes the parameter
 * file's value for every row.
 */
export function parseDataFile(text: string, params: ModelParams): MeasuredPoint[] {
  const { headers } = readTable(text);
  if (headers.length === 0) throw new FitInputError("data file: empty (it needs a header line and data rows)");
  const has = (name: string) => headers.includes(name);
  if (!has(DEFAULT_COLUMNS.wavelength)) throw new FitInputError(`data file: no column "${DEFAULT_COLUMNS.wavelength}" in the header`);
  if (has(DEFAULT_COLUMNS.verdet) && has(DEFAULT_COLUMNS.rotation)) {
    throw new FitInputError(`data file: both "${DEFAULT_COLUMNS.verdet}" and "${DEFAULT_COLUMNS.rotation}" are present; keep one`);
  }
  const quantity = has(DEFAULT_COLUMNS.rotation) ? "rotation" : "verdet";
  if (!has(DEFAULT_COLUMNS.verdet) && !has(DEFAULT_COLUMNS.rotation)) {
    throw new FitInputError(`data file: no column "${DEFAULT_COLUMNS.verdet}" or "${DEFAULT_COLUMNS.rotation}" in the header`);
  }
  if (!has(DEFAULT_COLUMNS.sigma))
    throw new FitInputError(`data file: no column "${DEFAULT_COLUMNS.sigma}" (the standard uncertainty of each value) in the header`);
  const optional = (name: string) => (has(name) ? name : null);
  const mapping: ColumnMapping = {
    wavelengthColumn: DEFAULT_COLUMNS.wavelength,
    wavelengthUnit: "nm",
    quantity,
    valueColumn: quantity === "verdet" ? DEFAULT_COLUMNS.verdet : DEFAULT_COLUMNS.rotation,
    valueUnit: quantity === "verdet" ? "rad/(T·m)" : "rad",
    sigmaColumn: DEFAULT_COLUMNS.sigma,
    temperatureColumn: optional(DEFAULT_COLUMNS.temperature),
    fieldColumn: optional(DEFAULT_COLUMNS.field),
    lengthColumn: optional(DEFAULT_COLUMNS.length),
  };
  const result = parseMeasurementTable(text, mapping, {
    temperatureK: params.temperatureK,
    fieldT: params.fieldT,
    lengthM: params.lengthM,
  });
  if (result.errors.length > 0) {
    const more = result.errors.length > 1 ? ` (and ${result.errors.length - 1} more problem${result.errors.length > 2 ? "s" : ""})` : "";
    throw new FitInputError(`data file: ${result.errors[0]}${more}`);
  }
  return result.points;
}

export interface FitArgs {
  paramsFile: string;
  /** One or more data files: each is a measurement set of a global fit. */
  dataFiles: string[];
  free: FreeParam[];
  priors: Prior[];
  starts: number;
  seed: number;
  scaleByChi2: boolean;
  /** The data are magnitudes: each value takes the model's sign. */
  magnitudes: boolean;
  /** Profile the magnetic share at every point (a few dozen refits each); off with --no-share-intervals. */
  shareIntervals: boolean;
}

export const FIT_USAGE =
  "usage: npm run --silent fit -- --params P.json --data D.csv [--data E.csv …] [--free a,b,c] " +
  "[--prior KEY=MEAN:SIGMA …] [--starts N] [--seed N] [--magnitudes] [--scale-by-chi2] [--no-share-intervals]";

const NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

/** KEY=MEAN:SIGMA, e.g. oscillatorWavelengthNm=258:8. */
export function parsePriorArg(text: string): Prior {
  const m = /^([A-Za-z]+)=([^:]+):(.+)$/.exec(text);
  if (!m || !NUMBER.test(m[2]!) || !NUMBER.test(m[3]!)) {
    throw new FitInputError(`--prior: "${text}" is not KEY=MEAN:SIGMA (e.g. oscillatorWavelengthNm=258:8)`);
  }
  const parsed = priorSchema.safeParse({ key: m[1], mean: Number(m[2]), sigma: Number(m[3]) });
  if (!parsed.success) throw new FitInputError(`--prior ${text}: ${zodIssueLines(parsed.error.issues)[0]}`);
  return parsed.data;
}

function wholeNumber(flag: string, text: string, min: number, max: number): number {
  const n = Number(text);
  if (!Number.isInteger(n) || n < min || n > max)
    throw new FitInputError(`${flag}: must be a whole number from ${min} to ${max} (got "${text}")`);
  return n;
}

export function parseFitArgs(argv: readonly string[]): FitArgs {
  const args = argv.filter((a) => a !== "--");
  let paramsFile: string | undefined;
  const dataFiles: string[] = [];
  const priors: Prior[] = [];
  let freeList: string | undefined;
  let scaleByChi2 = false;
  let magnitudes = false;
  let shareIntervals = true;
  let starts = 4;
  let seed = 1;
  for (let i = 0; i < args.length; i++) {
    const a = args[i]!;
    const [flag, inline] =
      a.startsWith("--") && a.includes("=") ? [a.slice(0, a.indexOf("=")), a.slice(a.indexOf("=") + 1)] : [a, undefined];
    const value = () => {
      const v = inline ?? args[++i];
      if (v === undefined || v === "") throw new FitInputError(`${flag}: needs a value; ${FIT_USAGE}`);
      return v;
    };
    if (flag === "--params") paramsFile = value();
    else if (flag === "--data") dataFiles.push(value());
    else if (flag === "--free") freeList = value();
    else if (flag === "--prior") priors.push(parsePriorArg(value()));
    else if (flag === "--starts") starts = wholeNumber("--starts", value(), 1, MAX_FIT_STARTS);
    else if (flag === "--seed") seed = wholeNumber("--seed", value(), 0, 0xffffffff);
    else if (flag === "--scale-by-chi2" && inline === undefined) scaleByChi2 = true;
    else if (flag === "--magnitudes" && inline === undefined) magnitudes = true;
    else if (flag === "--no-share-intervals" && inline === undefined) shareIntervals = false;
    else throw new FitInputError(`${a}: unknown argument; ${FIT_USAGE}`);
  }
  if (!paramsFile) throw new FitInputError(`--params is required; ${FIT_USAGE}`);
  if (dataFiles.length === 0) throw new FitInputError(`--data is required; ${FIT_USAGE}`);
  if (new Set(dataFiles).size !== dataFiles.length) throw new FitInputError("--data: a file is given twice");
  if (new Set(priors.map((p) => p.key)).size !== priors.length) throw new FitInputError("--prior: a parameter has two priors");
  const keys = freeList === undefined ? DEFAULT_FREE_KEYS : freeList.split(",").map((k) => k.trim());
  const free = keys.map((key) => {
    if (!(FREEABLE_KEYS as readonly string[]).includes(key)) {
      throw new FitInputError(`--free: "${key}" is not a model parameter that a fit can free (choose from ${FREEABLE_KEYS.join(", ")})`);
    }
    return { key: key as FreeableKey };
  });
  if (new Set(keys).size !== keys.length) throw new FitInputError("--free: a parameter is listed twice");
  return { paramsFile, dataFiles, free, priors, starts, seed, scaleByChi2, magnitudes, shareIntervals };
}

const oneLine = (s: string) => s.replace(/\s*[\r\n]+\s*/g, " ").trim();

export interface CommandRun {
  status: number;
  stdout: string;
  stderr: string;
}

/**
 * The whole command, with the file system passed in: status 0 and the JSON on stdout, notes as
 * "warning:" lines; status 2 and one line for bad input; status 1 for anything unexpected.
 */
export function runFitCommand(argv: readonly string[], readText: (path: string) => string): CommandRun {
  const read = (file: string, what: string) => {
    try {
      return readText(file);
    } catch (err) {
      const code = (err as { code?: string }).code;
      throw new FitInputError(
        `${file}: cannot read the ${what} (${code === "ENOENT" ? "no such file" : (code ?? (err as Error).message)})`,
      );
    }
  };
  try {
    const args = parseFitArgs(argv);
    const text = read(args.paramsFile, "parameter file");
    let json: unknown;
    try {
      json = JSON.parse(text);
    } catch (err) {
      throw new FitInputError(`${args.paramsFile}: malformed JSON (${(err as Error).message})`);
    }
    const params = parseParameterFile(json);
    const sets = args.dataFiles.map((f) => ({ name: f.split(/[\\/]/).pop() || f, points: parseDataFile(read(f, "data file"), params) }));
    if (new Set(sets.map((s) => s.name)).size !== sets.length) throw new FitInputError("--data: two data files have the same name");
    const report = analyseFit(
      {
        params,
        free: args.free,
        priors: args.priors,
        ...(sets.length === 1 ? { points: sets[0]!.points } : { sets }),
        starts: args.starts,
        seed: args.seed,
        scaleByChi2: args.scaleByChi2,
        takeModelSign: args.magnitudes,
      },
      { shareProfiles: args.shareIntervals },
    );
    const warnings = [...report.verdict.reasons, ...report.notes];
    return {
      status: 0,
      stdout: `${JSON.stringify(fitOutput(report), null, 2)}\n`,
      stderr: warnings.map((w) => `warning: ${oneLine(w)}\n`).join(""),
    };
  } catch (err) {
    if (err instanceof FitInputError || err instanceof FitError) return { status: 2, stdout: "", stderr: `${oneLine(err.message)}\n` };
    return { status: 1, stdout: "", stderr: `internal error: ${oneLine((err as Error).message)}\n` };
  }
}
