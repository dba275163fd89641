import { describe, expect, it } from "vitest";
import { describeFormat, parseMeasurementTable, proposeMapping, readTable } from "@/lib/measurements/parse";
import { measuredPointSchema } from "@/lib/measurements/point";

/*
 * The files instruments and notebooks write besides plain CSV: numpy.savetxt's default (spaces,
 * `%.18e`, a `# `-prefixed header when one is given), and European spreadsheets (semicolons and
 * decimal commas).
 */

// What numpy.savetxt("x.txt", a, header="wavelength_nm verdet_rad_per_T_m sigma") writes (numpy's
// defaults: delimiter " ", fmt "%.18e", comments "# "; numpy.savetxt documentation).
const SAVETXT = [
  "# wavelength_nm verdet_rad_per_T_m sigma",
  "6.328000000000000000e+02 -1.340000000000000000e+02 2.000000000000000000e+00",
  "1.064000000000000000e+03 -4.000000000000000000e+01 1.000000000000000000e+00",
  "",
].join("\n");

const defaults = { temperatureK: 293.15, fieldT: 1, lengthM: 0.01 };

describe("readTable: detected formats", () => {
  it("takes the header from numpy.savetxt's # line and keeps every data row", () => {
    const table = readTable(SAVETXT);
    expect(table.delimiter).toBe("whitespace");
    expect(table.headerSource).toBe("comment");
    expect(table.headerLine).toBe(1);
    expect(table.headers).toEqual(["wavelength_nm", "verdet_rad_per_T_m", "sigma"]);
    expect(table.rows.map((r) => r.line)).toEqual([2, 3]);
    expect(describeFormat(table)).toBe("columns separated by spaces, decimal points, header from the # comment on line 1");
  });

  it("reads a savetxt file end to end, values as written", () => {
    const table = readTable(SAVETXT);
    const result = parseMeasurementTable(SAVETXT, proposeMapping(table.headers), defaults);
    expect(result.errors).toEqual([]);
    expect(result.points.map((p) => [p.wavelengthNm, p.value, p.sigma])).toEqual([
      [632.8, -134, 2],
      [1064, -40, 1],
    ]);
  });

  it("keeps an ordinary header line first, and a comment above it stays a comment", () => {
    const table = readTable("# exported by the spectrometer\nwavelength_nm\tverdet\n632.8\t-134\n");
    expect(table.delimiter).toBe("\t");
    expect(table.headerSource).toBe("line");
    expect(table.headers).toEqual(["wavelength_nm", "verdet"]);
    expect(table.rows).toHaveLength(1);
  });

  it("does not take a comment with another field count as the header", () => {
    const table = readTable("# run 4 of the day, sample A\n632.8 -134\n1064 -40\n");
    expect(table.headerSource).toBe("line");
    expect(table.headers).toEqual(["632.8", "-134"]);
  });

  it("reads semicolons with decimal commas", () => {
    const text = "wavelength_nm;verdet_rad_per_T_m;sigma\n632,8;-134,5;2\n1064;-40,25;1,5\n";
    const table = readTable(text);
    expect(table.delimiter).toBe(";");
    expect(table.decimal).toBe(",");
    const result = parseMeasurementTable(text, proposeMapping(table.headers), defaults);
    expect(result.errors).toEqual([]);
    expect(result.points.map((p) => [p.wavelengthNm, p.value, p.sigma])).toEqual([
      [632.8, -134.5, 2],
      [1064, -40.25, 1.5],
    ]);
  });

  it("lets the user override the detection", () => {
    const text = "a;b\n1,5;2\n";
    expect(readTable(text, { delimiter: "auto", decimal: "." }).decimal).toBe(".");
    const forced = readTable("wavelength_nm,verdet\n632.8,-134\n", { delimiter: "whitespace", decimal: "auto" });
    expect(forced.delimiter).toBe("whitespace");
    expect(forced.headers).toEqual(["wavelength_nm,verdet"]);
  });

  it("never reads a comma as a decimal mark in a comma-separated file", () => {
    expect(readTable("a,b\n1,5\n").decimal).toBe(".");
  });
});

describe("parseMeasurementTable: extra text columns", () => {
  it("keeps unmapped columns per point as text", () => {
    const text = "wavelength_nm,verdet_rad_per_T_m,sigma,source,note\n632.8,-134,2,HeNe run 4,\n1064,-40,1,Nd:YAG,checked\n";
    const result = parseMeasurementTable(text, proposeMapping(readTable(text).headers), defaults);
    expect(result.errors).toEqual([]);
    expect(result.points.map((p) => p.extra)).toEqual([{ source: "HeNe run 4" }, { source: "Nd:YAG", note: "checked" }]);
    for (const p of result.points) expect(measuredPointSchema.safeParse(p).success).toBe(true);
  });

  it("names the line of a text cell that is too long", () => {
    const text = `wavelength_nm,verdet_rad_per_T_m,sigma,source\n632.8,-134,2,${"x".repeat(201)}\n`;
    const result = parseMeasurementTable(text, proposeMapping(readTable(text).headers), defaults);
    expect(result.errors).toEqual(["line 2: source is longer than 200 characters"]);
  });
});

describe("readTable: a # header above data with text columns", () => {
  it("takes the comment as the header when the first row holds numbers beside text", () => {
    const table = readTable("# wavelength_nm verdet source\n632.8 -134 HeNe\n1064 -40 Nd:YAG\n");
    expect(table.headerSource).toBe("comment");
    expect(table.headers).toEqual(["wavelength_nm", "verdet", "source"]);
    expect(table.rows).toHaveLength(2);
  });
});
