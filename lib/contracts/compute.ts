import { z } from "zod";
import { fitRequestSchema, MAX_FIT_POINTS } from "@/lib/fit/schema";
import { mapPayloadSchema, mapRun, spectrumPayloadSchema, spectrumRun } from "@/lib/lab-runs/kinds";

/*
 * Synchronous compute for API users (POST /api/compute/spectrum, /map, /fit): small requests
 * answered in the response, with the very schemas the lab-run workers and the fit worker validate
 * (a spectrum or map body is a lab run's `payload`, a fit body the fit's request). A request above
 * the limits below is refused with code payload_too_large and a `labRun` pointer: the same body,
 * submitted as a lab run, is computed by the lab's workers.
 */

export const computeSpectrumSchema = spectrumPayloadSchema;
export const computeMapSchema = mapPayloadSchema;
export const computeFitSchema = fitRequestSchema;
/** POST /api/compute/fit?shareIntervals=true also profiles the magnetic share at every distinct point condition. */
export const computeFitQuerySchema = z.strictObject({
  shareIntervals: z
    .enum(["true", "false"], { error: 'shareIntervals must be "true" or "false"' })
    .default("false")
    .transform((v) => v === "true"),
});

/**
 * Cells one request may compute on the web server, by method: about a fifth of a second of one
 * core for either (numerical LLG about 7,000 cells/s per thread, tests/e2e/lab-runs.e2e.ts; the
 * analytic model some 100 times more), so a burst of them never stalls the server for long.
 */
export const SYNC_CELL_LIMIT = { analytic: 50_000, llg: 1_500 } as const;
/** Points of one synchronous fit (a 64 KiB request body holds about that many); more: the workbench or `npm run fit`. */
export const SYNC_FIT_POINT_LIMIT = Math.min(500, MAX_FIT_POINTS);

export type ComputeKind = "spectrum" | "map";

/** Cells of a spectrum or map request, and the limit for its method. */
export function syncCells(kind: ComputeKind, body: z.infer<typeof spectrumPayloadSchema> | z.infer<typeof mapPayloadSchema>) {
  const cells = kind === "map" ? mapRun.cells(body as z.infer<typeof mapPayloadSchema>) : spectrumRun.cells(body);
  return { cells, limit: SYNC_CELL_LIMIT[body.method] };
}

/** The answer of /api/compute/spectrum and /map: a lab-run result, computed at once. */
export interface ComputeResultBody {
  kind: ComputeKind;
  /** The engine that computed it (lib/lab-runs/engine.ts), as a lab run's result records it. */
  engineVersion: string;
  computeMs: number;
  meta: Record<string, unknown>;
  /** Named columns, NaN as null; the same columns as GET /api/runs/{id}/result. */
  columns: Record<string, (number | null)[]>;
}

export const computeResultSchema = z.object({
  kind: z.enum(["spectrum", "map"]),
  engineVersion: z.string(),
  computeMs: z.number(),
  meta: z.record(z.string(), z.unknown()),
  columns: z.record(z.string(), z.array(z.number().nullable())),
});
