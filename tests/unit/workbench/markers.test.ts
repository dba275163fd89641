import { describe, expect, it } from "vitest";
import type { SpectrumPoint } from "@/lib/physics/types";
import { markerColumns } from "@/lib/workbench/marker-columns";
import { checkMarkerNm, checkMarkerText, exactPoint, interpolatePoint } from "@/lib/workbench/markers";
import { parseViewState } from "@/lib/workbench/view-state";

const point = (nm: number, theta: number, share: number | null = 0.1): SpectrumPoint => ({
  wavelengthNm: nm,
  thetaRad: theta,
  thetaElectricRad: theta * 0.9,
  thetaMagneticRad: theta * 0.1,
  thetaCrossRad: 0,
  ellipticityRad: 0,
  magneticShare: share,
  verdetRadPerTm: theta * 100,
});

describe("marker validation", () => {
  it("accepts 1 to 5000 nm and refuses the rest with a message that names the range", () => {
    expect(checkMarkerText("1064", [], 24)).toEqual({ nm: 1064, error: null });
    expect(checkMarkerText("1", [], 24).nm).toBe(1);
    expect(checkMarkerText("5000", [], 24).nm).toBe(5000);
    for (const text of ["99999", "5000.1", "0.5", "0", "-632.8"]) {
      const r = checkMarkerText(text, [], 24);
      expect(r.nm, text).toBeNull();
      expect(r.error).toContain("between 1 and 5000 nm");
    }
  });

  it("says what is wrong with text, duplicates and too many markers", () => {
    expect(checkMarkerText("", [], 24).error).toMatch(/Enter a wavelength/);
    expect(checkMarkerText("1e", [], 24).error).toMatch(/not a number/);
    expect(checkMarkerText("1064", [1064], 24).error).toMatch(/already a marker at 1064 nm/);
    expect(checkMarkerNm(900, [1, 2, 3], 3).error).toMatch(/At most 3 markers/);
  });

  it("drops stored markers outside the range instead of the whole list", () => {
    expect(parseViewState({ markersNm: [632.8, 99999, 1064] }).markersNm).toEqual([632.8, 1064]);
  });
});

describe("marker values from a computed spectrum", () => {
  const points = [point(1000, -1), point(1100, -0.8), point(1200, -0.6, null)];

  it("takes a grid point as it is", () => {
    expect(exactPoint(points, 1100)).toBe(points[1]);
    expect(exactPoint(points, 1050)).toBeNull();
    expect(interpolatePoint(points, 1000)).toBe(points[0]);
  });

  it("interpolates linearly between the neighbours and never extrapolates", () => {
    const p = interpolatePoint(points, 1030)!;
    expect(p.wavelengthNm).toBe(1030);
    expect(p.thetaRad).toBeCloseTo(-0.94, 12);
    expect(p.verdetRadPerTm).toBeCloseTo(-94, 10);
    expect(p.magneticShare).toBeCloseTo(0.1, 12);
    // A null neighbour gives null, not a made-up number.
    expect(interpolatePoint(points, 1150)!.magneticShare).toBeNull();
    expect(interpolatePoint(points, 999)).toBeNull();
    expect(interpolatePoint(points, 1201)).toBeNull();
    expect(interpolatePoint([], 1000)).toBeNull();
  });
});

describe("marker table columns follow the plot's units", () => {
  const g = { fieldT: 2, lengthM: 0.01 };
  const p = point(1064, -0.5);
  const headers = (x: Parameters<typeof markerColumns>[0], y: Parameters<typeof markerColumns>[1]) =>
    markerColumns(x, y).map((c) => c.header);
  const value = (x: Parameters<typeof markerColumns>[0], y: Parameters<typeof markerColumns>[1], id: string) =>
    markerColumns(x, y)
      .find((c) => c.id === id)!
      .value(p, g);

  it("nm and rad: the SI columns only", () => {
    expect(headers("nm", "rad")).toEqual(["θ (rad)", "θe (rad)", "θm (rad)", "Magnetic share", "V (rad/(T·m))", "L45", "θm / θ"]);
    expect(value("nm", "rad", "total")).toBe(-0.5);
  });

  it("eV and mrad: a photon-energy column and rotations in mrad", () => {
    expect(headers("eV", "mrad").slice(0, 4)).toEqual(["E (eV)", "θ (mrad)", "θe (mrad)", "θm (mrad)"]);
    // hc/λ with hc = 1239.84198 eV·nm (CODATA 2018, exact SI constants).
    expect(value("eV", "mrad", "x-eV")).toBeCloseTo(1239.84198 / 1064, 12);
    expect(value("eV", "mrad", "total")).toBeCloseTo(-500, 12);
  });

  it("degrees, and Verdet mode turns θ, θe, θm into V, Ve, Vm per tesla and metre", () => {
    expect(value("nm", "deg", "magnetic")).toBeCloseTo((-0.05 * 180) / Math.PI, 12);
    expect(headers("cm-1", "verdet").slice(0, 4)).toEqual(["ν̃ (cm⁻¹)", "V (rad/(T·m))", "Ve (rad/(T·m))", "Vm (rad/(T·m))"]);
    // θ / (B0 L) = −0.5 / (2 T × 0.01 m) = −25 rad/(T·m); no second V column.
    expect(value("cm-1", "verdet", "total")).toBeCloseTo(-25, 12);
    expect(headers("cm-1", "verdet").filter((h) => h.startsWith("V ("))).toHaveLength(1);
    expect(value("cm-1", "verdet", "x-cm-1")).toBeCloseTo(1e7 / 1064, 9);
  });
});
