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
import type { ModelParams } from "@/lib/physics/schema";

/*
 * The one schema: plural snake_case tables, camelCase keys. Timestamps carry the time zone so the
 * API's ISO strings are unambiguous. Types sit beside each table.
 */

export const siteRoleEnum = pgEnum("site_role", ["admin", "member"]);
export const labRoleEnum = pgEnum("lab_role", ["owner", "editor", "viewer"]);

export type SiteRole = (typeof siteRoleEnum.enumValues)[number];
export type LabRole = (typeof labRoleEnum.enumValues)[number];

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
  (t) => [unique("parameter_sets_lab_name_unique").on(t.labId, t.name), index("parameter_sets_lab_idx").on(t.labId)],
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
  (t) => [index("audit_log_target_idx").on(t.targetType, t.targetId), index("audit_log_at_idx").on(t.at)],
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
 * Failed sign-ins per (e-mail, client address). Kept in the database rather than in memory so
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
  (t) => [index("sign_in_failures_key_idx").on(t.email, t.ip, t.at)],
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

/* ---------- Lab runs: long computations on the job queue (workers/lab-runs) ---------- */

export const labRunStateEnum = pgEnum("lab_run_state", ["queued", "running", "done", "failed", "cancelled"]);
export type LabRunState = (typeof labRunStateEnum.enumValues)[number];

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
    cancelRequested: boolean("cancel_requested").notNull().default(false),
    error: text("error"),
    workerId: text("worker_id"),
    attempt: integer("attempt").notNull().default(0),
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
  createdAt: createdAt(),
});
export type LabRunResult = typeof labRunResults.$inferSelect;
