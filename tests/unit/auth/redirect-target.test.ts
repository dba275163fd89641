import { describe, expect, it } from "vitest";
import { safeRedirectTarget } from "@/lib/auth/redirect-target";
import { isSameOriginRequest } from "@/lib/auth/same-origin";

const PUBLIC = "https://gyrolux.example.org";
const FALLBACK = "/parameter-sets";

describe("the page after sign-in is a same-origin path only", () => {
  it("keeps a plain path with its query and hash", () => {
    expect(safeRedirectTarget("/workbench/abc?x=1#map", PUBLIC)).toBe("/workbench/abc?x=1#map");
  });
  it.each([
    ["TAB between the slashes", "/\t/evil.test"],
    ["CR", "/\r/evil.test"],
    ["LF", "/\n/x"],
    ["ideographic space", "/\u3000/evil.test"],
    ["no-break space", "/\u00a0x"],
    ["backslash", "/\\evil.test"],
    ["backslash later", "/a\\..\\..\\\\evil.test"],
    ["protocol-relative", "//evil.test"],
    ["absolute URL", "https://evil.test/"],
    ["scheme trick", "javascript:alert(1)"],
    ["DEL", "/\u007f/evil.test"],
    ["C1 control", "/\u0085/evil.test"],
    ["sign-in loop", "/sign-in?callbackUrl=/x"],
    ["API", "/api/tokens"],
  ])("refuses %s", (_label, value) => {
    expect(safeRedirectTarget(value, PUBLIC)).toBe(FALLBACK);
  });
  it("answers ASCII only, so the Location header is always valid", () => {
    expect(safeRedirectTarget("/parameter-sets?q=magnétique", PUBLIC)).toBe("/parameter-sets?q=magn%C3%A9tique");
  });
  it("refuses values that are not strings", () => {
    expect(safeRedirectTarget(undefined, PUBLIC)).toBe(FALLBACK);
    expect(safeRedirectTarget(["/x"], PUBLIC)).toBe(FALLBACK);
  });
  it("resolves dot segments and still stays home", () => {
    expect(safeRedirectTarget("/a/../../workbench", PUBLIC)).toBe("/workbench");
  });
});

describe("a cookie-authenticated change must come from the public origin, scheme included", () => {
  const check = (headers: Record<string, string>, method = "POST") =>
    isSameOriginRequest({ method, headers: new Headers(headers), publicUrl: PUBLIC });
  it("accepts our own origin, reads, and scripts that send no Origin", () => {
    expect(check({ origin: PUBLIC })).toBe(true);
    expect(check({ origin: "http://evil.test" }, "GET")).toBe(true);
    expect(check({})).toBe(true);
  });
  it("refuses another scheme, host or port, and cross-site fetches", () => {
    expect(check({ origin: "http://gyrolux.example.org" })).toBe(false);
    expect(check({ origin: "https://gyrolux.example.org:8443" })).toBe(false);
    expect(check({ origin: "https://evil.test", host: "gyrolux.example.org" })).toBe(false);
    expect(check({ origin: "null" })).toBe(false);
    expect(check({ "sec-fetch-site": "cross-site" })).toBe(false);
  });
});
