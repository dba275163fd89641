import { z } from "zod";
import { finiteNumber, safeString } from "@/lib/contracts/validation";
import { modelParamsSchema } from "@/lib/physics/schema";
import {
  FREEABLE_KEYS,
  type FreeableKey,
  NATURAL_LOWER,
  analysisDefinitionSchema,
  defaultAnalysisDefinition,
  noiseModelSchema,
} from "@/lib/analysis/definition";

/*
 * The one request schema of the measurement planner, shared by the planner worker, the API that
 * stores plans and the tests. Units are in the keys. Impossible requests (no lines, no points, a
 * cryostat reaching the Curie–Weiss temperature) get a message that names what to change.
 */

/** Per axis (temperature, field) at most this many steps; keeps the candidate list readable. */
export const MAX_STEPS_PER_AXIS = 200;
/** At most this many candidate points (line × temperature × field). */
export const MAX_CANDIDATES = 20000;
/** The points a plan may hold; beyond this a plan is a survey, not a choice. */
export const MAX_PLAN_POINTS = 60;
export const MAX_LINES = 50;

export const planLineSchema = z.strictObject({
  name: safeString({ error: "line name must be text" }).trim().min(1, "give the line a name").max(120, "at most 120 characters"),
  wavelengthNm: finiteNumber("wavelength").gt(0, "must be > 0 nm").max(1e6, "must be ≤ 1e6 nm"),
  /** The source's power at the sample, W; with optics.referencePowerW it scales the shot noise. */
  powerW: finiteNumber("power").gt(0, "must be > 0 W").max(1e6, "must be ≤ 1e6 W").nullish(),
});
export type PlanLine = z.infer<typeof planLineSchema>;

export const temperatureRangeSchema = z.strictObject({
  minK: finiteNumber("lowest temperature").gt(0, "must be > 0 K").max(10000, "must be ≤ 10000 K"),
  maxK: finiteNumber("highest temperature").gt(0, "must be > 0 K").max(10000, "must be ≤ 10000 K"),
  stepK: finiteNumber("temperature step").gt(0, "must be > 0 K"),
});

/** The temperatures a lab has as a set (room, 77 K, 4.2 K…), not a range. */
export const temperatureSetSchema = z.strictObject({
  valuesK: z
    .array(finiteNumber("temperature").gt(0, "must be > 0 K").max(10000, "must be ≤ 10000 K"), { error: "valuesK must be a list" })
    .min(1, "give at least one temperature")
    .max(MAX_STEPS_PER_AXIS, `at most ${MAX_STEPS_PER_AXIS} temperatures`),
});
export const temperaturesSchema = z.union([temperatureRangeSchema, temperatureSetSchema], {
  error: "temperatures must be { minK, maxK, stepK } or { valuesK: [...] }",
});
export type PlanTemperatures = z.infer<typeof temperaturesSchema>;

export const fieldRangeSchema = z.strictObject({
  minT: finiteNumber("lowest field").min(-100, "must be ≥ −100 T").max(100, "must be ≤ 100 T"),
  maxT: finiteNumber("highest field").min(-100, "must be ≥ −100 T").max(100, "must be ≤ 100 T"),
  stepT: finiteNumber("field step").gt(0, "must be > 0 T"),
});
export const fieldSetSchema = z.strictObject({
  valuesT: z
    .array(finiteNumber("field").min(-100, "must be ≥ −100 T").max(100, "must be ≤ 100 T"), { error: "valuesT must be a list" })
    .min(1, "give at least one field")
    .max(MAX_STEPS_PER_AXIS, `at most ${MAX_STEPS_PER_AXIS} fields`),
});
export const fieldsSchema = z.union([fieldRangeSchema, fieldSetSchema], {
  error: "fields must be { minT, maxT, stepT } or { valuesT: [...] }",
});
export type PlanFields = z.infer<typeof fieldsSchema>;

/**
 * The light that gets through and the noise beyond the polarimeter's own: the relative floor and
 * the minimum transmission of the shared noise model (lib/analysis/definition.ts), whether points
 * past a quarter turn are excluded, and the power at which the polarimeter noise is stated.
 */
export const opticsSchema = noiseModelSchema.omit({ absoluteRad: true }).extend({
  /** Exclude points whose |θ| exceeds π/2 (they need a field sweep to unwrap); else they are only flagged. */
  excludeWrapped: z.boolean().default(false),
  /** The power at which the noise is stated; a line of power P then has shot noise × √(reference/P). Absent: power ignored. */
  referencePowerW: finiteNumber("reference power").gt(0, "must be > 0 W").max(1e6, "must be ≤ 1e6 W").optional(),
});
export type PlanOptics = z.infer<typeof opticsSchema>;
export const DEFAULT_OPTICS: PlanOptics = { relativeFloor: 0, minTransmission: 0.01, excludeWrapped: false };

/** Time a plan costs in the lab: per measured point and per cool-down to a temperature other than ambient. */
export const labTimeSchema = z.strictObject({
  perPointS: finiteNumber("time per point").min(0, "must be ≥ 0 s").max(1e6, "must be ≤ 1e6 s").default(60),
  perCooldownS: finiteNumber("time per cool-down").min(0, "must be ≥ 0 s").max(1e7, "must be ≤ 1e7 s").default(3600),
  /** The temperature that needs no cool-down (the lab's room). */
  ambientK: finiteNumber("ambient temperature").gt(0, "must be > 0 K").max(400, "must be ≤ 400 K").default(293.15),
});
export type PlanLabTime = z.infer<typeof labTimeSchema>;

/**
 * A prior range of an uncertain parameter for the robust design: the criterion is averaged (or its
 * worst case taken) over a seeded sample of the ranges.
 */
export const robustRangeSchema = z
  .strictObject({
    key: z.enum(FREEABLE_KEYS as [FreeableKey, ...FreeableKey[]], {
      error: (issue) => `"${String(issue.input)}" is not a model parameter`,
    }),
    min: finiteNumber("range start"),
    max: finiteNumber("range end"),
  })
  .refine((r) => r.min < r.max, { message: "the range must start below its end", path: ["max"] });
export const MAX_ROBUST_SAMPLES = 32;
export const robustSchema = z.strictObject({
  mode: z.enum(["average", "worst"], { error: 'mode must be "average" or "worst"' }).default("average"),
  samples: finiteNumber("samples").int("must be a whole number").min(2, "at least 2").max(MAX_ROBUST_SAMPLES).default(8),
  seed: finiteNumber("seed")
    .int("must be a whole number")
    .min(0)
    .max(2 ** 31)
    .default(1),
  ranges: z.array(robustRangeSchema).min(1, "give at least one range").max(8),
});
export type PlanRobust = z.infer<typeof robustSchema>;

/**
 * Noise of one point: a rotation noise density (rad/√Hz) and an integration time, σ = noise/√t
 * (white noise averaged over t; the factor of order one that depends on the detection bandwidth
 * convention is left to the user's noise figure — common practice, no source), or σ directly.
 */
export const noiseSchema = z.discriminatedUnion(
  "kind",
  [
    z.strictObject({
      kind: z.literal("density"),
      radPerSqrtHz: finiteNumber("noise density").gt(0, "must be > 0 rad/√Hz"),
      integrationS: finiteNumber("integration time").gt(0, "must be > 0 s").max(1e6, "must be ≤ 1e6 s"),
    }),
    z.strictObject({ kind: z.literal("sigma"), sigmaRad: finiteNumber("σ per point").gt(0, "must be > 0 rad") }),
  ],
  { error: 'noise.kind must be "density" or "sigma"' },
);
export type PlanNoise = z.infer<typeof noiseSchema>;

export const criterionSchema = z.discriminatedUnion(
  "kind",
  [
    /** Standard error of the magnetic share |θm|/(|θe|+|θm|) at one wavelength (the default). */
    z.strictObject({ kind: z.literal("share"), wavelengthNm: finiteNumber("wavelength").gt(0, "must be > 0 nm") }),
    /** Standard error of the fitted magneticScale. */
    z.strictObject({ kind: z.literal("magneticScale") }),
    /** D-optimal: the determinant of the covariance of the free parameters (as relative errors). */
    z.strictObject({ kind: z.literal("dOptimal") }),
    /**
     * Detect the magnetic-dipole part: the largest expected Δχ² between magneticScale = 0 and the
     * alternative (the prior value), i.e. the smallest σ(magneticScale)/alternative.
     */
    z.strictObject({
      kind: z.literal("detect"),
      /** The alternative magneticScale; absent: the prior mean on magneticScale, else the set's value, else 1. */
      alternative: finiteNumber("alternative magneticScale").gt(0, "must be > 0").optional(),
    }),
  ],
  { error: 'criterion.kind must be "share", "magneticScale", "dOptimal" or "detect"' },
);
export type PlanCriterion = z.infer<typeof criterionSchema>;

export const planRequestSchema = z
  .strictObject({
    params: modelParamsSchema,
    lines: z.array(planLineSchema).max(MAX_LINES, `at most ${MAX_LINES} lines`),
    temperatures: temperaturesSchema,
    fields: fieldsSchema,
    lengthM: finiteNumber("sample length").gt(0, "must be > 0 m").max(100, "must be ≤ 100 m"),
    /** The polarimeter's own noise at full transmission (the absolute term of the noise model). */
    noise: noiseSchema,
    optics: opticsSchema.default(DEFAULT_OPTICS),
    points: finiteNumber("number of points").int("must be a whole number").max(MAX_PLAN_POINTS, `must be ≤ ${MAX_PLAN_POINTS}`),
    criterion: criterionSchema,
    /** The analysis the plan is made for: the fit's free set, priors and calibration nuisances. */
    definition: analysisDefinitionSchema.default(defaultAnalysisDefinition),
    robust: robustSchema.optional(),
    labTime: labTimeSchema.default({ perPointS: 60, perCooldownS: 3600, ambientK: 293.15 }),
    topPlans: finiteNumber("number of plans").int().min(1).max(20).default(5),
  })
  .superRefine((v, ctx) => {
    const issue = (path: (string | number)[], message: string) => ctx.addIssue({ code: "custom", path, message });
    if (v.lines.length === 0)
      issue(["lines"], "no lines: add at least one light source (two or more different wavelengths are needed to separate the parts)");
    const freeKeys = v.definition.free.map((f) => f.key);
    const withPrior = new Set(v.definition.priors.map((p) => p.key));
    const unconstrained = freeKeys.filter((k) => !withPrior.has(k)).length;
    if (v.points < 1) issue(["points"], "zero points: a plan needs at least one point (at least one per free parameter for a finite σ)");
    if (v.points >= 1 && v.points < unconstrained) {
      issue(
        ["points"],
        `${unconstrained} free parameters without a prior need at least ${unconstrained} points for a finite σ; you allowed ${v.points}`,
      );
    }
    if ("minK" in v.temperatures && v.temperatures.maxK < v.temperatures.minK)
      issue(["temperatures", "maxK"], "must be ≥ the lowest temperature");
    const cw = v.params.curieWeissK;
    const lowestK = "minK" in v.temperatures ? v.temperatures.minK : Math.min(...v.temperatures.valuesK);
    if (lowestK <= cw) {
      issue(
        ["temperatures", "minK" in v.temperatures ? "minK" : "valuesK"],
        `${lowestK} K is at or below the Curie–Weiss temperature of this set (${cw} K): ` +
          `the model has no ordered phase; keep every temperature above ${cw} K`,
      );
    }
    if ("minT" in v.fields && v.fields.maxT < v.fields.minT) issue(["fields", "maxT"], "must be ≥ the lowest field");
    const tSteps = "minK" in v.temperatures ? Math.floor((v.temperatures.maxK - v.temperatures.minK) / v.temperatures.stepK + 1e-9) + 1 : 0;
    const bSteps = "minT" in v.fields ? Math.floor((v.fields.maxT - v.fields.minT) / v.fields.stepT + 1e-9) + 1 : 0;
    if (tSteps > MAX_STEPS_PER_AXIS)
      issue(["temperatures", "stepK"], `gives ${tSteps} temperatures; at most ${MAX_STEPS_PER_AXIS} (use a coarser step)`);
    if (bSteps > MAX_STEPS_PER_AXIS)
      issue(["fields", "stepT"], `gives ${bSteps} fields; at most ${MAX_STEPS_PER_AXIS} (use a coarser step)`);
    if (tSteps <= MAX_STEPS_PER_AXIS && bSteps <= MAX_STEPS_PER_AXIS) {
      const temps = temperatureValues(v.temperatures).length;
      const fields = fieldValues(v.fields);
      const candidates = v.lines.length * temps * fields.filter((b) => b !== 0).length;
      if (candidates > MAX_CANDIDATES)
        issue(["lines"], `${candidates} candidate points; at most ${MAX_CANDIDATES} (fewer lines or coarser steps)`);
      if (fields.every((b) => b === 0)) issue(["fields"], "a field of 0 T gives no rotation at all: let the magnet reach a nonzero field");
    }
    if (v.criterion.kind === "magneticScale" && !freeKeys.includes("magneticScale"))
      issue(["criterion"], "pinning down magneticScale needs magneticScale among the free parameters");
    if (v.criterion.kind === "detect" && !freeKeys.includes("magneticScale"))
      issue(["criterion"], "detecting the magnetic-dipole part needs magneticScale among the free parameters");
    v.definition.free.forEach((f, i) => {
      const x = v.params[f.key];
      if ((f.min !== undefined && x < f.min) || (f.max !== undefined && x > f.max))
        issue(["definition", "free", i], `the set's ${f.key} (${x}) lies outside its bounds [${f.min ?? "−∞"}, ${f.max ?? "∞"}]`);
    });
    v.robust?.ranges.forEach((r, i) => {
      if (!freeKeys.includes(r.key) && !withPrior.has(r.key))
        issue(
          ["robust", "ranges", i, "key"],
          `${r.key} is held fixed in this analysis: free it (or give it a prior) to plan over its range`,
        );
      const lower = NATURAL_LOWER[r.key];
      if (lower !== undefined && r.min < lower) issue(["robust", "ranges", i, "min"], `must be ≥ ${lower} (the model's bound of ${r.key})`);
    });
    if (v.params.sellmeierB > 0) {
      v.lines.forEach((line, i) => {
        if (!(line.wavelengthNm > v.params.sellmeierWavelengthNm))
          issue(["lines", i, "wavelengthNm"], `must be above the Sellmeier pole of this set (${v.params.sellmeierWavelengthNm} nm)`);
      });
      if (v.criterion.kind === "share" && !(v.criterion.wavelengthNm > v.params.sellmeierWavelengthNm)) {
        issue(["criterion", "wavelengthNm"], `must be above the Sellmeier pole of this set (${v.params.sellmeierWavelengthNm} nm)`);
      }
    }
    if (v.params.oscillatorDampingRadPerS === 0) {
      v.lines.forEach((line, i) => {
        if (line.wavelengthNm === v.params.oscillatorWavelengthNm)
          issue(["lines", i, "wavelengthNm"], "must not equal the oscillator wavelength when its damping is 0");
      });
    }
  });

export type PlanRequest = z.infer<typeof planRequestSchema>;
export type PlanRequestInput = z.input<typeof planRequestSchema>;

/** σ of one measured rotation, rad. */
export function sigmaPerPointRad(noise: PlanNoise): number {
  return noise.kind === "sigma" ? noise.sigmaRad : noise.radPerSqrtHz / Math.sqrt(noise.integrationS);
}

/** The temperatures a request allows, K, ascending and distinct. */
export function temperatureValues(t: PlanTemperatures): number[] {
  const all = "minK" in t ? rangeValues(t.minK, t.maxK, t.stepK) : t.valuesK;
  return [...new Set(all)].sort((a, b) => a - b);
}

/** The fields a request allows, T, ascending and distinct (0 T included if asked; the candidates drop it). */
export function fieldValues(f: PlanFields): number[] {
  const all = "minT" in f ? rangeValues(f.minT, f.maxT, f.stepT) : f.valuesT;
  return [...new Set(all)].sort((a, b) => a - b);
}

/** The values of an inclusive range; the last step is dropped when it would overshoot. */
export function rangeValues(min: number, max: number, step: number): number[] {
  const n = Math.floor((max - min) / step + 1e-9) + 1;
  const out: number[] = [];
  // Twelve significant digits, so 0.1-sized steps print as typed.
  for (let i = 0; i < n; i++) out.push(Number((min + i * step).toPrecision(12)));
  return out;
}
