import { z } from "zod";
import { errorResponse } from "./responses";
import { type ApiRouteDoc, ROUTES, type RouteAccess } from "./registry";

/*
 * The OpenAPI 3.1 description of the API, built from the route registry and the zod schemas with
 * zod's own JSON Schema export (draft 2020-12, which OpenAPI 3.1 adopts as its schema dialect).
 * Request schemas are exported as the input a client sends (defaults optional, coercions as
 * their input type); answers as the output the server writes.
 */

type JsonSchema = Record<string, unknown>;

export const API_VERSION = "1";

export const ACCESS_WORDS: Record<RouteAccess, string> = {
  public: "No sign-in needed.",
  caller: "Any signed-in caller (browser session or API token).",
  session: "A browser session only (not an API token).",
  viewer: "At least viewer in the lab.",
  editor: "At least editor in the lab.",
  owner: "Owner of the lab (site admins act as owner).",
  "admin-or-self": "A site admin, or the user themself.",
};

function toSchema(schema: z.ZodType, io: "input" | "output"): JsonSchema {
  const out = z.toJSONSchema(schema, { io, unrepresentable: "any", target: "draft-2020-12" }) as JsonSchema;
  delete out.$schema;
  return out;
}

/** `{id}` segments of an OpenAPI path, in order. */
export function pathParams(path: string): string[] {
  return [...path.matchAll(/\{([^}]+)\}/g)].map((m) => m[1]!);
}

function parameters(route: ApiRouteDoc): JsonSchema[] {
  const inPath = pathParams(route.path).map((name) => ({ name, in: "path", required: true, schema: { type: "string" } }));
  if (!route.query) return inPath;
  const query = toSchema(route.query, "input") as { properties?: Record<string, JsonSchema>; required?: string[] };
  const inQuery = Object.entries(query.properties ?? {}).map(([name, schema]) => ({
    name,
    in: "query",
    required: (query.required ?? []).includes(name),
    schema,
    ...(typeof schema.description === "string" ? { description: schema.description } : {}),
  }));
  return [...inPath, ...inQuery];
}

function requestBody(route: ApiRouteDoc): JsonSchema | undefined {
  if (!route.body) return undefined;
  const schema = toSchema(route.body, "input");
  if (route.bodyType?.kind === "multipart") {
    const properties = { ...((schema.properties as Record<string, JsonSchema>) ?? {}) };
    for (const file of route.bodyType.files) properties[file] = { type: "string", contentMediaType: "application/octet-stream" };
    const required = [...((schema.required as string[]) ?? []), ...route.bodyType.files];
    const encoding = Object.fromEntries(route.bodyType.jsonFields.map((field) => [field, { contentType: "application/json" }]));
    return {
      required: true,
      content: { "multipart/form-data": { schema: { ...schema, properties, required }, encoding } },
    };
  }
  return { required: true, content: { "application/json": { schema } } };
}

function responses(route: ApiRouteDoc): JsonSchema {
  const { status, description, schema, contentType } = route.response;
  const success: JsonSchema = { description };
  if (schema) success.content = { "application/json": { schema: toSchema(schema, "output") } };
  else if (contentType) success.content = { [contentType]: { schema: { type: "string" } } };
  return {
    [String(status)]: success,
    default: {
      description: "An error: 400 validation (with fields), 401, 403, 404, 409, 413, 429, 503 …",
      content: { "application/json": { schema: { $ref: "#/components/schemas/Error" } } },
    },
  };
}

function operation(route: ApiRouteDoc): JsonSchema {
  const op: JsonSchema = {
    operationId: `${route.method.toLowerCase()}${route.path
      .replace(/^\/api/, "")
      .replace(/[{}]/g, "")
      .replace(/[/-](\w)/g, (_, c: string) => c.toUpperCase())}`,
    tags: [route.tag],
    summary: route.summary,
    description: [route.description, ACCESS_WORDS[route.access]].filter(Boolean).join("\n\n"),
    "x-gyrolux-access": route.access,
    responses: responses(route),
  };
  const params = parameters(route);
  if (params.length > 0) op.parameters = params;
  const body = requestBody(route);
  if (body) op.requestBody = body;
  if (route.access === "public") op.security = [];
  else if (route.access === "session") op.security = [{ session: [] }];
  return op;
}

export interface OpenApiDocument {
  openapi: "3.1.0";
  info: { title: string; version: string; description: string };
  paths: Record<string, Record<string, JsonSchema>>;
  components: JsonSchema;
  security: JsonSchema[];
  tags: { name: string }[];
}

/** The whole description; `serverUrl` is where this server answers. */
export function buildOpenApiDocument(routes: readonly ApiRouteDoc[] = ROUTES): OpenApiDocument {
  const paths: OpenApiDocument["paths"] = {};
  for (const route of routes) {
    paths[route.path] ??= {};
    paths[route.path]![route.method.toLowerCase()] = operation(route);
  }
  return {
    openapi: "3.1.0",
    info: {
      title: "Gyrolux API",
      version: API_VERSION,
      description:
        "Faraday rotation of paramagnets, split into its electric-dipole and magnetic-dipole parts, in this product's model. " +
        "Authenticate with an API token (Settings → API tokens) as `Authorization: Bearer <token>`. Values are SI unless a name " +
        "says otherwise (wavelengthNm, fieldT, temperatureK).",
    },
    paths,
    components: {
      schemas: { Error: toSchema(errorResponse, "output") },
      securitySchemes: {
        token: { type: "http", scheme: "bearer", description: "An API token made in Settings." },
        session: { type: "apiKey", in: "cookie", name: "authjs.session-token", description: "The browser's session cookie." },
      },
    },
    security: [{ token: [] }, { session: [] }],
    tags: [...new Set(routes.map((r) => r.tag))].map((name) => ({ name })),
  };
}
