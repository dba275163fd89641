import { describe, expect, it } from "vitest";
import { fmtDifference, fmtHeldValue } from "@/lib/workbench/format";

describe("differences in the compare table", () => {
  it("are signed, written with a power of ten and say the relative change", () => {
    expect(fmtDifference(-2.991e-4, 0.1361)).toBe("−2.99 × 10⁻⁴ (−0.22 %)");
    expect(fmtDifference(3.5, 70)).toBe("+3.5 (+5.00 %)");
    expect(fmtDifference(1.2e6, null)).toBe("+1.2 × 10⁶");
    expect(fmtDifference(0, 5)).toBe("0");
    expect(fmtDifference(null, 5)).toBe("–");
  });

  it("takes the relative change against the size of a negative reference", () => {
    // −134 → −130: +4 against |−134|.
    expect(fmtDifference(4, -134)).toBe("+4 (+2.99 %)");
  });
});

describe("held values of a fit", () => {
  it("gives numbers five significant digits and switches or words as they are", () => {
    expect(fmtHeldValue(135.83)).toBe("135.83");
    expect(fmtHeldValue(1.2726e28)).toBe("1.2726e28");
    expect(fmtHeldValue(258.00004)).toBe("258");
    expect(fmtHeldValue(true)).toBe("true");
    expect(fmtHeldValue("sellmeier")).toBe("sellmeier");
  });
});
