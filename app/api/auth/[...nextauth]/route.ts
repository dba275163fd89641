import { NextRequest } from "next/server";
import { readText } from "@/lib/api/body";
import { DomainError } from "@/lib/contracts/errors";
import { domainErrorResponse } from "@/lib/api/errors";
import { errorResponse } from "@/lib/api/route";
import { isStorableText } from "@/lib/contracts/validation";
import { handlers } from "@/lib/auth/config";
import { rateLimitMessage, signInClient, signInWaitSeconds } from "@/lib/auth/rate-limit";

export const GET = handlers.GET;

/*
 * Every Auth.js POST (sign-in, sign-out) is read here first under the API's 64 KiB limit, so an
 * oversized body is refused before anything parses it. While failures for this e-mail and address
 * are being slowed down, a credentials sign-in gets 429 with Retry-After here instead of Auth.js's
 * redirect, so scripts and tests see the limit; authorize() enforces the same limit for the
 * server-action path.
 */
export async function POST(request: NextRequest): Promise<Response> {
  let text: string;
  try {
    text = await readText(request);
  } catch (error) {
    return errorResponse(error, request);
  }
  const form = new URLSearchParams(text);
  if ([...form].some(([key, value]) => !isStorableText(key) || !isStorableText(value))) {
    return domainErrorResponse(
      new DomainError("validation", "The form contains a character that cannot be used (a NUL byte or a broken surrogate)."),
    );
  }
  if (new URL(request.url).pathname.endsWith("/callback/credentials")) {
    try {
      const email = form.get("email");
      if (email !== null && email.length <= 320) {
        const wait = await signInWaitSeconds(email, signInClient(request.headers, email));
        if (wait > 0) {
          return domainErrorResponse(new DomainError("rate_limited", rateLimitMessage(wait), { retryAfterS: wait }));
        }
      }
    } catch (error) {
      return errorResponse(error, request);
    }
  }
  const headers = new Headers(request.headers);
  headers.delete("content-length");
  return handlers.POST(new NextRequest(request.url, { method: "POST", headers, body: text }));
}
