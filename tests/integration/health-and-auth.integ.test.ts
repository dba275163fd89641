import { describe, expect, it } from "vitest";
import { Client, DEMO_GARNET_SET_ID, DEMO_LAB_ID } from "./support";

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
