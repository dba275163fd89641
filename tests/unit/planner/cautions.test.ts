import { describe, expect, it } from "vitest";
import { class1LimitW, indicativeLaserClass } from "@/lib/planner/cautions";

/*
 * Indicative classes from the IEC 60825-1 Class 1 limits for long CW exposure, as recalled in
 * lib/planner/cautions.ts (from memory, not checked against the standard's tables).
 */
describe("indicative laser class by wavelength and power", () => {
  it("puts a 10 mW line at 1550 nm in Class 1, at its limit, not in 3B", () => {
    expect(indicativeLaserClass(1550, 0.01)).toBe("1 (near the Class 3R limit)");
    expect(indicativeLaserClass(1550, 0.002)).toBe("1");
    expect(indicativeLaserClass(1550, 0.03)).toBe("3R");
    expect(indicativeLaserClass(1550, 0.2)).toBe("3B");
  });

  it("keeps the visible steps: 1, 2, 3R, 3B", () => {
    expect(indicativeLaserClass(632.8, 0.0002)).toBe("1");
    expect(indicativeLaserClass(632.8, 0.0008)).toBe("2");
    expect(indicativeLaserClass(632.8, 0.003)).toBe("3R");
    expect(indicativeLaserClass(632.8, 0.01)).toBe("3B");
    expect(indicativeLaserClass(532, 2)).toBe("4");
  });

  it("raises the Class 1 limit through the near infrared (C4, C7)", () => {
    // 1064 nm: C4 = 5, C7 = 1 → 5 × 0.39 mW = 1.95 mW (from memory, as in cautions.ts).
    expect(class1LimitW(1064)).toBeCloseTo(1.95e-3, 6);
    // 850 nm: C4 = 10^0.3 ≈ 2.0.
    expect(class1LimitW(850)).toBeCloseTo(3.9e-4 * 10 ** 0.3, 8);
    expect(indicativeLaserClass(1064, 0.001)).toBe("1");
    expect(indicativeLaserClass(1064, 0.005)).toBe("3R");
    expect(indicativeLaserClass(1064, 0.02)).toBe("3B");
  });

  it("gives no indication where the table does not reach", () => {
    expect(class1LimitW(355)).toBeNull();
    expect(indicativeLaserClass(355, 0.01)).toMatch(/unknown at this wavelength/);
    expect(indicativeLaserClass(10600, 1)).toBe("4");
  });
});
