import type { z } from "zod";

// Types of build.mjs (plain JavaScript so that next.config.mjs can import it under Node 20).

export type NodeEnv = "development" | "production" | "test";

export interface BuildSettings {
  nodeEnv: NodeEnv;
  nextDistDir: string;
  hstsMaxAgeS: number;
}

export declare const nodeEnvSchema: z.ZodDefault<z.ZodEnum<{ development: "development"; production: "production"; test: "test" }>>;

export declare const buildSettingsSchema: z.ZodType<
  BuildSettings,
  { NODE_ENV?: string; GYROLUX_NEXT_DIST_DIR?: string; GYROLUX_HSTS_MAX_AGE?: string }
>;

export declare function readBuildSettings(source?: Record<string, string | undefined>): BuildSettings;
