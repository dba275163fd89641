import { and, desc, eq, inArray, isNull, sql } from "drizzle-orm";
import type { SharedSet, ShareLinkSummary } from "@/lib/contracts/sharing";
import { decodeCursor, timeIdCursor, toPage } from "@/db/paging";
import type { Page, PageQuery } from "@/lib/contracts/paging";
import type { ResourceAccess } from "@/lib/contracts/access";
import type { Executor } from "../executor";
import { parameterSets, shareLinks, users } from "../schema";
import { recordAudit } from "./audit";
import { selectSetInLab } from "./parameter-sets";

/*
 * Read-only share links to one parameter set. Only the sha256 of the link's token is stored; the
 * link itself is shown once, to the editor who makes it. Managing links takes the proof
 * authorize() made for the set; opening one takes only the token.
 */

type SetAccess = ResourceAccess<"parameter_set">;

export async function createShareLink(db: Executor, options: { access: SetAccess; tokenHash: string }): Promise<ShareLinkSummary> {
  const { access } = options;
  const actorId = access.caller.id;
  return db.transaction(async (tx) => {
    const [row] = await tx
      .insert(shareLinks)
      .values({ setId: access.id, tokenHash: options.tokenHash, createdById: actorId })
      .returning({ id: shareLinks.id, createdAt: shareLinks.createdAt });
    if (!row) throw new Error("insert into share_links returned no row");
    await recordAudit(tx, {
      entry: {
        actorId,
        action: "share_link.create",
        targetType: "parameter_set",
        targetId: access.id,
        labId: access.labId,
        details: { linkId: row.id },
      },
    });
    const [actor] = await tx.select({ id: users.id, name: users.name }).from(users).where(eq(users.id, actorId));
    return { id: row.id, createdAt: row.createdAt.toISOString(), createdBy: actor ?? null };
  });
}

/** The set's live (unrevoked) links, newest first. */
export async function listShareLinks(db: Executor, options: { access: SetAccess; page: PageQuery }): Promise<Page<ShareLinkSummary>> {
  const { access } = options;
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
        eq(shareLinks.setId, access.id),
        inArray(shareLinks.setId, selectSetInLab(db, access)),
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

/** False when the set has no live link with this id. */
export async function revokeShareLink(db: Executor, options: { access: SetAccess; linkId: string }): Promise<boolean> {
  const { access } = options;
  return db.transaction(async (tx) => {
    const [row] = await tx
      .update(shareLinks)
      .set({ revokedAt: new Date() })
      .where(
        and(
          eq(shareLinks.id, options.linkId),
          eq(shareLinks.setId, access.id),
          inArray(shareLinks.setId, selectSetInLab(tx, access)),
          isNull(shareLinks.revokedAt),
        ),
      )
      .returning({ id: shareLinks.id });
    if (!row) return false;
    await recordAudit(tx, {
      entry: {
        actorId: access.caller.id,
        action: "share_link.revoke",
        targetType: "parameter_set",
        targetId: access.id,
        labId: access.labId,
        details: { linkId: row.id },
      },
    });
    return true;
  });
}

/** The set behind a live link (anyone holding the link may read it); null for unknown or revoked links. */
export async function findSharedSet(db: Executor, options: { tokenHash: string }): Promise<SharedSet | null> {
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
