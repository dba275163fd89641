import { spawnSync } from "node:child_process";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { TGG } from "./fixtures";

const dir = mkdtempSync(join(tmpdir(), "gyrolux-cli-"));
let count = 0;

// The first test spawns exactly what users type (npm run spectrum, which builds dist/ when stale);
// the others run the same launcher with node directly, which skips npm's start-up.
function run(content: string | null, viaNpx = false) {
  const file = join(dir, `p${count++}.json`);
  if (content !== null) writeFileSync(file, content);
  const [cmd, args] = viaNpx
    ? ["npm", ["run", "--silent", "spectrum", "--", file]]
    : [process.execPath, ["scripts/run-built.mjs", "spectrum", file]];
  const r = spawnSync(cmd, args as string[], { cwd: process.cwd(), encoding: "utf8" });
  return { status: r.status, stdout: r.stdout, stderr: r.stderr, stderrLines: r.stderr.split("\n").filter((l) => l.length > 0) };
}

const valid = { ...TGG, lengthM: 0.01, wavelengthsNm: [632.8, 1064], method: "analytic" };

describe("command line", () => {
  it("prints the spectrum as JSON for a valid file", () => {
    const r = run(JSON.stringify(valid), true);
    expect(r.status).toBe(0);
    expect(r.stderr).toBe("");
    const out = JSON.parse(r.stdout);
    expect(out.magnetizationAPerM).toBeGreaterThan(0);
    expect(out.points).toHaveLength(2);
    expect(Object.keys(out.points[0]).sort()).toEqual(
      [
        "absorptionMinusPerM",
        "absorptionPlusPerM",
        "ellipticityAngleRad",
        "ellipticityRad",
        "magneticShare",
        "thetaCrossRad",
        "thetaElectricRad",
        "thetaMagneticRad",
        "thetaRad",
        "transmissionMinus",
        "transmissionPlus",
        "verdetRadPerTm",
        "wavelengthNm",
      ].sort(),
    );
    // Published TGG −134 rad/(T m) at 632.8 nm (Wikipedia "Verdet constant"; sources and tolerance in
    // spectrum.test.ts), which is also the product reference value the §9 κE is calibrated to; ±0.5 here.
    expect(out.points[0].verdetRadPerTm).toBeCloseTo(-134, 0);
    expect(out.maxRelDeviationFromAnalytic).toBeUndefined();
    expect(out.warnings).toBeUndefined();
  });

  it("adds maxRelDeviationFromAnalytic for method llg; null share and Verdet at zero field", () => {
    const r = run(JSON.stringify({ ...valid, method: "llg" }));
    expect(r.status).toBe(0);
    expect(JSON.parse(r.stdout).maxRelDeviationFromAnalytic).toBeLessThan(1e-4);
    const z = JSON.parse(run(JSON.stringify({ ...valid, fieldT: 0 })).stdout);
    expect(z.points[0].magneticShare).toBeNull();
    expect(z.points[0].verdetRadPerTm).toBeNull();
  });

  it("refuses method llg outside the numerical range (§2) with exit 2 and one line naming the field; analytic runs there", () => {
    const cold = run(JSON.stringify({ ...valid, method: "llg", temperatureK: 0.5, curieWeissK: 0 }));
    expect(cold.status).toBe(2);
    expect(cold.stdout).toBe("");
    expect(cold.stderrLines).toHaveLength(1);
    expect(cold.stderrLines[0]).toMatch(
      /^temperatureK: numerical LLG is specified for T from 1 to 400 K; 0\.5 K lies outside \(use method "analytic"\)$/,
    );
    const far = run(JSON.stringify({ ...valid, method: "llg", wavelengthsNm: [632.8, 30_000] }));
    expect(far.status).toBe(2);
    expect(far.stderrLines).toHaveLength(1);
    expect(far.stderrLines[0]).toMatch(/^wavelengthsNm\.1: numerical LLG is specified for wavelengths from 200 to 20000 nm/);
    expect(run(JSON.stringify({ ...valid, wavelengthsNm: [632.8, 30_000] })).status).toBe(0);
  });

  it("takes the diamagnetic switch (§5.5): a per-point diamagnetic part when on, a one-line error when not a boolean", () => {
    const on = run(JSON.stringify({ ...valid, diamagneticTerm: true }));
    expect(on.status).toBe(0);
    const p = JSON.parse(on.stdout).points[0];
    // Diamagnetic sign (§8): the bound-electron part alone rotates with V > 0 for B0 > 0.
    expect(p.thetaDiamagneticRad).toBeGreaterThan(0);
    const off = JSON.parse(run(JSON.stringify({ ...valid, diamagneticTerm: false })).stdout).points[0];
    expect(off.thetaDiamagneticRad).toBeUndefined();
    const bad = run(JSON.stringify({ ...valid, diamagneticTerm: "yes" }));
    expect(bad.status).toBe(2);
    expect(bad.stderrLines).toHaveLength(1);
    expect(bad.stderrLines[0]).toMatch(/^diamagneticTerm: /);
  });

  it("rejects an unknown key with exit 2 and one line naming it", () => {
    const r = run(JSON.stringify({ ...valid, colour: "blue" }));
    expect(r.status).toBe(2);
    expect(r.stdout).toBe("");
    expect(r.stderrLines).toHaveLength(1);
    expect(r.stderrLines[0]).toMatch(/^colour: unknown key/);
  });

  it("rejects duplicate wavelengths", () => {
    const r = run(JSON.stringify({ ...valid, wavelengthsNm: [632.8, 632.8] }));
    expect(r.status).toBe(2);
    expect(r.stderrLines).toHaveLength(1);
    expect(r.stderrLines[0]).toMatch(/^wavelengthsNm\.1: duplicate wavelength/);
  });

  it('rejects the string "NaN" (JSON has no NaN literal) and a NaN literal as malformed JSON', () => {
    const r = run(JSON.stringify({ ...valid, temperatureK: "NaN" }));
    expect(r.status).toBe(2);
    expect(r.stderrLines).toHaveLength(1);
    expect(r.stderrLines[0]).toMatch(/^temperatureK: /);
    const lit = run(JSON.stringify(valid).replace('"temperatureK":293.15', '"temperatureK":NaN'));
    expect(lit.status).toBe(2);
    expect(lit.stderrLines).toHaveLength(1);
    expect(lit.stderrLines[0]).toMatch(/malformed JSON/);
  });

  it.each([
    [{ temperatureK: -5 }, /^temperatureK: /],
    [{ curieWeissK: 400, temperatureK: 300 }, /^temperatureK: must be above the Curie–Weiss/],
    [{ totalJ: 2.2 }, /^totalJ: /],
    [{ lengthM: -1 }, /^lengthM: /],
    [{ wavelengthsNm: [] }, /^wavelengthsNm: /],
    [{ wavelengthsNm: Array.from({ length: 5001 }, (_, i) => 300 + i) }, /^wavelengthsNm: must hold at most 5000/],
  ] as const)("rejects physically meaningless input %#", (over, pattern) => {
    const r = run(JSON.stringify({ ...valid, ...over }));
    expect(r.status).toBe(2);
    expect(r.stderrLines).toHaveLength(1);
    expect(r.stderrLines[0]).toMatch(pattern);
  });

  it("reports a missing file and malformed JSON on one line with exit 2", () => {
    const missing = run(null);
    expect(missing.status).toBe(2);
    expect(missing.stderrLines).toHaveLength(1);
    expect(missing.stderrLines[0]).toMatch(/cannot read/);
    const bad = run("{ not json");
    expect(bad.status).toBe(2);
    expect(bad.stderrLines).toHaveLength(1);
  });

  it("prints passivity warnings on stderr and in the JSON, with exit 0", () => {
    const r = run(JSON.stringify({ ...valid, temperatureK: 4, fieldT: 5, oscillatorStrength: 0.005, wavelengthsNm: [400, 632.8, 1064] }));
    expect(r.status).toBe(0);
    expect(r.stderrLines.length).toBeGreaterThan(0);
    expect(r.stderrLines.every((l) => l.startsWith("warning:"))).toBe(true);
    const out = JSON.parse(r.stdout);
    expect(out.warnings).toHaveLength(1);
    expect(out.warnings[0]).toMatch(/passivity/);
  });
});
