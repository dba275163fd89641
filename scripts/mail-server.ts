import { randomBytes } from "node:crypto";
import { mkdirSync, writeFileSync, renameSync } from "node:fs";
import path from "node:path";
import { SMTPServer } from "smtp-server";
import { parseMessage } from "../lib/mail/mime";
import type { CaughtMail } from "../lib/mail/caught-mail";
import { scriptSettings } from "../lib/settings/scripts";

/*
 * The local SMTP stand-in for the demo and the tests (started by scripts/mail.sh). It listens on
 * 127.0.0.1 only, accepts every message and delivers none: each one is written to the mail folder
 * as <id>.eml (raw) and <id>.json (sender, recipients, subject, decoded text).
 */

const settings = scriptSettings.mail;
mkdirSync(settings.dir, { recursive: true, mode: 0o700 });

const server = new SMTPServer({
  authOptional: true,
  disabledCommands: ["STARTTLS"],
  banner: "Gyrolux local mail catcher",
  size: 1024 * 1024,
  onAuth(_auth, _session, callback) {
    callback(null, { user: "local" });
  },
  onData(stream, session, callback) {
    const chunks: Buffer[] = [];
    stream.on("data", (chunk: Buffer) => chunks.push(chunk));
    stream.on("end", async () => {
      try {
        const raw = Buffer.concat(chunks);
        const parsed = await parseMessage(raw);
        const receivedAt = new Date().toISOString();
        const id = `${receivedAt.replace(/[:.]/g, "-")}-${randomBytes(4).toString("hex")}`;
        const record: CaughtMail = {
          id,
          receivedAt,
          from: session.envelope.mailFrom ? session.envelope.mailFrom.address : "",
          to: session.envelope.rcptTo.map((r) => r.address),
          subject: parsed.subject,
          text: parsed.text,
        };
        // Caught mail holds live reset and invitation links: readable by this user only.
        writeFileSync(path.join(settings.dir, `${id}.eml`), raw, { mode: 0o600 });
        // Write then rename, so a reader never sees half a JSON file.
        const tmp = path.join(settings.dir, `.${id}.tmp`);
        writeFileSync(tmp, JSON.stringify(record, null, 2), { mode: 0o600 });
        renameSync(tmp, path.join(settings.dir, `${id}.json`));
        callback();
      } catch (error) {
        callback(error instanceof Error ? error : new Error(String(error)));
      }
    });
  },
});

server.on("error", (error) => console.error("[mail] server error:", error.message));
server.listen(settings.port, "127.0.0.1", () => {
  console.log(`[mail] catching mail on 127.0.0.1:${settings.port}, stored in ${settings.dir}`);
});

const stop = () => server.close(() => process.exit(0));
process.on("SIGTERM", stop);
process.on("SIGINT", stop);
