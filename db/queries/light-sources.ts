import "server-only";
import { and, asc, eq } from "drizzle-orm";
import { uniqueViolation } from "@/db/errors";
import { DomainError, notFound, validationError } from "@/lib/contracts/errors";
import {
  type CreateLightSourceInput,
  type LightSource,
  type UpdateLightSourceInput,
  lightSourceInputSchema,
} from "@/lib/contracts/light-sources";
import { db } from "../client";
import { lightSources, type LightSourceRow } from "../schema";
import { recordAudit } from "./audit";
import type { Caller } from "@/lib/contracts/access";

/*
 * A lab's light sources. Callers pass the lab they were authorized for (requireLabRole) and every
 * query filters on it, so an id from another lab finds nothing.
 */

const NOT_FOUND = "No such light source.";

function toDto(row: LightSourceRow): LightSource {
  return {
    id: row.id,
    labId: row.labId,
    name: row.name,
    wavelengthNm: row.wavelengthNm,
    tunableMinNm: row.tunableMinNm,
    tunableMaxNm: row.tunableMaxNm,
    powerW: row.powerW,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
  };
}

function duplicateName(error: unknown, name: string): DomainError | null {
  if (uniqueViolation(error) !== "light_sources_lab_name_unique") return null;
  return new DomainError("conflict", `This lab already has a light source named “${name}”.`, {
    fields: { name: "This lab already has a light source with this name." },
  });
}

export async function listLightSources(options: { labId: string }): Promise<LightSource[]> {
  const rows = await db
    .select()
    .from(lightSources)
    .where(eq(lightSources.labId, options.labId))
    .orderBy(asc(lightSources.wavelengthNm), asc(lightSources.name));
  return rows.map(toDto);
}

/** The lab a light source belongs to (for requireLabRole), or null. */
export async function findLightSourceLabId(options: { id: string }): Promise<string | null> {
  const [row] = await db.select({ labId: lightSources.labId }).from(lightSources).where(eq(lightSources.id, options.id)).limit(1);
  return row?.labId ?? null;
}

export async function getLightSource(options: { id: string; labId: string }): Promise<LightSource | null> {
  const [row] = await db
    .select()
    .from(lightSources)
    .where(and(eq(lightSources.id, options.id), eq(lightSources.labId, options.labId)))
    .limit(1);
  return row ? toDto(row) : null;
}

export async function createLightSource(options: { caller: Caller; input: CreateLightSourceInput }): Promise<LightSource> {
  const { caller, input } = options;
  try {
    return await db.transaction(async (tx) => {
      const [row] = await tx.insert(lightSources).values(input).returning();
      if (!row) throw new Error("insert into light_sources returned no row");
      await recordAudit(tx, {
        entry: {
          actorId: caller.id,
          action: "light_source.create",
          targetType: "light_source",
          targetId: row.id,
          labId: input.labId,
          details: { name: input.name, wavelengthNm: input.wavelengthNm },
        },
      });
      return toDto(row);
    });
  } catch (error) {
    throw duplicateName(error, input.name) ?? error;
  }
}

export async function updateLightSource(options: {
  caller: Caller;
  id: string;
  labId: string;
  patch: UpdateLightSourceInput;
}): Promise<LightSource> {
  const { caller, id, labId, patch } = options;
  const current = await getLightSource({ id, labId });
  if (!current) throw notFound(NOT_FOUND);
  // The range rule spans fields, so the merged line is checked as a whole.
  const merged = lightSourceInputSchema.safeParse({
    name: patch.name ?? current.name,
    wavelengthNm: patch.wavelengthNm ?? current.wavelengthNm,
    tunableMinNm: patch.tunableMinNm === undefined ? current.tunableMinNm : patch.tunableMinNm,
    tunableMaxNm: patch.tunableMaxNm === undefined ? current.tunableMaxNm : patch.tunableMaxNm,
    powerW: patch.powerW === undefined ? current.powerW : patch.powerW,
  });
  if (!merged.success) throw validationError(merged.error);
  try {
    return await db.transaction(async (tx) => {
      const [row] = await tx
        .update(lightSources)
        .set({ ...merged.data, updatedAt: new Date() })
        .where(and(eq(lightSources.id, id), eq(lightSources.labId, labId)))
        .returning();
      if (!row) throw notFound(NOT_FOUND);
      await recordAudit(tx, {
        entry: {
          actorId: caller.id,
          action: "light_source.update",
          targetType: "light_source",
          targetId: id,
          labId,
          details: { name: row.name },
        },
      });
      return toDto(row);
    });
  } catch (error) {
    throw duplicateName(error, merged.data.name) ?? error;
  }
}

export async function deleteLightSource(options: { caller: Caller; id: string; labId: string }): Promise<void> {
  const { caller, id, labId } = options;
  await db.transaction(async (tx) => {
    const [row] = await tx
      .delete(lightSources)
      .where(and(eq(lightSources.id, id), eq(lightSources.labId, labId)))
      .returning({ name: lightSources.name });
    if (!row) throw notFound(NOT_FOUND);
    await recordAudit(tx, {
      entry: {
        actorId: caller.id,
        action: "light_source.delete",
        targetType: "light_source",
        targetId: id,
        labId,
        details: { name: row.name },
      },
    });
  });
}
