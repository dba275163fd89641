import { readJson } from "@/lib/api/body";
import { clientIp } from "@/lib/auth/client-ip";
import { DomainError } from "@/lib/contracts/errors";
import { apiRoute, json } from "@/lib/api/route";
import { signUpSchema } from "@/lib/contracts/accounts";
import { SIGN_UP_RECEIVED, signUpNeutrally, signUpRefusalError } from "@/lib/auth/sign-up";

/**
 * POST /api/sign-up { name, email, password, invitationToken? } → 202 { message }. The JSON twin
 * of the sign-up form. The answer is the same whether or not the address already has an account
 * (that account's owner gets an e-mail instead), so it tells nobody who has an account; sign in
 * afterwards with /api/auth/callback/credentials. At most a few attempts per address and hour (429
 * beyond). With an invitation link's token the account joins that lab with the invitation's role
 * and gets no personal lab; an unusable link creates nothing (404 unknown, 409 used, withdrawn or
 * expired, 400 on `email` when the link is for another address).
 */
export const POST = apiRoute(async (request) => {
  const input = await readJson(request, signUpSchema);
  const outcome = await signUpNeutrally(input, { address: clientIp(request.headers) });
  if (outcome.outcome === "refused") throw signUpRefusalError(outcome.refusal);
  if (outcome.outcome === "throttled") {
    throw new DomainError("rate_limited", "Too many sign-up attempts from here or for this address. Try again in an hour.", {
      retryAfterS: 3600,
    });
  }
  return json({ message: SIGN_UP_RECEIVED }, 202);
});
