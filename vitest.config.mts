import { defineConfig } from "vitest/config";

// Unit tests (*.test.ts) and API/database tests (*.integ.test.ts). Browser specs (*.e2e.ts) run
// through tests/e2e/run.ts against a production build, not here.
export default defineConfig({
  resolve: { tsconfigPaths: true },
  test: {
    include: ["tests/**/*.test.ts", "lib/**/*.test.ts"],
    exclude: ["**/node_modules/**", "tests/e2e/**"],
    environment: "node",
    pool: "forks",
    testTimeout: 60_000,
    hookTimeout: 120_000,
  },
});
