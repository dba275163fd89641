import { db } from "@/db/client";
import { listLabs } from "@/db/queries/labs";
import { apiRoute, json } from "@/lib/api/route";
import { requireCaller } from "@/lib/auth/access";

/** GET /api/labs → { items: [{ id, name, role }] } (site admin: every lab, as owner) */
export const GET = apiRoute(async (request) => {
  const caller = await requireCaller(request);
  return json({ items: await listLabs(db, { caller }) });
});
