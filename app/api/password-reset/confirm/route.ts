import { db } from "@/db/client";
import { isPasswordResetLive, resetPasswordWithToken } from "@/db/queries/users";
import { readJson } from "@/lib/api/body";
import { DomainError } from "@/lib/contracts/errors";
import { apiRoute, json } from "@/lib/api/route";
import { hashPassword } from "@/lib/auth/password";
import { resetPasswordSchema } from "@/lib/contracts/accounts";
import { hashToken, isLinkSecret } from "@/lib/auth/tokens";

const INVALID = "This reset link is not valid, was already used or has expired. Ask for a new one.";

/**
 * POST /api/password-reset/confirm { token, newPassword } → { email, tokensRevoked }: ends every
 * session of the account and revokes its API tokens. The link is looked up before the new password
 * is hashed, so a bogus token costs a query, never a bcrypt hash.
 */
export const POST = apiRoute(async (request) => {
  const { token, newPassword } = await readJson(request, resetPasswordSchema);
  const invalid = () => new DomainError("validation", INVALID, { fields: { token: INVALID } });
  if (!isLinkSecret(token)) throw invalid();
  const tokenHash = hashToken(token);
  if (!(await isPasswordResetLive(db, { tokenHash }))) throw invalid();
  const result = await resetPasswordWithToken(db, { tokenHash, passwordHash: await hashPassword(newPassword) });
  if (!result.ok) throw invalid();
  return json({ email: result.email, tokensRevoked: result.tokensRevoked });
});
