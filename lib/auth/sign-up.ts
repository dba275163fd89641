import "server-only";
import { createAccount, type CreateAccountResult } from "@/db/queries/users";
import { hashPassword } from "./password";
import type { SignUpInput } from "./schemas";

/** A new account and its personal lab (owned by the new user); shared by the form and the API. */
export async function registerAccount(input: SignUpInput): Promise<CreateAccountResult> {
  const passwordHash = await hashPassword(input.password);
  return createAccount({ name: input.name, email: input.email, passwordHash });
}

export const EMAIL_TAKEN_MESSAGE = "An account with this e-mail already exists. Sign in instead.";
