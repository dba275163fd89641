import { after } from "next/server";
import { db } from "@/db/client";
import { enqueueMail } from "@/db/queries/mail-outbox";
import { takeThrottleSlot } from "@/db/queries/throttle";
import { createPasswordReset, findUserByEmail } from "@/db/queries/users";
import { readJson } from "@/lib/api/body";
import { apiRoute, json } from "@/lib/api/route";
import { emailOnlySchema } from "@/lib/contracts/accounts";
import { clientIp } from "@/lib/auth/client-ip";
import { generateLinkSecret } from "@/lib/auth/tokens";
import { passwordResetMail } from "@/lib/mail/messages";
import { kickOutbox } from "@/lib/mail/outbox";
import { appLink } from "@/lib/mail/send";

const RESET_MINUTES = 30;
const RESETS_PER_HOUR = 5;
const RESETS_PER_CLIENT_HOUR = 30;
const HOUR_MS = 60 * 60 * 1000;

const RESET_REQUESTED = "If an account uses this address, we sent it a link to choose a new password. It expires in 30 minutes.";

/**
 * POST /api/password-reset { email } → 202 { message }: the same answer, status and work for a
 * known, an unknown and a throttled address. The request path only takes the throttle slots; the
 * account lookup, the new link and its mail (queued in the link's transaction, sent by the
 * outbox) happen after the answer, so its timing tells nothing about the address.
 */
export const POST = apiRoute(async (request) => {
  const { email } = await readJson(request, emailOnlySchema);
  const perClient = await takeThrottleSlot(db, {
    kind: "password_reset_client",
    key: clientIp(request.headers),
    max: RESETS_PER_CLIENT_HOUR,
    windowMs: HOUR_MS,
  });
  const allowed =
    perClient && (await takeThrottleSlot(db, { kind: "password_reset", key: email, max: RESETS_PER_HOUR, windowMs: HOUR_MS }));
  if (allowed) after(() => sendResetLink(email));
  return json({ message: RESET_REQUESTED }, 202);
});

async function sendResetLink(email: string): Promise<void> {
  const user = await findUserByEmail(db, { email });
  if (!user) return;
  const { secret, secretHash } = generateLinkSecret();
  await db.transaction(async (tx) => {
    await createPasswordReset(tx, { userId: user.id, tokenHash: secretHash, ttlMs: RESET_MINUTES * 60 * 1000 });
    await enqueueMail(tx, {
      kind: "password_reset",
      to: user.email,
      ...passwordResetMail({ link: appLink(`/reset-password/${secret}`), minutes: RESET_MINUTES }),
    });
  });
  kickOutbox();
}
