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
import { generateLinkSecret, hashToken, isLinkSecret } from "./tokens";
import type { SignUpInput } from "@/lib/contracts/accounts";
import { DomainError } from "@/lib/contracts/errors";
import { INVITATION_REFUSAL_CODE, INVITATION_REFUSED, type InvitationRefusal } from "@/lib/contracts/labs";

export const VERIFY_EMAIL_DAYS = 7;
const HOUR_MS = 60 * 60 * 1000;

/**
 * A new account, its lab (its own personal lab, or the invited lab when the sign-up carries an
 * invitation link) and the mail with the link that confirms the address, in one transaction: the
 * mail is in the outbox exactly when the account exists. A malformed invitation link is refused
 * before anything is hashed or written.
 */
export async function registerAccount(input: SignUpInput): Promise<CreateAccountResult> {
  const token = input.invitationToken;
  if (token !== undefined && !isLinkSecret(token)) return { ok: false, reason: "invitation", refusal: { reason: "unknown" } };
  const passwordHash = await hashPassword(input.password);
  const result = await db.transaction(async (tx) => {
    const created = await createAccount(tx, {
      name: input.name,
      email: input.email,
      passwordHash,
      ...(token === undefined ? {} : { invitationTokenHash: hashToken(token) }),
    });
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

export type SignUpOutcome = { outcome: "done" } | { outcome: "throttled" } | { outcome: "refused"; refusal: InvitationRefusal };

/**
 * Creates the account, or, when the address is taken, e-mails that account's owner (queued after
 * the answer, so the time taken does not tell). The caller gives the same answer either way. At
 * most a few attempts per e-mail address and a bounded number per client address and hour. An
 * unusable invitation link is refused outright: it says nothing about accounts (the link's holder
 * already sees the invited address on the invitation page) and creates none.
 */
export async function signUpNeutrally(input: SignUpInput, client: { address: string }): Promise<SignUpOutcome> {
  const perClient = serverSettings.auth.signUpsPerClientHour;
  if (!(await takeThrottleSlot(db, { kind: "sign_up_client", key: client.address, max: perClient, windowMs: HOUR_MS })))
    return { outcome: "throttled" };
  if (!(await takeThrottleSlot(db, { kind: "sign_up", key: input.email, max: SIGN_UPS_PER_ADDRESS_HOUR, windowMs: HOUR_MS })))
    return { outcome: "throttled" };
  const result = await registerAccount(input);
  if (!result.ok && result.reason === "invitation") return { outcome: "refused", refusal: result.refusal };
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
  return { outcome: "done" };
}

/** The words for a refused invitation link at sign-up, and the form field they belong to. */
export function signUpRefusalMessage(refusal: InvitationRefusal): { message: string; field: "email" | null } {
  if (refusal.reason === "other_email") {
    return {
      message: `This invitation is for ${refusal.email}. Create the account with that address, or without the invitation.`,
      field: "email",
    };
  }
  return { message: INVITATION_REFUSED[refusal.reason], field: null };
}

/** A refused invitation link at sign-up as the API's error: the address mismatch is a 400 on `email`. */
export function signUpRefusalError(refusal: InvitationRefusal): DomainError {
  const { message } = signUpRefusalMessage(refusal);
  if (refusal.reason === "other_email") return new DomainError("validation", message, { fields: { email: message } });
  return new DomainError(INVITATION_REFUSAL_CODE[refusal.reason], message);
}
