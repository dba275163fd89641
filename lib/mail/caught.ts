import "server-only";
import { readdir, readFile } from "node:fs/promises";
import path from "node:path";
import { caughtMailSchema, type CaughtMail } from "./caught-mail";
import { serverSettings } from "@/lib/settings/server";
import { mailSettings } from "./send";

/**
 * Whether the caught-mail page exists here: only in a demo deployment (GYROLUX_DEMO=1) whose mail
 * goes to the local catcher. Caught mail holds live reset and invitation links of every user, so
 * a real deployment never shows it, whatever its SMTP host.
 */
export function caughtMailVisible(): boolean {
  const local = mailSettings.host === "127.0.0.1" || mailSettings.host === "localhost";
  return serverSettings.site.demo && local;
}

/** Messages the local SMTP stand-in caught, newest first (the site-admin mail page). */
export async function listCaughtMail(options: { limit: number }): Promise<{ dir: string; items: CaughtMail[] }> {
  const dir = mailSettings.dir;
  let names: string[];
  try {
    names = (await readdir(dir))
      .filter((name) => name.endsWith(".json"))
      .sort()
      .reverse();
  } catch {
    return { dir, items: [] };
  }
  const items: CaughtMail[] = [];
  for (const name of names.slice(0, options.limit)) {
    try {
      const parsed = caughtMailSchema.safeParse(JSON.parse(await readFile(path.join(dir, name), "utf8")));
      if (parsed.success) items.push(parsed.data);
    } catch {
      // A file being written right now or removed by hand: skip it.
    }
  }
  return { dir, items };
}
