import { defineConfig } from "drizzle-kit";
import { readDatabaseSettings } from "./lib/settings/database";

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
