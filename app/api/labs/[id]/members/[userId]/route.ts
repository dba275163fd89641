import { changeMember } from "@/db/queries/labs";
import type { LabRole } from "@/lib/contracts/roles";
import { readJson } from "@/lib/api/body";
import { DomainError, forbidden, notFound } from "@/lib/contracts/errors";
import { isUuid } from "@/lib/contracts/validation";
import { apiRoute, json, noContent } from "@/lib/api/route";
import { changeMemberSchema } from "@/lib/contracts/labs";
import { requireCaller, requireLabRole } from "@/lib/auth/access";
import { type Caller } from "@/lib/contracts/access";

type Params = { id: string; userId: string };

async function change(options: { caller: Caller; labId: string; userId: string; role: LabRole | null }) {
  if (!isUuid(options.userId)) throw notFound("No such member.");
  const result = await changeMember({
    actorId: options.caller.id,
    actorIsSiteAdmin: options.caller.siteRole === "admin",
    labId: options.labId,
    userId: options.userId,
    role: options.role,
  });
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
  const access = await requireLabRole(caller, id, "owner");
  const { role } = await readJson(request, changeMemberSchema);
  return json({ item: await change({ caller, labId: access.labId, userId, role }) });
});

/** DELETE /api/labs/{id}/members/{userId} (owner) → 204 */
export const DELETE = apiRoute<Params>(async (request, { params }) => {
  const { id, userId } = await params;
  const caller = await requireCaller(request);
  const access = await requireLabRole(caller, id, "owner");
  await change({ caller, labId: access.labId, userId, role: null });
  return noContent();
});
