import { db } from "@/db/client";
import { createInvitation, INVITATION_DAYS, listPendingInvitations } from "@/db/queries/invitations";
import { enqueueMail } from "@/db/queries/mail-outbox";
import { takeThrottleSlot } from "@/db/queries/throttle";
import { findUserById } from "@/db/queries/users";
import { readJson } from "@/lib/api/body";
import { DomainError } from "@/lib/contracts/errors";
import { readPage } from "@/lib/api/paging";
import { apiRoute, json } from "@/lib/api/route";
import { createInvitationSchema } from "@/lib/contracts/labs";
import { authorizeLab, requireCaller } from "@/lib/auth/access";
import { generateLinkSecret } from "@/lib/auth/tokens";
import { invitationMail } from "@/lib/mail/messages";
import { sendQueuedNow } from "@/lib/mail/outbox";
import { appLink } from "@/lib/mail/send";

type Params = { id: string };

/** GET /api/labs/{id}/invitations?limit=&cursor= (owner) → { items, nextCursor }: pending invitations */
export const GET = apiRoute<Params>(async (request, { params }) => {
  const { id } = await params;
  const caller = await requireCaller(request);
  const access = await authorizeLab(caller, id, "owner");
  return json(await listPendingInvitations(db, { access, page: readPage(request) }));
});

/** Invitations one account, one lab and one recipient may be sent (mail from our address to anyone). */
const INVITATION_LIMITS = {
  perAccountHour: 20,
  perLabDay: 50,
  perRecipientDay: 3,
} as const;
const HOUR_MS = 60 * 60 * 1000;

async function requireInvitationSlots(options: { callerId: string; labId: string; email: string }): Promise<void> {
  const limited = (message: string, retryAfterS: number) => new DomainError("rate_limited", message, { retryAfterS });
  const { perAccountHour, perLabDay, perRecipientDay } = INVITATION_LIMITS;
  if (!(await takeThrottleSlot(db, { kind: "invite_account", key: options.callerId, max: perAccountHour, windowMs: HOUR_MS })))
    throw limited(`You sent ${perAccountHour} invitations in the last hour; try again later.`, 3600);
  if (!(await takeThrottleSlot(db, { kind: "invite_lab", key: options.labId, max: perLabDay, windowMs: 24 * HOUR_MS })))
    throw limited(`This lab sent ${perLabDay} invitations in the last day; try again tomorrow.`, 86_400);
  if (!(await takeThrottleSlot(db, { kind: "invite_recipient", key: options.email, max: perRecipientDay, windowMs: 24 * HOUR_MS })))
    throw limited(`This address got ${perRecipientDay} invitations in the last day; try again tomorrow.`, 86_400);
}

/**
 * POST /api/labs/{id}/invitations { email, role } (owner, with a confirmed address) → 201
 * { item, mail: "sent" | "queued" }. The same answer whether or not the address has an account
 * or is already a member: the invitee finds out on accepting. The mail is queued with the
 * invitation in one transaction and tried at once; "queued" means the mail server did not take it
 * yet and it is being retried. Limited per account, lab and recipient (429).
 */
export const POST = apiRoute<Params>(async (request, { params }) => {
  const { id } = await params;
  const caller = await requireCaller(request);
  const access = await authorizeLab(caller, id, "owner");
  const input = await readJson(request, createInvitationSchema);
  const inviter = await findUserById(db, { id: caller.id });
  if (!inviter?.emailVerified) {
    throw new DomainError(
      "forbidden",
      "Confirm your e-mail address before inviting anyone: open the link we mailed you (Settings sends a new one).",
      {
        extra: { reason: "email_unverified" },
      },
    );
  }
  await requireInvitationSlots({ callerId: caller.id, labId: access.labId, email: input.email });
  const { secret, secretHash } = generateLinkSecret();
  const { item, mailId } = await db.transaction(async (tx) => {
    const created = await createInvitation(tx, { access, email: input.email, role: input.role, tokenHash: secretHash });
    const queued = await enqueueMail(tx, {
      kind: "invitation",
      to: input.email,
      ...invitationMail({
        labName: access.labName,
        inviterName: caller.name,
        role: input.role,
        link: appLink(`/invite/${secret}`),
        days: INVITATION_DAYS,
      }),
    });
    return { item: created, mailId: queued };
  });
  return json({ item, mail: await sendQueuedNow(mailId) }, 201);
});
