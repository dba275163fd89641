import { describe, expect, it } from "vitest";
import { formatAbsorptionText, parseAbsorptionText } from "@/lib/model/absorption-text";

describe("absorption table as pasted text", () => {
  it("reads nm and 1/cm rows in any common separator, stores 1/m (1 /cm = 100 /m)", () => {
    const r = parseAbsorptionText("# TGG\n632.8 0.001\n1064,0.0017\n\n1550;\t0.19\n");
    expect(r).toEqual({
      ok: true,
      rows: [
        { wavelengthNm: 632.8, absorptionPerM: 0.1 },
        { wavelengthNm: 1064, absorptionPerM: 0.17 },
        { wavelengthNm: 1550, absorptionPerM: 19 },
      ],
    });
  });

  it("empty text means no table", () => {
    expect(parseAbsorptionText("  \n# nothing\n")).toEqual({ ok: true, rows: undefined });
  });

  it("names the line and the rule", () => {
    expect(parseAbsorptionText("500 0.1\n400 0.2")).toEqual({
      ok: false,
      error: "line 2: wavelengths must be strictly increasing (400 nm after 500 nm)",
    });
    expect(parseAbsorptionText("500 -1\n600 1")).toMatchObject({ ok: false, error: "line 1: α must be a number ≥ 0 /cm" });
    expect(parseAbsorptionText("500\n600 1")).toMatchObject({ ok: false, error: expect.stringMatching(/^line 1: expected two numbers/) });
    expect(parseAbsorptionText("500 1")).toMatchObject({ ok: false, error: "a table needs at least two rows" });
  });

  it("round-trips what it formats", () => {
    const rows = [
      { wavelengthNm: 461.604, absorptionPerM: 0.21607 },
      { wavelengthNm: 1620.02, absorptionPerM: 91.92 },
    ];
    const back = parseAbsorptionText(formatAbsorptionText(rows));
    expect(back.ok && back.rows!.map((r) => r.absorptionPerM)).toEqual([0.21607, 91.92]);
  });
});
