/*
 * A JSON Schema (as lib/api-docs/document.ts writes it) flattened into the rows of a field table
 * for the API page: one row per field with its dotted path, type, whether it is required, its
 * rules in words and its description. Alternatives (oneOf/anyOf) become labelled groups.
 */

type Schema = Record<string, unknown>;

export interface FieldRow {
  /** Dotted path; `[]` marks the items of a list. */
  path: string;
  depth: number;
  type: string;
  required: boolean;
  rules: string[];
  description?: string;
}

export interface FieldGroup {
  /** "kind = map", or null when the schema has one shape. */
  label: string | null;
  rows: FieldRow[];
}

const counted = (n: unknown, noun: string) => `${n} ${noun}${n === 1 ? "" : "s"}`;

const RULES: [string, (v: unknown) => string][] = [
  ["minimum", (v) => `≥ ${v}`],
  ["exclusiveMinimum", (v) => `> ${v}`],
  ["maximum", (v) => `≤ ${v}`],
  ["exclusiveMaximum", (v) => `< ${v}`],
  ["minLength", (v) => `at least ${counted(v, "character")}`],
  ["maxLength", (v) => `at most ${counted(v, "character")}`],
  ["minItems", (v) => `at least ${counted(v, "item")}`],
  ["maxItems", (v) => `at most ${counted(v, "item")}`],
  ["default", (v) => `default ${JSON.stringify(v)}`],
  ["const", (v) => `always ${JSON.stringify(v)}`],
];

function alternatives(schema: Schema): Schema[] | null {
  const list = (schema.oneOf ?? schema.anyOf) as Schema[] | undefined;
  return Array.isArray(list) ? list : null;
}

/** `string | null` for a nullable field, the enum's values, or the type name. */
export function typeName(schema: Schema): string {
  if (Array.isArray(schema.enum)) return (schema.enum as unknown[]).map((v) => JSON.stringify(v)).join(" | ");
  const alts = alternatives(schema);
  if (alts) return [...new Set(alts.map(typeName))].join(" | ");
  const type = schema.type;
  const base = Array.isArray(type) ? type.join(" | ") : typeof type === "string" ? type : "any";
  if (base === "array" && schema.items && typeof schema.items === "object") return `${typeName(schema.items as Schema)}[]`;
  if (base === "string" && typeof schema.format === "string") return `string (${schema.format})`;
  if (base === "integer") return "integer";
  return base;
}

function rulesOf(schema: Schema): string[] {
  const out: string[] = [];
  for (const [key, word] of RULES) if (key in schema) out.push(word(schema[key]));
  if (schema.type === "integer") out.push("whole number");
  return out;
}

function walk(schema: Schema, path: string, depth: number, required: boolean, rows: FieldRow[]): void {
  const alts = alternatives(schema);
  // A nullable object (anyOf [object, null]) is listed as its object.
  const shape = alts?.find((a) => a.type === "object") ?? (schema.type === "object" ? schema : null);
  if (path !== "") {
    rows.push({
      path,
      depth,
      type: typeName(schema),
      required,
      rules: rulesOf(schema),
      ...(typeof schema.description === "string" ? { description: schema.description } : {}),
    });
  }
  if (shape?.properties && typeof shape.properties === "object") {
    const requiredKeys = new Set((shape.required as string[]) ?? []);
    for (const [key, child] of Object.entries(shape.properties as Record<string, Schema>)) {
      walk(child, path === "" ? key : `${path}.${key}`, path === "" ? 0 : depth + 1, requiredKeys.has(key), rows);
    }
  }
  const items = schema.items as Schema | undefined;
  if (items && typeof items === "object" && items.type === "object") walk({ ...items }, `${path}[]`, depth + 1, true, rows);
}

function discriminant(schema: Schema): string | null {
  for (const [key, child] of Object.entries((schema.properties as Record<string, Schema>) ?? {})) {
    if ("const" in child) return `${key} = ${JSON.stringify(child.const)}`;
  }
  return null;
}

/** The field groups of a body or answer schema. */
export function schemaRows(schema: Schema): FieldGroup[] {
  const alts = schema.type === undefined ? alternatives(schema) : null;
  if (alts?.every((a) => a.type === "object")) {
    return alts.map((alt, i) => {
      const rows: FieldRow[] = [];
      walk(alt, "", 0, true, rows);
      return { label: discriminant(alt) ?? `shape ${i + 1}`, rows };
    });
  }
  const rows: FieldRow[] = [];
  walk(schema, "", 0, true, rows);
  return [{ label: null, rows }];
}
