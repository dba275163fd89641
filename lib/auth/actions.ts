"use server";

import { AuthError, CredentialsSignin } from "next-auth";
import { headers } from "next/headers";
import { isDbUnavailable } from "@/db/errors";
import { zodIssueFields } from "@/lib/contracts/validation";
import { signIn, signOut } from "./config";
import { rateLimitMessage, signInClient, signInWaitSeconds } from "./rate-limit";
import { afterSignInTarget } from "./after-sign-in";
import { clientIp } from "./client-ip";
import { signInSchema, signUpSchema } from "@/lib/contracts/accounts";
import { signUpNeutrally, signUpRefusalMessage } from "./sign-up";

/** State of the sign-in/sign-up forms (useActionState). */
export interface AuthFormState {
  error?: string;
  fields?: Record<string, string>;
}

const WRONG_CREDENTIALS = "Wrong e-mail or password.";
const ALREADY_REGISTERED_HINT =
  "We could not sign you in with this address and password. " +
  "If the address already had an account, we sent it an e-mail: sign in with that account's password, or reset it.";
const UNAVAILABLE = "Signing in is unavailable right now (the database is not reachable). Try again shortly.";

const text = (formData: FormData, key: string) => {
  const value = formData.get(key);
  return typeof value === "string" ? value : undefined;
};

/**
 * Signs in and redirects to the form's `redirectTo` (default /parameter-sets). signIn throws a
 * redirect (NEXT_REDIRECT) on success, which must propagate; it throws AuthError on failure.
 */
async function signInAndRedirect(options: { email: string; password: string; redirectTo: string }): Promise<AuthFormState> {
  try {
    await signIn("credentials", { ...options });
  } catch (error) {
    if (error instanceof CredentialsSignin && error.code === "rate_limited") {
      const wait = await signInWaitSeconds(options.email, signInClient(await headers(), options.email)).catch(() => 60);
      return { error: rateLimitMessage(Math.max(wait, 1)) };
    }
    if (error instanceof CredentialsSignin) return { error: WRONG_CREDENTIALS };
    // Anything else thrown inside authorize (a lost database) arrives as a CallbackRouteError.
    if (error instanceof AuthError)
      return { error: isDbUnavailable(error) || error.type === "CallbackRouteError" ? UNAVAILABLE : WRONG_CREDENTIALS };
    throw error;
  }
  return {};
}

export async function signInAction(_prev: AuthFormState, formData: FormData): Promise<AuthFormState> {
  const parsed = signInSchema.safeParse({ email: text(formData, "email"), password: text(formData, "password") });
  if (!parsed.success) return { error: "Check the highlighted fields.", fields: zodIssueFields(parsed.error.issues) };
  const redirectTo = afterSignInTarget(text(formData, "redirectTo"));
  try {
    const wait = await signInWaitSeconds(parsed.data.email, signInClient(await headers(), parsed.data.email));
    if (wait > 0) return { error: rateLimitMessage(wait) };
  } catch (error) {
    if (isDbUnavailable(error)) return { error: UNAVAILABLE };
    throw error;
  }
  return signInAndRedirect({ ...parsed.data, redirectTo });
}

export async function signUpAction(_prev: AuthFormState, formData: FormData): Promise<AuthFormState> {
  const parsed = signUpSchema.safeParse({
    name: text(formData, "name"),
    email: text(formData, "email"),
    password: text(formData, "password"),
    invitationToken: text(formData, "invitationToken") || undefined,
  });
  const fields = parsed.success ? {} : zodIssueFields(parsed.error.issues);
  const confirm = text(formData, "confirmPassword");
  if (confirm !== undefined && confirm !== text(formData, "password")) fields.confirmPassword = "The passwords do not match.";
  if (!parsed.success || Object.keys(fields).length > 0) return { error: "Check the highlighted fields.", fields };
  try {
    const signedUp = await signUpNeutrally(parsed.data, { address: clientIp(await headers()) });
    if (signedUp.outcome === "throttled")
      return { error: "Too many sign-up attempts from here or for this address. Try again in an hour." };
    if (signedUp.outcome === "refused") {
      const { message, field } = signUpRefusalMessage(signedUp.refusal);
      return { error: message, ...(field ? { fields: { [field]: message } } : {}) };
    }
  } catch (error) {
    if (isDbUnavailable(error)) return { error: "Signing up is unavailable right now (the database is not reachable). Try again shortly." };
    throw error;
  }
  const result = await signInAndRedirect({
    email: parsed.data.email,
    password: parsed.data.password,
    redirectTo: afterSignInTarget(text(formData, "redirectTo")),
  });
  // The address already had an account with another password. Say no more than the API does.
  if (result.error === WRONG_CREDENTIALS) return { error: ALREADY_REGISTERED_HINT };
  return result;
}

export async function signOutAction(): Promise<void> {
  await signOut({ redirectTo: "/sign-in" });
}
