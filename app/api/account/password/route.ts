import { db } from "@/db/client";
import { changePassword, findUserById } from "@/db/queries/users";
import { readJson } from "@/lib/api/body";
import { DomainError } from "@/lib/contracts/errors";
import { apiRoute, json } from "@/lib/api/route";
import { requireSessionCaller } from "@/lib/auth/access";
import { signIn } from "@/lib/auth/config";
import { hashPassword, verifyPassword } from "@/lib/auth/password";
import { rateLimitMessage, reserveSignInAttempt, signInClient } from "@/lib/auth/rate-limit";
import { changePasswordSchema } from "@/lib/contracts/accounts";

/**
 * POST /api/account/password { currentPassword, newPassword } (browser session) → { ok }.
 * Ends every other session (the session version moves on) and re-issues this browser's cookie.
 * A wrong current password counts as a failed sign-in, so this is no way around the limiter.
 */
export const POST = apiRoute(async (request) => {
  const caller = await requireSessionCaller(request, "Changing the password");
  const { currentPassword, newPassword } = await readJson(request, changePasswordSchema);
  const attempt = await reserveSignInAttempt(caller.email, signInClient(request.headers, caller.email));
  if (!attempt.allowed) throw new DomainError("rate_limited", rateLimitMessage(attempt.waitS), { retryAfterS: attempt.waitS });
  const user = await findUserById(db, { id: caller.id });
  if (!user || !(await verifyPassword(currentPassword, user.passwordHash))) {
    throw new DomainError("validation", "The current password is wrong.", {
      fields: { currentPassword: "The current password is wrong." },
    });
  }
  await attempt.succeeded();
  await changePassword(db, { userId: caller.id, passwordHash: await hashPassword(newPassword) });
  // A fresh cookie carrying the new session version keeps this browser signed in.
  await signIn("credentials", { email: caller.email, password: newPassword, redirect: false });
  return json({ ok: true });
});
