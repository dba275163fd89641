import { z } from "zod";
import { finiteNumber, safeString } from "@/lib/contracts/validation";
import { modelParamsSchema } from "@/lib/physics/schema";

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
});
export type PlanLine = z.infer<typeof planLineSchema>;

export const temperatureRangeSchema = z.strictObject({
  minK: finiteNumber("lowest temperature").gt(0, "must be > 0 K").max(10000, "must be ≤ 10000 K"),
  maxK: finiteNumber("highest temperature").gt(0, "must be > 0 K").max(10000, "must be ≤ 10000 K"),
  stepK: finiteNumber("temperature step").gt(0, "must be > 0 K"),
});

export const fieldRangeSchema = z.strictObject({
  minT: finiteNumber("lowest field").min(-100, "must be ≥ −100 T").max(100, "must be ≤ 100 T"),
  maxT: finiteNumber("highest field").min(-100, "must be ≥ −100 T").max(100, "must be ≤ 100 T"),
  stepT: finiteNumber("field step").gt(0, "must be > 0 T"),
});

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
  ],
  { error: 'criterion.kind must be "share", "magneticScale" or "dOptimal"' },
);
export type PlanCriterion = z.infer<typeof criterionSchema>;

/** The two amplitudes that carry the electric-dipole and the magnetic-dipole part. */
export const DEFAULT_FREE_KEYS = ["gyrationPerT", "magneticScale"] as const;

export const planRequestSchema = z
  .strictObject({
    params: modelParamsSchema,
    lines: z.array(planLineSchema).max(MAX_LINES, `at most ${MAX_LINES} lines`),
    temperatures: temperatureRangeSchema,
    fields: fieldRangeSchema,
    lengthM: finiteNumber("sample length").gt(0, "must be > 0 m").max(100, "must be ≤ 100 m"),
    noise: noiseSchema,
    points: finiteNumber("number of points").int("must be a whole number").max(MAX_PLAN_POINTS, `must be ≤ ${MAX_PLAN_POINTS}`),
    criterion: criterionSchema,
    freeKeys: z
      .array(z.string())
      .min(1, "free at least one parameter")
      .max(8, "free at most 8 parameters")
      .default([...DEFAULT_FREE_KEYS]),
    topPlans: finiteNumber("number of plans").int().min(1).max(20).default(5),
  })
  .superRefine((v, ctx) => {
    const issue = (path: (string | number)[], message: string) => ctx.addIssue({ code: "custom", path, message });
    if (v.lines.length === 0)
      issue(["lines"], "no lines: add at least one light source (two or more different wavelengths are needed to separate the parts)");
    if (v.points < 1) issue(["points"], "zero points: a plan needs at least one point (at least one per free parameter for a finite σ)");
    if (v.points >= 1 && v.points < v.freeKeys.length) {
      issue(
        ["points"],
        `${v.freeKeys.length} free parameters need at least ${v.freeKeys.length} points for a finite σ; you allowed ${v.points}`,
      );
    }
    if (v.temperatures.maxK < v.temperatures.minK) issue(["temperatures", "maxK"], "must be ≥ the lowest temperature");
    const cw = v.params.curieWeissK;
    if (v.temperatures.minK <= cw) {
      issue(
        ["temperatures", "minK"],
        `${v.temperatures.minK} K is at or below the Curie–Weiss temperature of this set (${cw} K): ` +
          `the model has no ordered phase; start the range above ${cw} K`,
      );
    }
    if (v.fields.maxT < v.fields.minT) issue(["fields", "maxT"], "must be ≥ the lowest field");
    const tSteps = Math.floor((v.temperatures.maxK - v.temperatures.minK) / v.temperatures.stepK + 1e-9) + 1;
    const bSteps = Math.floor((v.fields.maxT - v.fields.minT) / v.fields.stepT + 1e-9) + 1;
    if (tSteps > MAX_STEPS_PER_AXIS)
      issue(["temperatures", "stepK"], `gives ${tSteps} temperatures; at most ${MAX_STEPS_PER_AXIS} (use a coarser step)`);
    if (bSteps > MAX_STEPS_PER_AXIS)
      issue(["fields", "stepT"], `gives ${bSteps} fields; at most ${MAX_STEPS_PER_AXIS} (use a coarser step)`);
    const candidates = v.lines.length * Math.max(tSteps, 0) * Math.max(bSteps, 0);
    if (candidates > MAX_CANDIDATES)
      issue(["lines"], `${candidates} candidate points; at most ${MAX_CANDIDATES} (fewer lines or coarser steps)`);
    if (v.fields.minT === 0 && v.fields.maxT === 0)
      issue(["fields"], "a field of 0 T gives no rotation at all: let the magnet reach a nonzero field");
    const numeric = new Set(
      Object.entries(v.params)
        .filter(([k, x]) => typeof x === "number" && !["temperatureK", "fieldT", "lengthM"].includes(k))
        .map(([k]) => k),
    );
    const seen = new Set<string>();
    v.freeKeys.forEach((k, i) => {
      if (!numeric.has(k)) issue(["freeKeys", i], `${k} is not a numeric material parameter of this set`);
      if (seen.has(k)) issue(["freeKeys", i], `${k} is listed twice`);
      seen.add(k);
    });
    if (v.criterion.kind === "magneticScale" && !seen.has("magneticScale"))
      issue(["criterion"], "pinning down magneticScale needs magneticScale among the free parameters");
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

/** The values of an inclusive range; the last step is dropped when it would overshoot. */
export function rangeValues(min: number, max: number, step: number): number[] {
  const n = Math.floor((max - min) / step + 1e-9) + 1;
  const out: number[] = [];
  // Twelve significant digits, so 0.1-sized steps print as typed.
  for (let i = 0; i < n; i++) out.push(Number((min + i * step).toPrecision(12)));
  return out;
}
