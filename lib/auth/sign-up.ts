import "server-only";
import { db } from "@/db/client";
import { takeThrottleSlot } from "@/db/queries/throttle";
import { type CreateAccountResult, createAccount } from "@/db/queries/users";
import { signUpExistingMail } from "@/lib/mail/messages";
import { appLink, sendMail } from "@/lib/mail/send";
import { hashPassword } from "./password";
import type { SignUpInput } from "@/lib/contracts/accounts";

/** A new account and its personal lab (owned by the new user); shared by the form and the API. */
export async function registerAccount(input: SignUpInput): Promise<CreateAccountResult> {
  const passwordHash = await hashPassword(input.password);
  return createAccount(db, { name: input.name, email: input.email, passwordHash });
}

export const SIGN_UP_RECEIVED =
  "Sign-up received. Sign in with this e-mail address and password. " +
  "If the address already had an account, its owner got an e-mail instead.";

const SIGN_UPS_PER_HOUR = 5;

/**
 * Creates the account, or, when the address is taken, e-mails that account's owner (after the
 * answer, so the time taken does not tell). The caller gives the same answer either way.
 */
export async function signUpNeutrally(input: SignUpInput): Promise<"done" | "throttled"> {
  if (!(await takeThrottleSlot(db, { kind: "sign_up", key: input.email, max: SIGN_UPS_PER_HOUR, windowMs: 60 * 60 * 1000 })))
    return "throttled";
  const result = await registerAccount(input);
  if (!result.ok) {
    void sendMail({
      to: input.email,
      ...signUpExistingMail({ signInLink: appLink("/sign-in"), resetLink: appLink("/forgot-password") }),
    }).catch(() => undefined);
  }
  return "done";
}
