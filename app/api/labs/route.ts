import { db } from "@/db/client";
import { createPersonalLab, listLabs } from "@/db/queries/labs";
import { readJson } from "@/lib/api/body";
import { apiRoute, json } from "@/lib/api/route";
import { requireCaller } from "@/lib/auth/access";
import { createPersonalLabSchema } from "@/lib/contracts/labs";
import { DomainError } from "@/lib/contracts/errors";

/** GET /api/labs → { items: [{ id, name, role }] } (site admin: every lab, as owner) */
export const GET = apiRoute(async (request) => {
  const caller = await requireCaller(request);
  return json({ items: await listLabs(db, { caller }) });
});

/**
 * POST /api/labs { name? } → 201 { item: { id, name, role: "owner" } }: the caller's personal lab,
 * for someone who joined through an invitation or was removed from every lab. One per person
 * (409 when the caller already owns their personal lab).
 */
export const POST = apiRoute(async (request) => {
  const caller = await requireCaller(request);
  const { name } = await readJson(request, createPersonalLabSchema);
  const result = await createPersonalLab(db, { caller, ...(name === undefined ? {} : { name }) });
  if (!result.ok) throw new DomainError("conflict", "You already have a personal lab.");
  return json({ item: result.lab }, 201);
});
