import { describe, expect, it } from "vitest";
import { wavelengthToNm } from "@/lib/measurements/units";
import { fmtStored } from "@/lib/workbench/format";

describe("fmtStored", () => {
  it("shows a wavelength converted from µm without conversion noise", () => {
    const nm = wavelengthToNm(0.6328, "um");
    expect(String(nm)).not.toBe("632.8"); // the noise this exists for (IEEE 754 binary64)
    expect(fmtStored(nm)).toBe("632.8");
  });

  it("keeps every digit a measurement carries, and the sign and exponent", () => {
    expect(fmtStored(-134.56789)).toBe("-134.56789");
    expect(fmtStored(1.23456789e-7)).toBe("1.23456789e-7");
    expect(fmtStored(Number.NaN)).toBe("–");
  });
});
