import { describe, expect, it } from "vitest";
import { z } from "zod";
import { listMeasurementSetsQuery, uploadMeasurementMetaSchema } from "@/lib/contracts/measurement-sets";
import { listParameterSetsQuery } from "@/lib/contracts/parameter-sets";
import { finiteNumber, positiveNumber, zodIssueFields, zodIssueLines } from "@/lib/contracts/validation";
import { fileDefaultsSchema, proposeMapping } from "@/lib/measurements/parse";

/* The one validation module: the numeric field rules, the issue formatter, and text fields that must be storable. */

const messages = (schema: z.ZodType, value: unknown) => {
  const parsed = schema.safeParse(value);
  return parsed.success ? [] : parsed.error.issues.map((i) => i.message);
};

describe("numeric fields", () => {
  it("finiteNumber names the field: required, not a number; Infinity and NaN are refused too", () => {
    const field = z.strictObject({ temperature: finiteNumber("temperature") });
    expect(messages(field, {})).toEqual(["temperature is required"]);
    expect(messages(field, { temperature: "300" })).toEqual(["temperature must be a number"]);
    // zod 4's number type already refuses them, before the explicit finite rule.
    expect(messages(field, { temperature: Number.POSITIVE_INFINITY })).toEqual(["temperature must be a number"]);
    expect(messages(field, { temperature: Number.NaN })).toEqual(["temperature must be a number"]);
    expect(messages(field, { temperature: -4 })).toEqual([]);
  });

  it("positiveNumber refuses 0 and below with its own rule, and what finiteNumber refuses", () => {
    const length = positiveNumber("The sample length");
    expect(messages(length, 0)).toEqual(["The sample length must be > 0"]);
    expect(messages(length, -1)).toEqual(["The sample length must be > 0"]);
    expect(messages(length, Number.NaN)).toEqual(["The sample length must be a number"]);
    expect(messages(length, 1e-9)).toEqual([]);
  });

  it("the upload's one-value-per-file defaults use them", () => {
    expect(messages(fileDefaultsSchema, { temperatureK: 0 })).toEqual(["The temperature must be > 0"]);
    expect(messages(fileDefaultsSchema, { fieldT: "1" })).toEqual(["The field must be a number"]);
    expect(messages(fileDefaultsSchema, { fieldT: -2, relativeSigma: 0.02 })).toEqual([]);
  });
});

describe("the zod-issue formatter", () => {
  const schema = z.strictObject({ lines: z.array(z.strictObject({ wavelengthNm: finiteNumber("wavelength").gt(0, "must be > 0 nm") })) });
  const rooted = schema.refine((v) => v.lines.length < 2, { message: "at most one line" });
  const issues = rooted.safeParse({ lines: [{ wavelengthNm: 1 }, { wavelengthNm: -1 }] }).error!.issues;

  it("writes dotted paths, the root under its label, and lets a caller rename a path", () => {
    expect(zodIssueLines(issues)).toEqual(["lines.1.wavelengthNm: must be > 0 nm", expect.stringMatching(/^\(input\): /)]);
    expect(zodIssueLines(issues, { rootLabel: "(request)" })[1]).toMatch(/^\(request\): /);
    expect(zodIssueLines(issues, { label: (path) => (path.endsWith("wavelengthNm") ? "Wavelength" : undefined) })[0]).toBe(
      "Wavelength: must be > 0 nm",
    );
  });

  it("names each unknown key of a strict object as a field of its own", () => {
    const extra = schema.safeParse({ lines: [], extra: 1, other: 2 }).error!.issues;
    expect(zodIssueLines(extra)).toEqual(["extra: unknown key", "other: unknown key"]);
    expect(zodIssueLines(extra, { unknownKey: "not a model parameter" })[0]).toBe("extra: not a model parameter");
  });

  it("keys fields by dotted path, the root as body, the first message per field winning", () => {
    const both = z.strictObject({ name: z.string().min(3, "too short").startsWith("x", "must start with x") });
    expect(zodIssueFields(both.safeParse({ name: "a" }).error!.issues)).toEqual({ name: "too short" });
    expect(Object.keys(zodIssueFields(issues))).toEqual(["lines.1.wavelengthNm", "body"]);
  });
});

describe("text fields that reach the database", () => {
  const NUL = "a\u0000b";
  const SURROGATE = "x\ud800";

  it("list queries refuse text PostgreSQL cannot store, in q, tag and labId", () => {
    for (const bad of [NUL, SURROGATE]) {
      expect(listMeasurementSetsQuery.safeParse({ q: bad }).success).toBe(false);
      expect(listMeasurementSetsQuery.safeParse({ labId: bad }).success).toBe(false);
      expect(listParameterSetsQuery.safeParse({ q: bad }).success).toBe(false);
      expect(listParameterSetsQuery.safeParse({ tag: bad }).success).toBe(false);
      expect(listParameterSetsQuery.safeParse({ labId: bad }).success).toBe(false);
    }
    // A labId that is no id at all is text here; the lookup answers 404 for it.
    expect(listParameterSetsQuery.parse({ labId: "not-a-uuid", q: "  garnet " })).toEqual({ labId: "not-a-uuid", q: "garnet" });
    expect(messages(listMeasurementSetsQuery, { q: "x".repeat(201) })).toEqual(["At most 200 characters."]);
  });

  it("the upload's multipart fields refuse it in the name, the sample and the mapped column names", () => {
    const meta = {
      labId: "00000000-0000-4000-8000-000000000000",
      name: "TGG run 3",
      sample: "",
      mapping: proposeMapping(["wavelength_nm", "verdet_rad_per_T_m", "sigma"]),
    };
    expect(uploadMeasurementMetaSchema.safeParse(meta).success).toBe(true);
    const problems = (over: Record<string, unknown>) => {
      const parsed = uploadMeasurementMetaSchema.safeParse({ ...meta, ...over });
      return parsed.success ? {} : zodIssueFields(parsed.error.issues);
    };
    expect(problems({ name: NUL })).toEqual({ name: expect.stringMatching(/cannot be stored/) });
    expect(problems({ sample: SURROGATE })).toEqual({ sample: expect.stringMatching(/cannot be stored/) });
    expect(problems({ mapping: { ...meta.mapping, sigmaColumn: NUL } })).toEqual({
      "mapping.sigmaColumn": expect.stringMatching(/cannot be stored/),
    });
  });
});
