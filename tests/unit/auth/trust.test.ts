import { describe, expect, it, vi } from "vitest";

// lib/auth/client-ip.ts and rate-limit.ts are server modules; their markers throw outside Next.
vi.mock("server-only", () => ({}));
vi.mock("@/db/client", () => ({ db: {} }));

const { clientIpFrom, DIRECT_CLIENT } = await import("@/lib/auth/client-ip");
const { signInWaitFor, FREE_FAILURES, FREE_FAILURES_ANY_ADDRESS } = await import("@/lib/auth/rate-limit");
const { isStorableText, jsonProblem } = await import("@/lib/contracts/validation");
const { decodeCursor, encodeCursor, timeIdCursor } = await import("@/db/paging");
const { parseMessage } = await import("@/lib/mail/mime");
const { signUpSchema } = await import("@/lib/contracts/accounts");

describe("client address (X-Forwarded-For is trusted only from configured proxies)", () => {
  const headers = new Headers({ "x-forwarded-for": "203.0.113.9, 198.51.100.7, 10.0.0.2" });
  it("ignores the header without a configured proxy", () => {
    expect(clientIpFrom(headers, 0)).toBe(DIRECT_CLIENT);
  });
  it("takes the address the outermost trusted proxy saw", () => {
    expect(clientIpFrom(headers, 1)).toBe("10.0.0.2");
    expect(clientIpFrom(headers, 2)).toBe("198.51.100.7");
  });
});

describe("sign-in slowing", () => {
  const now = Date.now();
  const rows = (ip: string, n: number) => Array.from({ length: n }, (_, i) => ({ at: new Date(now - i * 1000), ip }));
  it("slows an address after its own free failures", () => {
    expect(signInWaitFor({ rows: rows("a", FREE_FAILURES - 1), ip: "a", now })).toBe(0);
    expect(signInWaitFor({ rows: rows("a", FREE_FAILURES), ip: "a", now })).toBeGreaterThan(0);
  });
  it("never blocks a clean address for the failures of others", () => {
    expect(signInWaitFor({ rows: rows("attacker", FREE_FAILURES_ANY_ADDRESS + 10), ip: "owner", now })).toBe(0);
  });
  it("slows an address that failed once when the e-mail is under attack from many", () => {
    const spread = [
      ...rows("a", 1),
      ...Array.from({ length: FREE_FAILURES_ANY_ADDRESS }, (_, i) => ({ at: new Date(now - i * 10), ip: `x${i}` })),
    ];
    expect(signInWaitFor({ rows: spread, ip: "a", now })).toBeGreaterThan(0);
  });
});

describe("storable text", () => {
  it("refuses NUL and unpaired surrogates, accepts pairs", () => {
    expect(isStorableText("a\u0000")).toBe(false);
    expect(isStorableText("\ud800")).toBe(false);
    expect(isStorableText("\udc00x")).toBe(false);
    expect(isStorableText("\ud83d\ude00 Faraday")).toBe(true);
  });
  it("finds deep nesting without recursion", () => {
    let deep: unknown = 1;
    for (let i = 0; i < 100_000; i++) deep = [deep];
    expect(jsonProblem(deep, 32)).toMatch(/deeper/);
    expect(jsonProblem({ a: [{ b: "ok" }] }, 32)).toBeNull();
  });
  it("limits passwords by UTF-8 bytes (bcrypt reads 72)", () => {
    const base = { name: "A", email: "a@b.test" };
    expect(signUpSchema.safeParse({ ...base, password: "a".repeat(72) }).success).toBe(true);
    expect(signUpSchema.safeParse({ ...base, password: "é".repeat(37) }).success).toBe(false);
  });
});

describe("paging cursors", () => {
  it("round-trip and refuse tampering with 400", () => {
    const cursor = encodeCursor(["2026-12-02 05:01:02.123456+00", "6a1f0c2e-5b1d-4c1e-9f00-00000000c001"]);
    expect(decodeCursor(cursor, timeIdCursor)).toEqual(["2026-12-02 05:01:02.123456+00", "6a1f0c2e-5b1d-4c1e-9f00-00000000c001"]);
    expect(() => decodeCursor("bm90IGpzb24", timeIdCursor)).toThrow(/cursor/);
    expect(() => decodeCursor(encodeCursor(["'; drop table", "x"]), timeIdCursor)).toThrow(/cursor/);
  });
});

describe("caught mail", () => {
  it("decodes quoted-printable bodies and encoded subjects (RFC 2045 §6.7, RFC 2047)", () => {
    const raw =
      "Subject: =?UTF-8?Q?Einladung_=E2=80=93_=C3=BC?=\r\nContent-Transfer-Encoding: quoted-printable\r\n\r\n" +
      "http://x/invite/abc=\r\ndef =C3=BC\r\n";
    const parsed = parseMessage(raw);
    expect(parsed.subject).toBe("Einladung – ü");
    expect(parsed.text).toBe("http://x/invite/abcdef ü\n");
  });
});
