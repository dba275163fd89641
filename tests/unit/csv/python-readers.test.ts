import { execFileSync, spawnSync } from "node:child_process";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { buildCsv } from "@/lib/csv/write";
import { TERBIUM_GARNET_DEFAULTS } from "@/lib/model/defaults";
import type { SpectrumResult } from "@/lib/physics/types";
import { buildSpectrumCsv, CSV_COLUMNS } from "@/lib/workbench/export";

/*
 * Our CSV exports read by the tools a scientist opens them with: Python's csv module always, and
 * numpy.genfromtxt(names=True) when numpy is installed (it is not a dependency of the product;
 * the test says so when it skips). python3 itself is required, as by the Python client's tests.
 */

const python = spawnSync("python3", ["--version"], { encoding: "utf8" });
const hasNumpy = python.status === 0 && spawnSync("python3", ["-c", "import numpy"]).status === 0;

const dir = mkdtempSync(path.join(tmpdir(), "gyrolux-csv-"));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

function runPython(script: string, file: string): unknown {
  return JSON.parse(execFileSync("python3", ["-c", script, file], { encoding: "utf8" }));
}

const result: SpectrumResult = {
  magnetizationAPerM: 1.2e4,
  points: [
    {
      wavelengthNm: 632.8,
      thetaRad: -1.34,
      thetaElectricRad: -1.39,
      thetaMagneticRad: 0.045,
      thetaCrossRad: 1e-10,
      ellipticityRad: 1e-5,
      magneticShare: 0.031,
      verdetRadPerTm: -134,
    },
    {
      wavelengthNm: 1064,
      thetaRad: -0.4,
      thetaElectricRad: -0.41,
      thetaMagneticRad: 0.01,
      thetaCrossRad: 0,
      ellipticityRad: 0,
      magneticShare: 0.024,
      verdetRadPerTm: -40,
    },
  ],
};
const meta = {
  setName: 'TGG, "batch 2"\r\nsecond line',
  setId: "abc",
  version: 3,
  method: "analytic" as const,
  exportedAt: "2026-01-01T00:00:00Z",
};

const CSV_READER = `
import csv, json, sys
with open(sys.argv[1], newline="") as f:
    rows = [r for r in csv.reader(f) if r and not r[0].startswith("#")]
print(json.dumps(rows))
`;

const NUMPY_READER = `
import json, sys, numpy
a = numpy.genfromtxt(sys.argv[1], delimiter=",", names=True)
print(json.dumps({"names": list(a.dtype.names), "wavelength": a["wavelength_nm"].tolist(), "verdet": a["verdet_rad_per_T_m"].tolist()}))
`;

describe("exports read by Python", () => {
  it("python3 is on PATH (needed by this suite)", () => {
    expect(python.status, "install python3 (Debian: apt-get install python3)").toBe(0);
  });

  it("the csv module reads the plain and the commented spectrum CSV alike, numbers unchanged", () => {
    for (const style of ["plain", "commented"] as const) {
      const file = path.join(dir, `spectrum-${style}.csv`);
      writeFileSync(file, buildSpectrumCsv(meta, TERBIUM_GARNET_DEFAULTS, result, style));
      const rows = runPython(CSV_READER, file) as string[][];
      expect(rows[0]).toEqual([...CSV_COLUMNS]);
      expect(rows.slice(1).map((r) => Number(r[0]))).toEqual([632.8, 1064]);
      expect(Number(rows[1]![7])).toBe(-134);
    }
  });

  it("the csv module reads quoted text back exactly: commas, quotes, CR and LF inside a cell", () => {
    const file = path.join(dir, "text.csv");
    const name = 'HeNe "table 2", red\r\nline two\rthree';
    writeFileSync(
      file,
      buildCsv({
        header: ["name", "x"],
        rows: [
          [name, -1.5],
          ["=1+1", 2],
        ],
      }),
    );
    const rows = runPython(CSV_READER, file) as string[][];
    expect(rows).toEqual([
      ["name", "x"],
      [name, "-1.5"],
      ["'=1+1", "2"],
    ]);
  });

  it.skipIf(!hasNumpy)("numpy.genfromtxt(names=True) reads the plain CSV by column name (skipped where numpy is not installed)", () => {
    const file = path.join(dir, "spectrum-numpy.csv");
    writeFileSync(file, buildSpectrumCsv(meta, TERBIUM_GARNET_DEFAULTS, result, "plain"));
    const read = runPython(NUMPY_READER, file) as { names: string[]; wavelength: number[]; verdet: number[] };
    expect(read.names).toEqual([...CSV_COLUMNS]);
    expect(read.wavelength).toEqual([632.8, 1064]);
    expect(read.verdet).toEqual([-134, -40]);
  });
});
