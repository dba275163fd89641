import { describe, expect, it } from "vitest";
import { TERBIUM_GARNET_DEFAULTS } from "@/lib/model/defaults";
import type { SpectrumResult } from "@/lib/physics/types";
import { buildSpectrumCsv, chosenUnitColumns, CSV_COLUMNS, figureCaption, figureFileBase } from "@/lib/workbench/export";
import { fmtDelta } from "@/lib/workbench/format";
import { compareValue } from "@/lib/workbench/compare";

const params = { ...TERBIUM_GARNET_DEFAULTS, fieldT: 1, lengthM: 0.01 };
const result: SpectrumResult = {
  magnetizationAPerM: 1.2e4,
  points: [
    {
      wavelengthNm: 1000,
      thetaRad: -0.4,
      thetaElectricRad: -0.42,
      thetaMagneticRad: 0.02,
      thetaCrossRad: 0,
      ellipticityRad: 1e-5,
      magneticShare: 0.045,
      verdetRadPerTm: -40,
    },
  ],
};
const meta = { setName: "TGG", setId: null, version: 2, method: "analytic" as const, exportedAt: "2026-01-01T00:00:00.000Z" };

function table(csv: string) {
  const lines = csv.trimEnd().split("\r\n");
  const body = lines.filter((l) => !l.startsWith("#"));
  return { header: lines.filter((l) => l.startsWith("#")), columns: body[0]!.split(","), rows: body.slice(1).map((r) => r.split(",")) };
}

describe("CSV in the plot's chosen units", () => {
  it("adds nothing when the plot shows nm and rad", () => {
    expect(table(buildSpectrumCsv({ ...meta, display: { xUnit: "nm", yMode: "rad" } }, params, result)).columns).toEqual([...CSV_COLUMNS]);
  });

  it("keeps the SI columns first and adds labelled eV and mrad columns", () => {
    const t = table(buildSpectrumCsv({ ...meta, display: { xUnit: "eV", yMode: "mrad" } }, params, result));
    expect(t.columns.slice(0, CSV_COLUMNS.length)).toEqual([...CSV_COLUMNS]);
    expect(t.columns.slice(CSV_COLUMNS.length)).toEqual([
      "photon_energy_eV",
      "theta_mrad",
      "theta_electric_mrad",
      "theta_magnetic_mrad",
      "theta_cross_mrad",
      "ellipticity_mrad",
    ]);
    const row = t.rows[0]!;
    const at = (name: string) => Number(row[t.columns.indexOf(name)]);
    // hc/λ, hc = 1239.84198 eV·nm (CODATA 2018).
    expect(at("photon_energy_eV")).toBeCloseTo(1.23984198, 10);
    expect(at("theta_mrad")).toBeCloseTo(-400, 9);
    expect(at("theta_rad")).toBe(-0.4);
    for (const name of t.columns.slice(CSV_COLUMNS.length)) expect(t.header.some((l) => l.startsWith(`# column ${name}: `))).toBe(true);
  });

  it("in Verdet mode adds the parts per tesla and metre (the total is the SI Verdet column)", () => {
    const cols = chosenUnitColumns({ xUnit: "THz", yMode: "verdet" }).map((c) => c.name);
    expect(cols).toEqual([
      "frequency_THz",
      "verdet_electric_rad_per_T_m",
      "verdet_magnetic_rad_per_T_m",
      "verdet_cross_rad_per_T_m",
      "ellipticity_per_B0_L_rad_per_T_m",
    ]);
    const t = table(buildSpectrumCsv({ ...meta, display: { xUnit: "THz", yMode: "verdet" } }, params, result));
    // θe / (B0 L) = −0.42 / (1 T × 0.01 m).
    expect(Number(t.rows[0]![t.columns.indexOf("verdet_electric_rad_per_T_m")])).toBeCloseTo(-42, 9);
    // c / 1000 nm = 299.792458 THz (c exact, SI).
    expect(Number(t.rows[0]![t.columns.indexOf("frequency_THz")])).toBeCloseTo(299.792458, 9);
  });

  it("labels scaled columns with the magneticScale label, but not the electric-dipole part", () => {
    const t = table(buildSpectrumCsv({ ...meta, display: { xUnit: "nm", yMode: "deg" } }, { ...params, magneticScale: 3 }, result));
    expect(t.header.find((l) => l.startsWith("# column theta_magnetic_deg:"))).toContain("not first-principles");
    expect(t.header.find((l) => l.startsWith("# column theta_electric_deg:"))).not.toContain("not first-principles");
  });
});

describe("figure names", () => {
  it("carry set, version, temperature and field in captions and file names", () => {
    const id = { setName: "Terbium gallium garnet / handbook", version: 3, temperatureK: 293.15, fieldT: 1 };
    expect(figureCaption(id)).toBe("Terbium gallium garnet / handbook · v3 · 293.15 K · 1 T");
    expect(figureFileBase(id)).toBe("Terbium-gallium-garnet-handbook-v3-293.15K-1T");
    expect(figureFileBase({ ...id, edited: true, fieldT: -0.5 })).toBe("Terbium-gallium-garnet-handbook-v3-edited-293.15K--0.5T");
    expect(figureCaption({ ...id, version: null })).toBe("Terbium gallium garnet / handbook · unsaved scratch · 293.15 K · 1 T");
  });
});

describe("signed differences and compared quantities", () => {
  it("never writes −0.00", () => {
    expect(fmtDelta(-0.001)).toBe("0.00");
    expect(fmtDelta(-0)).toBe("0.00");
    expect(fmtDelta(0.004)).toBe("0.00");
    expect(fmtDelta(-0.005 - 1e-12)).toBe("−0.01");
    expect(fmtDelta(1.234)).toBe("+1.23");
    expect(fmtDelta(null)).toBe("–");
  });

  it("compares the Verdet constant and its parts per tesla and metre, raw rotations at each set's own B0 and L", () => {
    const p = result.points[0]!;
    const g = { fieldT: 2, lengthM: 0.005 };
    expect(compareValue("verdet", p, g, "rad")).toBeCloseTo(-0.4 / 0.01, 12);
    expect(compareValue("verdetMagnetic", p, g, "deg")).toBeCloseTo(0.02 / 0.01, 12);
    expect(compareValue("thetaElectric", p, g, "mrad")).toBeCloseTo(-420, 12);
    // In Verdet mode a raw rotation has no rotation unit to follow: rad.
    expect(compareValue("theta", p, g, "verdet")).toBe(-0.4);
  });
});
