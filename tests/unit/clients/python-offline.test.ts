import { spawnSync } from "node:child_process";
import path from "node:path";
import { describe, expect, it } from "vitest";

/* The Python client's own logic (no server): its offline unittest module, run with the system's python3. */

describe("the Python client, offline", () => {
  it("passes its offline tests", { timeout: 60_000 }, () => {
    const run = spawnSync("python3", ["-m", "unittest", "tests.test_offline", "-v"], {
      cwd: path.resolve(import.meta.dirname, "../../../clients/python"),
      encoding: "utf8",
    });
    expect(run.error, "python3 must be on PATH").toBeUndefined();
    expect(run.status, `${run.stdout}\n${run.stderr}`).toBe(0);
    expect(run.stderr).toMatch(/Ran [1-9]\d* tests?/);
  });
});
