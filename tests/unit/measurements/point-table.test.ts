import { describe, expect, it } from "vitest";
import type { StoredPoint } from "@/lib/contracts/measurement-sets";
import { changeFromDraft, describeChanges, draftOf, extraColumns, sortPoints, undoOf } from "@/lib/measurements/point-table";
import { pointChangeSchema } from "@/lib/contracts/measurement-sets";

const point = (over: Partial<StoredPoint> = {}): StoredPoint => ({
  ordinal: 0,
  line: 2,
  wavelengthNm: 632.8000000000001,
  quantity: "verdet",
  value: -134,
  sigma: 2,
  temperatureK: 293.15,
  fieldT: 1,
  lengthM: 0.01,
  masked: false,
  maskReason: null,
  note: "",
  original: null,
  ...over,
});

describe("sortPoints and extraColumns", () => {
  it("sorts by a numeric column, ties in file order", () => {
    const points = [
      point({ ordinal: 0, temperatureK: 293 }),
      point({ ordinal: 1, temperatureK: 77 }),
      point({ ordinal: 2, temperatureK: 77 }),
    ];
    expect(sortPoints(points, "temperatureK", "asc").map((p) => p.ordinal)).toEqual([1, 2, 0]);
    expect(sortPoints(points, "temperatureK", "desc").map((p) => p.ordinal)).toEqual([0, 1, 2]);
    expect(sortPoints([point({ ordinal: 0 }), point({ ordinal: 1, masked: true })], "masked", "desc")[0]!.ordinal).toBe(1);
  });

  it("lists the text columns in first-seen order", () => {
    expect(extraColumns([point({ extra: { source: "a" } }), point({ extra: { note: "b", source: "c" } }), point()])).toEqual([
      "source",
      "note",
    ]);
  });
});

describe("changeFromDraft", () => {
  it("an untouched draft is no change, even where the stored value has conversion noise", () => {
    const p = point();
    expect(draftOf(p).values.wavelengthNm).toBe("632.8");
    expect(changeFromDraft(p, draftOf(p))).toEqual({ change: null, errors: {} });
  });

  it("masking needs a reason; with one, the change passes the API's schema", () => {
    const p = point();
    expect(changeFromDraft(p, { ...draftOf(p), masked: true }).errors).toEqual({ maskReason: "Say why the point is masked." });
    const { change } = changeFromDraft(p, { ...draftOf(p), masked: true, maskReason: " laser drift " });
    expect(change).toEqual({ ordinal: 0, masked: true, maskReason: "laser drift" });
    expect(pointChangeSchema.safeParse(change).success).toBe(true);
  });

  it("reads a corrected value (a decimal comma too) and refuses one that is not a number", () => {
    const p = point();
    const draft = draftOf(p);
    expect(changeFromDraft(p, { ...draft, values: { ...draft.values, sigma: "2,5" } }).change).toEqual({
      ordinal: 0,
      values: { sigma: 2.5 },
    });
    expect(changeFromDraft(p, { ...draft, values: { ...draft.values, value: "abc" } }).errors).toEqual({ value: "Enter a number." });
  });

  it("undo restores what the change touched", () => {
    const before = point({ masked: true, maskReason: "dust", note: "old" });
    expect(undoOf(before, { ordinal: 0, masked: false, note: "new", values: { sigma: 3 } })).toEqual({
      ordinal: 0,
      masked: true,
      maskReason: "dust",
      note: "old",
      values: { sigma: 2 },
    });
  });
});

describe("describeChanges", () => {
  it("says what a revision did in words", () => {
    expect(describeChanges({ masked: { from: false, to: true }, maskReason: { from: null, to: "drift" }, sigma: { from: 2, to: 3 } })).toBe(
      "masked; reason “drift”; σ 2 → 3",
    );
    expect(describeChanges({ note: { from: "x", to: "" } })).toBe("note removed");
    // Told in one order whatever order the stored JSON has its keys in.
    expect(describeChanges({ note: { from: "", to: "n" }, sigma: { from: 2, to: 3 }, masked: { from: false, to: true } })).toBe(
      "masked; note “n”; σ 2 → 3",
    );
  });
});
