import { db } from "@/db/client";
import { createParameterSet, listParameterSets } from "@/db/queries/parameter-sets";
import { readJson } from "@/lib/api/body";
import { validationError } from "@/lib/contracts/errors";
import { readPage } from "@/lib/api/paging";
import { apiRoute, json } from "@/lib/api/route";
import { createParameterSetSchema, listParameterSetsQuery } from "@/lib/contracts/parameter-sets";
import { authorizeLab, requireCaller } from "@/lib/auth/access";

/** GET /api/parameter-sets?labId=&q=&tag=&limit=&cursor= → { items: ParameterSetSummary[], nextCursor } */
export const GET = apiRoute(async (request) => {
  const caller = await requireCaller(request);
  const search = new URL(request.url).searchParams;
  const parsed = listParameterSetsQuery.safeParse({
    labId: search.get("labId") || undefined,
    q: search.get("q") || undefined,
    tag: search.get("tag") || undefined,
  });
  if (!parsed.success) throw validationError(parsed.error);
  const { labId, q, tag } = parsed.data;
  // A lab filter names a lab: the caller must see it (404 otherwise, like any lab resource).
  const lab = labId ? await authorizeLab(caller, labId, "viewer") : undefined;
  return json(await listParameterSets(db, { caller, lab, q, tag, page: readPage(request) }));
});

/** POST /api/parameter-sets (editor) → 201 { item } */
export const POST = apiRoute(async (request) => {
  const caller = await requireCaller(request);
  const input = await readJson(request, createParameterSetSchema);
  const access = await authorizeLab(caller, input.labId, "editor");
  return json({ item: await createParameterSet(db, { access, input }) }, 201);
});
