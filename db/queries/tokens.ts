import { and, desc, eq, isNull, lt, or, sql } from "drizzle-orm";
import type { Page, PageQuery } from "@/lib/contracts/paging";
import type { TokenSummary } from "@/lib/contracts/tokens";
import type { Executor } from "../executor";
import { decodeCursor, timeIdCursor, toPage } from "../paging";
import { apiTokens, type User, users } from "../schema";
import { recordAudit } from "./audit";

const summary = (row: { id: string; name: string; createdAt: Date; lastUsedAt: Date | null }): TokenSummary => ({
  id: row.id,
  name: row.name,
  createdAt: row.createdAt.toISOString(),
  lastUsedAt: row.lastUsedAt?.toISOString() ?? null,
});

/** The user's live tokens, newest first. */
export async function listTokens(db: Executor, options: { userId: string; page: PageQuery }): Promise<Page<TokenSummary>> {
  const after = decodeCursor(options.page.cursor, timeIdCursor);
  const rows = await db
    .select({
      id: apiTokens.id,
      name: apiTokens.name,
      createdAt: apiTokens.createdAt,
      lastUsedAt: apiTokens.lastUsedAt,
      cursorAt: sql<string>`${apiTokens.createdAt}::text`,
    })
    .from(apiTokens)
    .where(
      and(
        eq(apiTokens.userId, options.userId),
        isNull(apiTokens.revokedAt),
        after ? sql`(${apiTokens.createdAt}, ${apiTokens.id}) < (${after[0]}::timestamptz, ${after[1]}::uuid)` : undefined,
      ),
    )
    .orderBy(desc(apiTokens.createdAt), desc(apiTokens.id))
    .limit(options.page.limit + 1);
  return toPage(rows, options.page.limit, summary, (row) => [row.cursorAt, row.id]);
}

export async function createToken(db: Executor, options: { userId: string; name: string; tokenHash: string }): Promise<TokenSummary> {
  return db.transaction(async (tx) => {
    const [row] = await tx
      .insert(apiTokens)
      .values({ userId: options.userId, name: options.name, tokenHash: options.tokenHash })
      .returning();
    if (!row) throw new Error("insert into api_tokens returned no row");
    await recordAudit(tx, {
      entry: { actorId: options.userId, action: "token.create", targetType: "api_token", targetId: row.id, details: { name: row.name } },
    });
    return summary(row);
  });
}

/** Revokes one of the caller's own tokens; false when there is no such live token of theirs. */
export async function revokeToken(db: Executor, options: { userId: string; tokenId: string }): Promise<boolean> {
  return db.transaction(async (tx) => {
    const rows = await tx
      .update(apiTokens)
      .set({ revokedAt: new Date() })
      .where(and(eq(apiTokens.id, options.tokenId), eq(apiTokens.userId, options.userId), isNull(apiTokens.revokedAt)))
      .returning({ id: apiTokens.id, name: apiTokens.name });
    const row = rows[0];
    if (!row) return false;
    await recordAudit(tx, {
      entry: { actorId: options.userId, action: "token.revoke", targetType: "api_token", targetId: row.id, details: { name: row.name } },
    });
    return true;
  });
}

// last_used_at is a hint for the settings page; writing it at most once a minute spares a write
// per API call.
const LAST_USED_GRANULARITY_MS = 60 * 1000;

/** The user a live (not revoked) token belongs to, or null. */
export async function findUserByTokenHash(db: Executor, options: { tokenHash: string }): Promise<User | null> {
  const [row] = await db
    .select({ user: users, tokenId: apiTokens.id })
    .from(apiTokens)
    .innerJoin(users, eq(users.id, apiTokens.userId))
    .where(and(eq(apiTokens.tokenHash, options.tokenHash), isNull(apiTokens.revokedAt)))
    .limit(1);
  if (!row) return null;
  const now = new Date();
  await db
    .update(apiTokens)
    .set({ lastUsedAt: now })
    .where(
      and(
        eq(apiTokens.id, row.tokenId),
        or(isNull(apiTokens.lastUsedAt), lt(apiTokens.lastUsedAt, new Date(now.getTime() - LAST_USED_GRANULARITY_MS))),
      ),
    );
  return row.user;
}
