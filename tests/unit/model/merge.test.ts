import { describe, expect, it } from "vitest";
import { TERBIUM_GARNET_DEFAULTS } from "@/lib/model/defaults";
import type { SetSnapshot } from "@/lib/model/diff";
import { mergeOntoNewer } from "@/lib/model/merge";

const base = {
  name: "TGG 293 K",
  description: "Room temperature",
  tags: ["tgg", "garnet"],
  params: { ...TERBIUM_GARNET_DEFAULTS },
} satisfies SetSnapshot;

describe("mergeOntoNewer", () => {
  it("keeps the other person's change to a field this user never touched", () => {
    const theirs = { ...base, params: { ...base.params, fieldT: 2 } };
    const mine = { ...base, params: { ...base.params, temperatureK: 77 } };
    const { merged, mine: taken, clashes } = mergeOntoNewer({ base, mine, theirs });
    expect(merged.params.fieldT).toBe(2);
    expect(merged.params.temperatureK).toBe(77);
    expect(taken).toEqual(["temperatureK"]);
    expect(clashes).toEqual([]);
  });

  it("applies text and tag edits and leaves untouched text as the newer version has it", () => {
    const theirs = { ...base, description: "Measured again in March" };
    const mine = { ...base, name: "TGG 293 K (checked)", tags: ["garnet", "tgg", "reference"] };
    const { merged, mine: taken } = mergeOntoNewer({ base, mine, theirs });
    expect(merged).toMatchObject({
      name: "TGG 293 K (checked)",
      description: "Measured again in March",
      tags: ["garnet", "tgg", "reference"],
    });
    expect(taken).toEqual(["name", "tags"]);
  });

  it("does not count a reordered tag list as a change", () => {
    const theirs = { ...base, tags: ["tgg"] };
    const mine = { ...base, tags: ["garnet", "tgg"] };
    expect(mergeOntoNewer({ base, mine, theirs }).merged.tags).toEqual(["tgg"]);
  });

  it("lets this user's value win where both changed a field, and names the clash", () => {
    const theirs = { ...base, params: { ...base.params, temperatureK: 300 } };
    const mine = { ...base, params: { ...base.params, temperatureK: 77 } };
    const result = mergeOntoNewer({ base, mine, theirs });
    expect(result.merged.params.temperatureK).toBe(77);
    expect(result.clashes).toEqual(["temperatureK"]);
  });

  it("is no clash when both made the same change", () => {
    const both = { ...base, params: { ...base.params, lengthM: 0.02 } };
    const result = mergeOntoNewer({ base, mine: both, theirs: both });
    expect(result.merged.params.lengthM).toBe(0.02);
    expect(result.clashes).toEqual([]);
  });

  it("returns the newer version unchanged when this user changed nothing", () => {
    const theirs = { ...base, name: "Renamed", params: { ...base.params, gilbertDamping: 0.05 } };
    const result = mergeOntoNewer({ base, mine: base, theirs });
    expect(result.merged).toEqual(theirs);
    expect(result.mine).toEqual([]);
  });
});
