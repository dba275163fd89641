import { db } from "@/db/client";
import { restoreParameterSetVersion } from "@/db/queries/parameter-sets";
import { readJson } from "@/lib/api/body";
import { notFound } from "@/lib/contracts/errors";
import { apiRoute, json } from "@/lib/api/route";
import { restoreVersionSchema } from "@/lib/contracts/parameter-sets";
import { authorize, requireCaller } from "@/lib/auth/access";

/**
 * POST /api/parameter-sets/{id}/versions/{n}/restore { version } (editor) → { item }: a new
 * version whose content equals version n. `version` (required, like PATCH's) is the current
 * version the client saw (stale → 409 stale_version), so a restore is never a blind write.
 */
export const POST = apiRoute<{ id: string; n: string }>(async (request, { params }) => {
  const { id, n } = await params;
  const caller = await requireCaller(request);
  const access = await authorize(caller, { kind: "parameter_set", id }, "editor");
  if (!/^[1-9][0-9]{0,8}$/.test(n)) throw notFound(`This parameter set has no version ${n}.`);
  const body = await readJson(request, restoreVersionSchema);
  const item = await restoreParameterSetVersion(db, { access, restoreVersion: Number(n), expectedVersion: body.version });
  return json({ item });
});
