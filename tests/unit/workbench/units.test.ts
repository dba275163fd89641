import { describe, expect, it } from "vitest";
import { HC_EV_NM, curveLabel, curveSymbol, fromNm, rotationTo, toNm, wavelengthGrid, X_UNITS } from "@/lib/workbench/units";

describe("x-axis conversions", () => {
  it("uses hc = 1239.84198 eV·nm (CODATA 2018: h, c, e exact in the 2019 SI)", () => {
    expect(HC_EV_NM).toBe(1239.84198);
    expect(fromNm(1239.84198, "eV")).toBeCloseTo(1, 12);
    // 1550 nm telecom line is 0.7999 eV.
    expect(fromNm(1550, "eV")).toBeCloseTo(0.799898, 6);
  });

  it("converts to µm, cm⁻¹ and THz", () => {
    expect(fromNm(1550, "um")).toBeCloseTo(1.55, 12);
    expect(fromNm(1000, "cm-1")).toBeCloseTo(10000, 9);
    // c / 1 µm = 299.792458 THz exactly.
    expect(fromNm(1000, "THz")).toBeCloseTo(299.792458, 9);
  });

  it("round-trips every unit", () => {
    for (const unit of X_UNITS) {
      for (const nm of [200, 632.8, 1064, 20000]) {
        expect(toNm(fromNm(nm, unit), unit)).toBeCloseTo(nm, 8);
      }
    }
  });
});

describe("y quantities", () => {
  const geometry = { fieldT: 1, lengthM: 0.01 };
  it("converts rad to mrad and degrees", () => {
    expect(rotationTo(Math.PI / 4, "deg", geometry)).toBeCloseTo(45, 12);
    expect(rotationTo(0.5, "mrad", geometry)).toBeCloseTo(500, 12);
    expect(rotationTo(0.5, "rad", geometry)).toBe(0.5);
  });
  it("gives the Verdet constant θ / (B0 L), null at zero field", () => {
    expect(rotationTo(-1.34, "verdet", geometry)).toBeCloseTo(-134, 10);
    expect(rotationTo(-1.34, "verdet", { fieldT: 0, lengthM: 0.01 })).toBeNull();
  });
});

describe("wavelength grid", () => {
  it("is log-spaced, strictly increasing and keeps the typed ends", () => {
    const g = wavelengthGrid(300, 3000, 256);
    expect(g).toHaveLength(256);
    expect(g[0]).toBe(300);
    expect(g[255]).toBe(3000);
    for (let i = 1; i < g.length; i++) expect(g[i]!).toBeGreaterThan(g[i - 1]!);
    expect(g[1]! / g[0]!).toBeCloseTo(g[200]! / g[199]!, 10);
  });
  it("can be linear", () => {
    const g = wavelengthGrid(400, 800, 5, "linear");
    expect(g).toEqual([400, 500, 600, 700, 800]);
  });
});

describe("curve names follow the y axis quantity", () => {
  it("names Verdet parts V, Ve, Vm and the ellipticity per B·L, not an angle", () => {
    expect(curveLabel("total", "verdet")).toBe("Verdet constant V");
    expect(curveLabel("electric", "verdet")).toBe("Electric-dipole part Ve");
    expect(curveSymbol("ellipticity", "verdet")).toBe("Ellipticity per B·L");
    expect(curveLabel("ellipticity", "verdet")).not.toMatch(/angle/);
  });

  it("names rotations θ and the ellipticity an angle", () => {
    for (const mode of ["rad", "mrad", "deg"] as const) {
      expect(curveLabel("total", mode)).toBe("Total θ");
      expect(curveSymbol("magnetic", mode)).toBe("θm");
      expect(curveSymbol("ellipticity", mode)).toBe("Ellipticity angle");
    }
  });
});
