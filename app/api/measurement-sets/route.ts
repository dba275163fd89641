import { db } from "@/db/client";
import { createMeasurementSet, listMeasurementSets } from "@/db/queries/measurement-sets";
import { getParameterSet } from "@/db/queries/parameter-sets";
import type { Caller } from "@/lib/contracts/access";
import { DomainError, validationError } from "@/lib/contracts/errors";
import { cleanFileName, isStorableText, TEXT_PROBLEM } from "@/lib/contracts/validation";
import { withStorage } from "@/lib/api/storage";
import { listMeasurementSetsQuery, type SignSource, type SignsFrom, uploadMeasurementMetaSchema } from "@/lib/contracts/measurement-sets";
import { parseJsonText } from "@/lib/api/body";
import { readMultipart } from "@/lib/api/multipart";
import { readPage } from "@/lib/api/paging";
import { apiRoute, json } from "@/lib/api/route";
import { authorize, authorizeLab, requireCaller } from "@/lib/auth/access";
import { MAX_FILE_BYTES, parseMeasurementTable } from "@/lib/measurements/parse";
import type { MeasuredPoint } from "@/lib/measurements/point";
import { takeModelSigns } from "@/lib/measurements/sign-check";
import { objectStore } from "@/lib/storage/server";

/** GET /api/measurement-sets?labId=&q=&limit=&cursor= → { items: MeasurementSetSummary[], nextCursor } */
export const GET = apiRoute(async (request) => {
  const caller = await requireCaller(request);
  const search = new URL(request.url).searchParams;
  const parsed = listMeasurementSetsQuery.safeParse({ labId: search.get("labId") || undefined, q: search.get("q") || undefined });
  if (!parsed.success) throw validationError(parsed.error);
  const { labId, q } = parsed.data;
  const lab = labId ? await authorizeLab(caller, labId, "viewer") : undefined;
  return json(await listMeasurementSets(db, { caller, lab, q, page: readPage(request) }));
});

const MIB = 1024 * 1024;
/** Room for the form's other fields beside the file. */
const FORM_OVERHEAD_BYTES = 64 * 1024;
const tooLarge = (bytes?: number) => {
  const subject = bytes === undefined ? "The upload is" : `The file is ${(bytes / MIB).toFixed(1)} MiB,`;
  return new DomainError("payload_too_large", `${subject} larger than the ${MAX_FILE_BYTES / MIB} MiB a measurement file may be.`, {
    fields: { file: `At most ${MAX_FILE_BYTES / MIB} MiB.` },
  });
};

function jsonField(form: FormData, key: string): unknown {
  const raw = form.get(key);
  if (raw === null) return undefined;
  if (typeof raw !== "string")
    throw new DomainError("validation", `${key} must be JSON text.`, { fields: { [key]: "Must be JSON text." } });
  return parseJsonText(raw, key);
}

/** Served back on download: only plain-text types, so an upload can never come back as a page. */
const SAFE_TYPES = new Set(["text/csv", "text/tab-separated-values", "text/plain"]);
const safeContentType = (type: string) => (SAFE_TYPES.has(type.toLowerCase()) ? type.toLowerCase() : "application/octet-stream");

const textField = (form: FormData, key: string) => {
  const raw = form.get(key);
  return typeof raw === "string" ? raw : undefined;
};

/**
 * "These are magnitudes: take the model's sign": the points with the sign of the named parameter
 * set's model at their conditions. The set must be readable by the caller and still at the version
 * the upload was checked against, so the signs stored are the ones the person saw.
 */
async function withModelSigns(
  caller: Caller,
  signsFrom: SignsFrom,
  points: MeasuredPoint[],
): Promise<{ points: MeasuredPoint[]; signSource: SignSource }> {
  const access = await authorize(caller, { kind: "parameter_set", id: signsFrom.parameterSetId }, "viewer");
  const set = await getParameterSet(db, { access });
  if (!set) throw new DomainError("not_found", "The parameter set for the signs was deleted; nothing was stored.");
  if (set.version !== signsFrom.version)
    throw new DomainError(
      "stale_version",
      `“${set.name}” was saved as version ${set.version} after the sign check against version ${signsFrom.version}; ` +
        "nothing was stored. Check the signs again.",
      { fields: { signsFrom: `Now at version ${set.version}.` } },
    );
  const signed = takeModelSigns(set.params, points);
  return {
    points: signed.values,
    signSource: { parameterSetId: set.id, parameterSetName: set.name, version: set.version, changedCount: signed.changed },
  };
}

/**
 * POST /api/measurement-sets (editor), multipart: file, labId, name, sample, mapping (JSON),
 * defaults (JSON), format (JSON, optional: delimiter and decimal mark, detected when absent),
 * signsFrom (JSON, optional: the values are magnitudes, signed by that set's model) → 201 { item }.
 * Every row is checked first; a file with problems answers 400 with `problems: ["line 14: wavelength is empty", …]` and stores nothing.
 */
export const POST = apiRoute(async (request) => {
  const caller = await requireCaller(request);
  const form = await readMultipart(request, MAX_FILE_BYTES + FORM_OVERHEAD_BYTES, tooLarge().message);
  const meta = uploadMeasurementMetaSchema.safeParse({
    labId: textField(form, "labId"),
    name: textField(form, "name"),
    sample: textField(form, "sample"),
    mapping: jsonField(form, "mapping"),
    defaults: jsonField(form, "defaults"),
    format: jsonField(form, "format"),
    signsFrom: jsonField(form, "signsFrom"),
  });
  if (!meta.success) throw validationError(meta.error);
  const access = await authorizeLab(caller, meta.data.labId, "editor");

  const file = form.get("file");
  if (!(file instanceof File)) throw new DomainError("validation", "Choose a CSV or TSV file.", { fields: { file: "Choose a file." } });
  if (file.size > MAX_FILE_BYTES) throw tooLarge(file.size);
  if (!isStorableText(file.name))
    throw new DomainError("validation", `The file name cannot be stored: ${TEXT_PROBLEM}`, { fields: { file: TEXT_PROBLEM } });
  const bytes = new Uint8Array(await file.arrayBuffer());
  let text: string;
  try {
    text = new TextDecoder("utf-8", { fatal: true }).decode(bytes);
  } catch {
    throw new DomainError("validation", "The file is not UTF-8 text. Save it as CSV or TSV in UTF-8 and upload it again.", {
      fields: { file: "Not UTF-8 text." },
    });
  }
  const parsed = parseMeasurementTable(text, meta.data.mapping, meta.data.defaults, meta.data.format);
  if (parsed.errors.length > 0) {
    const count = parsed.errors.length;
    throw new DomainError("validation", `The file has ${count === 1 ? "a problem" : `${count} problems`}; nothing was stored.`, {
      fields: { file: parsed.errors[0]! },
      extra: { problems: parsed.errors },
    });
  }
  const signed = meta.data.signsFrom ? await withModelSigns(caller, meta.data.signsFrom, parsed.points) : null;
  const item = await withStorage("nothing was stored", () =>
    createMeasurementSet(db, {
      access,
      store: objectStore,
      input: {
        name: meta.data.name,
        sample: meta.data.sample,
        fileName: cleanFileName(file.name, "measurements.csv"),
        contentType: safeContentType(file.type || "text/csv"),
        bytes,
        mapping: meta.data.mapping,
        defaults: meta.data.defaults,
        format: meta.data.format,
        points: signed?.points ?? parsed.points,
        ...(signed ? { signSource: signed.signSource } : {}),
      },
    }),
  );
  return json({ item }, 201);
});
