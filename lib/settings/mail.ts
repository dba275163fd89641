import { z } from "zod";
import { port } from "./port";

/*
 * The mail fragment. The app (lib/mail/send.ts) and the local SMTP stand-in (scripts/mail-server.ts)
 * read the same settings, so they agree on the port and the folder without extra configuration.
 */

const DEFAULT_SMTP_PORT = 2525;

export const mailSettingsSchema = z
  .object({
    GYROLUX_SMTP_HOST: z.string().min(1).default("127.0.0.1"),
    GYROLUX_SMTP_PORT: port.default(DEFAULT_SMTP_PORT),
    GYROLUX_SMTP_USER: z.string().optional(),
    GYROLUX_SMTP_PASS: z.string().optional(),
    GYROLUX_MAIL_FROM: z.string().min(3).default("Gyrolux <no-reply@gyrolux.test>"),
    GYROLUX_MAIL_DIR: z.string().min(1).optional(),
  })
  .transform((env) => ({
    host: env.GYROLUX_SMTP_HOST,
    port: env.GYROLUX_SMTP_PORT,
    user: env.GYROLUX_SMTP_USER || undefined,
    pass: env.GYROLUX_SMTP_PASS || undefined,
    from: env.GYROLUX_MAIL_FROM,
    /** Where the local SMTP stand-in stores caught messages (one JSON and one .eml per message). */
    dir: env.GYROLUX_MAIL_DIR ?? `/tmp/gyrolux-mail-${env.GYROLUX_SMTP_PORT}`,
  }));

export type MailSettings = z.output<typeof mailSettingsSchema>;
