import { z } from "zod";
import { finiteNumber } from "@/lib/contracts/validation";
import { measuredPointSchema } from "@/lib/measurements/point";
import {
  MODEL_FLAG_KEYS,
  MODEL_OPTION_KEYS,
  type ModelFlagKey,
  type ModelOptionKey,
  materialShape,
  modelParamsSchema,
} from "@/lib/physics/schema";

/*
 * The one request schema of the fit, shared by the worker, the API and the command line.
 * Free parameters are material keys only: the conditions (temperature, field, length) belong to
 * each measured point.
 */

type MaterialKey = keyof typeof materialShape;
/**
 * totalJ is a quantum number (a multiple of 1/2), not a continuous parameter, and a switch such as
 * the diamagnetic term is not a number at all (physics-model.md §5.5): neither is ever fitted.
 */
export type FreeableKey = Exclude<MaterialKey, "totalJ" | ModelFlagKey | ModelOptionKey>;
const NOT_FREEABLE: ReadonlySet<string> = new Set<string>(["totalJ", ...MODEL_FLAG_KEYS, ...MODEL_OPTION_KEYS]);
export const FREEABLE_KEYS = (Object.keys(materialShape) as MaterialKey[]).filter((k): k is FreeableKey => !NOT_FREEABLE.has(k));

/** The default free parameters (the two amplitudes and the dispersion of the electric part). */
export const DEFAULT_FREE_KEYS: FreeableKey[] = ["gyrationPerT", "oscillatorWavelengthNm", "magneticScale"];

/** At most this many points in one fit (the upload's row limit). */
export const MAX_FIT_POINTS = 20000;

export const freeParamSchema = z
  .strictObject({
    key: z.enum(FREEABLE_KEYS as [FreeableKey, ...FreeableKey[]], {
      error: (issue) => `"${String(issue.input)}" is not a model parameter that a fit can free`,
    }),
    min: finiteNumber("min").optional(),
    max: finiteNumber("max").optional(),
  })
  .refine((f) => f.min === undefined || f.max === undefined || f.min < f.max, { message: "min must be below max", path: ["min"] });
export type FreeParam = z.infer<typeof freeParamSchema>;

export const fitRequestSchema = z
  .strictObject({
    params: modelParamsSchema,
    free: z
      .array(freeParamSchema, { error: "free must be a list of parameters" })
      .min(1, "free at least one parameter")
      .max(FREEABLE_KEYS.length),
    points: z
      .array(measuredPointSchema, { error: "points must be a list of measured points" })
      .min(1, "needs at least one point")
      .max(MAX_FIT_POINTS, `at most ${MAX_FIT_POINTS} points`),
    scaleByChi2: z.boolean().default(false),
  })
  .superRefine((req, ctx) => {
    const seen = new Set<string>();
    req.free.forEach((f, i) => {
      if (seen.has(f.key)) ctx.addIssue({ code: "custom", path: ["free", i, "key"], message: `${f.key} is listed twice` });
      seen.add(f.key);
      const start = req.params[f.key];
      if ((f.min !== undefined && start < f.min) || (f.max !== undefined && start > f.max)) {
        ctx.addIssue({
          code: "custom",
          path: ["free", i],
          message: `the starting value of ${f.key} (${start}) lies outside its bounds [${f.min ?? "−∞"}, ${f.max ?? "∞"}]`,
        });
      }
    });
    if (req.points.length <= req.free.length) {
      ctx.addIssue({
        code: "custom",
        path: ["points"],
        message:
          `${req.points.length} point(s) cannot determine ${req.free.length} free parameter(s); ` +
          "a fit needs more points than free parameters",
      });
    }
  });
export type FitRequest = z.infer<typeof fitRequestSchema>;
export type FitRequestInput = z.input<typeof fitRequestSchema>;
