import { defineConfig } from "vitest/config";

// Browser tests: playwright-core drives Debian's Chromium against the server that scripts/test.sh
// starts (GYROLUX_TEST_BASE_URL). One file at a time; the server and browser are shared resources.
export default defineConfig({
  resolve: { tsconfigPaths: true },
  test: {
    include: ["tests/e2e/**/*.e2e.ts"],
    environment: "node",
    pool: "forks",
    fileParallelism: false,
    testTimeout: 180_000,
    hookTimeout: 120_000,
  },
});
