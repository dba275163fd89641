import { z } from "zod";

/*
 * Mail settings, read from the environment once and validated with zod. No "server-only" marker:
 * the local SMTP stand-in (scripts/mail-server.ts) shares the defaults, so the app, the stand-in
 * and the tests agree on the port and the folder without extra configuration.
 */

export const DEFAULT_SMTP_PORT = 2525;

const port = z.coerce.number().int().min(1).max(65535);

export const mailSettingsSchema = z
  .object({
    GYROLUX_SMTP_HOST: z.string().min(1).default("127.0.0.1"),
    GYROLUX_SMTP_PORT: port.default(DEFAULT_SMTP_PORT),
    GYROLUX_SMTP_USER: z.string().optional(),
    GYROLUX_SMTP_PASS: z.string().optional(),
    GYROLUX_MAIL_FROM: z.string().min(3).default("Gyrolux <no-reply@gyrolux.test>"),
    GYROLUX_MAIL_DIR: z.string().min(1).optional(),
    // Links in e-mails are built from this, never from the request's Host header (which a caller
    // controls: a reset link pointing elsewhere would hand over the token).
    GYROLUX_PUBLIC_URL: z.url().optional(),
    PORT: port.default(3000),
  })
  .transform((env) => ({
    host: env.GYROLUX_SMTP_HOST,
    port: env.GYROLUX_SMTP_PORT,
    user: env.GYROLUX_SMTP_USER || undefined,
    pass: env.GYROLUX_SMTP_PASS || undefined,
    from: env.GYROLUX_MAIL_FROM,
    /** Where the local SMTP stand-in stores caught messages (one JSON and one .eml per message). */
    dir: env.GYROLUX_MAIL_DIR ?? `/tmp/gyrolux-mail-${env.GYROLUX_SMTP_PORT}`,
    publicUrl: (env.GYROLUX_PUBLIC_URL ?? `http://localhost:${env.PORT}`).replace(/\/$/, ""),
  }));

export type MailSettings = z.output<typeof mailSettingsSchema>;

export function readMailSettings(source: Record<string, string | undefined> = process.env): MailSettings {
  return mailSettingsSchema.parse(source);
}

/** One caught message as the stand-in stores it and the admin page and the tests read it. */
export const caughtMailSchema = z.object({
  id: z.string(),
  receivedAt: z.string(),
  from: z.string(),
  to: z.array(z.string()),
  subject: z.string(),
  text: z.string(),
});
export type CaughtMail = z.infer<typeof caughtMailSchema>;
