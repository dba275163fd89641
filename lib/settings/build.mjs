import { z } from "zod";

/*
 * The build fragment: the variables next.config.mjs needs. Plain JavaScript because Node 20 cannot
 * import TypeScript and Next loads next.config.mjs with Node's own import; build.d.mts gives the
 * TypeScript side its types. The server variant reuses NODE_ENV from here, so it has one home.
 */

export const nodeEnvSchema = z.enum(["development", "production", "test"]).default("development");

export const buildSettingsSchema = z
  .object({
    NODE_ENV: nodeEnvSchema,
    // `npm test` builds into its own folder (.next-test), so a test run never rebuilds the build a
    // running `npm run demo` serves from the same checkout. An empty value means the default.
    GYROLUX_NEXT_DIST_DIR: z.string().optional(),
    // Strict-Transport-Security max-age in seconds for a deployment behind TLS; 0 sends no header
    // (a plain-http demo must not tell browsers to insist on https). Read when the app is built.
    GYROLUX_HSTS_MAX_AGE: z.coerce.number().int().min(0).max(63_072_000).default(0),
  })
  .transform((env) => ({
    nodeEnv: env.NODE_ENV,
    nextDistDir: env.GYROLUX_NEXT_DIST_DIR || ".next",
    hstsMaxAgeS: env.GYROLUX_HSTS_MAX_AGE,
  }));

/** The build settings of `source` (the process environment unless given). */
export function readBuildSettings(source = process.env) {
  return buildSettingsSchema.parse(source);
}
