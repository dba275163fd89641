import { spawnSync } from "node:child_process";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { BASE_URL, createApiToken, DEMO, DEMO_GARNET_SET_ID, DEMO_LAB_ID, signIn } from "../integration/support";

/*
 * The Python client (clients/python) against this test server: its unittest suite runs with an
 * editor's fresh API token. Every live test must run (a skip here means the environment did not
 * reach Python) and pass. No browser: it sits with the browser tests because scripts/test.sh runs
 * them with a lab-run worker up (the API tier's lab-run test needs a queue without one), and the
 * client submits a lab run and waits for its result. The client's fits go to POST /api/compute/fit,
 * one also to the fit command line (`npm run fit`, built by scripts/test.sh), so npm must be on PATH.
 */

const CLIENT_DIR = path.resolve(import.meta.dirname, "../../clients/python");

describe("the Python client", () => {
  it("passes its tests against the running server", { timeout: 300_000 }, async () => {
    const editor = await signIn(DEMO.editor);
    const { token } = await createApiToken(editor);
    const run = spawnSync("python3", ["-m", "unittest", "discover", "-s", "tests", "-t", ".", "-v"], {
      cwd: CLIENT_DIR,
      encoding: "utf8",
      timeout: 280_000,
      env: {
        ...process.env,
        GYROLUX_TEST_BASE_URL: BASE_URL,
        GYROLUX_TEST_TOKEN: token,
        GYROLUX_TEST_LAB_ID: DEMO_LAB_ID,
        GYROLUX_TEST_SET_ID: DEMO_GARNET_SET_ID,
      },
    });
    const output = `${run.stdout}\n${run.stderr}`;
    expect(run.error, "python3 must be on PATH").toBeUndefined();
    expect(run.status, output).toBe(0);
    expect(output).toMatch(/Ran \d+ tests/);
    expect(output, "no live test may be skipped").not.toMatch(/skipped/);
  });
});
