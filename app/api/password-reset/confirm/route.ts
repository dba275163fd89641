import { db } from "@/db/client";
import { resetPasswordWithToken } from "@/db/queries/users";
import { readJson } from "@/lib/api/body";
import { DomainError } from "@/lib/contracts/errors";
import { apiRoute, json } from "@/lib/api/route";
import { hashPassword } from "@/lib/auth/password";
import { resetPasswordSchema } from "@/lib/contracts/accounts";
import { hashToken, isLinkSecret } from "@/lib/auth/tokens";

const INVALID = "This reset link is not valid, was already used or has expired. Ask for a new one.";

/** POST /api/password-reset/confirm { token, newPassword } → { email }; ends every session of the account. */
export const POST = apiRoute(async (request) => {
  const { token, newPassword } = await readJson(request, resetPasswordSchema);
  if (!isLinkSecret(token)) throw new DomainError("validation", INVALID, { fields: { token: INVALID } });
  const result = await resetPasswordWithToken(db, { tokenHash: hashToken(token), passwordHash: await hashPassword(newPassword) });
  if (!result.ok) throw new DomainError("validation", INVALID, { fields: { token: INVALID } });
  return json({ email: result.email });
});
