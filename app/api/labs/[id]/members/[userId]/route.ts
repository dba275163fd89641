import { db } from "@/db/client";
import { changeMember } from "@/db/queries/labs";
import { readJson } from "@/lib/api/body";
import { apiRoute, json, noContent } from "@/lib/api/route";
import { authorizeLab, requireCaller } from "@/lib/auth/access";
import type { ResourceAccess } from "@/lib/contracts/access";
import { DomainError, forbidden, notFound } from "@/lib/contracts/errors";
import { changeMemberSchema } from "@/lib/contracts/labs";
import type { LabRole } from "@/lib/contracts/roles";
import { isUuid } from "@/lib/contracts/validation";

type Params = { id: string; userId: string };

async function change(options: { access: ResourceAccess<"lab">; userId: string; role: LabRole | null }) {
  if (!isUuid(options.userId)) throw notFound("No such member.");
  const result = await changeMember(db, options);
  if (!result.ok && result.reason === "not_member") throw notFound("No such member.");
  if (!result.ok && result.reason === "not_owner")
    throw forbidden("Only an owner of this lab can change members; your role changed meanwhile.");
  if (!result.ok) throw new DomainError("conflict", "A lab needs at least one owner: make someone else owner first.");
  return result.member;
}

/** PATCH /api/labs/{id}/members/{userId} { role } (owner) → { item } */
export const PATCH = apiRoute<Params>(async (request, { params }) => {
  const { id, userId } = await params;
  const caller = await requireCaller(request);
  // Authorize before reading the body, as everywhere: a non-owner learns nothing from validation.
  const access = await authorizeLab(caller, id, "owner");
  const { role } = await readJson(request, changeMemberSchema);
  return json({ item: await change({ access, userId, role }) });
});

/** DELETE /api/labs/{id}/members/{userId} (owner) → 204 */
export const DELETE = apiRoute<Params>(async (request, { params }) => {
  const { id, userId } = await params;
  const caller = await requireCaller(request);
  const access = await authorizeLab(caller, id, "owner");
  await change({ access, userId, role: null });
  return noContent();
});
