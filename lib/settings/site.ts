import { z } from "zod";
import { port } from "./port";

/*
 * The site fragment: where the app is reached and what kind of deployment it is.
 */

export const siteSettingsSchema = z
  .object({
    // Links in e-mails and share links are built from this, never from the request's Host header
    // (which a caller controls: a reset link pointing elsewhere would hand over the token).
    GYROLUX_PUBLIC_URL: z.url().optional(),
    /** The web server's port (next start reads it too); the public URL defaults to it on localhost. */
    PORT: port.default(3000),
    /** 1 marks a demo deployment. */
    GYROLUX_DEMO: z.enum(["0", "1"]).default("0"),
  })
  .transform((env) => ({
    publicUrl: (env.GYROLUX_PUBLIC_URL ?? `http://localhost:${env.PORT}`).replace(/\/$/, ""),
    demo: env.GYROLUX_DEMO === "1",
  }));

export type SiteSettings = z.output<typeof siteSettingsSchema>;
