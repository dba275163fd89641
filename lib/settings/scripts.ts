import { loadEnvFile } from "./env-file.mjs";
import { settingsReader } from "./parse";
import { seedSettingsSchema } from "./seed";
import { sharedFragments } from "./shared";

/*
 * Settings of the programs that run under plain Node, tsx or an esbuild bundle (db/migrate.ts,
 * db/seed.ts, scripts/*.ts, the lab-run worker), where the server variant's "server-only" marker
 * throws. Built from the same fragments as ./server.ts; parsed once, when first imported, after the
 * .env loader (./env-file.mjs) has filled in what the environment does not set.
 */

export const readScriptSettings = settingsReader({ ...sharedFragments, seed: seedSettingsSchema });

export type ScriptSettings = ReturnType<typeof readScriptSettings>;

// The .env of the current folder first (values already in the environment win), as Next does for the server.
loadEnvFile(process.env);
export const scriptSettings: ScriptSettings = readScriptSettings(process.env);
