import { defineConfig } from "vitest/config";

// Browser tests: playwright-core drives Debian's Chromium against the server that scripts/test.sh
// starts (GYROLUX_TEST_BASE_URL). One file at a time; the server and browser are shared resources,
// and the demo accounts' stored sessions are written by the first file that signs each one in.
export default defineConfig({
  resolve: { tsconfigPaths: true },
  test: {
    include: ["tests/e2e/**/*.e2e.ts"],
    globalSetup: ["tests/e2e/sessions-setup.ts"],
    environment: "node",
    pool: "forks",
    fileParallelism: false,
    testTimeout: 180_000,
    hookTimeout: 120_000,
  },
});
