import { describe, expect, it } from "vitest";
import { cautionsFor, indicativeLaserClass } from "@/lib/planner/cautions";
import { planToCsv } from "@/lib/planner/export";
import { markersQueryValue, parseMarkersQuery } from "@/lib/planner/markers-query";
import type { RankedPlan } from "@/lib/planner/plan";

describe("planner cautions", () => {
  it("always name the laser standards and defer to the laser safety officer", () => {
    const c = cautionsFor({ lines: [{ name: "YAG", wavelengthNm: 1064, powerW: 2 }], minTemperatureK: null, maxFieldT: null });
    const text = c.flatMap((x) => x.lines).join(" ");
    expect(text).toMatch(/IEC 60825-1/);
    expect(text).toMatch(/ANSI Z136\.1/);
    expect(text).toMatch(/laser safety officer/);
    expect(text).toMatch(/YAG \(1064 nm, 2 W\): indicative class 4/);
    expect(c.map((x) => x.key)).toEqual(["laser", "local"]);
  });
  it("add the 0.5 mT implant line with a field and cryogen hazards with a cryostat", () => {
    const c = cautionsFor({ lines: [], minTemperatureK: 4.2, maxFieldT: 7 });
    const text = c.flatMap((x) => x.lines).join(" ");
    expect(text).toMatch(/0\.5 mT/);
    expect(text).toMatch(/pacemakers/);
    expect(text).toMatch(/projectiles/);
    expect(text).toMatch(/asphyxiation/);
    expect(text).toMatch(/cold burns/);
  });
  it("indicative classes follow the usual power steps (from memory)", () => {
    expect(indicativeLaserClass(632.8, 0.0003)).toBe("1");
    expect(indicativeLaserClass(632.8, 0.0008)).toBe("2");
    expect(indicativeLaserClass(632.8, 0.003)).toBe("3R");
    expect(indicativeLaserClass(1550, 0.1)).toBe("3B");
    expect(indicativeLaserClass(800, 1.5)).toBe("4");
    expect(indicativeLaserClass(800, null)).toMatch(/unknown/);
  });
});

describe("plan export and hand-over", () => {
  const plan: RankedPlan = {
    rank: 1,
    expectedSigma: 0.0123,
    separable: true,
    partsCorrelation: -0.9,
    parameterSigma: {},
    rankedValue: 0.0123,
    detection: null,
    measurements: 3,
    cooldowns: 1,
    costHours: 1.05,
    points: [
      {
        index: 0,
        lineName: 'HeNe "table 2", red',
        wavelengthNm: 632.8,
        temperatureK: 77,
        fieldT: 1,
        count: 2,
        rotationRad: -1.5,
        magneticShare: 0.03,
        signalToNoise: 1.5e5,
        belowNoise: false,
        powerW: null,
        transmission: 0.9,
        sigmaRad: 1e-5,
        flags: [],
      },
      {
        index: 5,
        lineName: "YAG",
        wavelengthNm: 1064,
        temperatureK: 77,
        fieldT: 1,
        count: 1,
        rotationRad: -0.4,
        magneticShare: 0.09,
        signalToNoise: 0.5,
        belowNoise: true,
        powerW: 2,
        transmission: 0.5,
        sigmaRad: 0.8,
        flags: ["below-noise"],
      },
    ],
  };
  it("writes one CSV row per point with quoted names", () => {
    const csv = planToCsv({
      setName: "TGG",
      setVersion: 3,
      result: { criterionLabel: "σ of magneticScale", criterionUnit: "(×)", method: "greedy", candidateCount: 40, sigmaPerPointRad: 1e-5 },
      plan,
    });
    const rows = csv.trim().split("\r\n");
    expect(rows[0]).toBe('# Gyrolux measurement plan for "TGG" (version 3)');
    expect(rows[4]).toBe("line,wavelength_nm,temperature_K,field_T,count,predicted_rotation_rad,signal_to_noise,below_noise");
    expect(rows[5]).toBe('"HeNe ""table 2"", red",632.8,77,1,2,-1.50000,1.500e+5,false');
    expect(rows[6]!.endsWith(",true")).toBe(true);
  });
  it("passes distinct sorted wavelengths as ?markers= and parses them back forgivingly", () => {
    expect(markersQueryValue([1064, 632.8, 1064])).toBe("632.8,1064");
    expect(parseMarkersQuery("1064, 632.8,abc,-3,1064", 24)).toEqual([632.8, 1064]);
    expect(parseMarkersQuery(null, 24)).toEqual([]);
  });
});

describe("planner worker API", () => {
  it("parses the request at the boundary and reports each problem", async () => {
    const { createPlannerWorkerApi } = await import("@/lib/planner/worker-api");
    const out = await createPlannerWorkerApi().plan({ lines: [] });
    expect(out.ok).toBe(false);
    if (!out.ok) expect(out.issues.join("\n")).toMatch(/^params: /m);
  });
});
