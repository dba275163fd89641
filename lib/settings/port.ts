import { z } from "zod";

/** A TCP port given as an environment variable (a string, hence coerced). */
export const port = z.coerce.number().int().min(1).max(65_535);
