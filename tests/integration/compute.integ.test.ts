import { beforeAll, describe, expect, it } from "vitest";
import { SYNC_CELL_LIMIT } from "@/lib/contracts/compute";
import { Client, DEMO, signIn, validParams } from "./support";

/*
 * POST /api/compute/*: small computations answered at once, with the lab-run payload schemas and
 * limits; a larger request is refused with a pointer to the lab runs.
 */

describe("synchronous compute API", () => {
  let viewer: Client;

  beforeAll(async () => {
    viewer = await signIn(DEMO.viewer);
  });

  const spectrum = (count: number, method: "analytic" | "llg" = "analytic") => ({
    params: validParams(),
    method,
    wavelengths: { fromNm: 400, toNm: 1600, count },
  });

  it("needs a caller", async () => {
    const res = await new Client().post("/api/compute/spectrum", spectrum(10));
    expect(res.status).toBe(401);
  });

  it("a viewer computes a small spectrum and a small map", async () => {
    const res = await viewer.post("/api/compute/spectrum", spectrum(64));
    expect(res.status).toBe(200);
    expect(res.body.kind).toBe("spectrum");
    expect(res.body.columns.thetaRad).toHaveLength(64);
    expect(res.body.engineVersion).toMatch(/^\d+\.\d+\.\d+$/);
    const map = await viewer.post("/api/compute/map", {
      params: validParams(),
      method: "analytic",
      axis: "temperature",
      wavelengths: { fromNm: 500, toNm: 1000, count: 10 },
      rows: { from: 50, to: 300, count: 5 },
    });
    expect(map.status).toBe(200);
    expect(map.body.columns.magneticShare).toHaveLength(50);
  });

  it("bad input is refused with the field, as a lab run's would be", async () => {
    const res = await viewer.post("/api/compute/spectrum", { ...spectrum(10), wavelengths: { fromNm: 400, toNm: 300, count: 10 } });
    expect(res.status).toBe(400);
    expect(res.body.error.fields["wavelengths.toNm"]).toMatch(/above fromNm/);
  });

  it("a request above the limit answers 413 with the lab-run route to use instead", async () => {
    const res = await viewer.post("/api/compute/spectrum", spectrum(SYNC_CELL_LIMIT.llg + 1, "llg"));
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe("payload_too_large");
    expect(res.body.error.labRun).toEqual({ method: "POST", path: "/api/runs", kind: "spectrum" });
  });

  it("a small fit comes back with its values and σ", async () => {
    const points = [500, 600, 700, 800, 900, 1000].map((wavelengthNm, i) => ({
      line: i + 2,
      wavelengthNm,
      quantity: "verdet",
      value: -200 + i * 20,
      sigma: 2,
      temperatureK: 293.15,
      fieldT: 1,
      lengthM: 0.01,
    }));
    const res = await viewer.post("/api/compute/fit", { params: validParams(), free: [{ key: "magneticScale" }], points });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.result.free).toEqual(["magneticScale"]);
    expect(Number.isFinite(res.body.result.values.magneticScale)).toBe(true);
  });
});
