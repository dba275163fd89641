import { db } from "@/db/client";
import { createInvitation, INVITATION_DAYS, listPendingInvitations } from "@/db/queries/invitations";
import { readJson } from "@/lib/api/body";
import { DomainError } from "@/lib/contracts/errors";
import { readPage } from "@/lib/api/paging";
import { apiRoute, json } from "@/lib/api/route";
import { createInvitationSchema } from "@/lib/contracts/labs";
import { authorizeLab, requireCaller } from "@/lib/auth/access";
import { generateLinkSecret } from "@/lib/auth/tokens";
import { invitationMail } from "@/lib/mail/messages";
import { appLink, MailUnavailableError, sendMail } from "@/lib/mail/send";

type Params = { id: string };

/** GET /api/labs/{id}/invitations?limit=&cursor= (owner) → { items, nextCursor }: pending invitations */
export const GET = apiRoute<Params>(async (request, { params }) => {
  const { id } = await params;
  const caller = await requireCaller(request);
  const access = await authorizeLab(caller, id, "owner");
  return json(await listPendingInvitations(db, { access, page: readPage(request) }));
});

/**
 * POST /api/labs/{id}/invitations { email, role } (owner) → 201 { item }. The same answer whether
 * or not the address has an account or is already a member: the invitee finds out on accepting.
 */
export const POST = apiRoute<Params>(async (request, { params }) => {
  const { id } = await params;
  const caller = await requireCaller(request);
  const access = await authorizeLab(caller, id, "owner");
  const input = await readJson(request, createInvitationSchema);
  const { secret, secretHash } = generateLinkSecret();
  const item = await createInvitation(db, { access, email: input.email, role: input.role, tokenHash: secretHash });
  try {
    await sendMail({
      to: input.email,
      ...invitationMail({
        labName: access.labName,
        inviterName: caller.name,
        role: input.role,
        link: appLink(`/invite/${secret}`),
        days: INVITATION_DAYS,
      }),
    });
  } catch (error) {
    if (error instanceof MailUnavailableError) {
      throw new DomainError("busy", "The invitation was saved but the e-mail could not be sent; revoke it and invite again in a moment.", {
        retryAfterS: 30,
      });
    }
    throw error;
  }
  return json({ item }, 201);
});
