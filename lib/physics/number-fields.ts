import { z } from "zod";

/*
 * The numeric field rules every schema of the product uses (model parameters, fit, planner, lab
 * runs, measurements, stored records). They live here because the physics schema needs them and
 * the physics imports nothing from outside lib/physics; lib/contracts/validation.ts re-exports
 * them for everyone else. JSON has no NaN or Infinity, but a worker message or a parsed file can
 * carry them, so "finite" is checked explicitly.
 */

/** A finite number; the messages name the field: "temperature is required / must be a number / must be finite". */
export function finiteNumber(what: string) {
  return z
    .number({ error: (issue) => (issue.input === undefined ? `${what} is required` : `${what} must be a number`) })
    .refine(Number.isFinite, { message: `${what} must be finite` });
}

/** A finite number above 0; the messages name the field, as finiteNumber's do, and "… must be > 0". */
export function positiveNumber(what: string) {
  return finiteNumber(what).gt(0, `${what} must be > 0`);
}
