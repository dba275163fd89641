import { z } from "zod";
import { changePasswordSchema, confirmEmailSchema, emailOnlySchema, resetPasswordSchema, signUpSchema } from "@/lib/contracts/accounts";
import { auditQuerySchema } from "@/lib/contracts/audit";
import {
  computeFitQuerySchema,
  computeFitSchema,
  computeMapSchema,
  computeResultSchema,
  computeSpectrumSchema,
} from "@/lib/contracts/compute";
import { saveFitSchema } from "@/lib/contracts/fits";
import { listRunsQuery, submitRunSchema } from "@/lib/contracts/lab-runs";
import { acceptInvitationSchema, changeMemberSchema, createInvitationSchema, createPersonalLabSchema } from "@/lib/contracts/labs";
import { createLightSourceSchema, listLightSourcesQuery, updateLightSourceSchema } from "@/lib/contracts/light-sources";
import {
  editPointsSchema,
  listMeasurementSetsQuery,
  pointHistoryQuery,
  uploadMeasurementMetaSchema,
} from "@/lib/contracts/measurement-sets";
import { copyMaterialSchema } from "@/lib/contracts/materials";
import { pageQuerySchema } from "@/lib/contracts/paging";
import {
  createParameterSetSchema,
  listParameterSetsQuery,
  restoreVersionSchema,
  updateParameterSetSchema,
} from "@/lib/contracts/parameter-sets";
import { savePlanSchema } from "@/lib/contracts/plans";
import { createTokenSchema } from "@/lib/contracts/tokens";
import { labRoleSchema } from "@/lib/contracts/roles";
import { myViewBodySchema, viewStateSchema } from "@/lib/contracts/workbench-views";
import * as r from "./responses";

/*
 * Every route under app/api, one entry each: the one place the API description
 * (/api/openapi.json, the API page) is built from. A route added under app/api without an entry
 * here fails tests/unit/api-docs/registry.test.ts; adding one is one object in ROUTES.
 */

export const HTTP_METHODS = ["GET", "POST", "PUT", "PATCH", "DELETE"] as const;
export type HttpMethod = (typeof HTTP_METHODS)[number];

/** Who may call: nobody signed in, any caller (session or token), a lab role, or a browser session only. */
export type RouteAccess = "public" | "caller" | "session" | "viewer" | "editor" | "owner" | "admin-or-self";

export interface ApiResponseDoc {
  status: number;
  description: string;
  /** JSON body; absent for 204 and for non-JSON answers (contentType). */
  schema?: z.ZodType;
  contentType?: string;
}

export interface ApiRouteDoc {
  method: HttpMethod;
  /** OpenAPI path: `/api/runs/{id}` for app/api/runs/[id]/route.ts. */
  path: string;
  tag: string;
  summary: string;
  description?: string;
  access: RouteAccess;
  query?: z.ZodObject;
  body?: z.ZodType;
  /** JSON unless said otherwise; multipart bodies name their file fields. */
  bodyType?: { kind: "multipart"; files: string[]; jsonFields: string[] };
  response: ApiResponseDoc;
}

/** Routes that are not part of the documented API, with the reason (the test accepts only these). */
export const UNDOCUMENTED_ROUTES: Record<string, string> = {
  "/api/auth/[...nextauth]": "Auth.js's own sign-in endpoints for the browser; scripts authenticate with an API token instead.",
};

const ok = (schema: z.ZodType, description = "OK"): ApiResponseDoc => ({ status: 200, description, schema });
const created = (schema: z.ZodType, description = "Created"): ApiResponseDoc => ({ status: 201, description, schema });
const gone: ApiResponseDoc = { status: 204, description: "Done; no body." };
const message = z.object({ message: z.string() });
const setItem = r.item(r.parameterSetResponse);
const runItem = r.item(r.labRunSummaryResponse);

export const ROUTES: ApiRouteDoc[] = [
  /* ---- accounts and tokens ---- */
  {
    method: "POST",
    path: "/api/sign-up",
    tag: "Accounts",
    summary: "Create an account",
    description:
      "The same answer whether or not the address already has an account (its owner gets an e-mail instead). " +
      "With `invitationToken` (an invitation link's secret) the account joins the invited lab with the invitation's role and " +
      "gets no personal lab; an unusable link creates nothing (404 unknown, 409 used, withdrawn or expired, 400 on `email` " +
      "when the link is for another address).",
    access: "public",
    body: signUpSchema,
    response: { status: 202, description: "Accepted", schema: message },
  },
  {
    method: "POST",
    path: "/api/password-reset",
    tag: "Accounts",
    summary: "Ask for a password-reset link",
    access: "public",
    body: emailOnlySchema,
    response: { status: 202, description: "Accepted (the same for known and unknown addresses)", schema: message },
  },
  {
    method: "POST",
    path: "/api/password-reset/confirm",
    tag: "Accounts",
    summary: "Set a new password with a reset link's token",
    description: "Ends every session of the account.",
    access: "public",
    body: resetPasswordSchema,
    response: ok(z.object({ email: z.string() })),
  },
  {
    method: "GET",
    path: "/api/email-verification",
    tag: "Accounts",
    summary: "Whether your e-mail address is confirmed",
    access: "session",
    response: ok(z.object({ verified: z.boolean() })),
  },
  {
    method: "POST",
    path: "/api/email-verification",
    tag: "Accounts",
    summary: "Mail a new confirmation link",
    description:
      "At most 3 an hour; 200 when the address is already confirmed. A new account may invite only once its address is confirmed.",
    access: "session",
    response: { status: 202, description: "The link is on its way.", schema: z.object({ message: z.string() }) },
  },
  {
    method: "POST",
    path: "/api/email-verification/confirm",
    tag: "Accounts",
    summary: "Confirm an e-mail address with the mailed link's token",
    access: "public",
    body: confirmEmailSchema,
    response: ok(z.object({ email: z.string() })),
  },
  {
    method: "POST",
    path: "/api/account/password",
    tag: "Accounts",
    summary: "Change your password",
    description: "Ends every other session of the account.",
    access: "session",
    body: changePasswordSchema,
    response: ok(z.object({ ok: z.literal(true) })),
  },
  {
    method: "POST",
    path: "/api/users/{id}/end-sessions",
    tag: "Accounts",
    summary: "End every browser session of a user",
    description: "A site admin, or the user themself. API tokens are revoked separately.",
    access: "admin-or-self",
    response: gone,
  },
  {
    method: "GET",
    path: "/api/tokens",
    tag: "Accounts",
    summary: "List your live API tokens",
    access: "session",
    query: pageQuerySchema,
    response: ok(r.page(r.tokenResponse)),
  },
  {
    method: "POST",
    path: "/api/tokens",
    tag: "Accounts",
    summary: "Create an API token",
    description: "The secret appears in this answer only. Send it as `Authorization: Bearer <token>`.",
    access: "session",
    body: createTokenSchema,
    response: created(z.object({ item: r.tokenResponse, token: z.string().describe("The secret, shown this once.") })),
  },
  {
    method: "DELETE",
    path: "/api/tokens/{id}",
    tag: "Accounts",
    summary: "Revoke one of your API tokens",
    access: "session",
    response: gone,
  },
  {
    method: "GET",
    path: "/api/openapi.json",
    tag: "Service",
    summary: "This description (OpenAPI 3.1)",
    access: "public",
    response: { status: 200, description: "The OpenAPI document", contentType: "application/json" },
  },
  {
    method: "GET",
    path: "/api/health",
    tag: "Service",
    summary: "Is the service and its database up",
    access: "public",
    response: ok(
      z.object({ status: z.enum(["ok", "degraded"]), database: z.enum(["up", "down"]) }),
      "Up (503 with the same body when the database is down)",
    ),
  },
  /* ---- labs ---- */
  {
    method: "GET",
    path: "/api/labs",
    tag: "Labs",
    summary: "Your labs and your role in each",
    access: "caller",
    response: ok(r.items(r.labResponse)),
  },
  {
    method: "POST",
    path: "/api/labs",
    tag: "Labs",
    summary: "Create your personal lab",
    description:
      "For someone who joined through an invitation (no personal lab at sign-up) or was removed from every lab. " +
      "One per person: 409 when you already own your personal lab. Named after you unless `name` is given.",
    access: "caller",
    body: createPersonalLabSchema,
    response: created(r.item(r.labResponse)),
  },
  {
    method: "GET",
    path: "/api/labs/{id}/members",
    tag: "Labs",
    summary: "A lab's members",
    access: "viewer",
    query: pageQuerySchema,
    response: ok(r.page(r.memberResponse)),
  },
  {
    method: "PATCH",
    path: "/api/labs/{id}/members/{userId}",
    tag: "Labs",
    summary: "Change a member's role",
    access: "owner",
    body: changeMemberSchema,
    response: ok(r.item(r.memberResponse)),
  },
  { method: "DELETE", path: "/api/labs/{id}/members/{userId}", tag: "Labs", summary: "Remove a member", access: "owner", response: gone },
  {
    method: "GET",
    path: "/api/labs/{id}/invitations",
    tag: "Labs",
    summary: "Pending invitations",
    access: "owner",
    query: pageQuerySchema,
    response: ok(r.page(r.invitationResponse)),
  },
  {
    method: "POST",
    path: "/api/labs/{id}/invitations",
    tag: "Labs",
    summary: "Invite someone by e-mail",
    access: "owner",
    body: createInvitationSchema,
    response: created(r.item(r.invitationResponse)),
  },
  {
    method: "DELETE",
    path: "/api/labs/{id}/invitations/{invitationId}",
    tag: "Labs",
    summary: "Withdraw an invitation",
    access: "owner",
    response: gone,
  },
  {
    method: "POST",
    path: "/api/invitations/accept",
    tag: "Labs",
    summary: "Accept an invitation",
    access: "session",
    body: acceptInvitationSchema,
    response: ok(z.object({ labId: z.string(), labName: z.string(), role: labRoleSchema, alreadyMember: z.boolean() })),
  },
  {
    method: "GET",
    path: "/api/labs/{id}/audit",
    tag: "Labs",
    summary: "The lab's audit trail, newest first",
    access: "owner",
    query: auditQuerySchema.omit({ labId: true }),
    response: ok(r.page(r.auditEntryResponse)),
  },
  /* ---- parameter sets ---- */
  {
    method: "GET",
    path: "/api/parameter-sets",
    tag: "Parameter sets",
    summary: "List parameter sets",
    access: "caller",
    query: listParameterSetsQuery.extend(pageQuerySchema.shape),
    response: ok(r.page(r.parameterSetSummaryResponse)),
  },
  {
    method: "POST",
    path: "/api/parameter-sets",
    tag: "Parameter sets",
    summary: "Create a parameter set (version 1)",
    access: "editor",
    body: createParameterSetSchema,
    response: created(setItem),
  },
  {
    method: "GET",
    path: "/api/parameter-sets/{id}",
    tag: "Parameter sets",
    summary: "One set with its current parameters",
    access: "viewer",
    response: ok(setItem),
  },
  {
    method: "PATCH",
    path: "/api/parameter-sets/{id}",
    tag: "Parameter sets",
    summary: "Save changes as a new version",
    description: "`version` is the version you edited; an older one answers 409 stale_version with the current set.",
    access: "editor",
    body: updateParameterSetSchema,
    response: ok(setItem),
  },
  { method: "DELETE", path: "/api/parameter-sets/{id}", tag: "Parameter sets", summary: "Delete a set", access: "editor", response: gone },
  {
    method: "GET",
    path: "/api/parameter-sets/{id}/versions",
    tag: "Parameter sets",
    summary: "A set's versions, newest first",
    access: "viewer",
    query: pageQuerySchema,
    response: ok(r.page(r.parameterSetVersionResponse)),
  },
  {
    method: "POST",
    path: "/api/parameter-sets/{id}/versions/{n}/restore",
    tag: "Parameter sets",
    summary: "Restore version n as a new version",
    access: "editor",
    body: restoreVersionSchema,
    response: ok(setItem),
  },
  {
    method: "POST",
    path: "/api/parameter-sets/{id}/fits",
    tag: "Parameter sets",
    summary: "Save a fit's values as a new version",
    description:
      "The fit itself runs in the browser or the command line (`npm run fit`); this stores its values, " +
      "with the fit as the version's provenance.",
    access: "editor",
    body: saveFitSchema,
    response: created(setItem),
  },
  {
    method: "PUT",
    path: "/api/parameter-sets/{id}/view-state",
    tag: "Parameter sets",
    summary: "Set the lab's shared workbench view (no new version)",
    access: "editor",
    body: viewStateSchema,
    response: ok(setItem),
  },
  {
    method: "GET",
    path: "/api/parameter-sets/{id}/my-view",
    tag: "Parameter sets",
    summary: "Your own workbench view of a set",
    access: "viewer",
    response: ok(r.item(r.myViewResponse)),
  },
  {
    method: "PUT",
    path: "/api/parameter-sets/{id}/my-view",
    tag: "Parameter sets",
    summary: "Save your own workbench view",
    access: "viewer",
    body: myViewBodySchema,
    response: ok(r.item(r.myViewResponse)),
  },
  {
    method: "DELETE",
    path: "/api/parameter-sets/{id}/my-view",
    tag: "Parameter sets",
    summary: "Go back to the lab's shared view",
    access: "viewer",
    response: ok(r.item(r.myViewResponse)),
  },
  {
    method: "GET",
    path: "/api/parameter-sets/{id}/plans",
    tag: "Planner",
    summary: "Plans saved with a set, newest first",
    access: "viewer",
    response: ok(r.items(r.savedPlanResponse)),
  },
  {
    method: "POST",
    path: "/api/parameter-sets/{id}/plans",
    tag: "Planner",
    summary: "Save a plan with a set",
    access: "editor",
    body: savePlanSchema,
    response: created(r.item(r.savedPlanResponse)),
  },
  {
    method: "GET",
    path: "/api/parameter-sets/{id}/plans/{planId}",
    tag: "Planner",
    summary: "One saved plan",
    access: "viewer",
    response: ok(r.item(r.savedPlanResponse)),
  },
  {
    method: "DELETE",
    path: "/api/parameter-sets/{id}/plans/{planId}",
    tag: "Planner",
    summary: "Delete a saved plan",
    access: "editor",
    response: gone,
  },
  {
    method: "GET",
    path: "/api/parameter-sets/{id}/share-links",
    tag: "Sharing",
    summary: "A set's live share links",
    access: "editor",
    query: pageQuerySchema,
    response: ok(r.page(r.shareLinkResponse)),
  },
  {
    method: "POST",
    path: "/api/parameter-sets/{id}/share-links",
    tag: "Sharing",
    summary: "Make a read-only share link (no body)",
    access: "editor",
    response: created(z.object({ item: r.shareLinkResponse, url: z.string().describe("Holds the secret; shown this once.") })),
  },
  {
    method: "DELETE",
    path: "/api/parameter-sets/{id}/share-links/{linkId}",
    tag: "Sharing",
    summary: "Revoke a share link",
    access: "editor",
    response: gone,
  },
  {
    method: "GET",
    path: "/api/shared/{token}",
    tag: "Sharing",
    summary: "The set behind a share link",
    access: "public",
    response: ok(r.item(r.sharedSetResponse)),
  },
  /* ---- measurements ---- */
  {
    method: "GET",
    path: "/api/measurement-sets",
    tag: "Measurements",
    summary: "List measurement sets",
    access: "caller",
    query: listMeasurementSetsQuery,
    response: ok(r.items(r.measurementSetResponse)),
  },
  {
    method: "POST",
    path: "/api/measurement-sets",
    tag: "Measurements",
    summary: "Upload a measurement file (CSV, TSV, semicolon or whitespace separated)",
    description:
      "Multipart form: `file`, the text fields, and `mapping`, `defaults` (and `format`, `signsFrom`, when sent) as JSON text. Every " +
      'row is checked first; a file with problems answers 400 with `problems: ["line 14: wavelength is empty", …]` and stores nothing. ' +
      "`signsFrom` ({ parameterSetId, version }: the set's current version) stores the values as magnitudes with the sign of that " +
      "set's model at each point's conditions; the set records it as `signSource`.",
    access: "editor",
    body: uploadMeasurementMetaSchema,
    bodyType: { kind: "multipart", files: ["file"], jsonFields: ["mapping", "defaults", "format", "signsFrom"] },
    response: created(r.item(r.measurementSetResponse)),
  },
  {
    method: "GET",
    path: "/api/measurement-sets/{id}",
    tag: "Measurements",
    summary: "One measurement set",
    access: "viewer",
    response: ok(r.item(r.measurementSetResponse)),
  },
  {
    method: "DELETE",
    path: "/api/measurement-sets/{id}",
    tag: "Measurements",
    summary: "Delete a measurement set",
    access: "editor",
    response: gone,
  },
  {
    method: "GET",
    path: "/api/measurement-sets/{id}/points",
    tag: "Measurements",
    summary: "The points in SI, file order, with masks, notes and edits",
    access: "viewer",
    response: ok(r.pointsResponse),
  },
  {
    method: "PATCH",
    path: "/api/measurement-sets/{id}/points",
    tag: "Measurements",
    summary: "Mask, annotate or correct points (one new revision)",
    description:
      "`revision` is the revision you edited (an older one answers 409 stale_version). Values are in SI. Masking needs a reason. " +
      "The original file is never changed; a point keeps its imported values in `original`.",
    access: "editor",
    body: editPointsSchema,
    response: ok(z.object({ revision: z.number().int(), changedPoints: z.number().int() })),
  },
  {
    method: "GET",
    path: "/api/measurement-sets/{id}/history",
    tag: "Measurements",
    summary: "What each revision changed, point by point",
    access: "viewer",
    query: pointHistoryQuery,
    response: ok(r.items(r.pointChangeResponse)),
  },
  {
    method: "GET",
    path: "/api/measurement-sets/{id}/original",
    tag: "Measurements",
    summary: "The uploaded file, byte for byte",
    access: "viewer",
    response: { status: 200, description: "The file as an attachment", contentType: "text/csv" },
  },
  /* ---- light sources ---- */
  {
    method: "GET",
    path: "/api/light-sources",
    tag: "Planner",
    summary: "A lab's light sources",
    access: "viewer",
    query: listLightSourcesQuery,
    response: ok(r.items(r.lightSourceResponse)),
  },
  {
    method: "POST",
    path: "/api/light-sources",
    tag: "Planner",
    summary: "Add a light source",
    access: "editor",
    body: createLightSourceSchema,
    response: created(r.item(r.lightSourceResponse)),
  },
  {
    method: "GET",
    path: "/api/light-sources/{id}",
    tag: "Planner",
    summary: "One light source",
    access: "viewer",
    response: ok(r.item(r.lightSourceResponse)),
  },
  {
    method: "PATCH",
    path: "/api/light-sources/{id}",
    tag: "Planner",
    summary: "Change a light source",
    access: "editor",
    body: updateLightSourceSchema,
    response: ok(r.item(r.lightSourceResponse)),
  },
  { method: "DELETE", path: "/api/light-sources/{id}", tag: "Planner", summary: "Delete a light source", access: "editor", response: gone },
  /* ---- lab runs ---- */
  {
    method: "GET",
    path: "/api/runs",
    tag: "Lab runs",
    summary: "Recent lab runs",
    access: "caller",
    query: listRunsQuery,
    response: ok(r.items(r.labRunSummaryResponse)),
  },
  {
    method: "POST",
    path: "/api/runs",
    tag: "Lab runs",
    summary: "Submit a lab run",
    description:
      "`kind` picks the payload: `map` (rotation and magnetic share over wavelength × temperature or wavelength × field) or `spectrum` " +
      "(a long spectrum). `params` are the model parameters (as in a parameter set); `parameterSetId` names the set they came from " +
      "(its current version is recorded, and whether the parameters differ from it). Poll GET /api/runs/{id} until `state` is done, then " +
      "read GET /api/runs/{id}/result.",
    access: "editor",
    body: submitRunSchema,
    response: created(runItem),
  },
  {
    method: "GET",
    path: "/api/runs/{id}",
    tag: "Lab runs",
    summary: "One run with its payload and progress",
    access: "viewer",
    response: ok(r.item(r.labRunDetailResponse)),
  },
  {
    method: "POST",
    path: "/api/runs/{id}/cancel",
    tag: "Lab runs",
    summary: "Cancel a queued or running run",
    access: "editor",
    response: ok(runItem),
  },
  {
    method: "GET",
    path: "/api/runs/{id}/result",
    tag: "Lab runs",
    summary: "A finished run's result columns",
    description: "404 not_found until the run is done.",
    access: "viewer",
    response: ok(r.labRunResultResponse),
  },
  /* ---- material library ---- */
  {
    method: "GET",
    path: "/api/materials",
    tag: "Materials",
    summary: "The material library: cited materials that start a parameter set",
    description: "Site-wide and read-only; each item carries a parameter file, the source of every value and validity ranges.",
    access: "caller",
    response: ok(z.object({ libraryVersion: z.string(), items: z.array(z.record(z.string(), z.unknown())) })),
  },
  {
    method: "POST",
    path: "/api/materials/{id}/parameter-sets",
    tag: "Materials",
    summary: "A new parameter set from a library material",
    description: 'Version 1 records its provenance: { kind: "material", materialId, materialName, libraryVersion }.',
    access: "editor",
    body: copyMaterialSchema,
    response: created(r.item(r.parameterSetResponse)),
  },
  /* ---- synchronous compute ---- */
  {
    method: "POST",
    path: "/api/compute/spectrum",
    tag: "Compute",
    summary: "A small spectrum, computed at once",
    description:
      "The body is a spectrum lab run's payload. Up to 50,000 analytic or 1,500 numerical cells; above that 413 payload_too_large " +
      "with the cell count, the limit and a pointer to POST /api/runs.",
    access: "caller",
    body: computeSpectrumSchema,
    response: ok(computeResultSchema),
  },
  {
    method: "POST",
    path: "/api/compute/map",
    tag: "Compute",
    summary: "A small map, computed at once",
    description: "The body is a map lab run's payload; the limits and the 413 answer are those of /api/compute/spectrum.",
    access: "caller",
    body: computeMapSchema,
    response: ok(computeResultSchema),
  },
  {
    method: "POST",
    path: "/api/compute/fit",
    tag: "Compute",
    summary: "A small fit, computed at once",
    description:
      "The body is the fit's request (as `npm run fit` builds it); up to 500 points, above that 413 payload_too_large. " +
      "The answer's result is the fit's report as `npm run fit` prints it; `shareIntervals=true` also profiles the share at every point.",
    access: "caller",
    query: computeFitQuerySchema,
    body: computeFitSchema,
    response: ok(
      z.object({
        engineVersion: z.string(),
        computeMs: z.number(),
        result: z.record(z.string(), z.unknown()).describe("The fit result: values, σ, comparison, intervals, points (as the CLI prints)."),
      }),
    ),
  },
];
