import { describe, expect, it } from "vitest";
import { agree, countOf, noun, pluralForm } from "@/lib/text/plural";

describe("plurals", () => {
  const entry = noun("entry", "entries");

  it("uses the singular for exactly one and the plural otherwise (zero too)", () => {
    expect(countOf(1, entry)).toBe("1 entry");
    expect(countOf(2, entry)).toBe("2 entries");
    expect(countOf(0, entry)).toBe("0 entries");
    expect(countOf(1.5, noun("point"))).toBe("1.5 points");
  });

  it("defaults the plural to the singular plus s", () => {
    expect(pluralForm(3, noun("invitation"))).toBe("invitations");
    expect(pluralForm(1, noun("invitation"))).toBe("invitation");
  });

  it("shows a formatted count when given one", () => {
    expect(countOf(12000, noun("row"), "12,000")).toBe("12,000 rows");
  });

  it("agrees a verb with its count", () => {
    expect(`1 field ${agree(1, "differs", "differ")}`).toBe("1 field differs");
    expect(`4 fields ${agree(4, "differs", "differ")}`).toBe("4 fields differ");
  });
});
