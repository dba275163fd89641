import { describe, expect, it } from "vitest";
import { BASE_URL, Client, DEMO_GARNET_SET_ID, DEMO_LAB_ID } from "./support";

describe("health", () => {
  it("reports the database as up", async () => {
    const response = await new Client().get("/api/health");
    expect(response.status).toBe(200);
    expect(response.body).toEqual({ status: "ok", database: "up" });
  });
});

describe("signed-out callers", () => {
  const anonymous = new Client();
  const routes: [string, string][] = [
    ["GET", "/api/labs"],
    ["GET", `/api/labs/${DEMO_LAB_ID}/members`],
    ["GET", "/api/parameter-sets"],
    ["POST", "/api/parameter-sets"],
    ["GET", `/api/parameter-sets/${DEMO_GARNET_SET_ID}`],
    ["PATCH", `/api/parameter-sets/${DEMO_GARNET_SET_ID}`],
    ["DELETE", `/api/parameter-sets/${DEMO_GARNET_SET_ID}`],
    ["GET", `/api/parameter-sets/${DEMO_GARNET_SET_ID}/versions`],
    ["POST", `/api/parameter-sets/${DEMO_GARNET_SET_ID}/versions/1/restore`],
    ["PUT", `/api/parameter-sets/${DEMO_GARNET_SET_ID}/view-state`],
    ["GET", "/api/tokens"],
    ["POST", "/api/tokens"],
  ];

  it.each(routes)("%s %s → 401 unauthenticated", async (method, path) => {
    const response = await anonymous.request(method, path, method === "GET" ? {} : { json: {} });
    expect(response.status).toBe(401);
    expect(response.body.error.code).toBe("unauthenticated");
  });

  it("are redirected from app pages to /sign-in by the proxy", async () => {
    const response = await anonymous.raw("GET", "/parameter-sets?q=tgg");
    await response.body?.cancel();
    expect(response.status).toBeGreaterThanOrEqual(300);
    expect(response.status).toBeLessThan(400);
    const location = new URL(response.headers.get("location") ?? "", "http://x");
    expect(location.pathname).toBe("/sign-in");
    expect(location.searchParams.get("redirectTo")).toBe("/parameter-sets?q=tgg");
  });
});

describe("renamed pages", () => {
  it("sends the old /measurements address, with its query, on to /measurement-sets", async () => {
    const response = await fetch(`${BASE_URL}/measurements?q=garnet`, { redirect: "manual" });
    expect(response.status).toBe(308);
    const target = new URL(response.headers.get("location") ?? "", BASE_URL);
    expect(`${target.pathname}${target.search}`).toBe("/measurement-sets?q=garnet");
  });

  it("sends an old /runs/{id} address on to /lab-runs/{id}", async () => {
    const response = await fetch(`${BASE_URL}/runs/${DEMO_GARNET_SET_ID}`, { redirect: "manual" });
    expect(response.status).toBe(308);
    expect(new URL(response.headers.get("location") ?? "", BASE_URL).pathname).toBe(`/lab-runs/${DEMO_GARNET_SET_ID}`);
  });
});
