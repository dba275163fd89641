import { describe, expect, it } from "vitest";
import { tableAbsorptionPerM, withMeasuredLoss } from "@/lib/physics/absorption";
import { diamagneticGyration } from "@/lib/physics/optics";
import { type SpectrumRequest, spectrumRequestSchema } from "@/lib/physics/schema";
import { computeSpectrum } from "@/lib/physics/spectrum";
import { omegaOfNm } from "./closed-forms";
import { TGG, relErr } from "./fixtures";

/*
 * The diamagnetic term's two optional keys (anomaly factor γ, dispersion whole | host) and the
 * measured absorption table (physics-model.md §5.5, lib/physics/absorption.ts).
 */

const lambdas = [400, 532, 632.8, 800, 1064, 1550];
const run = (over: Partial<SpectrumRequest>) =>
  computeSpectrum({ ...TGG, lengthM: 0.01, wavelengthsNm: lambdas, method: "analytic", ...over } as SpectrumRequest);

describe("diamagnetic options: defaults are today's term bit for bit", () => {
  it("γ = 1 and dispersion 'whole' given explicitly equal the keys left out, every number identical", () => {
    expect(run({ diamagneticTerm: true, diamagneticAnomaly: 1, diamagneticDispersion: "whole" })).toEqual(run({ diamagneticTerm: true }));
  });

  it("with the term off the new keys change nothing", () => {
    expect(run({ diamagneticAnomaly: 0.5, diamagneticDispersion: "host" })).toEqual(run({}));
  });

  it("G_dia scales exactly with γ (a factor on the whole term, §5.5)", () => {
    const w = omegaOfNm(632.8);
    const one = diamagneticGyration(TGG, 1, w);
    const scaled = diamagneticGyration(TGG, 1, w, { anomaly: 0.777 });
    expect(relErr(scaled.re, 0.777 * one.re)).toBeLessThan(1e-15);
  });

  it("'host' drops the ion's pole: with f = 0 it equals 'whole', with f > 0 it is the Sellmeier part alone", () => {
    const w = omegaOfNm(800);
    const noOsc = { ...TGG, oscillatorStrength: 0 };
    expect(diamagneticGyration(noOsc, 1, w, { dispersion: "host" })).toEqual(diamagneticGyration(noOsc, 1, w));
    expect(diamagneticGyration(TGG, 1, w, { dispersion: "host" })).toEqual(diamagneticGyration(noOsc, 1, w));
  });

  it("the diamagnetic part stays a sub-part of θe, scaled by γ (to first order in G)", () => {
    const full = run({ diamagneticTerm: true }).points;
    const half = run({ diamagneticTerm: true, diamagneticAnomaly: 0.5 }).points;
    for (let i = 0; i < lambdas.length; i++)
      expect(relErr(half[i]!.thetaDiamagneticRad!, 0.5 * full[i]!.thetaDiamagneticRad!)).toBeLessThan(1e-6);
  });

  it("rejects a dispersion other than whole or host, and a negative γ, naming the field", () => {
    const base = { ...TGG, wavelengthsNm: [632.8], method: "analytic" };
    const bad = spectrumRequestSchema.safeParse({ ...base, diamagneticDispersion: "all" });
    expect(bad.success).toBe(false);
    expect(bad.error!.issues[0]!.path).toEqual(["diamagneticDispersion"]);
    expect(spectrumRequestSchema.safeParse({ ...base, diamagneticAnomaly: -1 }).success).toBe(false);
  });
});

describe("measured absorption table", () => {
  const table = [
    { wavelengthNm: 500, absorptionPerM: 0.2 },
    { wavelengthNm: 1000, absorptionPerM: 0.1 },
  ];

  it("interpolates linearly and gives null outside (no extrapolation)", () => {
    expect(tableAbsorptionPerM(table, 750)).toBeCloseTo(0.15, 15);
    expect(tableAbsorptionPerM(table, 500)).toBe(0.2);
    expect(tableAbsorptionPerM(table, 1000)).toBe(0.1);
    expect(tableAbsorptionPerM(table, 499.9)).toBeNull();
    expect(tableAbsorptionPerM(table, 1000.1)).toBeNull();
  });

  it("keeps the model's circular dichroism around the measured mean", () => {
    const [p, m] = withMeasuredLoss(3, 5, 1);
    expect((p + m) / 2).toBe(1);
    expect(m - p).toBe(2);
  });

  it("drives α±, transmission and the warning; the rotation is untouched", () => {
    const plain = run({}).points;
    const withTable = run({ absorptionTable: table });
    for (const [i, p] of withTable.points.entries()) {
      expect(p.thetaRad).toBe(plain[i]!.thetaRad);
      const inside = p.wavelengthNm >= 500 && p.wavelengthNm <= 1000;
      const mean = (p.absorptionPlusPerM! + p.absorptionMinusPerM!) / 2;
      if (inside) {
        expect(relErr(mean, tableAbsorptionPerM(table, p.wavelengthNm)!)).toBeLessThan(1e-9);
        // Beer–Lambert over 10 mm: exp(−α L).
        expect(relErr(p.transmissionPlus!, Math.exp(-p.absorptionPlusPerM! * 0.01))).toBeLessThan(1e-15);
      } else {
        expect(p.absorptionPlusPerM).toBe(plain[i]!.absorptionPlusPerM);
      }
    }
    expect(withTable.warnings?.some((w) => w.startsWith("absorption: the measured table covers 500–1000 nm"))).toBe(true);
    expect(withTable.warnings?.join(" ")).toContain("400, 1064, 1550");
  });

  it("rejects unsorted rows and a negative α with the row's path", () => {
    const base = { ...TGG, wavelengthsNm: [632.8], method: "analytic" };
    const unsorted = spectrumRequestSchema.safeParse({ ...base, absorptionTable: [table[1], table[0]] });
    expect(unsorted.error!.issues[0]!.path).toEqual(["absorptionTable", 1, "wavelengthNm"]);
    const negative = spectrumRequestSchema.safeParse({ ...base, absorptionTable: [{ wavelengthNm: 500, absorptionPerM: -1 }, table[1]] });
    expect(negative.error!.issues[0]!.path).toEqual(["absorptionTable", 0, "absorptionPerM"]);
  });
});
