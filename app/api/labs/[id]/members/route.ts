import { addMember, listMembers } from "@/db/queries/labs";
import { readJson } from "@/lib/api/body";
import { ApiError } from "@/lib/api/errors";
import { apiRoute, json } from "@/lib/api/route";
import { addMemberSchema } from "@/lib/api/schemas";
import { requireCaller, requireLabRole } from "@/lib/auth/access";

type Params = { id: string };

/** GET /api/labs/{id}/members (viewer) → { items: [{ userId, email, name, role }] } */
export const GET = apiRoute<Params>(async (request, { params }) => {
  const { id } = await params;
  const caller = await requireCaller(request);
  const access = await requireLabRole(caller, id, "viewer");
  return json({ items: await listMembers({ labId: access.labId }) });
});

/** POST /api/labs/{id}/members { email, role } (owner) → 201 { item } */
export const POST = apiRoute<Params>(async (request, { params }) => {
  const { id } = await params;
  const caller = await requireCaller(request);
  const access = await requireLabRole(caller, id, "owner");
  const input = await readJson(request, addMemberSchema);
  const result = await addMember({ actorId: caller.id, labId: access.labId, email: input.email, role: input.role });
  if (!result.ok && result.reason === "no_user") {
    throw new ApiError("validation", "No account uses this e-mail; ask them to sign up first.", {
      fields: { email: "No account uses this e-mail; ask them to sign up first." },
    });
  }
  if (!result.ok) {
    throw new ApiError("conflict", "This person is already a member of the lab.", { fields: { email: "Already a member of this lab." } });
  }
  return json({ item: result.member }, 201);
});
