import type { z } from "zod";
import { DomainError, validationError } from "@/lib/contracts/errors";
import { jsonProblem } from "@/lib/contracts/validation";

/** Largest request body the API accepts (shared contract). */
export const MAX_BODY_BYTES = 64 * 1024;
/** No request of ours nests deeper; a deeper body is refused before any schema walks it. */
export const MAX_JSON_DEPTH = 32;

/**
 * The body's bytes, refused with `onTooLarge()` once more than maxBytes arrive. The limit is
 * enforced on the bytes actually read, not only on Content-Length, because chunked requests carry
 * no length. Null when the request has no body.
 */
export async function readBoundedBytes(request: Request, maxBytes: number, onTooLarge: () => DomainError): Promise<Uint8Array | null> {
  const declared = request.headers.get("content-length");
  if (declared !== null && Number(declared) > maxBytes) throw onTooLarge();
  if (!request.body) return null;
  const reader = request.body.getReader();
  const chunks: Uint8Array[] = [];
  let total = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    total += value.byteLength;
    if (total > maxBytes) {
      await reader.cancel().catch(() => undefined);
      throw onTooLarge();
    }
    chunks.push(value);
  }
  const bytes = new Uint8Array(total);
  let offset = 0;
  for (const chunk of chunks) {
    bytes.set(chunk, offset);
    offset += chunk.byteLength;
  }
  return bytes;
}

/* Reads a JSON request body under the 64 KiB limit. */
export async function readText(request: Request): Promise<string> {
  const bytes = await readBoundedBytes(request, MAX_BODY_BYTES, tooLarge);
  if (!bytes) return "";
  try {
    return new TextDecoder("utf-8", { fatal: true }).decode(bytes);
  } catch {
    throw new DomainError("bad_json", "The request body is not valid UTF-8.");
  }
}

const tooLarge = () => new DomainError("payload_too_large", `The request body is larger than ${MAX_BODY_BYTES / 1024} KiB.`);

function requireJsonContentType(request: Request): void {
  const type = request.headers.get("content-type") ?? "";
  const mediaType = type.split(";")[0]?.trim().toLowerCase() ?? "";
  if (mediaType !== "application/json" && !mediaType.endsWith("+json")) {
    throw new DomainError("unsupported_media_type", "Send the body as JSON (Content-Type: application/json).");
  }
}

/**
 * The one JSON reader of the API: request bodies and the JSON fields of multipart uploads alike
 * get the same limits (storable text, at most MAX_JSON_DEPTH levels). `field` names the form field
 * in the error; a body's problems are reported under "body".
 */
export function parseJsonText(text: string, field = "body"): unknown {
  const what = field === "body" ? "The request body" : field;
  let value: unknown;
  try {
    // JSON cannot carry NaN or Infinity, but 1e999 parses to Infinity; the schemas' finite checks
    // turn that into a validation error with a field, not a stored Infinity (which would become null).
    value = JSON.parse(text);
  } catch {
    if (field === "body") throw new DomainError("bad_json", "The request body is not valid JSON.");
    throw new DomainError("validation", `${what} is not valid JSON.`, { fields: { [field]: "Not valid JSON." } });
  }
  const problem = jsonProblem(value, MAX_JSON_DEPTH);
  if (problem) throw new DomainError("validation", `${what} cannot be stored: ${problem}`, { fields: { [field]: problem } });
  return value;
}

/** Parses and validates a required JSON body. */
export async function readJson<S extends z.ZodType>(request: Request, schema: S): Promise<z.infer<S>> {
  requireJsonContentType(request);
  const text = await readText(request);
  if (text.trim() === "") throw new DomainError("bad_json", "The request body is empty; send a JSON object.");
  const result = schema.safeParse(parseJsonText(text));
  if (!result.success) throw validationError(result.error);
  return result.data;
}
