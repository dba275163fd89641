import { describe, expect, it } from "vitest";
import { workbenchHrefOfRun, workbenchStartFromRun } from "@/lib/lab-runs/open-in-workbench";
import { TERBIUM_GARNET_DEFAULTS } from "@/lib/model/defaults";
import { MAX_WAVELENGTHS } from "@/lib/physics/schema";

const set = { id: "6a1f0c2e-5b1d-4c1e-9f00-00000000c001", name: "TGG", version: 2, edited: false };

describe("open a lab run in the workbench", () => {
  it("opens the run's set with the run's id, or the scratch workbench for parameters given with the run", () => {
    expect(workbenchHrefOfRun({ id: "r1", parameterSet: set })).toBe(`/workbench/${set.id}?run=r1`);
    expect(workbenchHrefOfRun({ id: "r1", parameterSet: null })).toBe("/workbench?run=r1");
  });

  it("starts from the run's parameters and wavelength axis; a longer axis is drawn thinner and says so", () => {
    const params = { ...TERBIUM_GARNET_DEFAULTS, temperatureK: 77 };
    const map = workbenchStartFromRun({ payload: { params, wavelengths: { fromNm: 400, toNm: 1600, count: 160, spacing: "log" } } });
    expect(map).toEqual({ params, range: { fromNm: 400, toNm: 1600, points: 160, spacing: "log" }, thinned: null });
    const long = workbenchStartFromRun({ payload: { params, wavelengths: { fromNm: 300, toNm: 3000, count: 20_000, spacing: "linear" } } });
    expect(long?.range.points).toBe(MAX_WAVELENGTHS);
    expect(long?.thinned).toMatch(/20000 wavelengths/);
    expect(workbenchStartFromRun({ payload: { params } })).toBeNull();
  });
});
