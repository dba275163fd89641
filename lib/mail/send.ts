import "server-only";
import nodemailer, { type Transporter } from "nodemailer";
import type { MailSettings } from "@/lib/settings/mail";
import { serverSettings } from "@/lib/settings/server";

/*
 * The one mail module: plain-text messages over SMTP with nodemailer. In the demo and the tests
 * the SMTP server is the local stand-in that scripts/mail.sh starts; in production it is the
 * site's relay (GYROLUX_SMTP_*).
 */

export const mailSettings: MailSettings = serverSettings.mail;

let transporter: Transporter | null = null;

function transport(): Transporter {
  transporter ??= nodemailer.createTransport({
    host: mailSettings.host,
    port: mailSettings.port,
    secure: false,
    // The local stand-in offers no TLS; a production relay on 587 still upgrades when offered.
    ignoreTLS: mailSettings.host === "127.0.0.1" || mailSettings.host === "localhost",
    auth: mailSettings.user ? { user: mailSettings.user, pass: mailSettings.pass ?? "" } : undefined,
    connectionTimeout: 5_000,
    greetingTimeout: 5_000,
    socketTimeout: 10_000,
  });
  return transporter;
}

export class MailUnavailableError extends Error {
  constructor(cause: unknown) {
    super("The mail server did not accept the message.", { cause });
    this.name = "MailUnavailableError";
  }
}

export async function sendMail(message: { to: string; subject: string; text: string }): Promise<void> {
  try {
    await transport().sendMail({ from: mailSettings.from, to: message.to, subject: message.subject, text: message.text });
  } catch (error) {
    // Log the reason, not the message: it carries a secret link.
    console.error("[mail] send failed:", error instanceof Error ? error.message : String(error));
    throw new MailUnavailableError(error);
  }
}

/** An absolute link into the app, from the configured public URL (never from the Host header). */
export function appLink(path: string): string {
  return `${serverSettings.site.publicUrl}${path}`;
}
