import { beforeAll, describe, expect, it } from "vitest";
import { ROUTES } from "@/lib/api-docs/registry";
import { Client, DEMO, DEMO_GARNET_SET_ID, DEMO_LAB_ID, signIn } from "./support";

/*
 * The answer schemas of the API description (lib/api-docs/responses.ts) are written beside the
 * contracts' interfaces; here real answers of the running server are parsed with them, so the
 * description cannot drift from what the API sends.
 */

function answerSchema(method: string, path: string) {
  const route = ROUTES.find((r) => r.method === method && r.path === path);
  if (!route?.response.schema) throw new Error(`no answer schema for ${method} ${path}`);
  return route.response.schema;
}

describe("the API description matches the answers", () => {
  let editor: Client;
  let firstMeasurementSet: string;

  beforeAll(async () => {
    editor = await signIn(DEMO.editor);
    firstMeasurementSet = (await editor.get(`/api/measurement-sets?labId=${DEMO_LAB_ID}`)).body.items[0].id;
  });

  it("is served at /api/openapi.json without signing in", async () => {
    const response = await new Client().get("/api/openapi.json");
    expect(response.status).toBe(200);
    expect(response.body.openapi).toBe("3.1.0");
    expect(Object.keys(response.body.paths)).toContain("/api/runs");
  });

  const cases: [string, (ids: { set: string; measurement: string }) => string][] = [
    ["/api/labs", () => "/api/labs"],
    ["/api/labs/{id}/members", () => `/api/labs/${DEMO_LAB_ID}/members`],
    ["/api/parameter-sets", () => `/api/parameter-sets?labId=${DEMO_LAB_ID}`],
    ["/api/parameter-sets/{id}", ({ set }) => `/api/parameter-sets/${set}`],
    ["/api/parameter-sets/{id}/versions", ({ set }) => `/api/parameter-sets/${set}/versions`],
    ["/api/parameter-sets/{id}/my-view", ({ set }) => `/api/parameter-sets/${set}/my-view`],
    ["/api/parameter-sets/{id}/plans", ({ set }) => `/api/parameter-sets/${set}/plans`],
    ["/api/measurement-sets", () => `/api/measurement-sets?labId=${DEMO_LAB_ID}`],
    ["/api/measurement-sets/{id}", ({ measurement }) => `/api/measurement-sets/${measurement}`],
    ["/api/measurement-sets/{id}/points", ({ measurement }) => `/api/measurement-sets/${measurement}/points`],
    ["/api/measurement-sets/{id}/history", ({ measurement }) => `/api/measurement-sets/${measurement}/history`],
    ["/api/light-sources", () => `/api/light-sources?labId=${DEMO_LAB_ID}`],
    ["/api/runs", () => `/api/runs?labId=${DEMO_LAB_ID}`],
  ];

  it.each(cases)("GET %s", async (pattern, url) => {
    const response = await editor.get(url({ set: DEMO_GARNET_SET_ID, measurement: firstMeasurementSet }));
    expect(response.status).toBe(200);
    const parsed = answerSchema("GET", pattern).safeParse(response.body);
    expect(parsed.success, parsed.success ? "" : JSON.stringify(parsed.error.issues.slice(0, 3))).toBe(true);
  });
});
