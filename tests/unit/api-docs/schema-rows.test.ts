import { describe, expect, it } from "vitest";
import { z } from "zod";
import { schemaRows, typeName } from "@/lib/api-docs/schema-rows";

const json = (schema: z.ZodType) => z.toJSONSchema(schema, { io: "input" }) as Record<string, unknown>;

describe("schemaRows", () => {
  it("lists nested fields with their path, depth, requirement and rules", () => {
    const [group] = schemaRows(
      json(
        z.object({ name: z.string().min(1).describe("what it is called"), rows: z.object({ count: z.number().int().max(9) }).optional() }),
      ),
    );
    expect(group!.label).toBeNull();
    expect(group!.rows).toEqual([
      { path: "name", depth: 0, type: "string", required: true, rules: ["at least 1 character"], description: "what it is called" },
      { path: "rows", depth: 0, type: "object", required: false, rules: [] },
      { path: "rows.count", depth: 1, type: "integer", required: true, rules: expect.arrayContaining(["≤ 9", "whole number"]) },
    ]);
  });

  it("gives each shape of a discriminated union its own group, labelled by the discriminant", () => {
    const groups = schemaRows(
      json(z.discriminatedUnion("kind", [z.object({ kind: z.literal("map"), a: z.number() }), z.object({ kind: z.literal("spectrum") })])),
    );
    expect(groups.map((g) => g.label)).toEqual(['kind = "map"', 'kind = "spectrum"']);
    expect(groups[0]!.rows.map((r) => r.path)).toEqual(["kind", "a"]);
  });

  it("names enums, nullable and list types", () => {
    expect(typeName(json(z.enum(["a", "b"])))).toBe('"a" | "b"');
    expect(typeName(json(z.string().nullable()))).toBe("string | null");
    expect(typeName(json(z.array(z.number())))).toBe("number[]");
  });
});
