import { z } from "zod";
import { nodeEnvSchema } from "./build.mjs";

/*
 * The sign-in fragment. next-auth reads AUTH_SECRET itself to sign the session cookies; it is
 * validated here so that a production server without one fails at start, naming the variable,
 * instead of answering every sign-in with next-auth's generic configuration error.
 */

const AUTH_SECRET_MIN = 16;

export const authSettingsSchema = z
  .object({
    NODE_ENV: nodeEnvSchema,
    AUTH_SECRET: z.string().min(AUTH_SECRET_MIN, `AUTH_SECRET must be at least ${AUTH_SECRET_MIN} characters`).optional(),
    // How many reverse proxies in front append to X-Forwarded-For; 0 ignores the header (lib/auth/client-ip.ts).
    GYROLUX_TRUSTED_PROXY_HOPS: z.coerce.number().int().min(0).max(10).default(0),
    // New accounts per client address and hour (lib/auth/sign-up.ts); the test run raises it, its clients share one address.
    GYROLUX_SIGN_UPS_PER_CLIENT_HOUR: z.coerce.number().int().min(1).max(100_000).default(20),
    // Failed sign-ins one client address may make across every e-mail in 15 minutes before it is slowed (password spraying).
    GYROLUX_SIGN_IN_FAILURES_PER_CLIENT: z.coerce.number().int().min(5).max(100_000).default(100),
  })
  .superRefine((env, context) => {
    if (env.NODE_ENV === "production" && env.AUTH_SECRET === undefined) {
      context.addIssue({
        code: "custom",
        path: ["AUTH_SECRET"],
        message: `AUTH_SECRET is required when NODE_ENV=production: set it to a random string of at least ${AUTH_SECRET_MIN} characters`,
      });
    }
  })
  .transform((env) => ({
    secret: env.AUTH_SECRET,
    trustedProxyHops: env.GYROLUX_TRUSTED_PROXY_HOPS,
    signUpsPerClientHour: env.GYROLUX_SIGN_UPS_PER_CLIENT_HOUR,
    signInFailuresPerClient: env.GYROLUX_SIGN_IN_FAILURES_PER_CLIENT,
  }));

export type AuthSettings = z.output<typeof authSettingsSchema>;
