import { z } from "zod";
import { finiteNumber } from "./number-fields";
import { zodIssueLines } from "./zod-issues";

/*
 * The one validation schema for the model parameters (../shared/physics-model.md §2), shared by
 * the API, the forms, the worker and the command line. Keys carry their units.
 * Messages name the rule, so the command line can print "field: rule" on one line.
 */

/** The two dispersions the diamagnetic term may follow (§5.5). */
export const DIAMAGNETIC_DISPERSIONS = ["whole", "host"] as const;
export type DiamagneticDispersion = (typeof DIAMAGNETIC_DISPERSIONS)[number];

export const MAX_ABSORPTION_ROWS = 1000;

/** One row of a measured absorption table: vacuum wavelength and intensity absorption coefficient. */
export const absorptionRowSchema = z.strictObject({
  wavelengthNm: finiteNumber("wavelength").gt(0, "must be > 0 nm").max(1e6, "must be ≤ 1e6 nm"),
  absorptionPerM: finiteNumber("absorption coefficient").min(0, "must be ≥ 0 m⁻¹").max(1e9, "must be ≤ 1e9 m⁻¹"),
});
export type AbsorptionRow = z.infer<typeof absorptionRowSchema>;

/** At least two rows, wavelengths strictly increasing (linear interpolation between them). */
export const absorptionTableSchema = z
  .array(absorptionRowSchema, { error: "absorptionTable must be a list of { wavelengthNm, absorptionPerM }" })
  .min(2, "must hold at least two rows")
  .max(MAX_ABSORPTION_ROWS, `must hold at most ${MAX_ABSORPTION_ROWS} rows`)
  .superRefine((rows, ctx) => {
    for (let i = 1; i < rows.length; i++) {
      if (!(rows[i]!.wavelengthNm > rows[i - 1]!.wavelengthNm)) {
        ctx.addIssue({ code: "custom", path: [i, "wavelengthNm"], message: "wavelengths must be strictly increasing" });
        return;
      }
    }
  });

const isHalfInteger = (j: number) => Math.abs(j * 2 - Math.round(j * 2)) < 1e-9 && j >= 0.5;

/** Material parameters of a paramagnet (no measurement conditions). */
export const materialShape = {
  ionDensityPerM3: finiteNumber("ion density").min(0, "must be ≥ 0 m⁻³").max(1e30, "must be ≤ 1e30 m⁻³"),
  landeG: finiteNumber("Landé g").gt(0, "must be > 0").max(10, "must be ≤ 10"),
  totalJ: finiteNumber("J")
    .max(50, "must be ≤ 50")
    .refine(isHalfInteger, { message: "must be a positive multiple of 1/2 (1/2, 1, 3/2, …)" }),
  curieWeissK: finiteNumber("Curie–Weiss temperature").min(-1000, "must be ≥ −1000 K").max(1000, "must be ≤ 1000 K"),
  gilbertDamping: finiteNumber("Gilbert damping").min(0, "must be ≥ 0").max(10, "must be ≤ 10"),
  epsInf: finiteNumber("ε∞").gt(0, "must be > 0").max(100, "must be ≤ 100"),
  sellmeierB: finiteNumber("Sellmeier B").min(0, "must be ≥ 0").max(100, "must be ≤ 100"),
  sellmeierWavelengthNm: finiteNumber("Sellmeier wavelength").gt(0, "must be > 0 nm").max(1e6, "must be ≤ 1e6 nm"),
  oscillatorStrength: finiteNumber("oscillator strength").min(0, "must be ≥ 0").max(100, "must be ≤ 100"),
  oscillatorWavelengthNm: finiteNumber("oscillator wavelength").gt(0, "must be > 0 nm").max(1e6, "must be ≤ 1e6 nm"),
  oscillatorDampingRadPerS: finiteNumber("oscillator damping").min(0, "must be ≥ 0 rad/s").max(1e17, "must be ≤ 1e17 rad/s"),
  gyrationPerT: finiteNumber("gyration").min(-10, "must be ≥ −10 T⁻¹").max(10, "must be ≤ 10 T⁻¹"),
  magneticScale: finiteNumber("magnetic scale").min(0, "must be ≥ 0").max(1000, "must be ≤ 1000").default(1),
  /**
   * The classical bound-electron (diamagnetic) gyration of §5.5, added to G when true. A switch,
   * not a number, so it never appears among the numeric parameters a fit may free. Absent = off.
   */
  diamagneticTerm: z.boolean({ error: "diamagneticTerm must be true or false" }).optional(),
  /**
   * Magneto-optic anomaly factor γ of the diamagnetic term (§5.5): G_dia is multiplied by it.
   * Becquerel's formula with γ = 1 overestimates glasses' Verdet constants; absent = 1 (today's term).
   */
  diamagneticAnomaly: finiteNumber("diamagnetic anomaly factor").min(0, "must be ≥ 0").max(10, "must be ≤ 10").optional(),
  /**
   * Which dispersion the diamagnetic term uses (§5.5): "whole" = every pole of ε (absent = this),
   * "host" = the Sellmeier background only, without the paramagnetic ion's own transition.
   */
  diamagneticDispersion: z.enum(DIAMAGNETIC_DISPERSIONS, { error: 'must be "whole" or "host"' }).optional(),
  /**
   * A measured absorption table α(λ) (absorption.ts): where present it, not the oscillator's
   * Lorentzian tail, sets the isotropic loss inside its wavelength range.
   */
  absorptionTable: absorptionTableSchema.optional(),
} as const;

/** Measurement conditions. */
export const conditionsShape = {
  temperatureK: finiteNumber("temperature").gt(0, "must be > 0 K").max(10000, "must be ≤ 10000 K"),
  fieldT: finiteNumber("field").min(-100, "must be ≥ −100 T").max(100, "must be ≤ 100 T"),
  lengthM: finiteNumber("length").gt(0, "must be > 0 m").max(100, "must be ≤ 100 m"),
} as const;

type WithTemps = { temperatureK: number; curieWeissK: number };
const temperatureAboveCurieWeiss = <T extends WithTemps>(v: T, ctx: z.RefinementCtx) => {
  if (!(v.temperatureK > v.curieWeissK)) {
    ctx.addIssue({
      code: "custom",
      path: ["temperatureK"],
      message: `must be above the Curie–Weiss temperature (${v.curieWeissK} K); the ordered phase is not modelled`,
    });
  }
};

/** A stored parameter set's model: material + conditions. */
export const modelParamsSchema = z.strictObject({ ...materialShape, ...conditionsShape }).superRefine(temperatureAboveCurieWeiss);

export type ModelParams = z.infer<typeof modelParamsSchema>;
export type ModelParamsInput = z.input<typeof modelParamsSchema>;
export type ModelParamKey = keyof ModelParams;
/** The on/off switches of the model (§5.5); never freed by a fit, never shown as a number box. */
export type ModelFlagKey = "diamagneticTerm";
/**
 * Optional refinements that are not plain number boxes: the diamagnetic term's anomaly factor and
 * dispersion (§5.5) and the measured absorption table. A fit never frees them; absent = today's model.
 */
export type ModelOptionKey = "diamagneticAnomaly" | "diamagneticDispersion" | "absorptionTable";
/** The numeric model parameters: the ones a form shows as number boxes and a fit may vary. */
export type NumericModelParamKey = Exclude<ModelParamKey, ModelFlagKey | ModelOptionKey>;
export const MODEL_FLAG_KEYS: readonly ModelFlagKey[] = ["diamagneticTerm"];
export const MODEL_OPTION_KEYS: readonly ModelOptionKey[] = ["diamagneticAnomaly", "diamagneticDispersion", "absorptionTable"];

export const MAX_WAVELENGTHS = 5000;

/** A spectrum request (command line, worker, API): model + wavelengths + method. */
export const spectrumRequestSchema = z
  .strictObject({
    ...materialShape,
    ...conditionsShape,
    wavelengthsNm: z
      .array(finiteNumber("wavelength").gt(0, "each wavelength must be > 0 nm"), {
        error: (issue) => (issue.input === undefined ? "wavelengthsNm is required" : "wavelengthsNm must be a list of numbers"),
      })
      .min(1, "must hold at least one wavelength")
      .max(MAX_WAVELENGTHS, `must hold at most ${MAX_WAVELENGTHS} wavelengths`),
    method: z.enum(["analytic", "llg"], {
      error: (issue) => (issue.input === undefined ? 'method is required ("analytic" or "llg")' : 'must be "analytic" or "llg"'),
    }),
    intensityWPerM2: finiteNumber("intensity").min(0, "must be ≥ 0 W/m²").max(1e20, "must be ≤ 1e20 W/m²").optional(),
  })
  .superRefine(temperatureAboveCurieWeiss)
  .superRefine((v, ctx) => {
    for (let i = 1; i < v.wavelengthsNm.length; i++) {
      const prev = v.wavelengthsNm[i - 1]!;
      const cur = v.wavelengthsNm[i]!;
      if (!(cur > prev)) {
        ctx.addIssue({
          code: "custom",
          path: ["wavelengthsNm", i],
          message:
            cur === prev
              ? `duplicate wavelength ${cur} nm; values must be strictly increasing`
              : `must be strictly increasing (${cur} nm follows ${prev} nm)`,
        });
        return;
      }
    }
    if (v.sellmeierB > 0) {
      const first = v.wavelengthsNm[0];
      if (first !== undefined && !(first > v.sellmeierWavelengthNm)) {
        ctx.addIssue({
          code: "custom",
          path: ["wavelengthsNm", 0],
          message: `every wavelength must be above the Sellmeier pole (${v.sellmeierWavelengthNm} nm) when sellmeierB > 0`,
        });
      }
    }
    if (v.oscillatorDampingRadPerS === 0 && v.wavelengthsNm.includes(v.oscillatorWavelengthNm)) {
      ctx.addIssue({
        code: "custom",
        path: ["wavelengthsNm"],
        message: `must not contain the oscillator wavelength (${v.oscillatorWavelengthNm} nm) when its damping is 0`,
      });
    }
  });

export type SpectrumRequest = z.infer<typeof spectrumRequestSchema>;
export type SpectrumRequestInput = z.input<typeof spectrumRequestSchema>;

/** One line per problem: "field: rule". Used by the command line and the API's `fields`. */
export function formatIssues(error: z.ZodError): string[] {
  return zodIssueLines(error.issues, { unknownKey: "unknown key (not a model parameter)" });
}

/**
 * Request for a spin trace (one wavelength, both circular drives; physics-model.md §7): the model
 * parameters plus the wavelength, the intensity (0 → the linear-regime drive of §7) and the number
 * of lock-in periods shown after the ramp.
 */
export const spinTraceRequestSchema = z
  .strictObject({
    ...materialShape,
    ...conditionsShape,
    wavelengthNm: finiteNumber("wavelength").gt(0, "must be > 0 nm").max(1e9, "must be ≤ 1e9 nm"),
    intensityWPerM2: finiteNumber("intensity").min(0, "must be ≥ 0 W/m²").max(1e20, "must be ≤ 1e20 W/m²"),
    periods: finiteNumber("periods").int("must be a whole number").min(1, "must be ≥ 1").max(50, "must be ≤ 50"),
  })
  .superRefine(temperatureAboveCurieWeiss)
  .superRefine((v, ctx) => {
    if (v.sellmeierB > 0 && !(v.wavelengthNm > v.sellmeierWavelengthNm)) {
      ctx.addIssue({
        code: "custom",
        path: ["wavelengthNm"],
        message: `must be above the Sellmeier pole (${v.sellmeierWavelengthNm} nm) when sellmeierB > 0`,
      });
    }
    if (v.fieldT === 0 || v.ionDensityPerM3 === 0) {
      ctx.addIssue({
        code: "custom",
        path: ["fieldT"],
        message: "a spin trace needs spins in a nonzero field (fieldT ≠ 0, ionDensityPerM3 > 0)",
      });
    }
  });

export type SpinTraceRequest = z.infer<typeof spinTraceRequestSchema>;
export type SpinTraceRequestInput = z.input<typeof spinTraceRequestSchema>;
