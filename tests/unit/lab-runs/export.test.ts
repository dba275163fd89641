import { describe, expect, it } from "vitest";
import { buildMapCsv, mapFileBase } from "@/lib/lab-runs/export";
import { columnsAsJson } from "@/lib/lab-runs/encoding";
import { computeRunInProcess, mapRun } from "@/lib/lab-runs/kinds";
import { TERBIUM_GARNET_DEFAULTS } from "@/lib/model/defaults";

const payload = (axis: "temperature" | "field") =>
  mapRun.payloadSchema.parse({
    params: { ...TERBIUM_GARNET_DEFAULTS, temperatureK: 293.15, fieldT: 1, lengthM: 0.005 },
    method: "analytic",
    axis,
    wavelengths: { fromNm: 500, toNm: 1000, count: 3 },
    rows: axis === "temperature" ? { from: 20, to: 300, count: 2 } : { from: 0.5, to: 2, count: 2 },
  });

const id = { runId: "1a2b3c4d-0000-4000-8000-000000000000", setName: "Terbium gallium garnet", version: 3, edited: false };

describe("map exports", () => {
  it("the file name states the span of the varied condition, not one temperature", () => {
    expect(mapFileBase(id, payload("temperature"))).toBe("Terbium-gallium-garnet-v3-map-20-300K-1T-run-1a2b3c4d");
    expect(mapFileBase(id, payload("field"))).toBe("Terbium-gallium-garnet-v3-map-293.15K-0.5-2T-run-1a2b3c4d");
    expect(mapFileBase({ ...id, version: null }, payload("field"))).toMatch(/-run-params-map-/);
  });

  it("every cell row names its wavelength, temperature, field and length, and carries θ, θe, θm and V", () => {
    for (const axis of ["temperature", "field"] as const) {
      const p = payload(axis);
      const result = computeRunInProcess("map", p);
      const csv = buildMapCsv({ title: "t", payload: p, columns: columnsAsJson(result.columns), setLabel: "TGG v3", runId: id.runId });
      // Records end in CRLF (RFC 4180 §2.1), as every CSV of the product.
      expect(csv.endsWith("\r\n")).toBe(true);
      const rows = csv
        .trim()
        .split("\r\n")
        .filter((l) => !l.startsWith("#"));
      expect(rows[0]).toBe(
        "wavelength_nm,temperature_K,field_T,length_m,magnetic_share,theta_rad,theta_electric_rad,theta_magnetic_rad,verdet_rad_per_T_m",
      );
      expect(rows).toHaveLength(1 + 3 * 2);
      const last = rows.at(-1)!.split(",");
      // The last cell is in the last row: its varied condition is the row's end value.
      if (axis === "temperature") expect([last[1], last[2]]).toEqual(["300", "1"]);
      else expect([last[1], last[2]]).toEqual(["293.15", "2"]);
      expect(last[3]).toBe("0.005");
      expect(Number(last[6])).toBe(result.columns.thetaElectricRad!.at(-1));
    }
  });
});
