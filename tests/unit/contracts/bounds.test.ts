import { describe, expect, it } from "vitest";
import { pageQuerySchema } from "@/lib/contracts/paging";
import { savePlanSchema } from "@/lib/contracts/plans";
import { setVersionSchema } from "@/lib/contracts/parameter-sets";
import { cleanFileName, INT4_MAX, isTimestampText, queryInteger } from "@/lib/contracts/validation";
import { decodeCursor, encodeCursor, timeIdCursor, versionCursor } from "@/db/paging";
import { measuredPointSchema, pointLimitProblem } from "@/lib/measurements/point";
import { parseMeasurementTable } from "@/lib/measurements/parse";

const ID = "6a1f0c2e-5b1d-4c1e-9f00-00000000c001";

describe("integers in query strings are strict", () => {
  const limit = queryInteger("limit", { min: 1, max: 200 });
  it.each(["0x10", " 5", "5 ", "1e1", "+5", "-1", "0", "201", "5.0", "", "٥"])("refuses %j", (text) => {
    expect(limit.safeParse(text).success).toBe(false);
  });
  it("accepts plain digits in range", () => {
    expect(limit.parse("5")).toBe(5);
    expect(pageQuerySchema.parse({}).limit).toBe(50);
    expect(pageQuerySchema.safeParse({ limit: "0x10" }).success).toBe(false);
  });
});

describe("whole numbers fit PostgreSQL's integer", () => {
  it("refuses a set version beyond int4 (PATCH and plans)", () => {
    expect(setVersionSchema.safeParse(INT4_MAX).success).toBe(true);
    expect(setVersionSchema.safeParse(3_000_000_000).success).toBe(false);
    const plan = savePlanSchema.safeParse({ name: "p", setVersion: 3_000_000_000, request: {}, plan: {} });
    expect(plan.success).toBe(false);
    expect(plan.error?.issues.some((issue) => issue.path[0] === "setVersion")).toBe(true);
  });
  it("refuses a version cursor beyond int4", () => {
    expect(() => decodeCursor(encodeCursor([3_000_000_000]), versionCursor)).toThrow(/cursor/);
    expect(decodeCursor(encodeCursor([7]), versionCursor)).toEqual([7]);
  });
});

describe("cursor timestamps name a real instant", () => {
  it.each([
    "2026-99-99 00:00:00+00",
    "0000-00-00 00:00:00",
    "2026-02-30 10:00:00+00",
    "2025-02-29 10:00:00+00",
    "2026-12-02 24:00:00+00",
    "2026-12-02 05:61:02+00",
    "2026-12-02 05:01:02+99",
  ])("refuses %s", (text) => {
    expect(isTimestampText(text)).toBe(false);
    expect(() => decodeCursor(encodeCursor([text, ID]), timeIdCursor)).toThrow(/cursor/);
  });
  it.each(["2026-12-02 05:01:02.123456+00", "2024-02-29 23:59:59+05:30", "2026-12-02T05:01:02Z"])("accepts %s", (text) => {
    expect(isTimestampText(text)).toBe(true);
  });
});

describe("file names", () => {
  it("are capped at 255 UTF-8 bytes on a character boundary", () => {
    const name = cleanFileName("é".repeat(8000), "x.csv");
    expect(new TextEncoder().encode(name).length).toBeLessThanOrEqual(255);
    expect(name).toBe("é".repeat(127));
    expect(cleanFileName("a".repeat(1_000_000), "x.csv")).toHaveLength(255);
  });
  it("lose control characters, and fall back when nothing is left", () => {
    expect(cleanFileName("data\u0000\r\n\t\u0085.csv", "x.csv")).toBe("data.csv");
    expect(cleanFileName("\u0000\u0001", "x.csv")).toBe("x.csv");
    expect(cleanFileName("half\ud800.csv", "x.csv")).toBe("x.csv");
  });
});

describe("stored points are physically possible", () => {
  const good = { wavelengthNm: 632.8, value: 100, sigma: 1, temperatureK: 4.2, fieldT: 1, lengthM: 0.01 };
  it.each([
    ["wavelength 1e-300 nm", { wavelengthNm: 1e-300 }],
    ["wavelength 1e300 nm", { wavelengthNm: 1e300 }],
    ["σ 5e-324", { sigma: 5e-324 }],
    ["value 1e300", { value: 1e300 }],
    ["temperature 1e6 K", { temperatureK: 1e6 }],
    ["field 1000 T", { fieldT: 1000 }],
  ])("refuses %s", (_label, change) => {
    expect(pointLimitProblem({ ...good, ...change })).not.toBeNull();
    expect(measuredPointSchema.safeParse({ ...good, ...change, line: 2, quantity: "verdet" }).success).toBe(false);
  });
  it("accepts an ordinary point", () => {
    expect(pointLimitProblem(good)).toBeNull();
  });
  it("refuses such rows in an uploaded file with the line", () => {
    const mapping = {
      wavelengthColumn: "wavelength_nm",
      wavelengthUnit: "nm",
      quantity: "verdet",
      valueColumn: "verdet",
      valueUnit: "rad/(T·m)",
      sigmaColumn: "sigma",
      temperatureColumn: null,
      fieldColumn: null,
      lengthColumn: null,
    } as const;
    const text = "wavelength_nm,verdet,sigma\n632.8,100,1\n1e-300,100,1\n632.8,100,5e-324\n";
    const parsed = parseMeasurementTable(text, mapping, { temperatureK: 4.2, fieldT: 1, lengthM: 0.01 });
    expect(parsed.errors[0]).toMatch(/^line 3: wavelength/);
    expect(parsed.errors[1]).toMatch(/^line 4: σ/);
  });
});
