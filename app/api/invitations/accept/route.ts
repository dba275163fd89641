import { db } from "@/db/client";
import { acceptInvitation } from "@/db/queries/invitations";
import { readJson } from "@/lib/api/body";
import { DomainError } from "@/lib/contracts/errors";
import { apiRoute, json } from "@/lib/api/route";
import { acceptInvitationSchema, INVITATION_REFUSAL_CODE, INVITATION_REFUSED } from "@/lib/contracts/labs";
import { requireSessionCaller } from "@/lib/auth/access";
import { hashToken, isLinkSecret } from "@/lib/auth/tokens";

/** POST /api/invitations/accept { token } (signed-in browser session) → { labId, labName, role } */
export const POST = apiRoute(async (request) => {
  const caller = await requireSessionCaller(request, "Accepting an invitation");
  const { token } = await readJson(request, acceptInvitationSchema);
  if (!isLinkSecret(token)) throw new DomainError("not_found", INVITATION_REFUSED.unknown);
  const result = await acceptInvitation(db, { caller, tokenHash: hashToken(token) });
  if (result.ok) return json({ labId: result.labId, labName: result.labName, role: result.role, alreadyMember: result.alreadyMember });
  if (result.reason === "other_email") {
    throw new DomainError(
      "forbidden",
      `This invitation is for ${result.email}; you are signed in as ${caller.email}. Sign in with the invited address.`,
    );
  }
  throw new DomainError(INVITATION_REFUSAL_CODE[result.reason], INVITATION_REFUSED[result.reason]);
});
