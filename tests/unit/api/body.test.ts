import { describe, expect, it } from "vitest";
import { z } from "zod";
import { MAX_BODY_BYTES, readJson } from "@/lib/api/body";
import { errorStatus } from "@/lib/api/errors";
import { DomainError } from "@/lib/contracts/errors";

const schema = z.object({ x: z.number().refine(Number.isFinite, "must be finite") });

const request = (body: BodyInit | null, headers: Record<string, string> = { "content-type": "application/json" }) =>
  new Request("http://localhost/api/test", { method: "POST", body, headers });

async function codeOf(promise: Promise<unknown>): Promise<string> {
  try {
    await promise;
    return "ok";
  } catch (error) {
    if (error instanceof DomainError) return `${errorStatus(error)} ${error.code}`;
    throw error;
  }
}

describe("readJson", () => {
  it("parses and validates", async () => {
    await expect(readJson(request('{"x": 2}'), schema)).resolves.toEqual({ x: 2 });
  });

  it("maps each bad input to the contract's code", async () => {
    expect(await codeOf(readJson(request('{"x": '), schema))).toBe("400 bad_json");
    expect(await codeOf(readJson(request(""), schema))).toBe("400 bad_json");
    expect(await codeOf(readJson(request('{"x": 1}', { "content-type": "text/plain" }), schema))).toBe("415 unsupported_media_type");
    expect(await codeOf(readJson(request('{"x": 1e999}'), schema))).toBe("400 validation");
    expect(await codeOf(readJson(request('{"x": "NaN"}'), schema))).toBe("400 validation");
    expect(await codeOf(readJson(request(new Uint8Array([0xff, 0xfe])), schema))).toBe("400 bad_json");
  });

  it("names the invalid field", async () => {
    const error = await readJson(request('{"x": 1e999}'), schema).catch((e: unknown) => e);
    expect(error).toBeInstanceOf(DomainError);
    expect((error as DomainError).fields).toEqual({ x: expect.any(String) });
  });

  it("rejects bodies over the limit, also when streamed without a length", async () => {
    const big = JSON.stringify({ x: 1, pad: "y".repeat(MAX_BODY_BYTES) });
    expect(await codeOf(readJson(request(big), schema))).toBe("413 payload_too_large");
    const stream = new ReadableStream<Uint8Array>({
      start(controller) {
        for (let i = 0; i < 80; i++) controller.enqueue(new Uint8Array(1024).fill(32));
        controller.close();
      },
    });
    const streamed = new Request("http://localhost/api/test", {
      method: "POST",
      body: stream,
      headers: { "content-type": "application/json" },
      duplex: "half",
    } as RequestInit);
    expect(await codeOf(readJson(streamed, schema))).toBe("413 payload_too_large");
  });
});

describe("readJson refuses what cannot be stored", () => {
  const loose = z.object({}).passthrough();
  it("refuses nesting deeper than the cap with 400 validation", async () => {
    const deep = "[".repeat(5000) + "]".repeat(5000);
    expect(await codeOf(readJson(request(`{"a":${deep}}`), loose))).toBe("400 validation");
  });
  it("refuses NUL and unpaired surrogates anywhere in the body", async () => {
    expect(await codeOf(readJson(request('{"a":"x\\u0000y"}'), loose))).toBe("400 validation");
    expect(await codeOf(readJson(request('{"a":["\\ud800"]}'), loose))).toBe("400 validation");
    expect(await codeOf(readJson(request('{"\\udc00":1}'), loose))).toBe("400 validation");
    await expect(readJson(request('{"a":"\\ud83d\\ude00"}'), loose)).resolves.toEqual({ a: "\u{1F600}" });
  });
});

describe("one JSON reader for bodies and upload fields", () => {
  it("refuses a deeply nested multipart field with its name, like a deep body", async () => {
    const { parseJsonText } = await import("@/lib/api/body");
    const deep = `${"[".repeat(100_000)}1${"]".repeat(100_000)}`;
    expect(() => parseJsonText(deep, "mapping")).toThrow(/mapping cannot be stored: Nested deeper/);
    expect(() => parseJsonText(deep)).toThrow(/request body cannot be stored/);
    expect(() => parseJsonText('{"a":"\\u0000"}', "defaults")).toThrow(/defaults cannot be stored/);
    expect(() => parseJsonText("{", "mapping")).toThrow(/mapping is not valid JSON/);
    expect(parseJsonText('{"wavelengthColumn":"nm"}', "mapping")).toEqual({ wavelengthColumn: "nm" });
  });
});
