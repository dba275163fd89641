import { describe, expect, it } from "vitest";
import { MAX_ROWS, parseMeasurementTable, proposeMapping, readTable, type ColumnMapping } from "@/lib/measurements/parse";
import { measuredPointSchema } from "@/lib/measurements/point";

const DEFAULT_HEADER = "wavelength_nm,verdet_rad_per_T_m,sigma,temperature_K,field_T,length_m";

describe("proposeMapping", () => {
  it("maps the default column names exactly", () => {
    const mapping = proposeMapping(DEFAULT_HEADER.split(","));
    expect(mapping).toEqual({
      wavelengthColumn: "wavelength_nm",
      wavelengthUnit: "nm",
      quantity: "verdet",
      valueColumn: "verdet_rad_per_T_m",
      valueUnit: "rad/(T·m)",
      sigmaColumn: "sigma",
      temperatureColumn: "temperature_K",
      fieldColumn: "field_T",
      lengthColumn: "length_m",
    });
  });

  it("recognises a rotation in rad and other units by suffix", () => {
    expect(proposeMapping(["wavelength_nm", "rotation_rad", "sigma"])).toMatchObject({
      quantity: "rotation",
      valueColumn: "rotation_rad",
      valueUnit: "rad",
    });
    expect(proposeMapping(["Energy (eV)", "Rotation (mrad)", "u"])).toMatchObject({
      wavelengthColumn: "Energy (eV)",
      wavelengthUnit: "eV",
      valueColumn: "Rotation (mrad)",
      valueUnit: "mrad",
      sigmaColumn: "u",
    });
    expect(proposeMapping(["wavenumber_cm-1", "verdet_min_per_Oe_cm"])).toMatchObject({
      wavelengthUnit: "cm-1",
      valueUnit: "min/(Oe·cm)",
      quantity: "verdet",
    });
  });

  it("leaves unknown columns to the user", () => {
    expect(proposeMapping(["a", "b"])).toMatchObject({
      wavelengthColumn: null,
      valueColumn: null,
      sigmaColumn: null,
      temperatureColumn: null,
    });
  });
});

describe("readTable", () => {
  it("skips comments and blank lines and keeps the original line numbers", () => {
    const table = readTable("# generated\r\n\r\nwavelength_nm\tverdet\r\n500\t1\r\n\r\n600\t2\r\n");
    expect(table.delimiter).toBe("\t");
    expect(table.headerLine).toBe(3);
    expect(table.rows.map((r) => r.line)).toEqual([4, 6]);
  });

  it("counts a quoted field spanning lines", () => {
    const table = readTable('a,b\n1,"x\ny"\n2,3\n');
    expect(table.rows.map((r) => r.line)).toEqual([2, 4]);
  });
});

describe("parseMeasurementTable", () => {
  const mapping = proposeMapping(DEFAULT_HEADER.split(","));

  it("converts a good file to SI points with line numbers", () => {
    const text = `${DEFAULT_HEADER}\n632.8,-134,2,293.15,1,0.01\n1064,-40,1.5,293.15,1,0.01\n`;
    const result = parseMeasurementTable(text, mapping);
    expect(result.errors).toEqual([]);
    expect(result.points).toEqual([
      { line: 2, wavelengthNm: 632.8, quantity: "verdet", value: -134, sigma: 2, temperatureK: 293.15, fieldT: 1, lengthM: 0.01 },
      { line: 3, wavelengthNm: 1064, quantity: "verdet", value: -40, sigma: 1.5, temperatureK: 293.15, fieldT: 1, lengthM: 0.01 },
    ]);
    // The shared shape's schema accepts every point the reader returns.
    for (const point of result.points) expect(measuredPointSchema.parse(point)).toEqual(point);
  });

  it("takes missing columns from the file's defaults and converts units", () => {
    const text = "energy_eV;rotation_deg\n1.959;-7.6\n";
    const m: ColumnMapping = { ...proposeMapping(["energy_eV", "rotation_deg"]) };
    expect(m).toMatchObject({ wavelengthUnit: "eV", quantity: "rotation", valueUnit: "deg", sigmaColumn: null, temperatureColumn: null });
    const missing = parseMeasurementTable(text, m);
    expect(missing.points).toEqual([]);
    expect(missing.errors).toEqual([
      "σ: choose a column or enter one relative σ for the whole file.",
      "Temperature: choose a column or enter one value for the whole file.",
      "Field: choose a column or enter one value for the whole file.",
      "Sample length: choose a column or enter one value for the whole file.",
    ]);
    const result = parseMeasurementTable(text, m, { relativeSigma: 0.05, temperatureK: 77, fieldT: 0.5, lengthM: 0.02 });
    expect(result.errors).toEqual([]);
    const [point] = result.points;
    // hc = 1239.84198 eV·nm (CODATA 2018); 180° = π rad.
    expect(point!.wavelengthNm).toBeCloseTo(1239.84198 / 1.959, 9);
    expect(point!.value).toBeCloseTo((-7.6 * Math.PI) / 180, 12);
    expect(point!.sigma).toBeCloseTo((0.05 * 7.6 * Math.PI) / 180, 12);
    expect(point).toMatchObject({ temperatureK: 77, fieldT: 0.5, lengthM: 0.02, quantity: "rotation" });
  });

  it("reports every bad row with its line number and returns no points", () => {
    const text = [
      "# generated test file",
      DEFAULT_HEADER,
      "632.8,-134,2,293.15,1,0.01",
      ",-100,2,293.15,1,0.01",
      "700,abc,2,293.15,1,0.01",
      "800,-80,0,293.15,1,0.01",
      "900,-60,2,293.15,1",
      "1000,-50,2,-3,1,0.01",
      "-5,-50,2,293,1,0.01",
    ].join("\n");
    const result = parseMeasurementTable(text, mapping);
    expect(result.points).toEqual([]);
    expect(result.rowCount).toBe(7);
    expect(result.errors).toEqual([
      "line 4: wavelength is empty",
      "line 5: Verdet constant “abc” is not a number",
      "line 6: σ must be > 0",
      "line 7: has 5 fields, the header has 6",
      "line 8: temperature must be > 0 K",
      "line 9: wavelength must be > 0",
    ]);
  });

  it("refuses a value that overflows when converted to SI", () => {
    const result = parseMeasurementTable(`${DEFAULT_HEADER}\n500,1e307,1,1,1,1\n`, { ...mapping, valueUnit: "min/(Oe·cm)" });
    expect(result.errors).toEqual(["line 2: value or σ is out of range after conversion"]);
  });

  it("names a mapped column the file lacks and a unit that does not fit", () => {
    const result = parseMeasurementTable(`${DEFAULT_HEADER}\n500,1,1,1,1,1\n`, { ...mapping, fieldColumn: "B", valueUnit: "mrad" });
    expect(result.errors).toEqual(["The unit mrad does not fit a Verdet constant.", "Field: the file has no column “B”."]);
  });

  it("refuses empty files and files over the row limit", () => {
    expect(parseMeasurementTable("", mapping).errors[0]).toMatch(/empty/);
    expect(parseMeasurementTable(`${DEFAULT_HEADER}\n`, mapping).errors[0]).toMatch(/no data rows/);
    const many = `${DEFAULT_HEADER}\n${"500,1,1,1,1,1\n".repeat(MAX_ROWS + 1)}`;
    expect(parseMeasurementTable(many, mapping).errors).toEqual(["The file has 20,001 data rows; at most 20,000 are allowed."]);
  });

  it("caps the list of messages and says how many more there are", () => {
    const text = `${DEFAULT_HEADER}\n${",1,1,1,1,1\n".repeat(250)}`;
    const result = parseMeasurementTable(text, mapping);
    expect(result.errors).toHaveLength(201);
    expect(result.errors[0]).toBe("line 2: wavelength is empty");
    expect(result.errors[200]).toBe("… and 50 more problems.");
  });
});
