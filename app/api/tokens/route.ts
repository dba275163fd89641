import { createToken, listTokens } from "@/db/queries/tokens";
import { readJson } from "@/lib/api/body";
import { apiRoute, json } from "@/lib/api/route";
import { createTokenSchema } from "@/lib/api/schemas";
import { requireCaller } from "@/lib/auth/access";
import { generateToken } from "@/lib/auth/tokens";

/** GET /api/tokens → { items: [{ id, name, createdAt, lastUsedAt }] } (the caller's live tokens) */
export const GET = apiRoute(async (request) => {
  const caller = await requireCaller(request);
  return json({ items: await listTokens({ userId: caller.id }) });
});

/** POST /api/tokens { name } → 201 { item, token }; the secret is shown this once only. */
export const POST = apiRoute(async (request) => {
  const caller = await requireCaller(request);
  const { name } = await readJson(request, createTokenSchema);
  const { token, tokenHash } = generateToken();
  const item = await createToken({ userId: caller.id, name, tokenHash });
  return json({ item, token }, 201);
});
