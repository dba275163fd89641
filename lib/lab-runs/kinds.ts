import { z } from "zod";
import { finiteNumber } from "@/lib/contracts/validation";
import { type NumericalRangeKey, numericalRangeProblem } from "@/lib/physics/numerical-range";
import { modelParamsSchema, spectrumRequestSchema, type ModelParams } from "@/lib/physics/schema";
import { createSpectrumJob, spectrumWarnings, staticMagnetization } from "@/lib/physics/spectrum";
import { wavelengthGrid } from "@/lib/workbench/units";

/*
 * Lab runs: long computations done by the lab's workers (workers/lab-runs) instead of a browser tab.
 * Each kind of run is one handler in RUN_KINDS, keyed by its name, with its own zod payload schema.
 * A handler splits its payload into chunks that any thread can compute on its own (so a worker
 * spreads them over its cores and checks for cancel between them) and assembles the chunk outputs
 * into one result of named Float64Array columns, stored as bytes so every double is kept exactly.
 *
 * Adding a kind (e.g. a multi-start fit) is one new handler here and one entry in RUN_KINDS; the
 * API, the queue, the worker and the runs page read everything else from the registry.
 */

/** A contiguous range of a run's work items (map rows, spectrum wavelengths, fit starts). */
export interface RunChunk {
  index: number;
  start: number;
  end: number;
}

/** What one chunk computed: columns over its own range, in order, plus run-wide side figures. */
export interface ChunkOutput {
  columns: Record<string, Float64Array>;
  flags?: Uint8Array;
  /** Largest numerical-vs-analytic deviation of χ± in the chunk (numerical LLG only). */
  deviation?: number;
  warnings: string[];
}

/** A finished run: named columns and a small JSON description of what they mean. */
export interface RunResultData {
  columns: Record<string, Float64Array>;
  meta: Record<string, unknown>;
}

export interface RunKindHandler<P> {
  kind: string;
  /** Shown in the runs list. */
  label: string;
  payloadSchema: z.ZodType<P>;
  /** Cells (spectrum points) the run computes: the unit of progress and of a worker's throughput. */
  cells(payload: P): number;
  /** A pessimistic time for the whole run on one slow core: the basis of the queue's expiry for it. */
  slowCoreSeconds(payload: P): number;
  /** One line describing the grid, for the runs list. */
  describe(payload: P): string;
  chunks(payload: P): RunChunk[];
  compute(payload: P, chunk: RunChunk): ChunkOutput;
  assemble(payload: P, outputs: ChunkOutput[]): RunResultData;
}

export const MAX_MAP_COLUMNS = 512;
export const MAX_MAP_ROWS = 256;
export const MAX_RUN_WAVELENGTHS = 20_000;
/** Wavelengths per chunk of a long spectrum: a few hundred ms of numerical LLG on one core. */
const SPECTRUM_CHUNK = 256;

/**
 * Cells per second of one slow core, for the expiry only: about a tenth of what one thread of the
 * test machine reaches (numerical LLG about 7,000 cells/s per thread, tests/e2e/lab-runs.e2e.ts;
 * the analytic model some 100 times more, scripts/bench.ts), so a busy lab PC stays inside it.
 */
const SLOW_CORE_CELLS_PER_S = { analytic: 50_000, llg: 700 } as const;

const methodSchema = z.enum(["analytic", "llg"], { error: 'must be "analytic" or "llg"' });

const wavelengthAxis = (max: number) =>
  z
    .strictObject({
      fromNm: finiteNumber("fromNm").gt(0, "must be > 0 nm"),
      toNm: finiteNumber("toNm").gt(0, "must be > 0 nm"),
      count: z.number().int("must be a whole number").min(1, "must be ≥ 1").max(max, `must be ≤ ${max}`),
      spacing: z.enum(["log", "linear"]).default("log"),
    })
    .refine((a) => a.toNm > a.fromNm || (a.count === 1 && a.toNm === a.fromNm), { message: "toNm must be above fromNm", path: ["toNm"] });

type WavelengthAxis = z.infer<ReturnType<typeof wavelengthAxis>>;
const axisValues = (a: WavelengthAxis) => wavelengthGrid(a.fromNm, a.toNm, a.count, a.spacing);

/** Each problem of a spectrum request, reported at the run payload's path. */
function checkRequest(ctx: z.RefinementCtx, request: unknown, where: string): void {
  const parsed = spectrumRequestSchema.safeParse(request);
  if (parsed.success) return;
  for (const issue of parsed.error.issues.slice(0, 3)) {
    const field = issue.path[0] === "wavelengthsNm" ? ["wavelengths"] : ["params", ...issue.path.map(String)];
    ctx.addIssue({ code: "custom", path: field, message: `${where}: ${issue.message}` });
  }
}

/**
 * The numerical method's range (lib/physics/numerical-range.ts), each problem at the payload field
 * that sets the value: the wavelength axis ends, the map's rows (every row, since a linear field
 * axis may cross 0), and the set's damping and whichever condition the rows do not vary.
 */
function checkNumericalRange(ctx: z.RefinementCtx, p: MapPayload | SpectrumPayload): void {
  if (p.method !== "llg") return;
  const check = (path: (string | number)[], key: NumericalRangeKey, value: number) => {
    const problem = numericalRangeProblem(key, value);
    if (problem) ctx.addIssue({ code: "custom", path, message: problem });
  };
  check(["wavelengths", "fromNm"], "wavelengthNm", p.wavelengths.fromNm);
  check(["wavelengths", "toNm"], "wavelengthNm", p.wavelengths.toNm);
  check(["params", "gilbertDamping"], "gilbertDamping", p.params.gilbertDamping);
  const map = "axis" in p ? p : null;
  if (map?.axis !== "temperature") check(["params", "temperatureK"], "temperatureK", p.params.temperatureK);
  if (map?.axis !== "field") check(["params", "fieldT"], "absFieldT", p.params.fieldT);
  if (!map) return;
  const key: NumericalRangeKey = map.axis === "temperature" ? "temperatureK" : "absFieldT";
  const ys = mapRowValues(map);
  const outside = ys.findIndex((y) => numericalRangeProblem(key, y) !== null);
  if (outside >= 0) check(["rows", outside === ys.length - 1 ? "to" : "from"], key, ys[outside]!);
}

/* ---------- map: wavelength × temperature or wavelength × field ---------- */

export const mapPayloadSchema = z
  .strictObject({
    params: modelParamsSchema,
    method: methodSchema,
    /** Which condition the rows vary; the other one stays at the set's value. */
    axis: z.enum(["temperature", "field"]),
    wavelengths: wavelengthAxis(MAX_MAP_COLUMNS),
    rows: z.strictObject({
      from: finiteNumber("from"),
      to: finiteNumber("to"),
      count: z.number().int("must be a whole number").min(1, "must be ≥ 1").max(MAX_MAP_ROWS, `must be ≤ ${MAX_MAP_ROWS}`),
      spacing: z.enum(["log", "linear"]).default("linear"),
    }),
  })
  .superRefine((p, ctx) => {
    if (p.rows.spacing === "log" && !(p.rows.from * p.rows.to > 0)) {
      ctx.addIssue({ code: "custom", path: ["rows", "from"], message: "a log-spaced axis needs from and to of the same sign, not 0" });
      return;
    }
    // The first and last rows bound the grid; a spectrum request that either of them breaks
    // would fail on the worker, so it is refused here with the rule it breaks.
    const ys = mapRowValues(p);
    const xs = axisValues(p.wavelengths);
    checkRequest(ctx, mapRowRequest(p, ys[0]!, xs), `first row (${ys[0]})`);
    if (ys.length > 1) checkRequest(ctx, mapRowRequest(p, ys[ys.length - 1]!, xs), `last row (${ys[ys.length - 1]})`);
    checkNumericalRange(ctx, p);
  });
export type MapPayload = z.infer<typeof mapPayloadSchema>;

export function mapRowValues(p: Pick<MapPayload, "rows">): number[] {
  return wavelengthGrid(p.rows.from, p.rows.to, p.rows.count, p.rows.spacing);
}

function mapRowParams(p: MapPayload, y: number): ModelParams {
  return p.axis === "temperature" ? { ...p.params, temperatureK: y } : { ...p.params, fieldT: y };
}

function mapRowRequest(p: MapPayload, y: number, xs: number[]) {
  return { ...mapRowParams(p, y), wavelengthsNm: xs, method: p.method };
}

/** Cell columns of a map, row-major (row j, column i at j·columns + i). */
export const MAP_COLUMNS = ["magneticShare", "thetaRad", "thetaElectricRad", "thetaMagneticRad", "verdetRadPerTm"] as const;

export const mapRun: RunKindHandler<MapPayload> = {
  kind: "map",
  label: "Map",
  payloadSchema: mapPayloadSchema,
  cells: (p) => p.wavelengths.count * p.rows.count,
  slowCoreSeconds: (p) => (p.wavelengths.count * p.rows.count) / SLOW_CORE_CELLS_PER_S[p.method],
  describe: (p) =>
    `${p.method === "llg" ? "numerical LLG" : "analytic"} map, ` +
    `${p.wavelengths.count} wavelengths (${p.wavelengths.fromNm}–${p.wavelengths.toNm} nm) × ${p.rows.count} ${
      p.axis === "temperature" ? `temperatures (${p.rows.from}–${p.rows.to} K)` : `fields (${p.rows.from}–${p.rows.to} T)`
    }`,
  // One row per chunk: a row is one spectrum, at most 512 wavelengths.
  chunks: (p) => Array.from({ length: p.rows.count }, (_, j) => ({ index: j, start: j, end: j + 1 })),
  compute(p, chunk) {
    const xs = axisValues(p.wavelengths);
    const ys = mapRowValues(p);
    const n = xs.length * (chunk.end - chunk.start);
    const columns = Object.fromEntries(MAP_COLUMNS.map((c) => [c, new Float64Array(n)])) as Record<
      (typeof MAP_COLUMNS)[number],
      Float64Array
    >;
    let deviation: number | undefined;
    const warnings = new Set<string>();
    for (let j = chunk.start; j < chunk.end; j++) {
      const job = createSpectrumJob(mapRowRequest(p, ys[j]!, xs));
      job.computeRange(0, job.length);
      const a = job.finish();
      const offset = (j - chunk.start) * xs.length;
      for (const name of MAP_COLUMNS) columns[name].set(a[name], offset);
      if (a.maxRelDeviationFromAnalytic !== undefined) deviation = Math.max(deviation ?? 0, a.maxRelDeviationFromAnalytic);
      for (const w of a.warnings) warnings.add(w);
    }
    return { columns, deviation, warnings: [...warnings] };
  },
  assemble(p, outputs) {
    const columns: Record<string, Float64Array> = {
      wavelengthNm: Float64Array.from(axisValues(p.wavelengths)),
      rowValue: Float64Array.from(mapRowValues(p)),
      ...concatColumns(MAP_COLUMNS, outputs),
    };
    return {
      columns,
      meta: {
        kind: "map",
        axis: p.axis,
        method: p.method,
        rowSpacing: p.rows.spacing,
        columnsPerRow: p.wavelengths.count,
        rows: p.rows.count,
        maxRelDeviationFromAnalytic: maxOf(outputs.map((o) => o.deviation)),
        warnings: [...new Set(outputs.flatMap((o) => o.warnings))],
      },
    };
  },
};

/* ---------- long spectrum ---------- */

export const spectrumPayloadSchema = z
  .strictObject({
    params: modelParamsSchema,
    method: methodSchema,
    wavelengths: wavelengthAxis(MAX_RUN_WAVELENGTHS),
  })
  .superRefine((p, ctx) => {
    const xs = axisValues(p.wavelengths);
    // The per-request cap of the physics (5000) applies to each chunk, not to the run.
    checkRequest(ctx, { ...p.params, method: p.method, wavelengthsNm: xs.slice(0, 2) }, "first wavelengths");
    checkRequest(ctx, { ...p.params, method: p.method, wavelengthsNm: xs.slice(-2) }, "last wavelengths");
    checkNumericalRange(ctx, p);
  });
export type SpectrumPayload = z.infer<typeof spectrumPayloadSchema>;

export const SPECTRUM_COLUMNS = [
  "thetaRad",
  "thetaElectricRad",
  "thetaMagneticRad",
  "thetaCrossRad",
  "ellipticityRad",
  "magneticShare",
  "verdetRadPerTm",
] as const;

export const spectrumRun: RunKindHandler<SpectrumPayload> = {
  kind: "spectrum",
  label: "Spectrum",
  payloadSchema: spectrumPayloadSchema,
  cells: (p) => p.wavelengths.count,
  slowCoreSeconds: (p) => p.wavelengths.count / SLOW_CORE_CELLS_PER_S[p.method],
  describe: (p) =>
    `${p.method === "llg" ? "numerical LLG" : "analytic"} spectrum, ` +
    `${p.wavelengths.count} wavelengths (${p.wavelengths.fromNm}–${p.wavelengths.toNm} nm)`,
  chunks(p) {
    const out: RunChunk[] = [];
    for (let start = 0; start < p.wavelengths.count; start += SPECTRUM_CHUNK) {
      out.push({ index: out.length, start, end: Math.min(p.wavelengths.count, start + SPECTRUM_CHUNK) });
    }
    return out;
  },
  compute(p, chunk) {
    const xs = axisValues(p.wavelengths).slice(chunk.start, chunk.end);
    const job = createSpectrumJob({ ...p.params, method: p.method, wavelengthsNm: xs });
    job.computeRange(0, job.length);
    const a = job.finish();
    const columns = Object.fromEntries(SPECTRUM_COLUMNS.map((c) => [c, a[c]]));
    return { columns, flags: a.flags, deviation: a.maxRelDeviationFromAnalytic, warnings: [] };
  },
  assemble(p, outputs) {
    const wavelengthNm = Float64Array.from(axisValues(p.wavelengths));
    const flags = new Uint8Array(wavelengthNm.length);
    let offset = 0;
    for (const o of outputs) {
      if (o.flags) flags.set(o.flags, offset);
      offset += o.flags?.length ?? 0;
    }
    const m0 = staticMagnetization(p.params);
    return {
      columns: { wavelengthNm, ...concatColumns(SPECTRUM_COLUMNS, outputs) },
      meta: {
        kind: "spectrum",
        method: p.method,
        magnetizationAPerM: m0,
        maxRelDeviationFromAnalytic: maxOf(outputs.map((o) => o.deviation)),
        // Rebuilt from the merged per-wavelength flags, as the browser's pool does.
        warnings: spectrumWarnings(p.params, { wavelengthNm, flags, magnetizationAPerM: m0 }),
      },
    };
  },
};

function concatColumns(names: readonly string[], outputs: ChunkOutput[]): Record<string, Float64Array> {
  const out: Record<string, Float64Array> = {};
  for (const name of names) {
    const total = outputs.reduce((s, o) => s + (o.columns[name]?.length ?? 0), 0);
    const col = new Float64Array(total);
    let offset = 0;
    for (const o of outputs) {
      const part = o.columns[name];
      if (!part) continue;
      col.set(part, offset);
      offset += part.length;
    }
    out[name] = col;
  }
  return out;
}

function maxOf(values: (number | undefined)[]): number | null {
  let best: number | null = null;
  for (const v of values) if (v !== undefined && (best === null || v > best)) best = v;
  return best;
}

/* ---------- the registry ---------- */

export const RUN_KINDS = {
  map: mapRun,
  spectrum: spectrumRun,
} as const;

export type RunKind = keyof typeof RUN_KINDS;
export const RUN_KIND_NAMES = Object.keys(RUN_KINDS) as RunKind[];

/** The handler of a kind, typed loosely for code that only moves payloads around (worker, API). */
export function runKindHandler(kind: string): RunKindHandler<unknown> | null {
  return (RUN_KINDS as Record<string, RunKindHandler<unknown>>)[kind] ?? null;
}

/** A run as submitted: its kind and a payload valid for that kind. */
export const runSpecSchema = z.discriminatedUnion("kind", [
  z.strictObject({ kind: z.literal("map"), payload: mapPayloadSchema }),
  z.strictObject({ kind: z.literal("spectrum"), payload: spectrumPayloadSchema }),
]);
export type RunSpec = z.infer<typeof runSpecSchema>;

/**
 * The whole run in this process, chunk by chunk in order: the reference the worker's result must
 * equal bit for bit (each chunk is independent, so the order and the thread do not matter).
 */
export function computeRunInProcess(kind: string, payload: unknown): RunResultData {
  const handler = runKindHandler(kind);
  if (!handler) throw new Error(`unknown run kind ${kind}`);
  const p = handler.payloadSchema.parse(payload);
  return handler.assemble(
    p,
    handler.chunks(p).map((c) => handler.compute(p, c)),
  );
}
