import { db } from "@/db/client";
import { listPointChanges } from "@/db/queries/measurement-points";
import { apiRoute, json } from "@/lib/api/route";
import { authorize, requireCaller } from "@/lib/auth/access";
import { validationError } from "@/lib/contracts/errors";
import { pointHistoryQuery } from "@/lib/contracts/measurement-sets";

type Params = { id: string };

/** GET /api/measurement-sets/{id}/history?limit= (viewer) → { items: PointChangeEntry[] }, newest revision first. */
export const GET = apiRoute<Params>(async (request, { params }) => {
  const { id } = await params;
  const caller = await requireCaller(request);
  const access = await authorize(caller, { kind: "measurement_set", id }, "viewer");
  const parsed = pointHistoryQuery.safeParse({ limit: new URL(request.url).searchParams.get("limit") || undefined });
  if (!parsed.success) throw validationError(parsed.error);
  return json({ items: await listPointChanges(db, { access, limit: parsed.data.limit }) });
});
