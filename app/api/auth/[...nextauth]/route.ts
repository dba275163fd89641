import { handlers } from "@/lib/auth/config";
import { errorResponse } from "@/lib/api/route";
import { ApiError } from "@/lib/api/errors";
import { clientIp } from "@/lib/auth/client-ip";
import { rateLimitMessage, signInWaitSeconds } from "@/lib/auth/rate-limit";

export const GET = handlers.GET;

/*
 * Auth.js answers every failed credentials sign-in with a redirect. While failures for this
 * e-mail and address are being slowed down, answer 429 with Retry-After here instead, so scripts
 * and tests see the limit; authorize() enforces the same limit for the server-action path.
 */
export async function POST(request: Request): Promise<Response> {
  if (new URL(request.url).pathname.endsWith("/callback/credentials")) {
    try {
      const form = await request.clone().formData();
      const email = form.get("email");
      if (typeof email === "string" && email.length <= 320) {
        const wait = await signInWaitSeconds({ email, ip: clientIp(request.headers) });
        if (wait > 0) {
          return new ApiError("rate_limited", rateLimitMessage(wait), { headers: { "Retry-After": String(wait) } }).toResponse();
        }
      }
    } catch (error) {
      if (!(error instanceof TypeError)) return errorResponse(error, request);
    }
  }
  return handlers.POST(request as Parameters<typeof handlers.POST>[0]);
}
