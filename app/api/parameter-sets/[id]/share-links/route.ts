import { createShareLink, listShareLinks } from "@/db/queries/share-links";
import { readPage } from "@/lib/api/paging";
import { requireParameterSetRole } from "@/lib/api/parameter-set-access";
import { apiRoute, json } from "@/lib/api/route";
import { requireCaller } from "@/lib/auth/access";
import { generateLinkSecret } from "@/lib/auth/tokens";
import { appLink } from "@/lib/mail/send";

type Params = { id: string };

/** GET /api/parameter-sets/{id}/share-links?limit=&cursor= (editor) → { items, nextCursor }: live links */
export const GET = apiRoute<Params>(async (request, { params }) => {
  const { id } = await params;
  const caller = await requireCaller(request);
  await requireParameterSetRole(caller, id, "editor");
  return json(await listShareLinks({ setId: id, page: readPage(request) }));
});

/**
 * POST /api/parameter-sets/{id}/share-links (editor, no body) → 201 { item, url }. The URL holds
 * the secret and is shown this once: only its hash is stored.
 */
export const POST = apiRoute<Params>(async (request, { params }) => {
  const { id } = await params;
  const caller = await requireCaller(request);
  const access = await requireParameterSetRole(caller, id, "editor");
  const { secret, secretHash } = generateLinkSecret();
  const item = await createShareLink({ actorId: caller.id, setId: id, labId: access.labId, tokenHash: secretHash });
  return json({ item, url: appLink(`/shared/${secret}`) }, 201);
});
