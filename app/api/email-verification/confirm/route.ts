import { db } from "@/db/client";
import { confirmEmailVerification } from "@/db/queries/users";
import { readJson } from "@/lib/api/body";
import { apiRoute, json } from "@/lib/api/route";
import { confirmEmailSchema } from "@/lib/contracts/accounts";
import { DomainError } from "@/lib/contracts/errors";
import { hashToken, isLinkSecret } from "@/lib/auth/tokens";

const INVALID = "This confirmation link is not valid, was already used or has expired. Sign in and ask for a new one in Settings.";

/** POST /api/email-verification/confirm { token } (anyone holding the mailed link) → { email }: the address is confirmed. */
export const POST = apiRoute(async (request) => {
  const { token } = await readJson(request, confirmEmailSchema);
  const invalid = () => new DomainError("validation", INVALID, { fields: { token: INVALID } });
  if (!isLinkSecret(token)) throw invalid();
  const result = await confirmEmailVerification(db, { tokenHash: hashToken(token) });
  if (!result.ok) throw invalid();
  return json({ email: result.email });
});
