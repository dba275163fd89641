import { db } from "@/db/client";
import { takeThrottleSlot } from "@/db/queries/throttle";
import { createPasswordReset, findUserByEmail } from "@/db/queries/users";
import { readJson } from "@/lib/api/body";
import { apiRoute, json } from "@/lib/api/route";
import { emailOnlySchema } from "@/lib/contracts/accounts";
import { generateLinkSecret } from "@/lib/auth/tokens";
import { passwordResetMail } from "@/lib/mail/messages";
import { appLink, sendMail } from "@/lib/mail/send";

const RESET_MINUTES = 30;
const RESETS_PER_HOUR = 5;

const RESET_REQUESTED = "If an account uses this address, we sent it a link to choose a new password. It expires in 30 minutes.";

/**
 * POST /api/password-reset { email } → 202 { message }: the same answer, status and (nearly) the
 * same time for a known, an unknown and a throttled address. The mail goes out after the answer
 * so its delivery time does not tell either.
 */
export const POST = apiRoute(async (request) => {
  const { email } = await readJson(request, emailOnlySchema);
  const allowed = await takeThrottleSlot(db, { kind: "password_reset", key: email, max: RESETS_PER_HOUR, windowMs: 60 * 60 * 1000 });
  const user = allowed ? await findUserByEmail(db, { email }) : null;
  if (user) {
    const { secret, secretHash } = generateLinkSecret();
    await createPasswordReset(db, { userId: user.id, tokenHash: secretHash, ttlMs: RESET_MINUTES * 60 * 1000 });
    void sendMail({ to: user.email, ...passwordResetMail({ link: appLink(`/reset-password/${secret}`), minutes: RESET_MINUTES }) }).catch(
      () => undefined,
    );
  }
  return json({ message: RESET_REQUESTED }, 202);
});
