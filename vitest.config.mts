import { defineConfig } from "vitest/config";

// Two projects: unit tests (tests/unit, nothing but the code) and API/database tests
// (tests/integration, HTTP against the server scripts/test.sh starts). `npm run test:unit` runs
// the first alone; `npx vitest run` runs both, and the integration project refuses to start without
// a server rather than passing while testing nothing. Browser specs (*.e2e.ts) have their own
// config, vitest.e2e.config.mts.
export default defineConfig({
  resolve: { tsconfigPaths: true },
  test: {
    environment: "node",
    pool: "forks",
    testTimeout: 60_000,
    hookTimeout: 120_000,
    projects: [
      { extends: true, test: { name: "unit", include: ["tests/unit/**/*.test.ts"] } },
      {
        extends: true,
        test: {
          name: "integration",
          include: ["tests/integration/**/*.integ.test.ts"],
          globalSetup: ["tests/integration/require-server.ts"],
        },
      },
    ],
  },
});
