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
const conds = [
  ...evenly(400, 1600, 24).map((w) => verdetAt(w)),
  ...evenly(500, 1500, 8).map((w) => verdetAt(w, { temperatureK: 150, fieldT: 2 })),
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
    expect(Object.keys(out).sort()).toEqual(["chi2", "correlation", "dof", "free", "points", "sigmas", "values"]);
    expect(out.free).toEqual(["gyrationPerT", "oscillatorWavelengthNm", "magneticScale"]);
    expect(out.dof).toBe(points.length - 3);
    expect(out.correlation).toHaveLength(3);
    expect(out.points).toHaveLength(points.length);
    expect(Object.keys(out.points[0]).sort()).toEqual([
      "magneticShare",
      "magneticShareSigma",
      "measured",
      "model",
      "sigma",
      "wavelengthNm",
    ]);
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

  const refusals: [string, () => string[], RegExp][] = [
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
