import { relations, sql } from "drizzle-orm";
import {
  boolean,
  customType,
  doublePrecision,
  index,
  integer,
  jsonb,
  pgEnum,
  pgTable,
  primaryKey,
  text,
  timestamp,
  unique,
  uniqueIndex,
  uuid,
} from "drizzle-orm/pg-core";
import { LAB_RUN_STATES } from "@/lib/contracts/lab-runs";
import type { SignSource } from "@/lib/contracts/measurement-sets";
import { LAB_ROLES, SITE_ROLES } from "@/lib/contracts/roles";
import type { ModelParams } from "@/lib/physics/schema";

/*
 * The one schema: plural snake_case tables, camelCase keys. Timestamps carry the time zone so the
 * API's ISO strings are unambiguous. Types sit beside each table.
 */

export const siteRoleEnum = pgEnum("site_role", SITE_ROLES);
export const labRoleEnum = pgEnum("lab_role", LAB_ROLES);

const createdAt = () => timestamp("created_at", { withTimezone: true }).notNull().defaultNow();
const updatedAt = () => timestamp("updated_at", { withTimezone: true }).notNull().defaultNow();

export const users = pgTable(
  "users",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    // Stored lower-cased by the code; the unique index on lower() also guards direct SQL.
    email: text("email").notNull(),
    name: text("name").notNull(),
    passwordHash: text("password_hash").notNull(),
    siteRole: siteRoleEnum("site_role").notNull().default("member"),
    // Bumped by sign-out, a password change or reset and "end all sessions"; a session cookie
    // carrying an older number no longer signs anything in.
    sessionVersion: integer("session_version").notNull().default(0),
    // False from sign-up until the mailed link is opened; an unconfirmed account may not invite.
    // The default true covers accounts made before addresses were confirmed, and the seed.
    emailVerified: boolean("email_verified").notNull().default(true),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [uniqueIndex("users_email_lower_unique").on(sql`lower(${t.email})`)],
);
export type User = typeof users.$inferSelect;
export type NewUser = typeof users.$inferInsert;

export const labs = pgTable("labs", {
  id: uuid("id").primaryKey().defaultRandom(),
  name: text("name").notNull(),
  // The lab made at sign-up; lets the UI label it and keeps it apart from shared group labs.
  personal: boolean("personal").notNull().default(false),
  createdAt: createdAt(),
  updatedAt: updatedAt(),
});
export type Lab = typeof labs.$inferSelect;
export type NewLab = typeof labs.$inferInsert;

export const labMemberships = pgTable(
  "lab_memberships",
  {
    labId: uuid("lab_id")
      .notNull()
      .references(() => labs.id, { onDelete: "cascade" }),
    userId: uuid("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    role: labRoleEnum("role").notNull(),
    createdAt: createdAt(),
  },
  (t) => [primaryKey({ columns: [t.labId, t.userId] }), index("lab_memberships_user_idx").on(t.userId)],
);
export type LabMembership = typeof labMemberships.$inferSelect;
export type NewLabMembership = typeof labMemberships.$inferInsert;

export const parameterSets = pgTable(
  "parameter_sets",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    labId: uuid("lab_id")
      .notNull()
      .references(() => labs.id, { onDelete: "cascade" }),
    name: text("name").notNull(),
    description: text("description").notNull().default(""),
    tags: text("tags").array().notNull().default(sql`'{}'::text[]`),
    params: jsonb("params").$type<ModelParams>().notNull(),
    viewState: jsonb("view_state").$type<Record<string, unknown>>(),
    version: integer("version").notNull().default(1),
    createdById: uuid("created_by")
      .notNull()
      .references(() => users.id),
    createdAt: createdAt(),
    updatedById: uuid("updated_by")
      .notNull()
      .references(() => users.id),
    updatedAt: updatedAt(),
  },
  // The list's keyset order within a lab (newest change first), so a page reads its rows in order instead of sorting the lab.
  (t) => [
    unique("parameter_sets_lab_name_unique").on(t.labId, t.name),
    index("parameter_sets_lab_idx").on(t.labId),
    index("parameter_sets_lab_updated_idx").on(t.labId, t.updatedAt, t.id),
  ],
);
export type ParameterSetRow = typeof parameterSets.$inferSelect;
export type NewParameterSetRow = typeof parameterSets.$inferInsert;

/** Immutable snapshots: one row per save (create, edit, restore); never updated. */
export const parameterSetVersions = pgTable(
  "parameter_set_versions",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    setId: uuid("set_id")
      .notNull()
      .references(() => parameterSets.id, { onDelete: "cascade" }),
    version: integer("version").notNull(),
    name: text("name").notNull(),
    description: text("description").notNull(),
    tags: text("tags").array().notNull(),
    params: jsonb("params").$type<ModelParams>().notNull(),
    // Where a version came from when it was not typed in (e.g. a fit to measurements: the data
    // used, the free parameters, values ± σ, correlation, χ²); null for ordinary edits.
    provenance: jsonb("provenance").$type<Record<string, unknown>>(),
    // Why the version was saved, in the saver's words (the history shows it); empty when none was given.
    note: text("note").notNull().default(""),
    // The version a restore copied, so the history can say "restored from v2"; null otherwise.
    restoredFrom: integer("restored_from"),
    createdById: uuid("created_by")
      .notNull()
      .references(() => users.id),
    createdAt: createdAt(),
  },
  (t) => [unique("parameter_set_versions_set_version_unique").on(t.setId, t.version)],
);
export type ParameterSetVersionRow = typeof parameterSetVersions.$inferSelect;
export type NewParameterSetVersionRow = typeof parameterSetVersions.$inferInsert;

/**
 * Who did what, when, to what. No foreign key to the target: the record must outlive a deleted
 * parameter set. The actor is kept as a plain id for the same reason.
 */
export const auditLog = pgTable(
  "audit_log",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    actorId: uuid("actor_id"),
    action: text("action").notNull(),
    targetType: text("target_type").notNull(),
    targetId: text("target_id").notNull(),
    labId: uuid("lab_id"),
    details: jsonb("details").$type<Record<string, unknown>>().notNull().default({}),
    at: timestamp("at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index("audit_log_target_idx").on(t.targetType, t.targetId),
    index("audit_log_at_idx").on(t.at),
    index("audit_log_lab_at_idx").on(t.labId, t.at),
  ],
);
export type AuditLogEntry = typeof auditLog.$inferSelect;
export type NewAuditLogEntry = typeof auditLog.$inferInsert;

/** Personal API tokens; only the sha256 of the secret is stored. */
export const apiTokens = pgTable(
  "api_tokens",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    userId: uuid("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    name: text("name").notNull(),
    tokenHash: text("token_hash").notNull(),
    createdAt: createdAt(),
    lastUsedAt: timestamp("last_used_at", { withTimezone: true }),
    revokedAt: timestamp("revoked_at", { withTimezone: true }),
  },
  (t) => [uniqueIndex("api_tokens_hash_unique").on(t.tokenHash), index("api_tokens_user_idx").on(t.userId)],
);
export type ApiToken = typeof apiTokens.$inferSelect;
export type NewApiToken = typeof apiTokens.$inferInsert;

/**
 * Failed sign-ins per (e-mail, client key: a known device or the client address). Kept in the database rather than in memory so
 * the limit holds across server restarts and several server processes.
 */
export const signInFailures = pgTable(
  "sign_in_failures",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    email: text("email").notNull(),
    ip: text("ip").notNull(),
    at: timestamp("at", { withTimezone: true }).notNull().defaultNow(),
  },
  // The second index serves the per-client count across e-mails (password spraying).
  (t) => [index("sign_in_failures_key_idx").on(t.email, t.ip, t.at), index("sign_in_failures_client_idx").on(t.ip, t.at)],
);
export type SignInFailure = typeof signInFailures.$inferSelect;

export const usersRelations = relations(users, ({ many }) => ({
  memberships: many(labMemberships),
  apiTokens: many(apiTokens),
}));

export const labsRelations = relations(labs, ({ many }) => ({
  memberships: many(labMemberships),
  parameterSets: many(parameterSets),
}));

export const labMembershipsRelations = relations(labMemberships, ({ one }) => ({
  lab: one(labs, { fields: [labMemberships.labId], references: [labs.id] }),
  user: one(users, { fields: [labMemberships.userId], references: [users.id] }),
}));

export const parameterSetsRelations = relations(parameterSets, ({ one, many }) => ({
  lab: one(labs, { fields: [parameterSets.labId], references: [labs.id] }),
  createdBy: one(users, { fields: [parameterSets.createdById], references: [users.id], relationName: "set_created_by" }),
  updatedBy: one(users, { fields: [parameterSets.updatedById], references: [users.id], relationName: "set_updated_by" }),
  versions: many(parameterSetVersions),
}));

export const parameterSetVersionsRelations = relations(parameterSetVersions, ({ one }) => ({
  set: one(parameterSets, { fields: [parameterSetVersions.setId], references: [parameterSets.id] }),
  createdBy: one(users, { fields: [parameterSetVersions.createdById], references: [users.id] }),
}));

export const apiTokensRelations = relations(apiTokens, ({ one }) => ({
  user: one(users, { fields: [apiTokens.userId], references: [users.id] }),
}));

/*
 * Per-person workbench views: what one person sees of one set (axes, units, markers, open panels,
 * spin-trace inputs). Until a person saves their own, the workbench starts from the lab's shared
 * view, which stays in parameter_sets.view_state and changes only through an explicit "share".
 */
export const workbenchViews = pgTable(
  "workbench_views",
  {
    userId: uuid("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    setId: uuid("set_id")
      .notNull()
      .references(() => parameterSets.id, { onDelete: "cascade" }),
    viewState: jsonb("view_state").$type<Record<string, unknown>>().notNull(),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [primaryKey({ columns: [t.userId, t.setId] }), index("workbench_views_set_idx").on(t.setId)],
);
export type WorkbenchViewRow = typeof workbenchViews.$inferSelect;
export type NewWorkbenchViewRow = typeof workbenchViews.$inferInsert;

/* ---- Measurement sets: uploaded measurements (original file in object storage, points here) ---- */

/**
 * One uploaded file. The original bytes live in object storage under objectKey; the row is written
 * only after the object is stored, so no row ever names a missing object. The summary columns
 * (span, temperatures, fields) are computed once at import for the lab's table.
 */
export const measurementSets = pgTable(
  "measurement_sets",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    labId: uuid("lab_id")
      .notNull()
      .references(() => labs.id, { onDelete: "cascade" }),
    name: text("name").notNull(),
    sample: text("sample").notNull().default(""),
    quantity: text("quantity").$type<"verdet" | "rotation">().notNull(),
    rowCount: integer("row_count").notNull(),
    wavelengthMinNm: doublePrecision("wavelength_min_nm").notNull(),
    wavelengthMaxNm: doublePrecision("wavelength_max_nm").notNull(),
    temperaturesK: doublePrecision("temperatures_k").array().notNull(),
    fieldsT: doublePrecision("fields_t").array().notNull(),
    lengthsM: doublePrecision("lengths_m").array().notNull(),
    /** The column mapping, units and whole-file values the points were read with. */
    mapping: jsonb("mapping").$type<Record<string, unknown>>().notNull(),
    fileName: text("file_name").notNull(),
    fileBytes: integer("file_bytes").notNull(),
    contentType: text("content_type").notNull(),
    fileSha256: text("file_sha256").notNull(),
    objectKey: text("object_key").notNull(),
    /** 1 at import; every edit of its points (mask, note, value) makes the next revision. The file is never changed. */
    revision: integer("revision").notNull().default(1),
    maskedCount: integer("masked_count").notNull().default(0),
    /** The model's parameter set version that gave the values their signs (the file held magnitudes); null: the file's signs. */
    signSource: jsonb("sign_source").$type<SignSource>(),
    createdById: uuid("created_by")
      .notNull()
      .references(() => users.id),
    createdAt: createdAt(),
  },
  (t) => [
    unique("measurement_sets_lab_name_unique").on(t.labId, t.name),
    index("measurement_sets_lab_idx").on(t.labId),
    index("measurement_sets_lab_created_idx").on(t.labId, t.createdAt, t.id),
  ],
);
export type MeasurementSetRow = typeof measurementSets.$inferSelect;
export type NewMeasurementSetRow = typeof measurementSets.$inferInsert;

/** The points of a set in SI (lib/measurements/point.ts), in file order. */
export const measurementPoints = pgTable(
  "measurement_points",
  {
    setId: uuid("set_id")
      .notNull()
      .references(() => measurementSets.id, { onDelete: "cascade" }),
    ordinal: integer("ordinal").notNull(),
    line: integer("line").notNull(),
    wavelengthNm: doublePrecision("wavelength_nm").notNull(),
    value: doublePrecision("value").notNull(),
    sigma: doublePrecision("sigma").notNull(),
    temperatureK: doublePrecision("temperature_k").notNull(),
    fieldT: doublePrecision("field_t").notNull(),
    lengthM: doublePrecision("length_m").notNull(),
    /** The file's other columns for this row, as text; null when it had none. */
    extra: jsonb("extra").$type<Record<string, string>>(),
    /** Masked points stay in the set but are left out of fits and overlays. */
    masked: boolean("masked").notNull().default(false),
    maskReason: text("mask_reason"),
    note: text("note").notNull().default(""),
    /** The values as imported, for the fields an edit changed; null while the point is as in the file. */
    original: jsonb("original").$type<Record<string, number>>(),
  },
  (t) => [primaryKey({ columns: [t.setId, t.ordinal] })],
);
export type MeasurementPointRow = typeof measurementPoints.$inferSelect;

/** What each revision of a set changed, point by point (who, when, why): the set's own history beside the audit log. */
export const measurementPointChanges = pgTable(
  "measurement_point_changes",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    setId: uuid("set_id")
      .notNull()
      .references(() => measurementSets.id, { onDelete: "cascade" }),
    revision: integer("revision").notNull(),
    ordinal: integer("ordinal").notNull(),
    /** { field: { from, to } } for every field the change touched. */
    changes: jsonb("changes").$type<Record<string, { from: unknown; to: unknown }>>().notNull(),
    actorId: uuid("actor_id").references(() => users.id, { onDelete: "set null" }),
    createdAt: createdAt(),
  },
  (t) => [index("measurement_point_changes_set_idx").on(t.setId, t.revision)],
);
export type MeasurementPointChangeRow = typeof measurementPointChanges.$inferSelect;

export const measurementSetsRelations = relations(measurementSets, ({ one, many }) => ({
  lab: one(labs, { fields: [measurementSets.labId], references: [labs.id] }),
  createdBy: one(users, { fields: [measurementSets.createdById], references: [users.id] }),
  points: many(measurementPoints),
}));

export const measurementPointsRelations = relations(measurementPoints, ({ one }) => ({
  set: one(measurementSets, { fields: [measurementPoints.setId], references: [measurementSets.id] }),
}));

/* ---- Planner: a lab's light sources and the measurement plans saved with a parameter set ---- */

/** The lines a lab owns (lab-scoped; editors edit, viewers read). Wavelengths in vacuum, nm. */
export const lightSources = pgTable(
  "light_sources",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    labId: uuid("lab_id")
      .notNull()
      .references(() => labs.id, { onDelete: "cascade" }),
    name: text("name").notNull(),
    wavelengthNm: doublePrecision("wavelength_nm").notNull(),
    tunableMinNm: doublePrecision("tunable_min_nm"),
    tunableMaxNm: doublePrecision("tunable_max_nm"),
    powerW: doublePrecision("power_w"),
    createdAt: createdAt(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [unique("light_sources_lab_name_unique").on(t.labId, t.name), index("light_sources_lab_idx").on(t.labId)],
);
export type LightSourceRow = typeof lightSources.$inferSelect;
export type NewLightSourceRow = typeof lightSources.$inferInsert;

/** A measurement plan saved with a parameter set: the planner's request and the chosen plan. */
export const plans = pgTable(
  "plans",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    setId: uuid("set_id")
      .notNull()
      .references(() => parameterSets.id, { onDelete: "cascade" }),
    setVersion: integer("set_version").notNull(),
    name: text("name").notNull(),
    request: jsonb("request").$type<Record<string, unknown>>().notNull(),
    plan: jsonb("plan").$type<Record<string, unknown>>().notNull(),
    createdById: uuid("created_by")
      .notNull()
      .references(() => users.id),
    createdAt: createdAt(),
  },
  (t) => [index("plans_set_idx").on(t.setId, t.createdAt)],
);
export type PlanRow = typeof plans.$inferSelect;
export type NewPlanRow = typeof plans.$inferInsert;

/*
 * Sharing and trust: e-mail invitations, password resets, read-only share links and a throttle
 * for unauthenticated requests that send mail or create accounts. Every secret is stored as the
 * sha256 of a 256-bit random token (lib/auth/tokens.ts), never in clear.
 */

/** An invitation to join a lab with a role; works once, expires, and the owner can revoke it. */
export const invitations = pgTable(
  "invitations",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    labId: uuid("lab_id")
      .notNull()
      .references(() => labs.id, { onDelete: "cascade" }),
    email: text("email").notNull(),
    role: labRoleEnum("role").notNull(),
    tokenHash: text("token_hash").notNull(),
    invitedById: uuid("invited_by").references(() => users.id, { onDelete: "set null" }),
    createdAt: createdAt(),
    expiresAt: timestamp("expires_at", { withTimezone: true }).notNull(),
    acceptedAt: timestamp("accepted_at", { withTimezone: true }),
    acceptedById: uuid("accepted_by").references(() => users.id, { onDelete: "set null" }),
    revokedAt: timestamp("revoked_at", { withTimezone: true }),
  },
  (t) => [uniqueIndex("invitations_token_hash_unique").on(t.tokenHash), index("invitations_lab_idx").on(t.labId, t.createdAt)],
);
export type Invitation = typeof invitations.$inferSelect;

/** A single-use password-reset link with a short expiry. */
export const passwordResets = pgTable(
  "password_resets",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    userId: uuid("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    tokenHash: text("token_hash").notNull(),
    createdAt: createdAt(),
    expiresAt: timestamp("expires_at", { withTimezone: true }).notNull(),
    usedAt: timestamp("used_at", { withTimezone: true }),
  },
  (t) => [uniqueIndex("password_resets_token_hash_unique").on(t.tokenHash), index("password_resets_user_idx").on(t.userId)],
);

/** A single-use link that confirms a new account's e-mail address. */
export const emailVerifications = pgTable(
  "email_verifications",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    userId: uuid("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    tokenHash: text("token_hash").notNull(),
    createdAt: createdAt(),
    expiresAt: timestamp("expires_at", { withTimezone: true }).notNull(),
    usedAt: timestamp("used_at", { withTimezone: true }),
  },
  (t) => [uniqueIndex("email_verifications_token_hash_unique").on(t.tokenHash), index("email_verifications_user_idx").on(t.userId)],
);

/**
 * Mail waiting to be sent, written in the same transaction as what caused it (an invitation, a
 * reset link, a sign-up), so mail is never lost when SMTP is down and never sent for a change
 * that rolled back. lib/mail/outbox.ts sends it with retries; the body (which carries a secret
 * link) is blanked once sent.
 */
export const mailOutbox = pgTable(
  "mail_outbox",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    kind: text("kind").notNull(),
    recipient: text("recipient").notNull(),
    subject: text("subject").notNull(),
    body: text("body").notNull(),
    createdAt: createdAt(),
    attempts: integer("attempts").notNull().default(0),
    nextAttemptAt: timestamp("next_attempt_at", { withTimezone: true }).notNull().defaultNow(),
    sentAt: timestamp("sent_at", { withTimezone: true }),
    gaveUpAt: timestamp("gave_up_at", { withTimezone: true }),
    lastError: text("last_error"),
  },
  (t) => [index("mail_outbox_due_idx").on(t.nextAttemptAt).where(sql`${t.sentAt} is null and ${t.gaveUpAt} is null`)],
);
export type MailOutboxRow = typeof mailOutbox.$inferSelect;

/** A read-only link to one parameter set; anyone holding it sees that set's workbench. */
export const shareLinks = pgTable(
  "share_links",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    setId: uuid("set_id")
      .notNull()
      .references(() => parameterSets.id, { onDelete: "cascade" }),
    tokenHash: text("token_hash").notNull(),
    createdById: uuid("created_by").references(() => users.id, { onDelete: "set null" }),
    createdAt: createdAt(),
    revokedAt: timestamp("revoked_at", { withTimezone: true }),
  },
  (t) => [uniqueIndex("share_links_token_hash_unique").on(t.tokenHash), index("share_links_set_idx").on(t.setId)],
);
export type ShareLink = typeof shareLinks.$inferSelect;

/** Recent unauthenticated requests per kind and key (e.g. sign-up per address), for throttling. */
export const requestThrottle = pgTable(
  "request_throttle",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    kind: text("kind").notNull(),
    key: text("key").notNull(),
    at: timestamp("at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("request_throttle_key_idx").on(t.kind, t.key, t.at)],
);

/**
 * Objects in the store that may have no row: written before an import's transaction (removed in
 * it), or left by a delete while the store was down. db/queries/object-sweep.ts deletes each once
 * no measurement set refers to its key, retrying while the store is down.
 */
export const pendingObjectDeletes = pgTable("pending_object_deletes", {
  objectKey: text("object_key").primaryKey(),
  reason: text("reason").$type<"upload" | "delete">().notNull(),
  createdAt: createdAt(),
  attempts: integer("attempts").notNull().default(0),
  lastError: text("last_error"),
});

/* ---------- Lab runs: long computations on the job queue (workers/lab-runs) ---------- */

export const labRunStateEnum = pgEnum("lab_run_state", LAB_RUN_STATES);

const bytea = customType<{ data: Buffer; driverData: Buffer }>({ dataType: () => "bytea" });

/**
 * One submitted run. Its id is also the pg-boss job id. `attempt` counts the times a worker took
 * it; a worker keeps computing only while the row still carries its own attempt, so a retried job
 * is never worked on by two workers at once.
 */
export const labRuns = pgTable(
  "lab_runs",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    labId: uuid("lab_id")
      .notNull()
      .references(() => labs.id, { onDelete: "cascade" }),
    submittedById: uuid("submitted_by")
      .notNull()
      .references(() => users.id),
    kind: text("kind").notNull(),
    title: text("title").notNull(),
    payload: jsonb("payload").$type<Record<string, unknown>>().notNull(),
    cells: integer("cells").notNull(),
    parameterSetId: uuid("parameter_set_id").references(() => parameterSets.id, { onDelete: "set null" }),
    parameterSetName: text("parameter_set_name"),
    parameterSetVersion: integer("parameter_set_version"),
    /** The parameters differ from the stored version (workbench what-if edits). */
    paramsEdited: boolean("params_edited").notNull().default(false),
    state: labRunStateEnum("state").notNull().default("queued"),
    progress: doublePrecision("progress").notNull().default(0),
    /** Progress the current attempt began with (chunks saved by earlier attempts), for the time left. */
    progressAtStart: doublePrecision("progress_at_start").notNull().default(0),
    cancelRequested: boolean("cancel_requested").notNull().default(false),
    error: text("error"),
    workerId: text("worker_id"),
    attempt: integer("attempt").notNull().default(0),
    /** The engine version (lib/lab-runs/engine.ts) the run was made for; workers of another major hand it back. */
    engineVersion: text("engine_version").notNull().default("1.0.0"),
    startedAt: timestamp("started_at", { withTimezone: true }),
    finishedAt: timestamp("finished_at", { withTimezone: true }),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [index("lab_runs_lab_idx").on(t.labId, t.createdAt), index("lab_runs_state_idx").on(t.state)],
);
export type LabRun = typeof labRuns.$inferSelect;
export type NewLabRun = typeof labRuns.$inferInsert;

/** The result of a run: at most one per run (primary key), written with ON CONFLICT DO NOTHING. */
export const labRunResults = pgTable("lab_run_results", {
  runId: uuid("run_id")
    .primaryKey()
    .references(() => labRuns.id, { onDelete: "cascade" }),
  workerId: text("worker_id").notNull(),
  attempt: integer("attempt").notNull(),
  /** Column names, lengths and what they mean; `data` holds the columns as little-endian float64. */
  meta: jsonb("meta").$type<Record<string, unknown>>().notNull(),
  data: bytea("data").notNull(),
  computeMs: integer("compute_ms").notNull(),
  /** The engine version of the worker that computed the result. */
  engineVersion: text("engine_version").notNull().default("1.0.0"),
  createdAt: createdAt(),
});
export type LabRunResult = typeof labRunResults.$inferSelect;

/**
 * Finished chunks of a run that is still in progress (map rows, spectrum stretches), saved as the
 * worker goes so that a retry computes only what is missing. Same encoding as the result (`meta`
 * names the columns, `data` holds them as little-endian float64); deleted when the result is stored.
 */
export const labRunCheckpoints = pgTable(
  "lab_run_checkpoints",
  {
    runId: uuid("run_id")
      .notNull()
      .references(() => labRuns.id, { onDelete: "cascade" }),
    chunkIndex: integer("chunk_index").notNull(),
    attempt: integer("attempt").notNull(),
    meta: jsonb("meta").$type<Record<string, unknown>>().notNull(),
    data: bytea("data").notNull(),
    createdAt: createdAt(),
  },
  (t) => [primaryKey({ columns: [t.runId, t.chunkIndex] })],
);
export type LabRunCheckpoint = typeof labRunCheckpoints.$inferSelect;
