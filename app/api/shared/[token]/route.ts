import { db } from "@/db/client";
import { findSharedSet } from "@/db/queries/share-links";
import { notFound } from "@/lib/contracts/errors";
import { apiRoute } from "@/lib/api/route";
import { hashToken, isLinkSecret } from "@/lib/auth/tokens";

const GONE = "This share link does not exist or was revoked.";

/** GET /api/shared/{token} (anyone with the link) → { item }: that one set, read-only, nothing of its lab. */
export const GET = apiRoute<{ token: string }>(async (_request, { params }) => {
  const { token } = await params;
  if (!isLinkSecret(token)) throw notFound(GONE);
  const item = await findSharedSet(db, { tokenHash: hashToken(token) });
  if (!item) throw notFound(GONE);
  return Response.json({ item }, { headers: { "X-Robots-Tag": "noindex, nofollow", "Cache-Control": "no-store" } });
});
