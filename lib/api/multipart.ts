import { readBoundedBytes } from "./body";
import { DomainError } from "@/lib/contracts/errors";

/*
 * Reads a multipart/form-data body under a byte limit. The limit is enforced on the bytes read,
 * not only on Content-Length (chunked requests carry none), before the form is parsed.
 */
export async function readMultipart(request: Request, maxBytes: number, tooLargeMessage: string): Promise<FormData> {
  const type = request.headers.get("content-type") ?? "";
  if (!type.toLowerCase().startsWith("multipart/form-data")) {
    throw new DomainError("unsupported_media_type", "Send the upload as multipart/form-data (a file and its fields).");
  }
  const bytes = await readBoundedBytes(request, maxBytes, () => new DomainError("payload_too_large", tooLargeMessage));
  if (!bytes) throw new DomainError("validation", "The request has no body.", { fields: { file: "Choose a file." } });
  try {
    return await new Response(new Blob([bytes as BlobPart]), { headers: { "content-type": type } }).formData();
  } catch {
    throw new DomainError("validation", "The multipart body could not be read.", { fields: { file: "Choose a file." } });
  }
}
