import { and, asc, eq } from "drizzle-orm";
import { uniqueViolation } from "@/db/errors";
import { DomainError, notFound, validationError } from "@/lib/contracts/errors";
import {
  type CreateLightSourceInput,
  type LightSource,
  type UpdateLightSourceInput,
  lightSourceInputSchema,
} from "@/lib/contracts/light-sources";
import type { Executor } from "../executor";
import { lightSources, type LightSourceRow } from "../schema";
import { recordAudit } from "./audit";
import type { ResourceAccess } from "@/lib/contracts/access";

/*
 * A lab's light sources. Every query of one source takes the proof lib/auth/access.ts authorize()
 * made for it and filters on both its id and its lab, so a proof can never reach a source of
 * another lab; the actor of a change is the proof's caller.
 */

type SourceAccess = ResourceAccess<"light_source">;

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

export async function listLightSources(db: Executor, options: { access: ResourceAccess<"lab"> }): Promise<LightSource[]> {
  const rows = await db
    .select()
    .from(lightSources)
    .where(eq(lightSources.labId, options.access.labId))
    .orderBy(asc(lightSources.wavelengthNm), asc(lightSources.name));
  return rows.map(toDto);
}

/** The source the proof is for; null when it was deleted since. */
export async function getLightSource(db: Executor, options: { access: SourceAccess }): Promise<LightSource | null> {
  const { access } = options;
  const [row] = await db
    .select()
    .from(lightSources)
    .where(and(eq(lightSources.id, access.id), eq(lightSources.labId, access.labId)))
    .limit(1);
  return row ? toDto(row) : null;
}

/** A new source in the lab the proof is for (the lab `input.labId` named, which authorize checked). */
export async function createLightSource(
  db: Executor,
  options: { access: ResourceAccess<"lab">; input: CreateLightSourceInput },
): Promise<LightSource> {
  const { access, input } = options;
  try {
    return await db.transaction(async (tx) => {
      const [row] = await tx
        .insert(lightSources)
        .values({ ...input, labId: access.labId })
        .returning();
      if (!row) throw new Error("insert into light_sources returned no row");
      await recordAudit(tx, {
        entry: {
          actorId: access.caller.id,
          action: "light_source.create",
          targetType: "light_source",
          targetId: row.id,
          labId: access.labId,
          details: { name: input.name, wavelengthNm: input.wavelengthNm },
        },
      });
      return toDto(row);
    });
  } catch (error) {
    throw duplicateName(error, input.name) ?? error;
  }
}

export async function updateLightSource(
  db: Executor,
  options: { access: SourceAccess; patch: UpdateLightSourceInput },
): Promise<LightSource> {
  const { access, patch } = options;
  const { id, labId } = access;
  const current = await getLightSource(db, { access });
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
          actorId: access.caller.id,
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

export async function deleteLightSource(db: Executor, options: { access: SourceAccess }): Promise<void> {
  const { id, labId, caller } = options.access;
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
