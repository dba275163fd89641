import { describe, expect, it, vi } from "vitest";

// lib/auth/client-ip.ts and rate-limit.ts are server modules; their markers throw outside Next.
vi.mock("server-only", () => ({}));
vi.mock("@/db/client", () => ({ db: {} }));

const { clientIpFrom, DIRECT_CLIENT } = await import("@/lib/auth/client-ip");
const { signInWaitMs, FREE_FAILURES, FREE_FAILURES_ANY_ADDRESS, FREE_FAILURES_PER_CLIENT } = await import("@/lib/auth/rate-limit");
const { newDeviceCookie, verifiedDeviceId, cookieValue } = await import("@/lib/auth/device");
const { isStorableText, jsonProblem } = await import("@/lib/contracts/validation");
const { decodeCursor, encodeCursor, timeIdCursor } = await import("@/db/paging");
const { parseMessage } = await import("@/lib/mail/mime");
const { signUpSchema } = await import("@/lib/contracts/accounts");

describe("client address (X-Forwarded-For is trusted only from configured proxies)", () => {
  const headers = new Headers({ "x-forwarded-for": "203.0.113.9, 198.51.100.7, 10.0.0.2" });
  it("ignores the header without a configured proxy", () => {
    expect(clientIpFrom(headers, 0)).toBe(DIRECT_CLIENT);
  });
  it("takes the socket peer from the web server's own header, only when the server set it", () => {
    const withPeer = new Headers({ "x-forwarded-for": "203.0.113.9", "x-gyrolux-peer": "192.0.2.4" });
    expect(clientIpFrom(withPeer, 0, true)).toBe("192.0.2.4");
    expect(clientIpFrom(withPeer, 0, false)).toBe(DIRECT_CLIENT);
  });
  it("takes the address the outermost trusted proxy saw", () => {
    expect(clientIpFrom(headers, 1)).toBe("10.0.0.2");
    expect(clientIpFrom(headers, 2)).toBe("198.51.100.7");
  });
});

describe("sign-in slowing", () => {
  const now = Date.now();
  const dates = (n: number, stepMs = 1000) => Array.from({ length: n }, (_, i) => new Date(now - i * stepMs));
  const empty = { own: [] as Date[], emailWide: [] as Date[], clientWide: [] as Date[] };
  const stranger = { knownDevice: false, now };
  it("slows a client after its own free failures", () => {
    expect(signInWaitMs({ ...empty, own: dates(FREE_FAILURES - 1) }, stranger)).toBe(0);
    expect(signInWaitMs({ ...empty, own: dates(FREE_FAILURES) }, stranger)).toBeGreaterThan(0);
  });
  it("never blocks a clean address for the failures of others", () => {
    expect(signInWaitMs({ ...empty, emailWide: dates(FREE_FAILURES_ANY_ADDRESS + 10) }, stranger)).toBe(0);
  });
  it("slows an address that failed once when the e-mail is under attack from many", () => {
    expect(signInWaitMs({ ...empty, own: dates(1), emailWide: dates(FREE_FAILURES_ANY_ADDRESS, 10) }, stranger)).toBeGreaterThan(0);
  });
  it("never locks out a browser that signed in before for strangers' failures", () => {
    const attacked = { own: dates(1), emailWide: dates(200, 10), clientWide: dates(FREE_FAILURES_PER_CLIENT + 5, 10) };
    expect(signInWaitMs(attacked, { knownDevice: true, now })).toBe(0);
    expect(signInWaitMs({ ...attacked, own: dates(FREE_FAILURES) }, { knownDevice: true, now })).toBeGreaterThan(0);
  });
  it("slows one address spraying passwords over many e-mails", () => {
    expect(signInWaitMs({ ...empty, clientWide: dates(FREE_FAILURES_PER_CLIENT - 1, 10) }, stranger)).toBe(0);
    expect(signInWaitMs({ ...empty, clientWide: dates(FREE_FAILURES_PER_CLIENT, 10) }, stranger)).toBeGreaterThan(0);
  });
  it("doubles the wait per failure past the free ones, capped at 15 minutes", () => {
    const wait = (n: number) => signInWaitMs({ ...empty, own: Array.from({ length: n }, () => new Date(now)) }, stranger);
    expect(wait(FREE_FAILURES)).toBe(30_000);
    expect(wait(FREE_FAILURES + 1)).toBe(60_000);
    expect(wait(FREE_FAILURES + 20)).toBe(15 * 60_000);
  });
});

describe("device cookie", () => {
  const secret = "unit-test-secret-0123456789";
  it("verifies only for the e-mail and secret it was made for", () => {
    const value = newDeviceCookie(secret, "Ada@Lab.test");
    expect(verifiedDeviceId(secret, "ada@lab.test", value)).toBe(value.split(".")[0]);
    expect(verifiedDeviceId(secret, "eve@lab.test", value)).toBeNull();
    expect(verifiedDeviceId(`${secret}x`, "ada@lab.test", value)).toBeNull();
    expect(verifiedDeviceId(secret, "ada@lab.test", `${value}x`)).toBeNull();
    expect(verifiedDeviceId(secret, "ada@lab.test", "garbage")).toBeNull();
  });
  it("reads one cookie out of a Cookie header", () => {
    expect(cookieValue("a=1; glx_device=abc.def; b=2", "glx_device")).toBe("abc.def");
    expect(cookieValue("a=1", "glx_device")).toBeNull();
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
  it("decodes quoted-printable bodies and encoded subjects (RFC 2045 §6.7, RFC 2047)", async () => {
    const raw =
      "Subject: =?UTF-8?Q?Einladung_=E2=80=93_=C3=BC?=\r\nContent-Transfer-Encoding: quoted-printable\r\n\r\n" +
      "http://x/invite/abc=\r\ndef =C3=BC\r\n";
    const parsed = await parseMessage(raw);
    expect(parsed.subject).toBe("Einladung – ü");
    expect(parsed.text).toBe("http://x/invite/abcdef ü\n");
  });
  it("joins adjacent encoded words without a space (RFC 2047 §6.2)", async () => {
    const raw = "Subject: =?UTF-8?Q?Atelier_magn=C3=A9t?=\r\n =?UTF-8?Q?o-optique?=\r\n\r\nbody\r\n";
    expect((await parseMessage(raw)).subject).toBe("Atelier magnéto-optique");
  });
});
