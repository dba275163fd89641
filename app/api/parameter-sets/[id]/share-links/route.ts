import { db } from "@/db/client";
import { createShareLink, listShareLinks } from "@/db/queries/share-links";
import { readPage } from "@/lib/api/paging";
import { apiRoute, json } from "@/lib/api/route";
import { authorize, requireCaller } from "@/lib/auth/access";
import { generateLinkSecret } from "@/lib/auth/tokens";
import { appLink } from "@/lib/mail/send";

type Params = { id: string };

/** GET /api/parameter-sets/{id}/share-links?limit=&cursor= (editor) → { items, nextCursor }: live links */
export const GET = apiRoute<Params>(async (request, { params }) => {
  const { id } = await params;
  const caller = await requireCaller(request);
  const access = await authorize(caller, { kind: "parameter_set", id }, "editor");
  return json(await listShareLinks(db, { access, page: readPage(request) }));
});

/**
 * POST /api/parameter-sets/{id}/share-links (editor, no body) → 201 { item, url }. The URL holds
 * the secret and is shown this once: only its hash is stored.
 */
export const POST = apiRoute<Params>(async (request, { params }) => {
  const { id } = await params;
  const caller = await requireCaller(request);
  const access = await authorize(caller, { kind: "parameter_set", id }, "editor");
  const { secret, secretHash } = generateLinkSecret();
  const item = await createShareLink(db, { access, tokenHash: secretHash });
  return json({ item, url: appLink(`/shared/${secret}`) }, 201);
});
