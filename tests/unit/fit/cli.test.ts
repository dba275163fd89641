import { spawnSync } from "node:child_process";
import { mkdtempSync, readFileSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { runFitCommand } from "@/lib/fit/cli-input";
import { TGG } from "../physics/fixtures";
import { evenly, seededGaussian, syntheticPoints, verdetAt } from "./support";

const dir = mkdtempSync(join(tmpdir(), "gyrolux-fit-cli-"));
let count = 0;
const file = (name: string, content: string) => {
  const path = join(dir, `${count++}-${name}`);
  writeFileSync(path, content);
  return path;
};

// The first test spawns the real process (node with the tsx loader, as the spectrum command line's
// tests do); the others run the same command in-process with the real file system, which is quicker.
function spawnFit(args: string[]) {
  const r = spawnSync(process.execPath, ["scripts/run-built.mjs", "fit", "--", ...args], { cwd: process.cwd(), encoding: "utf8" });
  return { status: r.status, stdout: r.stdout, stderr: r.stderr, stderrLines: r.stderr.split("\n").filter((l) => l.length > 0) };
}
function run(args: string[]) {
  const r = runFitCommand(["--", ...args], (path) => readFileSync(path, "utf8"));
  return { ...r, stderrLines: r.stderr.split("\n").filter((l) => l.length > 0) };
}

const params = { ...TGG, lengthM: 0.01, method: "analytic" };
const truth = { ...TGG, lengthM: 0.01, gyrationPerT: 5.0e-3, oscillatorWavelengthNm: 270, magneticScale: 3 };
// Few points: every point's share is profiled (a few dozen refits each).
const conds = [
  ...evenly(400, 1600, 10).map((w) => verdetAt(w)),
  ...evenly(500, 1500, 4).map((w) => verdetAt(w, { temperatureK: 150, fieldT: 2 })),
];
const points = syntheticPoints(truth, conds, 0.5, seededGaussian(21));
const csv =
  "# generated for a test\nwavelength_nm,verdet_rad_per_T_m,sigma,temperature_K,field_T\n" +
  `${points.map((p) => `${p.wavelengthNm},${p.value},${p.sigma},${p.temperatureK},${p.fieldT}`).join("\n")}\n`;
const paramsFile = file("p.json", JSON.stringify(params));
const dataFile = file("d.csv", csv);

describe("fit command line", () => {
  it("prints exactly the documented JSON, σ as given by the data by default", () => {
    const r = spawnFit(["--params", paramsFile, "--data", dataFile]);
    expect(r.status).toBe(0);
    expect(r.stderr).toBe("");
    const out = JSON.parse(r.stdout);
    expect(Object.keys(out).sort()).toEqual([
      "assumptions",
      "chi2",
      "comparison",
      "converged",
      "correlation",
      "dof",
      "free",
      "goodnessOfFit",
      "informationCriteria",
      "notes",
      "points",
      "profile",
      "sets",
      "shareCovariance",
      "sigmaScaledByChi2",
      "sigmas",
      "values",
      "verdict",
    ]);
    expect(out.comparison.map((c: { hypothesis: string }) => c.hypothesis)).toEqual(["noMagneticPart", "firstPrinciples"]);
    expect(Object.keys(out.comparison[0]).sort()).toEqual(
      ["aic", "aicc", "bic", "chi2", "deltaChi2", "fixed", "hypothesis", "pValue", "significanceSigma", "words"].sort(),
    );
    expect(out.comparison[1].fixed).toEqual({ magneticScale: 1 });
    expect(out.goodnessOfFit.dof).toBe(out.dof);
    const ms = out.profile.magneticScale;
    expect(ms.interval68[0]).toBeLessThan(ms.value);
    expect(ms.interval95[1]).toBeGreaterThan(ms.interval68[1]);
    expect(out.assumptions.find((a: { key: string }) => a.key === "landeG").source).toMatch(/handbook/);
    expect(out.shareCovariance).toHaveLength(points.length);
    expect(out.free).toEqual(["gyrationPerT", "oscillatorWavelengthNm", "magneticScale"]);
    expect(out.dof).toBe(points.length - 3);
    expect(out.correlation).toHaveLength(3);
    expect(out.points).toHaveLength(points.length);
    expect(Object.keys(out.points[0]).sort()).toEqual([
      "magneticShare",
      "magneticShareInterval68",
      "magneticShareSigma",
      "measured",
      "model",
      "set",
      "sigma",
      "wavelengthNm",
    ]);
    const [lo, hi] = out.points[0].magneticShareInterval68;
    expect(lo).toBeLessThan(out.points[0].magneticShare);
    expect(hi).toBeGreaterThan(out.points[0].magneticShare);
    for (const key of out.free as string[])
      expect(Math.abs(out.values[key] - (truth as unknown as Record<string, number>)[key]!)).toBeLessThan(3 * out.sigmas[key]);
    // The temperature and field columns are used (the second block is at 150 K, 2 T).
    expect(out.points[points.length - 1].measured).toBeCloseTo(points[points.length - 1]!.value, 10);

    const scaled = JSON.parse(run(["--params", paramsFile, "--data", dataFile, "--scale-by-chi2"]).stdout);
    // Scaling never shrinks σ (χ²/dof below 1 leaves them as they are).
    const factor = Math.max(1, Math.sqrt(out.chi2 / out.dof));
    expect(scaled.sigmas.magneticScale / out.sigmas.magneticScale).toBeCloseTo(factor, 6);
  });

  it("takes missing condition columns from the parameter file and honours --free", () => {
    const rotationCsv = `wavelength_nm,rotation_rad,sigma\n${evenly(450, 1500, 12)
      .map((w, i) => `${w},${-0.5 / (i + 3)},0.001`)
      .join("\n")}\n`;
    const r = run(["--params", paramsFile, "--data", file("rot.csv", rotationCsv), "--free", "gyrationPerT"]);
    expect(r.status).toBe(0);
    const out = JSON.parse(r.stdout);
    expect(out.free).toEqual(["gyrationPerT"]);
    expect(out.dof).toBe(11);
    // With magneticScale held fixed the split is not measured, and the command line says so.
    expect(r.stderrLines).toHaveLength(1);
    expect(r.stderrLines[0]).toMatch(/^warning: The split is not measured/);
  });

  it("fits several --data files globally and takes repeated --prior flags as nuisance parameters", () => {
    const warm = points.filter((p) => p.temperatureK > 200);
    const cold = points.filter((p) => p.temperatureK < 200);
    const toCsv = (list: typeof points) =>
      "wavelength_nm,verdet_rad_per_T_m,sigma,temperature_K,field_T\n" +
      `${list.map((p) => `${p.wavelengthNm},${p.value},${p.sigma},${p.temperatureK},${p.fieldT}`).join("\n")}\n`;
    const a = file("warm.csv", toCsv(warm));
    const b = file("cold.csv", toCsv(cold));
    const free = ["--free", "gyrationPerT,magneticScale", "--no-share-intervals"];
    const global = JSON.parse(run(["--params", paramsFile, "--data", a, "--data", b, ...free, "--starts", "1"]).stdout);
    const joined = JSON.parse(run(["--params", paramsFile, "--data", dataFile, ...free, "--starts", "1"]).stdout);
    expect(global.chi2).toBeCloseTo(joined.chi2, 8);
    expect(new Set(global.points.map((p: { set: string }) => p.set)).size).toBe(2);
    const withPrior = run([
      "--params",
      paramsFile,
      "--data",
      dataFile,
      ...free,
      "--prior",
      "oscillatorWavelengthNm=258:8",
      "--starts",
      "1",
    ]);
    expect(withPrior.status).toBe(0);
    const out = JSON.parse(withPrior.stdout);
    expect(Object.keys(out.values)).toEqual(["gyrationPerT", "magneticScale", "oscillatorWavelengthNm"]);
    expect(out.sigmas.oscillatorWavelengthNm).toBeLessThanOrEqual(8);
    expect(out.assumptions.map((x: { key: string }) => x.key)).not.toContain("oscillatorWavelengthNm");
  });

  const refusals: [string, () => string[], RegExp][] = [
    [
      "a malformed --prior",
      () => ["--params", paramsFile, "--data", dataFile, "--prior", "oscillatorWavelengthNm=258"],
      /^--prior: "oscillatorWavelengthNm=258" is not KEY=MEAN:SIGMA/,
    ],
    [
      "a prior with σ ≤ 0",
      () => ["--params", paramsFile, "--data", dataFile, "--prior", "oscillatorWavelengthNm=258:0"],
      /^--prior oscillatorWavelengthNm=258:0: .*must be > 0/,
    ],
    [
      "a prior on a key that cannot be freed",
      () => ["--params", paramsFile, "--data", dataFile, "--prior", "fieldT=1:0.1"],
      /^--prior fieldT=1:0.1: .*not a model parameter/,
    ],
    [
      "a bad --starts",
      () => ["--params", paramsFile, "--data", dataFile, "--starts", "0"],
      /^--starts: must be a whole number from 1 to 32/,
    ],
    ["no --data", () => ["--params", paramsFile], /^--data is required; usage: /],
    ["an unknown flag", () => ["--params", paramsFile, "--data", dataFile, "--fast"], /^--fast: unknown argument/],
    [
      "a missing file",
      () => ["--params", join(dir, "none.json"), "--data", dataFile],
      /none\.json: cannot read the parameter file \(no such file\)$/,
    ],
    ["malformed JSON", () => ["--params", file("bad.json", "{"), "--data", dataFile], /bad\.json: malformed JSON/],
    [
      "wavelengthsNm in the parameter file",
      () => ["--params", file("w.json", JSON.stringify({ ...params, wavelengthsNm: [600] })), "--data", dataFile],
      /^wavelengthsNm: not used by the fit/,
    ],
    [
      "an invalid parameter",
      () => ["--params", file("g.json", JSON.stringify({ ...params, landeG: -1 })), "--data", dataFile],
      /^landeG: must be > 0$/,
    ],
    [
      "an unknown parameter",
      () => ["--params", file("u.json", JSON.stringify({ ...params, colour: 1 })), "--data", dataFile],
      /^colour: unknown key/,
    ],
    [
      "a key that cannot be freed",
      () => ["--params", paramsFile, "--data", dataFile, "--free", "temperatureK"],
      /^--free: "temperatureK" is not a model parameter that a fit can free/,
    ],
    [
      "a file without σ",
      () => ["--params", paramsFile, "--data", file("ns.csv", "wavelength_nm,verdet_rad_per_T_m\n600,-100\n")],
      /^data file: no column "sigma"/,
    ],
    [
      "a bad row",
      () => [
        "--params",
        paramsFile,
        "--data",
        file("br.csv", "wavelength_nm,verdet_rad_per_T_m,sigma\n600,-100,1\n700,,1\n800,-50,1\n900,-40,x\n1000,-30,1\n"),
      ],
      /^data file: line 3: Verdet constant is empty \(and 1 more problem\)$/,
    ],
    [
      "too few points",
      () => ["--params", paramsFile, "--data", file("few.csv", "wavelength_nm,verdet_rad_per_T_m,sigma\n600,-100,1\n700,-80,1\n")],
      /^points: 2 point\(s\) cannot determine 3 free parameter\(s\)/,
    ],
  ];
  it("exits 2 from the real process on bad input", () => {
    const r = spawnFit(["--params", paramsFile, "--data", join(dir, "none.csv")]);
    expect(r.status).toBe(2);
    expect(r.stdout).toBe("");
    expect(r.stderrLines).toEqual([`${join(dir, "none.csv")}: cannot read the data file (no such file)`]);
  });

  it.each(refusals)("refuses %s: exit 2, one line naming the problem", (_name, args, message) => {
    const r = run(args());
    expect(r.status).toBe(2);
    expect(r.stdout).toBe("");
    expect(r.stderrLines).toHaveLength(1);
    expect(r.stderrLines[0]).toMatch(message);
  });
});
