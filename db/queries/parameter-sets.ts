import { and, desc, eq, ilike, inArray, lt, or, sql, type SQL } from "drizzle-orm";
import { decodeCursor, timeIdCursor, toPage, versionCursor } from "@/db/paging";
import type { Page, PageQuery } from "@/lib/contracts/paging";
import { alias } from "drizzle-orm/pg-core";
import { uniqueViolation } from "@/db/errors";
import type { AuditAction } from "@/lib/contracts/audit";
import { DomainError, notFound } from "@/lib/contracts/errors";
import { zodIssueFields } from "@/lib/contracts/validation";
import type {
  ParameterSet,
  ParameterSetSummary,
  ParameterSetVersion,
  CreateParameterSetInput,
  UpdateParameterSetInput,
} from "@/lib/contracts/parameter-sets";
import type { SaveFitInput } from "@/lib/contracts/fits";
import { fitProvenance } from "@/lib/fit/provenance";
import { type ModelParams, modelParamsSchema } from "@/lib/physics/schema";
import type { Executor, Tx } from "../executor";
import { labMemberships, labs, measurementSets, parameterSets, parameterSetVersions, users } from "../schema";
import type { LabRole } from "@/lib/contracts/roles";
import { recordAudit } from "./audit";
import type { Caller, ResourceAccess } from "@/lib/contracts/access";

/*
 * Parameter sets and their immutable versions. Every query of one set takes the proof
 * lib/auth/access.ts authorize() made for it and filters on both the set's id and its lab, so a
 * proof can never reach a set of another lab; the actor of a change is the proof's caller.
 */

type SetAccess = ResourceAccess<"parameter_set">;

const NOT_FOUND = "No such parameter set.";
const createdByUser = alias(users, "created_by_user");
const updatedByUser = alias(users, "updated_by_user");

const summaryColumns = {
  id: parameterSets.id,
  labId: parameterSets.labId,
  labName: labs.name,
  name: parameterSets.name,
  description: parameterSets.description,
  tags: parameterSets.tags,
  version: parameterSets.version,
  createdAt: parameterSets.createdAt,
  updatedAt: parameterSets.updatedAt,
  createdById: createdByUser.id,
  createdByName: createdByUser.name,
  updatedById: updatedByUser.id,
  updatedByName: updatedByUser.name,
};

type SummaryRow = {
  [K in keyof typeof summaryColumns]: (typeof summaryColumns)[K]["_"]["data"];
};

function toSummary(row: SummaryRow, role: LabRole): ParameterSetSummary {
  return {
    id: row.id,
    labId: row.labId,
    labName: row.labName,
    name: row.name,
    description: row.description,
    tags: row.tags,
    version: row.version,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
    createdBy: { id: row.createdById, name: row.createdByName },
    updatedBy: { id: row.updatedById, name: row.updatedByName },
    role,
  };
}

// LIKE wildcards in a search box are literal text to the user.
const escapeLike = (text: string) => text.replace(/[\\%_]/g, (c) => `\\${c}`);

/** Sets in the caller's labs (every lab for a site admin), newest edit first; `lab` narrows to one of them. */
export async function listParameterSets(
  db: Executor,
  options: {
    caller: Caller;
    lab?: ResourceAccess<"lab">;
    q?: string;
    tag?: string;
    page: PageQuery;
  },
): Promise<Page<ParameterSetSummary>> {
  const isAdmin = options.caller.siteRole === "admin";
  const conditions: (SQL | undefined)[] = [];
  if (!isAdmin) conditions.push(eq(labMemberships.userId, options.caller.id));
  if (options.lab) conditions.push(eq(parameterSets.labId, options.lab.labId));
  if (options.q) {
    const pattern = `%${escapeLike(options.q)}%`;
    conditions.push(or(ilike(parameterSets.name, pattern), ilike(parameterSets.description, pattern)));
  }
  if (options.tag) conditions.push(sql`${options.tag} = any(${parameterSets.tags})`);
  const after = decodeCursor(options.page.cursor, timeIdCursor);
  if (after) conditions.push(sql`(${parameterSets.updatedAt}, ${parameterSets.id}) < (${after[0]}::timestamptz, ${after[1]}::uuid)`);
  // Non-members' sets are filtered in SQL (not after the fetch), so every page is full.
  if (!isAdmin) conditions.push(sql`${labMemberships.role} is not null`);

  const rows = await db
    .select({ ...summaryColumns, memberRole: labMemberships.role, cursorAt: sql<string>`${parameterSets.updatedAt}::text` })
    .from(parameterSets)
    .innerJoin(labs, eq(labs.id, parameterSets.labId))
    .innerJoin(createdByUser, eq(createdByUser.id, parameterSets.createdById))
    .innerJoin(updatedByUser, eq(updatedByUser.id, parameterSets.updatedById))
    .leftJoin(labMemberships, and(eq(labMemberships.labId, parameterSets.labId), eq(labMemberships.userId, options.caller.id)))
    .where(and(...conditions))
    .orderBy(desc(parameterSets.updatedAt), desc(parameterSets.id))
    .limit(options.page.limit + 1);
  return toPage(
    rows,
    options.page.limit,
    (row) => toSummary(row, isAdmin ? "owner" : (row.memberRole ?? "viewer")),
    (row) => [row.cursorAt, row.id],
  );
}

/**
 * The proof's set id, as long as the set is still in the proof's lab: awaited, a row or none; in a
 * WHERE, a subquery that ties a child table (links, views) to the set and its lab.
 */
export function selectSetInLab(db: Executor, access: SetAccess) {
  return db
    .select({ id: parameterSets.id })
    .from(parameterSets)
    .where(and(eq(parameterSets.id, access.id), eq(parameterSets.labId, access.labId)));
}

/** One set, found by its id inside a lab, as the caller with `role` sees it. */
async function loadItem(executor: Executor, options: { id: string; labId: string; role: LabRole }): Promise<ParameterSet | null> {
  const [row] = await executor
    .select({ ...summaryColumns, params: parameterSets.params, viewState: parameterSets.viewState })
    .from(parameterSets)
    .innerJoin(labs, eq(labs.id, parameterSets.labId))
    .innerJoin(createdByUser, eq(createdByUser.id, parameterSets.createdById))
    .innerJoin(updatedByUser, eq(updatedByUser.id, parameterSets.updatedById))
    .where(and(eq(parameterSets.id, options.id), eq(parameterSets.labId, options.labId)))
    .limit(1);
  if (!row) return null;
  return { ...toSummary(row, options.role), params: row.params, viewState: row.viewState ?? null };
}

async function requireItem(executor: Executor, options: { id: string; labId: string; role: LabRole }): Promise<ParameterSet> {
  const item = await loadItem(executor, options);
  if (!item) throw notFound(NOT_FOUND);
  return item;
}

/** The set the proof is for; null when it was deleted since. */
export async function getParameterSet(db: Executor, options: { access: SetAccess }): Promise<ParameterSet | null> {
  return loadItem(db, options.access);
}

function duplicateName(error: unknown, name: string): DomainError | null {
  if (uniqueViolation(error) !== "parameter_sets_lab_name_unique") return null;
  return new DomainError("conflict", `A parameter set named “${name}” already exists in this lab.`, {
    fields: { name: "This lab already has a parameter set with this name." },
  });
}

/** A new set, version 1, in the lab the proof is for; `provenance` says where version 1 came from (e.g. a library material). */
export async function createParameterSet(
  db: Executor,
  options: { access: ResourceAccess<"lab">; input: CreateParameterSetInput; provenance?: Record<string, unknown> },
): Promise<ParameterSet> {
  const { access, input } = options;
  const { caller, labId } = access;
  try {
    return await db.transaction(async (tx) => {
      const [row] = await tx
        .insert(parameterSets)
        .values({
          labId,
          name: input.name,
          description: input.description,
          tags: input.tags,
          params: input.params,
          version: 1,
          createdById: caller.id,
          updatedById: caller.id,
        })
        .returning({ id: parameterSets.id, createdAt: parameterSets.createdAt });
      if (!row) throw new Error("insert into parameter_sets returned no row");
      await tx.insert(parameterSetVersions).values({
        setId: row.id,
        version: 1,
        name: input.name,
        description: input.description,
        tags: input.tags,
        params: input.params,
        provenance: options.provenance ?? null,
        createdById: caller.id,
        createdAt: row.createdAt,
      });
      await recordAudit(tx, {
        entry: {
          actorId: caller.id,
          action: "parameter_set.create",
          targetType: "parameter_set",
          targetId: row.id,
          labId,
          details: { name: input.name, version: 1, ...(options.provenance ? { from: options.provenance } : {}) },
        },
      });
      return requireItem(tx, { id: row.id, labId, role: access.role });
    });
  } catch (error) {
    throw duplicateName(error, input.name) ?? error;
  }
}

interface Content {
  name: string;
  description: string;
  tags: string[];
  params: ModelParams;
}

const CONTENT_KEYS = ["name", "description", "tags", "params"] as const satisfies readonly (keyof Content)[];

/**
 * Equality of JSON values regardless of object key order (jsonb does not keep the order the client
 * sent); array order counts.
 */
function sameJson(a: unknown, b: unknown): boolean {
  if (a === b) return true;
  if (Array.isArray(a) || Array.isArray(b)) {
    return Array.isArray(a) && Array.isArray(b) && a.length === b.length && a.every((item, i) => sameJson(item, b[i]));
  }
  if (a === null || b === null || typeof a !== "object" || typeof b !== "object") return false;
  const aKeys = Object.keys(a);
  const bRecord = b as Record<string, unknown>;
  if (aKeys.length !== Object.keys(bRecord).length) return false;
  return aKeys.every((key) => Object.hasOwn(bRecord, key) && sameJson((a as Record<string, unknown>)[key], bRecord[key]));
}

/**
 * Saves new content as version current+1 (with its immutable snapshot), after locking the row and
 * checking the version the client edited. Shared by PATCH and restore.
 */
async function saveNewVersion(
  tx: Tx,
  options: {
    access: SetAccess;
    expectedVersion: number | undefined;
    content: (current: Content & { version: number }) => Promise<Content> | Content;
    /** When the new content equals the current one: save nothing and answer the item as it is. */
    skipIfUnchanged?: boolean;
    /** Where the new version came from (e.g. a fit), stored with its snapshot. */
    provenance?: Record<string, unknown>;
    /** The saver's note and, for a restore, the version copied. */
    note?: string;
    restoredFrom?: number;
    audit: { action: AuditAction; details: (changed: (keyof Content)[]) => Record<string, unknown> };
  },
): Promise<ParameterSet> {
  const { access } = options;
  const [current] = await tx
    .select({
      version: parameterSets.version,
      name: parameterSets.name,
      description: parameterSets.description,
      tags: parameterSets.tags,
      params: parameterSets.params,
    })
    .from(parameterSets)
    .where(and(eq(parameterSets.id, access.id), eq(parameterSets.labId, access.labId)))
    .for("update");
  if (!current) throw notFound(NOT_FOUND);
  if (options.expectedVersion !== undefined && options.expectedVersion !== current.version) {
    const latest = await requireItem(tx, access);
    throw new DomainError(
      "stale_version",
      `Someone saved version ${current.version} after the version ${options.expectedVersion} you edited. ` +
        "Reload and apply your changes again.",
      { extra: { current: latest } },
    );
  }
  const next = await options.content(current);
  const changed = CONTENT_KEYS.filter((key) => !sameJson(next[key], current[key]));
  // A save that changes nothing must not add a version identical to the current one.
  if (options.skipIfUnchanged && changed.length === 0) return requireItem(tx, access);
  const version = current.version + 1;
  const now = new Date();
  await tx
    .update(parameterSets)
    .set({ ...next, version, updatedById: access.caller.id, updatedAt: now })
    .where(and(eq(parameterSets.id, access.id), eq(parameterSets.labId, access.labId)));
  await tx.insert(parameterSetVersions).values({
    setId: access.id,
    version,
    ...next,
    provenance: options.provenance ?? null,
    note: options.note ?? "",
    restoredFrom: options.restoredFrom ?? null,
    createdById: access.caller.id,
    createdAt: now,
  });
  await recordAudit(tx, {
    entry: {
      actorId: access.caller.id,
      action: options.audit.action,
      targetType: "parameter_set",
      targetId: access.id,
      labId: access.labId,
      details: { ...options.audit.details(changed), version },
    },
  });
  return requireItem(tx, access);
}

export async function updateParameterSet(
  db: Executor,
  options: { access: SetAccess; input: UpdateParameterSetInput },
): Promise<ParameterSet> {
  const { input } = options;
  try {
    return await db.transaction((tx) =>
      saveNewVersion(tx, {
        access: options.access,
        expectedVersion: input.version,
        content: (current) => ({
          name: input.name ?? current.name,
          description: input.description ?? current.description,
          tags: input.tags ?? current.tags,
          params: input.params ?? current.params,
        }),
        skipIfUnchanged: true,
        note: input.note,
        audit: { action: "parameter_set.update", details: (changed) => ({ changed }) },
      }),
    );
  } catch (error) {
    throw duplicateName(error, input.name ?? "") ?? error;
  }
}

export async function restoreParameterSetVersion(
  db: Executor,
  options: { access: SetAccess; restoreVersion: number; expectedVersion: number },
): Promise<ParameterSet> {
  const { access } = options;
  let restoredName = "";
  try {
    return await db.transaction((tx) =>
      saveNewVersion(tx, {
        access,
        expectedVersion: options.expectedVersion,
        content: async () => {
          const [old] = await tx
            .select({
              name: parameterSetVersions.name,
              description: parameterSetVersions.description,
              tags: parameterSetVersions.tags,
              params: parameterSetVersions.params,
            })
            .from(parameterSetVersions)
            .where(and(eq(parameterSetVersions.setId, access.id), eq(parameterSetVersions.version, options.restoreVersion)));
          if (!old) throw notFound(`This parameter set has no version ${options.restoreVersion}.`);
          restoredName = old.name;
          return old;
        },
        restoredFrom: options.restoreVersion,
        audit: { action: "parameter_set.restore", details: () => ({ restoredVersion: options.restoreVersion }) },
      }),
    );
  } catch (error) {
    throw duplicateName(error, restoredName) ?? error;
  }
}

/**
 * The provenance may name only measurement sets of the set's own lab (others do not exist for the
 * caller): the first one that is not there is a validation error on its field.
 */
async function requireSameLabMeasurements(db: Executor, options: { access: SetAccess; input: SaveFitInput }): Promise<void> {
  const ids = options.input.fit.measurementSets.map((m) => m.id);
  const rows = await db
    .select({ id: measurementSets.id })
    .from(measurementSets)
    .where(and(inArray(measurementSets.id, ids), eq(measurementSets.labId, options.access.labId)));
  const inLab = new Set(rows.map((row) => row.id));
  const foreign = ids.findIndex((id) => !inLab.has(id));
  if (foreign >= 0) {
    throw new DomainError("validation", "The fit names a measurement set that is not in this parameter set's lab.", {
      fields: { [`fit.measurementSets.${foreign}.id`]: "no such measurement set in this lab" },
    });
  }
}

/**
 * Saves fitted values as a new version with the fit's provenance. The fit started from
 * `input.version`; a newer current version is refused (stale_version) like an edit. The merged parameters are
 * validated with the one model schema, so a fit can never store an invalid set.
 */
export async function saveFitAsVersion(db: Executor, options: { access: SetAccess; input: SaveFitInput }): Promise<ParameterSet> {
  const { input } = options;
  await requireSameLabMeasurements(db, options);
  return db.transaction((tx) =>
    saveNewVersion(tx, {
      access: options.access,
      expectedVersion: input.version,
      content: (current) => {
        const merged = modelParamsSchema.safeParse({ ...current.params, ...input.values });
        if (!merged.success) {
          const fields = zodIssueFields(merged.error.issues);
          throw new DomainError(
            "validation",
            `The fitted values do not make a valid parameter set: ${Object.entries(fields)
              .map(([k, m]) => `${k} ${m}`)
              .join("; ")}`,
            {
              fields: Object.fromEntries(Object.entries(fields).map(([k, m]) => [`values.${k}`, m])),
            },
          );
        }
        return { name: current.name, description: current.description, tags: current.tags, params: merged.data };
      },
      provenance: { ...fitProvenance(input) },
      audit: {
        action: "parameter_set.fit",
        details: () => ({ free: input.fit.free.map((f) => f.key), measurementSets: input.fit.measurementSets.map((m) => m.id) }),
      },
    }),
  );
}

/** False when the set was already gone. */
export async function deleteParameterSet(db: Executor, options: { access: SetAccess }): Promise<boolean> {
  const { access } = options;
  return db.transaction(async (tx) => {
    const [row] = await tx
      .delete(parameterSets)
      .where(and(eq(parameterSets.id, access.id), eq(parameterSets.labId, access.labId)))
      .returning({ name: parameterSets.name, version: parameterSets.version });
    if (!row) return false;
    await recordAudit(tx, {
      entry: {
        actorId: access.caller.id,
        action: "parameter_set.delete",
        targetType: "parameter_set",
        targetId: access.id,
        labId: access.labId,
        details: row,
      },
    });
    return true;
  });
}

/** The set's versions, newest first; null when the set was deleted since. */
export async function listParameterSetVersions(
  db: Executor,
  options: { access: SetAccess; page: PageQuery },
): Promise<Page<ParameterSetVersion> | null> {
  const { access } = options;
  const [exists] = await selectSetInLab(db, access).limit(1);
  if (!exists) return null;
  const before = decodeCursor(options.page.cursor, versionCursor);
  const rows = await db
    .select({
      version: parameterSetVersions.version,
      name: parameterSetVersions.name,
      description: parameterSetVersions.description,
      tags: parameterSetVersions.tags,
      params: parameterSetVersions.params,
      provenance: parameterSetVersions.provenance,
      note: parameterSetVersions.note,
      restoredFrom: parameterSetVersions.restoredFrom,
      createdAt: parameterSetVersions.createdAt,
      createdById: users.id,
      createdByName: users.name,
    })
    .from(parameterSetVersions)
    .innerJoin(parameterSets, eq(parameterSets.id, parameterSetVersions.setId))
    .innerJoin(users, eq(users.id, parameterSetVersions.createdById))
    .where(
      and(
        eq(parameterSetVersions.setId, access.id),
        eq(parameterSets.labId, access.labId),
        before ? lt(parameterSetVersions.version, before[0]) : undefined,
      ),
    )
    .orderBy(desc(parameterSetVersions.version))
    .limit(options.page.limit + 1);
  return toPage(
    rows,
    options.page.limit,
    (row) => ({
      version: row.version,
      name: row.name,
      description: row.description,
      tags: row.tags,
      params: row.params,
      provenance: row.provenance ?? null,
      note: row.note,
      restoredFrom: row.restoredFrom,
      createdAt: row.createdAt.toISOString(),
      createdBy: { id: row.createdById, name: row.createdByName },
    }),
    (row) => [row.version],
  );
}

/** Stores the workbench's view state; not a content change, so no new version. */
export async function saveParameterSetViewState(
  db: Executor,
  options: { access: SetAccess; viewState: Record<string, unknown> | null },
): Promise<ParameterSet> {
  const { access } = options;
  return db.transaction(async (tx) => {
    const rows = await tx
      .update(parameterSets)
      .set({ viewState: options.viewState })
      .where(and(eq(parameterSets.id, access.id), eq(parameterSets.labId, access.labId)))
      .returning({ id: parameterSets.id });
    if (rows.length === 0) throw notFound(NOT_FOUND);
    await recordAudit(tx, {
      entry: {
        actorId: access.caller.id,
        action: "parameter_set.view_state",
        targetType: "parameter_set",
        targetId: access.id,
        labId: access.labId,
        details: { cleared: options.viewState === null },
      },
    });
    return requireItem(tx, access);
  });
}
