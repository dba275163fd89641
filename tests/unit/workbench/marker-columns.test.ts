import { describe, expect, it } from "vitest";
import type { SpectrumPoint } from "@/lib/physics/types";
import { markerColumns } from "@/lib/workbench/marker-columns";

const point: SpectrumPoint = {
  wavelengthNm: 632.8,
  thetaRad: -1.34,
  thetaElectricRad: -1.39,
  thetaMagneticRad: 0.045,
  thetaCrossRad: 0,
  ellipticityRad: 0,
  magneticShare: 0.031,
  verdetRadPerTm: -134,
  thetaDiamagneticRad: 0.153,
};
const g = { fieldT: 1, lengthM: 0.01 };

describe("marker columns: the diamagnetic part", () => {
  it("has no column unless the set has the term on", () => {
    expect(markerColumns("nm", "rad").map((c) => c.id)).not.toContain("diamagnetic");
  });

  it("follows the magnetic part, in the chosen unit (θdia in rad, Vdia per tesla and metre)", () => {
    const rad = markerColumns("nm", "rad", true);
    const ids = rad.map((c) => c.id);
    expect(ids.indexOf("diamagnetic")).toBe(ids.indexOf("magnetic") + 1);
    expect(rad.find((c) => c.id === "diamagnetic")!.value(point, g)).toBe(0.153);
    const verdet = markerColumns("nm", "verdet", true).find((c) => c.id === "diamagnetic")!;
    expect(verdet.header).toBe("Vdia (rad/(T·m))");
    // θ / (B0 L) = 0.153 rad / (1 T × 0.01 m) = 15.3 rad/(T·m).
    expect(verdet.value(point, g)).toBeCloseTo(15.3, 12);
    expect(verdet.value({ ...point, thetaDiamagneticRad: undefined }, g)).toBeNull();
  });
});
