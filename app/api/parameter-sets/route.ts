import { createParameterSet, listParameterSets } from "@/db/queries/parameter-sets";
import { readJson } from "@/lib/api/body";
import { validationError } from "@/lib/contracts/errors";
import { readPage } from "@/lib/api/paging";
import { apiRoute, json } from "@/lib/api/route";
import { createParameterSetSchema, listParameterSetsQuery } from "@/lib/contracts/parameter-sets";
import { requireCaller, requireLabRole } from "@/lib/auth/access";

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
  if (labId) await requireLabRole(caller, labId, "viewer");
  return json(await listParameterSets({ caller, labId, q, tag, page: readPage(request) }));
});

/** POST /api/parameter-sets (editor) → 201 { item } */
export const POST = apiRoute(async (request) => {
  const caller = await requireCaller(request);
  const input = await readJson(request, createParameterSetSchema);
  const access = await requireLabRole(caller, input.labId, "editor");
  return json({ item: await createParameterSet({ caller, role: access.role, input }) }, 201);
});
