import { type SpectrumRequest, formatIssues, spectrumRequestSchema } from "./schema";
import { numericalRangeIssues } from "./numerical-range";

/*
 * The errors of a spectrum run and their messages: invalid input, a computed number that is not
 * finite (reported, never a silent NaN, physics-model.md §6.3) and a cancelled job.
 */

/** Invalid input, with one "field: rule" line per problem (schema.ts formatIssues). */
export class SpectrumInputError extends Error {
  constructor(readonly issues: string[]) {
    super(issues.join("; "));
    this.name = "SpectrumInputError";
  }
}

/** A computed number came out non-finite: reported as an error, never as a silent NaN (§6.3). */
export class NonFiniteResultError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "NonFiniteResultError";
  }
}

/** Thrown by a job whose shouldCancel() returned true. */
export class SpectrumCancelledError extends Error {
  constructor() {
    super("Cancelled");
    this.name = "CancelledError";
  }
}

/** The request through the one schema (§2). Throws SpectrumInputError. */
export function validSpectrumRequest(input: SpectrumRequest): SpectrumRequest {
  const parsed = spectrumRequestSchema.safeParse(input);
  if (!parsed.success) throw new SpectrumInputError(formatIssues(parsed.error));
  // The numerical method's valid range (numerical-range.ts) holds on every path that runs it.
  const outOfRange = numericalRangeIssues(parsed.data);
  if (outOfRange.length > 0) throw new SpectrumInputError(outOfRange);
  return parsed.data;
}

/** A run-wide figure (M0, the LLG deviation) must be finite. */
export function assertFiniteFigure(name: string, value: number): void {
  if (!Number.isFinite(value)) throw new NonFiniteResultError(`${name}: computed value is not finite`);
}

/** The columns of wavelength i must be finite where they are defined (null: not defined there). */
export function assertFiniteColumns(i: number, wavelengthNm: number, values: readonly (readonly [string, number | null])[]): void {
  for (const [name, v] of values) {
    if (v !== null && !Number.isFinite(v)) {
      throw new NonFiniteResultError(
        `wavelengthsNm.${i}: computed ${name} is not finite at ${wavelengthNm} nm (the parameters reach a singularity there)`,
      );
    }
  }
}

/** δMz of wavelength i must be finite where it is defined (null: the cone reached |C| ≥ 1). */
export function assertFiniteDeltaMz(i: number, wavelengthNm: number, plus: number | null, minus: number | null): void {
  if ((plus !== null && !Number.isFinite(plus)) || (minus !== null && !Number.isFinite(minus))) {
    throw new NonFiniteResultError(`wavelengthsNm.${i}: computed deltaMz is not finite at ${wavelengthNm} nm`);
  }
}
