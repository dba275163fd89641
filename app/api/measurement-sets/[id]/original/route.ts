import { db } from "@/db/client";
import { getMeasurementOriginal } from "@/db/queries/measurement-sets";
import { notFound } from "@/lib/contracts/errors";
import { cleanFileName } from "@/lib/contracts/validation";
import { apiRoute } from "@/lib/api/route";
import { withStorage } from "@/lib/api/storage";
import { authorize, requireCaller } from "@/lib/auth/access";
import { objectStore } from "@/lib/storage/server";

type Params = { id: string };

/** RFC 6266 / RFC 5987: an ASCII fallback name plus the exact UTF-8 name. */
function contentDisposition(fileName: string): string {
  const ascii = fileName.replace(/[^\x20-\x7e]/g, "_").replace(/["\\]/g, "_");
  return `attachment; filename="${ascii}"; filename*=UTF-8''${encodeURIComponent(fileName)}`;
}

/** GET /api/measurement-sets/{id}/original (viewer) → the uploaded file, byte for byte, as an attachment. */
export const GET = apiRoute<Params>(async (request, { params }) => {
  const { id } = await params;
  const caller = await requireCaller(request);
  const access = await authorize(caller, { kind: "measurement_set", id }, "viewer");
  const original = await withStorage("the original file cannot be read now", () =>
    getMeasurementOriginal(db, { access, store: objectStore }),
  );
  if (!original) throw notFound("No such measurement set.");
  return new Response(new Blob([original.bytes as BlobPart]), {
    headers: {
      "content-type": original.contentType,
      "content-length": String(original.bytes.byteLength),
      // Names stored before names were capped at 255 bytes are cut here, so the header always fits.
      "content-disposition": contentDisposition(cleanFileName(original.fileName, "measurements.csv")),
      "cache-control": "private, no-store",
      "x-content-type-options": "nosniff",
    },
  });
});
