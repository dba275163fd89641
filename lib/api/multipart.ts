import { ApiError } from "./errors";

/*
 * Reads a multipart/form-data body under a byte limit. The limit is enforced on the bytes read,
 * not only on Content-Length (chunked requests carry none), before the form is parsed.
 */
export async function readMultipart(request: Request, maxBytes: number, tooLargeMessage: string): Promise<FormData> {
  const type = request.headers.get("content-type") ?? "";
  if (!type.toLowerCase().startsWith("multipart/form-data")) {
    throw new ApiError("unsupported_media_type", "Send the upload as multipart/form-data (a file and its fields).");
  }
  const declared = request.headers.get("content-length");
  if (declared !== null && Number(declared) > maxBytes) throw new ApiError("payload_too_large", tooLargeMessage);
  if (!request.body) throw new ApiError("validation", "The request has no body.", { fields: { file: "Choose a file." } });
  const reader = request.body.getReader();
  const chunks: Uint8Array[] = [];
  let total = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    total += value.byteLength;
    if (total > maxBytes) {
      await reader.cancel().catch(() => undefined);
      throw new ApiError("payload_too_large", tooLargeMessage);
    }
    chunks.push(value);
  }
  try {
    return await new Response(new Blob(chunks as BlobPart[]), { headers: { "content-type": type } }).formData();
  } catch {
    throw new ApiError("validation", "The multipart body could not be read.", { fields: { file: "Choose a file." } });
  }
}
