import { z } from "zod";
import { finiteNumber } from "@/lib/contracts/validation";
import { MODEL_FLAG_KEYS, MODEL_OPTION_KEYS, type ModelFlagKey, type ModelOptionKey, materialShape } from "@/lib/physics/schema";

/*
 * The analysis definition: what a fit frees, what it holds, which priors and calibration
 * nuisances it carries and how noisy a point is. One definition serves the fit (it analyses the
 * data it is given) and the planner (it designs data for exactly that analysis), so a plan is
 * always made for the fit that will be run. Pure: no server, database or UI.
 */

type MaterialKey = keyof typeof materialShape;
/**
 * totalJ is a quantum number (a multiple of 1/2), not a continuous parameter, and a switch such as
 * the diamagnetic term, the choice of its dispersion or a measured absorption table is not a number
 * at all: none is ever fitted.
 */
export type FreeableKey = Exclude<MaterialKey, "totalJ" | ModelFlagKey | ModelOptionKey>;
const NOT_FREEABLE: ReadonlySet<string> = new Set<string>(["totalJ", ...MODEL_FLAG_KEYS, ...MODEL_OPTION_KEYS]);
export const FREEABLE_KEYS = (Object.keys(materialShape) as MaterialKey[]).filter((k): k is FreeableKey => !NOT_FREEABLE.has(k));

/** The default free parameters of both the fit and the planner: the two amplitudes and the electric part's dispersion. */
export const DEFAULT_FREE_KEYS: FreeableKey[] = ["gyrationPerT", "oscillatorWavelengthNm", "magneticScale"];

/** Bounds that keep a free parameter inside the model's valid range (physics-model.md §2). */
export const NATURAL_LOWER: Partial<Record<FreeableKey, number>> = {
  ionDensityPerM3: 0,
  gilbertDamping: 0,
  sellmeierB: 0,
  oscillatorStrength: 0,
  oscillatorDampingRadPerS: 0,
  magneticScale: 0,
};

const freeableKeySchema = z.enum(FREEABLE_KEYS as [FreeableKey, ...FreeableKey[]], {
  error: (issue) => `"${String(issue.input)}" is not a model parameter that a fit can free`,
});

export const freeParamSchema = z
  .strictObject({
    key: freeableKeySchema,
    min: finiteNumber("min").optional(),
    max: finiteNumber("max").optional(),
  })
  .refine((f) => f.min === undefined || f.max === undefined || f.min < f.max, { message: "min must be below max", path: ["min"] });
export type FreeParam = z.infer<typeof freeParamSchema>;

/**
 * A Gaussian prior on a model parameter: the parameter is fitted as a nuisance with the penalty
 * ((x − mean)/sigma)² added to χ² (a Gaussian likelihood term, common practice, no source).
 */
export const priorSchema = z.strictObject({
  key: freeableKeySchema,
  mean: finiteNumber("prior mean"),
  sigma: finiteNumber("prior σ").gt(0, "must be > 0"),
});
export type Prior = z.infer<typeof priorSchema>;

/**
 * Calibration of one measurement set, as nuisances of the analysis. scaleSigma: relative σ of the
 * set's field × length scale, a factor on the model value with prior 1 ± scaleSigma (θ ∝ B·L in the
 * linear regime, physics-model.md §6). temperatureSigmaK: σ of the sample temperature. relativeFloor:
 * a fraction of |value| added in quadrature to each point's σ.
 */
export const calibrationSchema = z.strictObject({
  scaleSigma: finiteNumber("field/length scale σ").min(0, "must be ≥ 0").max(0.5, "must be ≤ 0.5").default(0),
  temperatureSigmaK: finiteNumber("temperature σ").min(0, "must be ≥ 0 K").max(100, "must be ≤ 100 K").default(0),
  relativeFloor: finiteNumber("relative error floor").min(0, "must be ≥ 0").max(1, "must be ≤ 1").default(0),
});
export type Calibration = z.infer<typeof calibrationSchema>;

/**
 * The noise a laboratory has, for designing data (the fit takes each point's σ from the data):
 * σ² = (absoluteRad / √transmission)² + (relativeFloor·|θ|)² + calibration terms. The absolute
 * polarimeter noise is stated for full transmission and grows as 1/√transmission because the
 * detected light is shot-noise limited (common practice, no source). Points whose transmission lies
 * below minTransmission are never proposed.
 */
export const noiseModelSchema = z.strictObject({
  absoluteRad: finiteNumber("polarimeter noise").gt(0, "must be > 0 rad"),
  relativeFloor: finiteNumber("relative floor").min(0, "must be ≥ 0").max(1, "must be ≤ 1").default(0),
  minTransmission: finiteNumber("minimum transmission").gt(0, "must be > 0").max(1, "must be ≤ 1").default(0.01),
});
export type NoiseModel = z.infer<typeof noiseModelSchema>;

export const analysisDefinitionSchema = z
  .strictObject({
    free: z
      .array(freeParamSchema, { error: "free must be a list of parameters" })
      .min(1, "free at least one parameter")
      .max(FREEABLE_KEYS.length),
    priors: z.array(priorSchema, { error: "priors must be a list" }).max(FREEABLE_KEYS.length).default([]),
    calibration: calibrationSchema.default({ scaleSigma: 0, temperatureSigmaK: 0, relativeFloor: 0 }),
  })
  .superRefine((d, ctx) => {
    const seen = new Set<string>();
    d.free.forEach((f, i) => {
      if (seen.has(f.key)) ctx.addIssue({ code: "custom", path: ["free", i, "key"], message: `${f.key} is listed twice` });
      seen.add(f.key);
    });
    const priorSeen = new Set<string>();
    d.priors.forEach((p, i) => {
      if (priorSeen.has(p.key)) ctx.addIssue({ code: "custom", path: ["priors", i, "key"], message: `${p.key} has two priors` });
      priorSeen.add(p.key);
    });
  });
export type AnalysisDefinition = z.infer<typeof analysisDefinitionSchema>;
export type AnalysisDefinitionInput = z.input<typeof analysisDefinitionSchema>;

/** The definition both the fit and the planner start from. */
export function defaultAnalysisDefinition(): AnalysisDefinition {
  return {
    free: DEFAULT_FREE_KEYS.map((key) => (NATURAL_LOWER[key] === undefined ? { key } : { key, min: NATURAL_LOWER[key] })),
    priors: [],
    calibration: { scaleSigma: 0, temperatureSigmaK: 0, relativeFloor: 0 },
  };
}

/**
 * Keys that vary in the analysis: the free ones, then those that carry a prior but are not listed
 * free (a prior frees its parameter as a nuisance).
 */
export function variedKeys(definition: Pick<AnalysisDefinition, "free" | "priors">): FreeableKey[] {
  const keys = definition.free.map((f) => f.key);
  for (const p of definition.priors) if (!keys.includes(p.key)) keys.push(p.key);
  return keys;
}

/** Σ ((x − mean)/σ)² over the priors, for values keyed by parameter. */
export function priorPenalty(priors: readonly Prior[], values: Readonly<Record<string, number>>): number {
  let sum = 0;
  for (const p of priors) {
    const x = values[p.key];
    if (x === undefined) continue;
    const z = (x - p.mean) / p.sigma;
    sum += z * z;
  }
  return sum;
}

/**
 * The effective variance of one point: its own σ, the relative floor and the temperature
 * calibration propagated through the model, (∂value/∂T · σT)², added in quadrature (the
 * effective-variance method, common practice, no source). The scale nuisance is not folded in here:
 * it is common to all points of a set, so it is fitted (or carried in the Fisher matrix) as a parameter.
 */
export function effectiveVariance(
  sigma: number,
  value: number,
  calibration: Pick<Calibration, "relativeFloor" | "temperatureSigmaK">,
  dValueDTemperature = 0,
): number {
  const floor = calibration.relativeFloor * Math.abs(value);
  const thermal = dValueDTemperature * calibration.temperatureSigmaK;
  return sigma * sigma + floor * floor + thermal * thermal;
}

/** σ of one designed point under the laboratory's noise (without calibration terms). */
export function designedPointSigma(noise: NoiseModel, thetaRad: number, transmission: number): number {
  const shot = noise.absoluteRad / Math.sqrt(Math.max(transmission, Number.MIN_VALUE));
  const floor = noise.relativeFloor * Math.abs(thetaRad);
  return Math.hypot(shot, floor);
}
