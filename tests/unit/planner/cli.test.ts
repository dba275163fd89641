import { spawnSync } from "node:child_process";
import { mkdtempSync, readFileSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { runPlanCommand } from "@/lib/planner/cli-input";
import { TGG } from "../physics/fixtures";

const dir = mkdtempSync(join(tmpdir(), "gyrolux-plan-cli-"));
let count = 0;
const file = (name: string, content: string) => {
  const path = join(dir, `${count++}-${name}`);
  writeFileSync(path, content);
  return path;
};
const paramsFile = file("p.json", JSON.stringify({ ...TGG, lengthM: 0.01 }));

// One test spawns the real built command line; the others run the same command in-process.
function run(args: string[]) {
  const r = runPlanCommand(["--", ...args], (path) => readFileSync(path, "utf8"));
  return { ...r, stderrLines: r.stderr.split("\n").filter((l) => l.length > 0) };
}

describe("plan command line", () => {
  it("prints exactly the documented JSON for the fit's default free set", () => {
    const r = spawnSync(
      process.execPath,
      ["scripts/run-built.mjs", "plan", "--", "--params", paramsFile, "--lines", "632.8,800,1064,1310,1550", "--temperatures", "293.15,77"],
      { cwd: process.cwd(), encoding: "utf8" },
    );
    expect(r.status).toBe(0);
    const out = JSON.parse(r.stdout);
    expect(Object.keys(out).sort()).toEqual(["criterion", "expected", "free", "points"]);
    expect(out.free).toEqual(["gyrationPerT", "oscillatorWavelengthNm", "magneticScale"]);
    expect(out.criterion).toBe("detect");
    expect(Object.keys(out.expected).sort()).toEqual(["detectionSigma", "sigmas"]);
    expect(out.expected.detectionSigma).toBeGreaterThan(0);
    expect(Object.keys(out.points[0]).sort()).toEqual([
      "fieldT",
      "flags",
      "predictedThetaRad",
      "repeats",
      "temperatureK",
      "transmission",
      "wavelengthNm",
    ]);
    expect(out.points.reduce((s: number, p: { repeats: number }) => s + p.repeats, 0)).toBe(6);
    for (const p of out.points) expect(p.transmission).toBeGreaterThanOrEqual(0.01);
    expect(
      r.stderr
        .split("\n")
        .filter(Boolean)
        .every((l) => l.startsWith("note: ")),
    ).toBe(true);
  });

  it("takes priors, another criterion, the noise model and a minimum transmission", () => {
    const r = run([
      "--params",
      paramsFile,
      "--criterion",
      "scale",
      "--prior",
      "oscillatorWavelengthNm=258:5",
      "--free",
      "gyrationPerT,magneticScale",
      "--noise-rad",
      "1e-4",
      "--relative-floor",
      "0.01",
      "--min-transmission",
      "0.1",
      "--points",
      "4",
    ]);
    expect(r.status).toBe(0);
    const out = JSON.parse(r.stdout);
    // A prior frees its parameter as a nuisance of the analysis.
    expect(out.free).toEqual(["gyrationPerT", "magneticScale", "oscillatorWavelengthNm"]);
    for (const p of out.points) expect(p.transmission).toBeGreaterThanOrEqual(0.1);
  });

  it("bad input exits 2 with one line naming the problem", () => {
    const cases: [string[], RegExp][] = [
      [[], /--params is required/],
      [["--params", paramsFile, "--criterion", "loud"], /--criterion: "loud" is not one of/],
      [["--params", paramsFile, "--free", "colour"], /--free: "colour" is not a model parameter/],
      [["--params", paramsFile, "--prior", "magneticScale=1"], /--prior: "magneticScale=1" is not KEY=MEAN:SIGMA/],
      [["--params", paramsFile, "--lines", "532,green"], /--lines: "green" is not a number/],
      [["--params", paramsFile, "--points", "0"], /--points: must be a whole number ≥ 1/],
      [["--params", paramsFile, "--min-transmission", "2"], /minTransmission|minimum transmission|must be ≤ 1/],
      [["--params", paramsFile, "--min-transmission", "0.99"], /no candidate point passes the minimum transmission/],
      [["--params", join(dir, "missing.json")], /cannot read the parameter file \(no such file\)/],
      [["--params", file("bad.json", "{")], /malformed JSON/],
      [["--params", paramsFile, "--loud"], /--loud: unknown argument/],
    ];
    for (const [args, message] of cases) {
      const r = run(args);
      expect(r.status, args.join(" ")).toBe(2);
      expect(r.stdout).toBe("");
      expect(r.stderrLines).toHaveLength(1);
      expect(r.stderrLines[0]).toMatch(message);
    }
  });
});
