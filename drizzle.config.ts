import { defineConfig } from "drizzle-kit";
import { readDatabaseSettings } from "./lib/settings/database";
import { loadEnvFile } from "./lib/settings/env-file.mjs";

// The checkout's .env, as every other program reads it (values in the environment win).
loadEnvFile();

export default defineConfig({
  schema: "./db/schema.ts",
  out: "./drizzle",
  dialect: "postgresql",
  dbCredentials: {
    url: readDatabaseSettings().url,
  },
  strict: true,
  // pg-boss keeps its job tables in its own `pgboss` schema; drizzle-kit must not touch them.
  schemaFilter: ["public"],
});
