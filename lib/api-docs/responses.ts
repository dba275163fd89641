import { z } from "zod";
import type { AuditEntry } from "@/lib/contracts/audit";
import type { UserRef } from "@/lib/contracts/common";
import { ERROR_CODES, type ErrorBody } from "@/lib/contracts/errors";
import { LAB_RUN_STATES, type LabRunDetail, type LabRunResultBody, type LabRunSummary } from "@/lib/contracts/lab-runs";
import type { InvitationSummary, LabSummary, MemberSummary } from "@/lib/contracts/labs";
import type { LightSource } from "@/lib/contracts/light-sources";
import {
  type MeasurementSetSummary,
  type PointChangeEntry,
  type PointsResponse,
  signSourceSchema,
  type StoredPoint,
} from "@/lib/contracts/measurement-sets";
import type { ParameterSet, ParameterSetSummary, ParameterSetVersion } from "@/lib/contracts/parameter-sets";
import { savedPlanSchema, type SavedPlan } from "@/lib/contracts/plans";
import { labRoleSchema } from "@/lib/contracts/roles";
import type { SharedSet, ShareLinkSummary } from "@/lib/contracts/sharing";
import type { TokenSummary } from "@/lib/contracts/tokens";
import type { MyWorkbenchView } from "@/lib/contracts/workbench-views";
import { EDITABLE_POINT_FIELDS, measuredPointSchema } from "@/lib/measurements/point";
import { modelParamsSchema } from "@/lib/physics/schema";

/*
 * The answers of the API as zod schemas, for the API description only. The shapes themselves are
 * the TypeScript interfaces in lib/contracts; each schema here is typed against its interface
 * (`z.ZodType<Interface>`), so a field added to an interface and not here fails the type check.
 */

const iso = z.string().describe("ISO 8601 date-time");
const isoOrNull = iso.nullable();
const json = z.record(z.string(), z.unknown());

export const userRefResponse: z.ZodType<UserRef> = z.object({ id: z.string(), name: z.string() });

export const errorResponse: z.ZodType<ErrorBody> = z.object({
  error: z
    .object({
      code: z.enum(ERROR_CODES),
      message: z.string(),
      fields: z
        .record(z.string(), z.string())
        .optional()
        .describe('One message per invalid field, keyed by dotted path ("params.temperatureK").'),
    })
    .catchall(z.unknown()),
});

export const labResponse: z.ZodType<LabSummary> = z.object({ id: z.string(), name: z.string(), role: labRoleSchema });
export const memberResponse: z.ZodType<MemberSummary> = z.object({
  userId: z.string(),
  email: z.string(),
  name: z.string(),
  role: labRoleSchema,
});
export const invitationResponse: z.ZodType<InvitationSummary> = z.object({
  id: z.string(),
  email: z.string(),
  role: labRoleSchema,
  createdAt: iso,
  expiresAt: iso,
  invitedBy: userRefResponse.nullable(),
});

const setSummaryFields = {
  id: z.string(),
  labId: z.string(),
  labName: z.string(),
  name: z.string(),
  description: z.string(),
  tags: z.array(z.string()),
  version: z.number().int().describe("The current version; every save makes a new one."),
  createdAt: iso,
  updatedAt: iso,
  createdBy: userRefResponse,
  updatedBy: userRefResponse,
  role: labRoleSchema.describe("The caller's role in the set's lab."),
};
export const parameterSetSummaryResponse: z.ZodType<ParameterSetSummary> = z.object(setSummaryFields);
export const parameterSetResponse: z.ZodType<ParameterSet> = z.object({
  ...setSummaryFields,
  params: modelParamsSchema,
  viewState: json.nullable(),
});
export const parameterSetVersionResponse: z.ZodType<ParameterSetVersion> = z.object({
  version: z.number().int(),
  name: z.string(),
  description: z.string(),
  tags: z.array(z.string()),
  params: modelParamsSchema,
  provenance: json.nullable().describe("Where the version came from when not typed in (a fit's summary); null otherwise."),
  createdAt: iso,
  createdBy: userRefResponse,
  note: z.string().describe('Why it was saved ("" when no note was given).'),
  restoredFrom: z.number().int().nullable().describe("The version this one restored, if it is a restore."),
});

export const measurementSetResponse: z.ZodType<MeasurementSetSummary> = z.object({
  id: z.string(),
  labId: z.string(),
  labName: z.string(),
  name: z.string(),
  sample: z.string(),
  quantity: z.enum(["verdet", "rotation"]).describe("Verdet constants in rad/(T·m) or rotations in rad."),
  rowCount: z.number().int(),
  wavelengthSpanNm: z.object({ min: z.number(), max: z.number() }),
  temperaturesK: z.array(z.number()),
  fieldsT: z.array(z.number()),
  lengthsM: z.array(z.number()),
  fileName: z.string(),
  fileBytes: z.number().int(),
  uploadedBy: userRefResponse,
  createdAt: iso,
  revision: z.number().int().describe("1 at import; each edit of the points makes the next."),
  maskedCount: z.number().int().describe("Points left out of fits and overlays."),
  signSource: signSourceSchema
    .nullable()
    .describe("The parameter set version whose model gave the values their signs (the file held magnitudes); null: the file's signs."),
  role: labRoleSchema,
});

const editableValues = z.object(Object.fromEntries(EDITABLE_POINT_FIELDS.map((f) => [f, z.number().optional()])));
export const storedPointResponse: z.ZodType<StoredPoint> = measuredPointSchema.extend({
  ordinal: z.number().int().describe("0-based position in the file; the point's id within the set."),
  masked: z.boolean().describe("Masked points are left out of fits and overlays."),
  maskReason: z.string().nullable(),
  note: z.string(),
  original: editableValues.nullable().describe("The imported values of the fields an edit changed; null while as in the file."),
});
export const pointsResponse: z.ZodType<PointsResponse> = z.object({ revision: z.number().int(), points: z.array(storedPointResponse) });
export const pointChangeResponse: z.ZodType<PointChangeEntry> = z.object({
  revision: z.number().int(),
  ordinal: z.number().int(),
  line: z.number().int(),
  changes: z.record(z.string(), z.object({ from: z.unknown(), to: z.unknown() })),
  actor: userRefResponse.nullable(),
  at: iso,
});

const runSummaryFields = {
  id: z.string(),
  labId: z.string(),
  labName: z.string(),
  kind: z.string().describe('"map" or "spectrum"'),
  title: z.string(),
  cells: z.number().int(),
  state: z.enum(LAB_RUN_STATES),
  progress: z.number().describe("0…1"),
  cancelRequested: z.boolean(),
  error: z.string().nullable(),
  workerId: z.string().nullable(),
  attempt: z.number().int(),
  submittedBy: userRefResponse,
  parameterSet: z.object({ id: z.string().nullable(), name: z.string(), version: z.number().int(), edited: z.boolean() }).nullable(),
  createdAt: iso,
  startedAt: isoOrNull,
  finishedAt: isoOrNull,
  updatedAt: iso,
  role: labRoleSchema,
  progressAtStart: z.number().describe("0…1: the progress the current attempt resumed from (its checkpoints)"),
  engineVersion: z.string().describe("The engine version the run was made for"),
};
export const labRunSummaryResponse: z.ZodType<LabRunSummary> = z.object(runSummaryFields);
export const labRunDetailResponse: z.ZodType<LabRunDetail> = z.object({ ...runSummaryFields, payload: json });
export const labRunResultResponse: z.ZodType<LabRunResultBody> = z.object({
  runId: z.string(),
  workerId: z.string(),
  attempt: z.number().int(),
  computeMs: z.number(),
  engineVersion: z.string().describe("The engine version that computed the result"),
  meta: json.describe("What the columns mean: the run kind's axes (e.g. wavelengthsNm, rowValues, axis)."),
  columns: z.record(z.string(), z.array(z.number().nullable())).describe("One array per column, row-major for a map; NaN as null."),
});

export const tokenResponse: z.ZodType<TokenSummary> = z.object({
  id: z.string(),
  name: z.string(),
  createdAt: iso,
  lastUsedAt: isoOrNull,
});

export const lightSourceResponse: z.ZodType<LightSource> = z.object({
  id: z.string(),
  labId: z.string(),
  name: z.string(),
  wavelengthNm: z.number(),
  tunableMinNm: z.number().nullable(),
  tunableMaxNm: z.number().nullable(),
  powerW: z.number().nullable(),
  createdAt: iso,
  updatedAt: iso,
});

export const savedPlanResponse: z.ZodType<SavedPlan> = z.object({
  id: z.string(),
  setId: z.string(),
  setVersion: z.number().int(),
  name: z.string(),
  request: z.unknown(),
  plan: savedPlanSchema,
  createdBy: userRefResponse,
  createdAt: iso,
});

export const shareLinkResponse: z.ZodType<ShareLinkSummary> = z.object({
  id: z.string(),
  createdAt: iso,
  createdBy: userRefResponse.nullable(),
});
export const sharedSetResponse: z.ZodType<SharedSet> = z.object({
  name: z.string(),
  description: z.string(),
  tags: z.array(z.string()),
  version: z.number().int(),
  updatedAt: iso,
  params: modelParamsSchema,
  viewState: json.nullable(),
});

export const myViewResponse: z.ZodType<MyWorkbenchView> = z.object({
  setId: z.string(),
  viewState: json.nullable(),
  updatedAt: isoOrNull,
  sharedViewState: json.nullable(),
});

export const auditEntryResponse: z.ZodType<AuditEntry> = z.object({
  id: z.string(),
  at: iso,
  action: z.string(),
  actor: userRefResponse.nullable(),
  targetType: z.string(),
  targetId: z.string(),
  targetName: z.string().nullable().describe("The target's present name, or the one recorded with the entry."),
  set: z.object({ id: z.string(), name: z.string().nullable() }).nullable().describe("The parameter set a plan belongs to."),
  details: json,
});

/** `{ item }` */
export const item = (schema: z.ZodType) => z.object({ item: schema });
/** `{ items }`, unpaged */
export const items = (schema: z.ZodType) => z.object({ items: z.array(schema) });
/** `{ items, nextCursor }` (lib/contracts/paging.ts) */
export const page = (schema: z.ZodType) =>
  z.object({ items: z.array(schema), nextCursor: z.string().nullable().describe("Pass as cursor for the next page; null on the last.") });
