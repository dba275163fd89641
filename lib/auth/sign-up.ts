import "server-only";
import { after } from "next/server";
import { db } from "@/db/client";
import { enqueueMail } from "@/db/queries/mail-outbox";
import { takeThrottleSlot } from "@/db/queries/throttle";
import { type CreateAccountResult, createAccount, createEmailVerification } from "@/db/queries/users";
import { signUpExistingMail, verifyEmailMail } from "@/lib/mail/messages";
import { kickOutbox } from "@/lib/mail/outbox";
import { appLink } from "@/lib/mail/send";
import { serverSettings } from "@/lib/settings/server";
import { hashPassword } from "./password";
import { generateLinkSecret } from "./tokens";
import type { SignUpInput } from "@/lib/contracts/accounts";

export const VERIFY_EMAIL_DAYS = 7;
const HOUR_MS = 60 * 60 * 1000;

/**
 * A new account, its personal lab (owned by the new user) and the mail with the link that confirms
 * the address, in one transaction: the mail is in the outbox exactly when the account exists.
 */
export async function registerAccount(input: SignUpInput): Promise<CreateAccountResult> {
  const passwordHash = await hashPassword(input.password);
  const result = await db.transaction(async (tx) => {
    const created = await createAccount(tx, { name: input.name, email: input.email, passwordHash });
    if (created.ok) await queueVerification(tx, { userId: created.user.id, email: created.user.email });
    return created;
  });
  kickOutbox();
  return result;
}

/** A fresh confirmation link for the user, queued in the caller's transaction. */
export async function queueVerification(tx: Parameters<typeof enqueueMail>[0], user: { userId: string; email: string }): Promise<void> {
  const { secret, secretHash } = generateLinkSecret();
  await createEmailVerification(tx, { userId: user.userId, tokenHash: secretHash, ttlMs: VERIFY_EMAIL_DAYS * 24 * HOUR_MS });
  await enqueueMail(tx, {
    kind: "verify_email",
    to: user.email,
    ...verifyEmailMail({ link: appLink(`/verify-email/${secret}`), days: VERIFY_EMAIL_DAYS }),
  });
}

export const SIGN_UP_RECEIVED =
  "Sign-up received. Sign in with this e-mail address and password; we sent a link to confirm the address. " +
  "If the address already had an account, its owner got an e-mail instead.";

const SIGN_UPS_PER_ADDRESS_HOUR = 5;

/**
 * Creates the account, or, when the address is taken, e-mails that account's owner (queued after
 * the answer, so the time taken does not tell). The caller gives the same answer either way. At
 * most a few attempts per e-mail address and a bounded number per client address and hour.
 */
export async function signUpNeutrally(input: SignUpInput, client: { address: string }): Promise<"done" | "throttled"> {
  const perClient = serverSettings.auth.signUpsPerClientHour;
  if (!(await takeThrottleSlot(db, { kind: "sign_up_client", key: client.address, max: perClient, windowMs: HOUR_MS }))) return "throttled";
  if (!(await takeThrottleSlot(db, { kind: "sign_up", key: input.email, max: SIGN_UPS_PER_ADDRESS_HOUR, windowMs: HOUR_MS })))
    return "throttled";
  const result = await registerAccount(input);
  if (!result.ok) {
    after(async () => {
      await enqueueMail(db, {
        kind: "sign_up_existing",
        to: input.email,
        ...signUpExistingMail({ signInLink: appLink("/sign-in"), resetLink: appLink("/forgot-password") }),
      });
      kickOutbox();
    });
  }
  return "done";
}
