import { db } from "@/db/client";
import { acceptInvitation } from "@/db/queries/invitations";
import { readJson } from "@/lib/api/body";
import { DomainError } from "@/lib/contracts/errors";
import { apiRoute, json } from "@/lib/api/route";
import { acceptInvitationSchema } from "@/lib/contracts/labs";
import { requireSessionCaller } from "@/lib/auth/access";
import { hashToken, isLinkSecret } from "@/lib/auth/tokens";

const REFUSED: Record<string, string> = {
  unknown: "This invitation link is not valid.",
  accepted: "This invitation has already been used.",
  revoked: "This invitation was withdrawn by the lab's owner.",
  expired: "This invitation has expired; ask the lab's owner for a new one.",
};

/** POST /api/invitations/accept { token } (signed-in browser session) → { labId, labName, role } */
export const POST = apiRoute(async (request) => {
  const caller = await requireSessionCaller(request, "Accepting an invitation");
  const { token } = await readJson(request, acceptInvitationSchema);
  if (!isLinkSecret(token)) throw new DomainError("not_found", REFUSED.unknown!);
  const result = await acceptInvitation(db, { caller, tokenHash: hashToken(token) });
  if (result.ok) return json({ labId: result.labId, labName: result.labName, role: result.role, alreadyMember: result.alreadyMember });
  if (result.reason === "unknown") throw new DomainError("not_found", REFUSED.unknown!);
  if (result.reason === "other_email") {
    throw new DomainError(
      "forbidden",
      `This invitation is for ${result.email}; you are signed in as ${caller.email}. Sign in with the invited address.`,
    );
  }
  throw new DomainError("conflict", REFUSED[result.reason]!);
});
