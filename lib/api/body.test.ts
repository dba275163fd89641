import { describe, expect, it } from "vitest";
import { z } from "zod";
import { MAX_BODY_BYTES, readJson, readOptionalJson } from "./body";
import { ApiError } from "./errors";

const schema = z.object({ x: z.number().refine(Number.isFinite, "must be finite") });

const request = (body: BodyInit | null, headers: Record<string, string> = { "content-type": "application/json" }) =>
  new Request("http://localhost/api/test", { method: "POST", body, headers });

async function codeOf(promise: Promise<unknown>): Promise<string> {
  try {
    await promise;
    return "ok";
  } catch (error) {
    if (error instanceof ApiError) return `${error.status} ${error.code}`;
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
    expect(error).toBeInstanceOf(ApiError);
    expect((error as ApiError).fields).toEqual({ x: expect.any(String) });
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

describe("readOptionalJson", () => {
  const optional = z.object({ version: z.number().int().optional() });
  it("treats an absent body as {}", async () => {
    await expect(readOptionalJson(new Request("http://localhost/x", { method: "POST" }), optional)).resolves.toEqual({});
    await expect(readOptionalJson(request(""), optional)).resolves.toEqual({});
    await expect(readOptionalJson(request('{"version": 3}'), optional)).resolves.toEqual({ version: 3 });
  });
});
