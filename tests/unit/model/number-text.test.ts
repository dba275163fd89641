import { describe, expect, it } from "vitest";
import { formatNumberDisplay, formatNumberInput, numberBoxText, parseDecimal, parseDecimalOrNull } from "@/lib/model/number-text";
import { parseNumber } from "@/lib/workbench/validate";

describe("parseDecimal", () => {
  it("reads a decimal comma as the decimal separator", () => {
    expect(parseDecimalOrNull("1,5")).toBe(1.5);
    expect(parseDecimalOrNull("-0,01")).toBe(-0.01);
    expect(parseDecimalOrNull("2,73e-3")).toBe(2.73e-3);
  });

  it("reads the usual forms", () => {
    expect(parseDecimalOrNull(" 293.15 ")).toBe(293.15);
    expect(parseDecimalOrNull("1.27e28")).toBe(1.27e28);
    expect(parseDecimalOrNull("\u22128")).toBe(-8);
    expect(parseDecimalOrNull("1 000")).toBe(1000);
  });

  it("tells an empty box from text that is not a number", () => {
    expect(parseDecimal("")).toEqual({ kind: "empty" });
    expect(parseDecimal("   ")).toEqual({ kind: "empty" });
    expect(parseDecimal("1e")).toEqual({ kind: "invalid" });
    expect(parseDecimal("abc")).toEqual({ kind: "invalid" });
    expect(parseDecimal("1e999")).toEqual({ kind: "invalid" });
  });

  it("refuses a comma beside a point instead of guessing which is the decimal mark", () => {
    expect(parseDecimal("1,000.5")).toEqual({ kind: "invalid" });
    expect(parseDecimal("1,2,3")).toEqual({ kind: "invalid" });
  });

  it("is what the workbench's boxes use", () => {
    expect(parseNumber("0,5")).toBe(0.5);
  });
});

describe("formatNumberInput", () => {
  it("shows large and small values in scientific form and round-trips them", () => {
    expect(formatNumberInput(1e14)).toBe("1e14");
    expect(formatNumberInput(1.2726e28)).toBe("1.2726e28");
    expect(formatNumberInput(2.5e-5)).toBe("2.5e-5");
    expect(formatNumberInput(293.15)).toBe("293.15");
    expect(formatNumberInput(0)).toBe("0");
    expect(formatNumberInput(Number.NaN)).toBe("");
    for (const v of [1e14, 1.2726e28, 2.5e-5, -8, 123456.789, 0.0012345]) expect(parseDecimalOrNull(formatNumberInput(v))).toBe(v);
  });
});

describe("numbers shown at meaningful precision, edited in full", () => {
  it("rounds a fitted value to five significant digits for reading", () => {
    expect(formatNumberDisplay(0.0064186413614499525)).toBe("0.0064186");
    expect(formatNumberDisplay(1.9431431724417974)).toBe("1.9431");
    expect(formatNumberDisplay(1.2726e28)).toBe("1.2726e28");
    expect(formatNumberDisplay(293.15)).toBe("293.15");
    expect(formatNumberDisplay(2.5e-5)).toBe("2.5e-5");
    expect(formatNumberDisplay(-8)).toBe("-8");
  });

  it("shows the full value in a focused box and what was typed over it", () => {
    const full = formatNumberInput(0.0064186413614499525);
    expect(numberBoxText(full, true)).toBe("0.0064186413614499525");
    expect(numberBoxText(full, false)).toBe("0.0064186");
    // Text that is not the plain form of its value (a decimal comma, trailing zeros) stays as typed.
    expect(numberBoxText("0,5", false)).toBe("0,5");
    expect(numberBoxText("1.50", false)).toBe("1.50");
    expect(numberBoxText("1e", false)).toBe("1e");
  });
});
