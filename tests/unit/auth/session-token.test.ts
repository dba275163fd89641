import { describe, expect, it, vi } from "vitest";

vi.mock("server-only", () => ({}));
const SECRET = "unit-test-session-secret-0123456789";
vi.mock("@/lib/settings/server", () => ({ serverSettings: { auth: { secret: "unit-test-session-secret-0123456789" } } }));

const { encode } = await import("next-auth/jwt");
const { sessionClaims, sessionTokenFrom } = await import("@/lib/auth/session-token");

describe("session cookie claims without Auth.js's pipeline", () => {
  it("reads the id and session version Auth.js encrypted", async () => {
    const token = await encode({ token: { id: "u-1", sv: 3 }, secret: SECRET, salt: "authjs.session-token" });
    expect(await sessionClaims(`a=1; authjs.session-token=${token}`)).toEqual({ id: "u-1", sv: 3 });
    // The same cookie again comes from the cache, with the same answer.
    expect(await sessionClaims(`authjs.session-token=${token}`)).toEqual({ id: "u-1", sv: 3 });
  });
  it("joins chunked cookies in order", async () => {
    const token = await encode({ token: { id: "u-2", sv: 0 }, secret: SECRET, salt: "authjs.session-token" });
    const half = Math.floor(token.length / 2);
    const header = `authjs.session-token.1=${token.slice(half)}; authjs.session-token.0=${token.slice(0, half)}`;
    expect(sessionTokenFrom(header)).toEqual({ token, name: "authjs.session-token" });
    expect(await sessionClaims(header)).toEqual({ id: "u-2", sv: 0 });
  });
  it("names nobody for a forged, foreign-secret, wrong-salt or expired cookie", async () => {
    const other = await encode({ token: { id: "u-3", sv: 0 }, secret: `${SECRET}x`, salt: "authjs.session-token" });
    const wrongSalt = await encode({ token: { id: "u-3", sv: 0 }, secret: SECRET, salt: "something-else" });
    const expired = await encode({ token: { id: "u-3", sv: 0 }, secret: SECRET, salt: "authjs.session-token", maxAge: -3600 });
    for (const token of [other, wrongSalt, expired, "not-a-jwe"]) {
      expect(await sessionClaims(`authjs.session-token=${token}`)).toBeNull();
    }
    expect(await sessionClaims(null)).toBeNull();
  });
});
