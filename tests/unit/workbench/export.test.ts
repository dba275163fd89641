import { describe, expect, it } from "vitest";
import { TERBIUM_GARNET_DEFAULTS } from "@/lib/model/defaults";
import type { SpectrumResult } from "@/lib/physics/types";
import { buildSpectrumCsv, buildSpectrumJson, CSV_COLUMNS, exportFileName } from "@/lib/workbench/export";

const result: SpectrumResult = {
  magnetizationAPerM: 1.2e4,
  maxRelDeviationFromAnalytic: 3.2e-6,
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
      thetaDiamagneticRad: 0.15,
      absorptionPlusPerM: 0.1,
      absorptionMinusPerM: 0.12,
      transmissionPlus: 0.999,
      transmissionMinus: 0.9988,
    },
    {
      wavelengthNm: 1550,
      thetaRad: 0,
      thetaElectricRad: 0,
      thetaMagneticRad: 0,
      thetaCrossRad: 0,
      ellipticityRad: 0,
      magneticShare: null,
      verdetRadPerTm: null,
    },
  ],
  warnings: ["passivity fails\nbelow 248 nm"],
};
const meta = {
  setName: "Terbium gallium garnet",
  setId: "abc",
  version: 3,
  method: "llg" as const,
  exportedAt: "2025-01-01T00:00:00.000Z",
};

describe("CSV export", () => {
  const csv = buildSpectrumCsv(meta, TERBIUM_GARNET_DEFAULTS, result);
  const lines = csv.trimEnd().split("\r\n");
  const header = lines.filter((l) => l.startsWith("#"));
  const body = lines.filter((l) => !l.startsWith("#"));

  it("starts with # lines naming set, version, model and method", () => {
    expect(lines[0]!.startsWith("#")).toBe(true);
    expect(header.some((l) => l.includes("parameter set: Terbium gallium garnet"))).toBe(true);
    expect(header.some((l) => l === "# version: 3")).toBe(true);
    expect(header.some((l) => l.includes("Gyrolux model: one gyrotropic oscillator + LLG spins, physics-model §"))).toBe(true);
    expect(header.some((l) => l.startsWith("# method: llg") && l.includes("3.2e-6"))).toBe(true);
    // A line break in a warning must not escape the comment.
    expect(header.some((l) => l === "# warning: passivity fails below 248 nm")).toBe(true);
  });

  it("has a column row with units, then one row per wavelength", () => {
    expect(body[0]).toBe(
      "wavelength_nm,theta_rad,theta_electric_rad,theta_magnetic_rad,theta_cross_rad,ellipticity_rad,magnetic_share,verdet_rad_per_T_m," +
        "theta_diamagnetic_rad,absorption_plus_per_m,absorption_minus_per_m,transmission_plus,transmission_minus",
    );
    expect(body).toHaveLength(1 + result.points.length);
    expect(body[1]!.split(",")).toHaveLength(CSV_COLUMNS.length);
    expect(body[1]).toBe("632.8,-1.34,-1.39,0.045,1e-10,0.00001,0.031,-134,0.15,0.1,0.12,0.999,0.9988");
    // Nulls, and the parts a result does not carry (no diamagnetic term, a result saved before absorption), are empty cells.
    expect(body[2]).toBe("1550,0,0,0,0,0,,,,,,,");
  });

  it("names every column with its meaning and unit in the header", () => {
    for (const column of CSV_COLUMNS) {
      expect(
        header.some((l) => l.startsWith(`# column ${column}: `) && /\(.*\)/.test(l)),
        column,
      ).toBe(true);
    }
    expect(header).toContain("# column verdet_rad_per_T_m: Verdet constant θ / (B0 L) (rad/(T·m); empty when B0 = 0)");
    expect(header.some((l) => l.startsWith("# geometry: L = 0.01 m, B0 = 1 T"))).toBe(true);
  });

  it("labels a non-unit magnetic scale", () => {
    const scaled = buildSpectrumCsv(meta, { ...TERBIUM_GARNET_DEFAULTS, magneticScale: 3 }, result);
    expect(scaled).toContain("# label: magnetic-dipole part × 3.0, not first-principles");
    expect(scaled).toContain(
      "# column theta_magnetic_rad: magnetic-dipole part θm (rad); magnetic-dipole part × 3.0, not first-principles",
    );
    expect(csv).not.toContain("# label:");
    expect(scaled).toContain("# column theta_electric_rad: electric-dipole part θe (rad)\r\n");
    expect(csv).not.toContain("not first-principles");
  });
});

describe("JSON export", () => {
  it("holds the parameters and the result", () => {
    const parsed = JSON.parse(buildSpectrumJson(meta, TERBIUM_GARNET_DEFAULTS, result));
    expect(parsed.params.temperatureK).toBe(293.15);
    expect(parsed.result.points).toHaveLength(2);
    expect(parsed.parameterSet).toEqual({ id: "abc", name: "Terbium gallium garnet", version: 3 });
  });
  it("makes safe file names", () => {
    expect(exportFileName("Terbium gallium garnet / v2", "spectrum", "csv")).toBe("Terbium-gallium-garnet-v2-spectrum.csv");
  });
});
