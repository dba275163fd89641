import { describe, expect, it } from "vitest";
import { TERBIUM_GARNET_DEFAULTS } from "@/lib/model/defaults";
import { computeSpectrum } from "@/lib/physics/spectrum";
import {
  absorptionRow,
  ellipticityNote,
  formatBands,
  formatTransmission,
  hasAbsorption,
  largeEllipticityBands,
  opaqueBandsOf,
  opaqueWarning,
} from "@/lib/workbench/absorption-view";

const spectrum = (over: object, wavelengthsNm: number[]) =>
  computeSpectrum({ ...TERBIUM_GARNET_DEFAULTS, ...over, wavelengthsNm, method: "analytic" }).points;

describe("absorption beside the rotation", () => {
  it("flags the garnet at 256 nm (the +230 rad point) as opaque, in words", () => {
    const pts = spectrum({}, [256, 1064, 1550]);
    // The rotation there is large and would be shown without a hint otherwise.
    expect(Math.abs(pts[0]!.thetaRad)).toBeGreaterThan(100);
    expect(opaqueBandsOf(pts)).toEqual([{ fromNm: 256, toNm: 256 }]);
    expect(opaqueWarning(pts, 0.01)).toMatch(/^Opaque for this 10 mm sample at 256 nm: both circular modes transmit less than 1 %/);
    expect(absorptionRow(pts[0]!).opaque).toBe(true);
    expect(absorptionRow(pts[2]!).opaque).toBe(false);
  });

  it("says nothing where light gets through, and nothing for a lossless set", () => {
    expect(opaqueWarning(spectrum({ lengthM: 1e-4 }, [1064, 1550]), 1e-4)).toBeNull();
    const lossless = spectrum({ oscillatorDampingRadPerS: 0, gilbertDamping: 0 }, [400, 1064]);
    expect(opaqueWarning(lossless, 0.01)).toBeNull();
    expect(absorptionRow(lossless[0]!).figureOfMeritRadPerT).toBeNull();
    expect(absorptionRow(lossless[0]!).alphaMeanPerCm).toBe(0);
  });

  it("marks where |η| is not small and shows the transmitted ellipticity angle there", () => {
    const pts = spectrum({}, [256, 260, 1064]);
    expect(largeEllipticityBands(pts)).toEqual([{ fromNm: 256, toNm: 260 }]);
    expect(ellipticityNote(pts)).toMatch(/atan\(tanh η\)/);
    const row = absorptionRow(pts[0]!);
    expect(Math.abs(row.ellipticityAngleRad!)).toBeLessThanOrEqual(Math.PI / 4);
    expect(row.etaSmall).toBe(false);
  });

  it("gives α in cm⁻¹ and the figure of merit in rad/T", () => {
    const p = spectrum({}, [1064])[0]!;
    const row = absorptionRow(p);
    expect(row.alphaMeanPerCm).toBeCloseTo(((p.absorptionPlusPerM! + p.absorptionMinusPerM!) / 2) * 0.01, 12);
    expect(row.figureOfMeritRadPerT).toBeCloseTo(Math.abs(p.verdetRadPerTm!) / ((p.absorptionPlusPerM! + p.absorptionMinusPerM!) / 2), 9);
  });

  it("formats bands, transmissions and old results without the columns", () => {
    expect(
      formatBands([
        { fromNm: 300, toNm: 703.2 },
        { fromNm: 1200, toNm: 1200 },
      ]),
    ).toBe("300–703.2 nm, 1200 nm");
    expect(
      formatBands(
        Array.from({ length: 6 }, (_, i) => ({ fromNm: i, toNm: i })),
        2,
      ),
    ).toBe("0 nm, 1 nm and 4 more");
    expect(formatTransmission(0.5)).toBe("50.0 %");
    expect(formatTransmission(0.0023)).toBe("0.23 %");
    expect(formatTransmission(1e-40)).toBe("1.0e-38 %");
    expect(formatTransmission(Infinity)).toBe("gain");
    expect(
      hasAbsorption([
        {
          wavelengthNm: 1,
          thetaRad: 0,
          thetaElectricRad: 0,
          thetaMagneticRad: 0,
          thetaCrossRad: 0,
          ellipticityRad: 0,
          magneticShare: null,
          verdetRadPerTm: null,
        },
      ]),
    ).toBe(false);
  });
});

describe("the opaque edge does not move with the grid", () => {
  it("interpolates the threshold crossing, so grids of 97 to 1000 points agree within 0.1 nm", () => {
    const edges = [97, 240, 401, 1000].map((n) => {
      const grid = Array.from({ length: n }, (_, i) => 300 + ((1500 - 300) * i) / (n - 1));
      const s = computeSpectrum({ ...TERBIUM_GARNET_DEFAULTS, wavelengthsNm: grid, method: "analytic" });
      const bands = opaqueBandsOf(s.points);
      expect(bands).toHaveLength(1);
      return bands[0]!.toNm;
    });
    // Before, the edge was the last opaque grid point: 700, 696.7, 699 and 700 nm for these grids.
    expect(Math.max(...edges) - Math.min(...edges)).toBeLessThan(0.1);
  });
});
