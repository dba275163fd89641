import { z } from "zod";
import { safeString } from "@/lib/contracts/validation";
import { measuredPointSchema } from "@/lib/measurements/point";
import { modelParamsSchema } from "@/lib/physics/schema";
import { FREEABLE_KEYS, calibrationSchema, freeParamSchema, priorSchema } from "@/lib/analysis/definition";

/*
 * The one request schema of the fit, shared by the worker, the API and the command line. Its
 * free parameters, priors and calibration are the fields of the shared analysis definition
 * (lib/analysis/definition.ts), so the planner designs data for exactly this fit. Free parameters
 * are material keys only: the conditions (temperature, field, length) belong to each measured
 * point. The points come either as one list (`points`, with the request's calibration) or as
 * several measurement sets (`sets`, each with its own calibration) fitted together.
 */

/** At most this many points in one fit (the upload's row limit). */
export const MAX_FIT_POINTS = 20000;
/** At most this many measurement sets in one global fit. */
export const MAX_FIT_SETS = 50;
/** At most this many starts of the optimiser. */
export const MAX_FIT_STARTS = 32;

const pointsSchema = z
  .array(measuredPointSchema, { error: "points must be a list of measured points" })
  .min(1, "needs at least one point")
  .max(MAX_FIT_POINTS, `at most ${MAX_FIT_POINTS} points`);

const noCalibration = { scaleSigma: 0, temperatureSigmaK: 0, relativeFloor: 0 };

export const fitSetSchema = z.strictObject({
  /** How the set is named in results (the measurement set's name). */
  name: safeString().trim().min(1, "name the measurement set").max(200),
  points: pointsSchema,
  calibration: calibrationSchema.default(noCalibration),
});
export type FitSet = z.infer<typeof fitSetSchema>;

export const fitRequestSchema = z
  .strictObject({
    params: modelParamsSchema,
    free: z
      .array(freeParamSchema, { error: "free must be a list of parameters" })
      .min(1, "free at least one parameter")
      .max(FREEABLE_KEYS.length),
    priors: z.array(priorSchema, { error: "priors must be a list" }).max(FREEABLE_KEYS.length).default([]),
    /** The calibration of `points` (sets carry their own). */
    calibration: calibrationSchema.default(noCalibration),
    points: pointsSchema.optional(),
    sets: z.array(fitSetSchema, { error: "sets must be a list of measurement sets" }).min(1).max(MAX_FIT_SETS).optional(),
    /** σ scaled by √(χ²/dof) when that factor exceeds 1; needs dof ≥ 3. */
    scaleByChi2: z.boolean().default(false),
    starts: z.number().int("must be a whole number").min(1, "at least 1 start").max(MAX_FIT_STARTS).default(4),
    seed: z.number().int("must be a whole number").min(0).max(0xffffffff).default(1),
    /** Measured values are magnitudes: each takes the sign of the model's prediction at the starting values. */
    takeModelSign: z.boolean().default(false),
  })
  .superRefine((req, ctx) => {
    if ((req.points === undefined) === (req.sets === undefined)) {
      ctx.addIssue({ code: "custom", path: ["points"], message: "send either points (one measurement set) or sets, not both or neither" });
      return;
    }
    const seen = new Set<string>();
    const bounds = new Map<string, { min?: number; max?: number }>();
    req.free.forEach((f, i) => {
      if (seen.has(f.key)) ctx.addIssue({ code: "custom", path: ["free", i, "key"], message: `${f.key} is listed twice` });
      seen.add(f.key);
      bounds.set(f.key, f);
      const start = req.params[f.key];
      if ((f.min !== undefined && start < f.min) || (f.max !== undefined && start > f.max)) {
        ctx.addIssue({
          code: "custom",
          path: ["free", i],
          message: `the starting value of ${f.key} (${start}) lies outside its bounds [${f.min ?? "−∞"}, ${f.max ?? "∞"}]`,
        });
      }
    });
    const priorSeen = new Set<string>();
    req.priors.forEach((p, i) => {
      if (priorSeen.has(p.key)) ctx.addIssue({ code: "custom", path: ["priors", i, "key"], message: `${p.key} has two priors` });
      priorSeen.add(p.key);
      const b = bounds.get(p.key);
      if (b && ((b.min !== undefined && p.mean < b.min) || (b.max !== undefined && p.mean > b.max))) {
        ctx.addIssue({ code: "custom", path: ["priors", i, "mean"], message: `the prior mean of ${p.key} lies outside its bounds` });
      }
    });
    const names = new Set<string>();
    req.sets?.forEach((s, i) => {
      if (names.has(s.name)) ctx.addIssue({ code: "custom", path: ["sets", i, "name"], message: `two sets are named "${s.name}"` });
      names.add(s.name);
    });
    const pointCount = req.points?.length ?? req.sets?.reduce((n, s) => n + s.points.length, 0) ?? 0;
    if (pointCount > MAX_FIT_POINTS) {
      ctx.addIssue({ code: "custom", path: ["sets"], message: `at most ${MAX_FIT_POINTS} points in all` });
    }
    // A prior adds an observation, so a parameter that carries one does not use up a point.
    const unconstrained = req.free.filter((f) => !priorSeen.has(f.key)).length;
    if (pointCount <= unconstrained) {
      ctx.addIssue({
        code: "custom",
        path: [req.points ? "points" : "sets"],
        message: `${pointCount} point(s) cannot determine ${unconstrained} free parameter(s); a fit needs more points than free parameters`,
      });
    }
  });
export type FitRequest = z.infer<typeof fitRequestSchema>;
export type FitRequestInput = z.input<typeof fitRequestSchema>;

/** The sets of a parsed request: `points` is one set named "data" with the request's calibration. */
export function requestSets(req: FitRequest): FitSet[] {
  return req.sets ?? [{ name: "data", points: req.points ?? [], calibration: req.calibration }];
}
