import { readdirSync, readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { buildOpenApiDocument, pathParams } from "@/lib/api-docs/document";
import { HTTP_METHODS, ROUTES, UNDOCUMENTED_ROUTES } from "@/lib/api-docs/registry";

/*
 * Every route handler under app/api has its entry in lib/api-docs/registry.ts (and every entry a
 * handler), so /api/openapi.json never misses a route or names one that is gone.
 */

const API_DIR = path.resolve(__dirname, "../../../app/api");

function routeFiles(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((entry) => {
    const full = path.join(dir, entry.name);
    if (entry.isDirectory()) return routeFiles(full);
    return entry.name === "route.ts" ? [full] : [];
  });
}

/** app/api/runs/[id]/route.ts → /api/runs/{id} */
function apiPath(file: string): string {
  const folder = path.relative(path.resolve(API_DIR, ".."), path.dirname(file)).split(path.sep).join("/");
  return `/${folder.replace(/\[([^\]]+)\]/g, "{$1}")}`;
}

const EXPORTED = new RegExp(`export\\s+(?:const|async\\s+function|function)\\s+(${HTTP_METHODS.join("|")})\\b`, "g");

const handlers = routeFiles(API_DIR).flatMap((file) => {
  const source = readFileSync(file, "utf8");
  const rawFolder = `/${path.relative(path.resolve(API_DIR, ".."), path.dirname(file)).split(path.sep).join("/")}`;
  return [...source.matchAll(EXPORTED)].map((m) => ({ method: m[1]!, path: apiPath(file), rawFolder }));
});

describe("the API registry", () => {
  it("finds the route handlers (the scan itself works)", () => {
    expect(handlers.length).toBeGreaterThan(30);
    expect(handlers).toContainEqual(expect.objectContaining({ method: "POST", path: "/api/runs" }));
  });

  it("has an entry for every handler under app/api", () => {
    const documented = new Set(ROUTES.map((r) => `${r.method} ${r.path}`));
    const missing = handlers
      .filter((h) => !(h.rawFolder in UNDOCUMENTED_ROUTES))
      .map((h) => `${h.method} ${h.path}`)
      .filter((key) => !documented.has(key));
    expect(missing, "add these to ROUTES in lib/api-docs/registry.ts").toEqual([]);
  });

  it("names no route that has no handler, and none twice", () => {
    const existing = new Set(handlers.map((h) => `${h.method} ${h.path}`));
    const keys = ROUTES.map((r) => `${r.method} ${r.path}`);
    expect(keys.filter((key) => !existing.has(key))).toEqual([]);
    expect(new Set(keys).size).toBe(keys.length);
  });

  it("exempts only folders that exist", () => {
    const folders = new Set(handlers.map((h) => h.rawFolder));
    for (const folder of Object.keys(UNDOCUMENTED_ROUTES)) expect(folders.has(folder), folder).toBe(true);
  });
});

describe("the OpenAPI document", () => {
  const doc = buildOpenApiDocument();

  it("is OpenAPI 3.1 with every registered operation", () => {
    expect(doc.openapi).toBe("3.1.0");
    const operations = Object.values(doc.paths).reduce((n, ops) => n + Object.keys(ops).length, 0);
    expect(operations).toBe(ROUTES.length);
  });

  it("declares every path parameter", () => {
    for (const [p, ops] of Object.entries(doc.paths)) {
      for (const op of Object.values(ops)) {
        const declared = ((op.parameters as { name: string; in: string }[]) ?? []).filter((x) => x.in === "path").map((x) => x.name);
        expect(declared, p).toEqual(pathParams(p));
      }
    }
  });

  it("documents the body of POST /api/runs from its schema: both kinds, lab and payload required", () => {
    const body = doc.paths["/api/runs"]!.post!.requestBody as { content: Record<string, { schema: Record<string, unknown> }> };
    const text = JSON.stringify(body.content["application/json"]!.schema);
    expect(text).toContain('"const":"map"');
    expect(text).toContain('"const":"spectrum"');
    expect(text).toContain('"temperatureK"');
    expect(text).toMatch(/"required":\[[^\]]*"labId"/);
  });

  it("answers with JSON schemas for the successful bodies it names", () => {
    const get = doc.paths["/api/parameter-sets/{id}"]!.get!.responses as Record<string, { content?: Record<string, { schema: unknown }> }>;
    expect(JSON.stringify(get["200"]!.content!["application/json"]!.schema)).toContain('"version"');
    expect(get.default).toBeDefined();
  });

  it("describes the upload as multipart with the file and JSON fields", () => {
    const body = doc.paths["/api/measurement-sets"]!.post!.requestBody as { content: Record<string, { schema: { required: string[] } }> };
    expect(body.content["multipart/form-data"]!.schema.required).toEqual(expect.arrayContaining(["file", "labId", "name", "mapping"]));
  });
});
