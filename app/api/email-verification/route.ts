import { db } from "@/db/client";
import { takeThrottleSlot } from "@/db/queries/throttle";
import { findUserById } from "@/db/queries/users";
import { apiRoute, json } from "@/lib/api/route";
import { DomainError } from "@/lib/contracts/errors";
import { requireSessionCaller } from "@/lib/auth/access";
import { queueVerification } from "@/lib/auth/sign-up";
import { kickOutbox } from "@/lib/mail/outbox";

const RESENDS_PER_HOUR = 3;

/** GET /api/email-verification (browser session) → { verified }: whether the caller's address is confirmed. */
export const GET = apiRoute(async (request) => {
  const caller = await requireSessionCaller(request, "Confirming an e-mail address");
  const user = await findUserById(db, { id: caller.id });
  return json({ verified: user?.emailVerified ?? false });
});

/** POST /api/email-verification (browser session) → 202 { message }: mails a new confirmation link (3 an hour). */
export const POST = apiRoute(async (request) => {
  const caller = await requireSessionCaller(request, "Confirming an e-mail address");
  const user = await findUserById(db, { id: caller.id });
  if (!user) throw new DomainError("unauthenticated", "Sign in first.");
  if (user.emailVerified) return json({ message: "Your address is already confirmed." }, 200);
  if (!(await takeThrottleSlot(db, { kind: "verify_email", key: user.id, max: RESENDS_PER_HOUR, windowMs: 60 * 60 * 1000 }))) {
    throw new DomainError("rate_limited", `At most ${RESENDS_PER_HOUR} confirmation links an hour; try again later.`, {
      retryAfterS: 3600,
    });
  }
  await db.transaction((tx) => queueVerification(tx, { userId: user.id, email: user.email }));
  kickOutbox();
  return json({ message: `We sent a new confirmation link to ${user.email}.` }, 202);
});
