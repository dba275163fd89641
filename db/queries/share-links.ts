import "server-only";
import { and, desc, eq, isNull, sql } from "drizzle-orm";
import type { SharedSet, ShareLinkSummary } from "@/lib/contracts/sharing";
import { decodeCursor, timeIdCursor, toPage } from "@/db/paging";
import { type Page } from "@/lib/contracts/paging";
import type { PageQuery } from "@/lib/contracts/paging";
import { db } from "../client";
import { parameterSets, shareLinks, users } from "../schema";
import { recordAudit } from "./audit";

/*
 * Read-only share links to one parameter set. Only the sha256 of the link's token is stored; the
 * link itself is shown once, to the editor who makes it.
 */

export async function createShareLink(options: {
  actorId: string;
  setId: string;
  labId: string;
  tokenHash: string;
}): Promise<ShareLinkSummary> {
  return db.transaction(async (tx) => {
    const [row] = await tx
      .insert(shareLinks)
      .values({ setId: options.setId, tokenHash: options.tokenHash, createdById: options.actorId })
      .returning({ id: shareLinks.id, createdAt: shareLinks.createdAt });
    if (!row) throw new Error("insert into share_links returned no row");
    await recordAudit(tx, {
      entry: {
        actorId: options.actorId,
        action: "share_link.create",
        targetType: "parameter_set",
        targetId: options.setId,
        labId: options.labId,
        details: { linkId: row.id },
      },
    });
    const [actor] = await tx.select({ id: users.id, name: users.name }).from(users).where(eq(users.id, options.actorId));
    return { id: row.id, createdAt: row.createdAt.toISOString(), createdBy: actor ?? null };
  });
}

export async function listShareLinks(options: { setId: string; page: PageQuery }): Promise<Page<ShareLinkSummary>> {
  const after = decodeCursor(options.page.cursor, timeIdCursor);
  const rows = await db
    .select({
      id: shareLinks.id,
      createdAt: shareLinks.createdAt,
      byId: users.id,
      byName: users.name,
      cursorAt: sql<string>`${shareLinks.createdAt}::text`,
    })
    .from(shareLinks)
    .leftJoin(users, eq(users.id, shareLinks.createdById))
    .where(
      and(
        eq(shareLinks.setId, options.setId),
        isNull(shareLinks.revokedAt),
        after ? sql`(${shareLinks.createdAt}, ${shareLinks.id}) < (${after[0]}::timestamptz, ${after[1]}::uuid)` : undefined,
      ),
    )
    .orderBy(desc(shareLinks.createdAt), desc(shareLinks.id))
    .limit(options.page.limit + 1);
  return toPage(
    rows,
    options.page.limit,
    (row) => ({
      id: row.id,
      createdAt: row.createdAt.toISOString(),
      createdBy: row.byId && row.byName ? { id: row.byId, name: row.byName } : null,
    }),
    (row) => [row.cursorAt, row.id],
  );
}

export async function revokeShareLink(options: { actorId: string; setId: string; labId: string; linkId: string }): Promise<boolean> {
  return db.transaction(async (tx) => {
    const [row] = await tx
      .update(shareLinks)
      .set({ revokedAt: new Date() })
      .where(and(eq(shareLinks.id, options.linkId), eq(shareLinks.setId, options.setId), isNull(shareLinks.revokedAt)))
      .returning({ id: shareLinks.id });
    if (!row) return false;
    await recordAudit(tx, {
      entry: {
        actorId: options.actorId,
        action: "share_link.revoke",
        targetType: "parameter_set",
        targetId: options.setId,
        labId: options.labId,
        details: { linkId: row.id },
      },
    });
    return true;
  });
}

export async function findSharedSet(options: { tokenHash: string }): Promise<SharedSet | null> {
  const [row] = await db
    .select({
      name: parameterSets.name,
      description: parameterSets.description,
      tags: parameterSets.tags,
      version: parameterSets.version,
      updatedAt: parameterSets.updatedAt,
      params: parameterSets.params,
      viewState: parameterSets.viewState,
    })
    .from(shareLinks)
    .innerJoin(parameterSets, eq(parameterSets.id, shareLinks.setId))
    .where(and(eq(shareLinks.tokenHash, options.tokenHash), isNull(shareLinks.revokedAt)))
    .limit(1);
  if (!row) return null;
  return { ...row, updatedAt: row.updatedAt.toISOString(), viewState: row.viewState ?? null };
}
