import { db } from "@/db/client";
import { createToken, listTokens } from "@/db/queries/tokens";
import { readJson } from "@/lib/api/body";
import { readPage } from "@/lib/api/paging";
import { apiRoute, json } from "@/lib/api/route";
import { createTokenSchema } from "@/lib/contracts/tokens";
import { requireSessionCaller } from "@/lib/auth/access";
import { generateToken } from "@/lib/auth/tokens";

/*
 * Token management needs a browser session: a token that could mint tokens would let a leaked
 * one outlive its own revocation through its children.
 */

/** GET /api/tokens?limit=&cursor= → { items: [{ id, name, createdAt, lastUsedAt }], nextCursor } (live tokens) */
export const GET = apiRoute(async (request) => {
  const caller = await requireSessionCaller(request);
  return json(await listTokens(db, { userId: caller.id, page: readPage(request) }));
});

/** POST /api/tokens { name } → 201 { item, token }; the secret is shown this once only. */
export const POST = apiRoute(async (request) => {
  const caller = await requireSessionCaller(request);
  const { name } = await readJson(request, createTokenSchema);
  const { token, tokenHash } = generateToken();
  const item = await createToken(db, { userId: caller.id, name, tokenHash });
  return json({ item, token }, 201);
});
