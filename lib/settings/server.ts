import "server-only";
import { authSettingsSchema } from "./auth";
import { buildSettingsSchema } from "./build.mjs";
import { settingsReader } from "./parse";
import { sharedFragments } from "./shared";
import { siteSettingsSchema } from "./site";

/*
 * The web server's settings: every variable the app reads, parsed once when the server first
 * loads a module that needs one, so a bad or missing value stops it with every problem named.
 * Command-line programs use ./scripts.ts instead (this marker throws outside Next's server bundle).
 */

export const readServerSettings = settingsReader({
  ...sharedFragments,
  build: buildSettingsSchema,
  auth: authSettingsSchema,
  site: siteSettingsSchema,
});

export type ServerSettings = ReturnType<typeof readServerSettings>;

export const serverSettings: ServerSettings = readServerSettings(process.env);
