import { settingsReader } from "./parse";
import { seedSettingsSchema } from "./seed";
import { sharedFragments } from "./shared";

/*
 * Settings of the programs that run under plain Node, tsx or an esbuild bundle (db/migrate.ts,
 * db/seed.ts, scripts/*.ts, the lab-run worker), where the server variant's "server-only" marker
 * throws. Built from the same fragments as ./server.ts; parsed once, when first imported.
 */

export const readScriptSettings = settingsReader({ ...sharedFragments, seed: seedSettingsSchema });

export type ScriptSettings = ReturnType<typeof readScriptSettings>;

export const scriptSettings: ScriptSettings = readScriptSettings(process.env);
