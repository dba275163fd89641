import { readJson } from "@/lib/api/body";
import { ApiError } from "@/lib/api/errors";
import { apiRoute, json } from "@/lib/api/route";
import { signUpSchema } from "@/lib/auth/schemas";
import { EMAIL_TAKEN_MESSAGE, registerAccount } from "@/lib/auth/sign-up";

/**
 * POST /api/sign-up { name, email, password } → 201 { user: { id, email, name }, labId }.
 * The JSON twin of the sign-up form (scripts and HTTP tests cannot post a server action); it does
 * not sign in — use /api/auth/callback/credentials or an API token for that.
 */
export const POST = apiRoute(async (request) => {
  const input = await readJson(request, signUpSchema);
  const result = await registerAccount(input);
  if (!result.ok) throw new ApiError("conflict", EMAIL_TAKEN_MESSAGE, { fields: { email: EMAIL_TAKEN_MESSAGE } });
  return json({ user: result.user, labId: result.labId }, 201);
});
