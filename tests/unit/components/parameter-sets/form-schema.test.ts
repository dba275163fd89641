import { describe, expect, it } from "vitest";
import { mapServerFields, setFormResolver, setFormSchema, toFormValues, type SetFormInput } from "@/components/parameter-sets/form-schema";
import { NAME_MAX, TAG_MAX } from "@/lib/contracts/parameter-sets";
import { TERBIUM_GARNET_DEFAULTS } from "@/lib/model/defaults";

const valid = (): SetFormInput =>
  toFormValues({ labId: "lab", name: "TGG", description: "", tags: ["tgg"], params: { ...TERBIUM_GARNET_DEFAULTS } });

async function resolve(values: SetFormInput) {
  return setFormResolver(values, undefined, { fields: {}, shouldUseNativeValidation: false } as never);
}

describe("parameter-set form schema", () => {
  it("takes its name limit from the API's schema", () => {
    expect(setFormSchema.safeParse({ ...valid(), name: "x".repeat(NAME_MAX) }).success).toBe(true);
    const tooLong = setFormSchema.safeParse({ ...valid(), name: "x".repeat(NAME_MAX + 1) });
    expect(tooLong.success).toBe(false);
    expect(tooLong.error?.issues[0]?.message).toBe(`At most ${NAME_MAX} characters.`);
  });

  it("reports a too-long tag on the tag box", async () => {
    const result = await resolve({ ...valid(), tags: `tgg, ${"a".repeat(TAG_MAX + 1)}` });
    expect(result.errors.tags?.message).toBe(`Each tag at most ${TAG_MAX} characters.`);
  });

  it("says Required for an empty number box and Not a number for unreadable text", async () => {
    const values = valid();
    const result = await resolve({ ...values, params: { ...values.params, temperatureK: Number.NaN, fieldT: "1e" as unknown as number } });
    expect(result.errors.params?.temperatureK?.message).toBe("Required");
    expect(result.errors.params?.fieldT?.message).toBe("Not a number");
  });

  it("passes a valid form through", async () => {
    const result = await resolve(valid());
    expect(result.errors).toEqual({});
  });

  it("maps the API's per-tag field onto the tag box", () => {
    expect(mapServerFields({ "tags.2": "Each tag at most 40 characters." }).field).toEqual([["tags", "Each tag at most 40 characters."]]);
  });
});
