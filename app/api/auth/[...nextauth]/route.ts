import { NextRequest, NextResponse } from "next/server";
import { getSessionUser } from "@/lib/auth/access";
import { isSessionCookieName } from "@/lib/auth/session-cookie";
import { DEVICE_COOKIE, deviceSetCookie, newDeviceCookie } from "@/lib/auth/device";
import { serverSettings } from "@/lib/settings/server";
import { readText } from "@/lib/api/body";
import { DomainError } from "@/lib/contracts/errors";
import { domainErrorResponse } from "@/lib/api/errors";
import { errorResponse } from "@/lib/api/route";
import { isStorableText } from "@/lib/contracts/validation";
import { handlers } from "@/lib/auth/config";
import { rateLimitMessage, signInClient, signInWaitSeconds } from "@/lib/auth/rate-limit";

/*
 * The session cookie is a JWT, which Auth.js alone would keep answering (and refreshing) until it
 * expires. An ended session (sign-out elsewhere, a password change or reset, "sign out
 * everywhere") has an older session version than the user's: it is answered as signed out and its
 * cookie is cleared, instead of being handed a fresh expiry.
 */
export async function GET(request: NextRequest): Promise<Response> {
  if (new URL(request.url).pathname.endsWith("/session") && hasSessionCookie(request)) {
    try {
      if (!(await getSessionUser(request))) return signedOut(request);
    } catch (error) {
      return errorResponse(error, request);
    }
  }
  return handlers.GET(request);
}

function sessionCookieNames(request: NextRequest): string[] {
  return request.cookies
    .getAll()
    .map(({ name }) => name)
    .filter(isSessionCookieName);
}

const hasSessionCookie = (request: NextRequest) => sessionCookieNames(request).length > 0;

function signedOut(request: NextRequest): Response {
  const response = NextResponse.json(null, { headers: { "cache-control": "private, no-store" } });
  for (const name of sessionCookieNames(request)) {
    response.cookies.set(name, "", { path: "/", maxAge: 0, httpOnly: true, sameSite: "lax", secure: name.startsWith("__Secure-") });
  }
  return response;
}

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
  const response = await handlers.POST(new NextRequest(request.url, { method: "POST", headers, body: text }));
  return withDeviceCookie(request, form, response);
}

/**
 * After a successful credentials sign-in, the browser gets its device cookie for the account
 * (lib/auth/device.ts), unless it already holds a valid one or authorize() set it.
 */
function withDeviceCookie(request: NextRequest, form: URLSearchParams, response: Response): Response {
  const email = form.get("email");
  const secret = serverSettings.auth.secret;
  if (!new URL(request.url).pathname.endsWith("/callback/credentials") || !email || !secret) return response;
  const setCookies = response.headers.getSetCookie();
  const signedIn = setCookies.some((line) => isSessionCookieName(line.slice(0, line.indexOf("="))) && !/max-age=0/i.test(line));
  if (!signedIn || setCookies.some((line) => line.startsWith(`${DEVICE_COOKIE}=`))) return response;
  if (signInClient(request.headers, email).deviceId) return response;
  // A copy: the answer Auth.js built may carry immutable headers.
  const headers = new Headers(response.headers);
  headers.append(
    "set-cookie",
    deviceSetCookie(newDeviceCookie(secret, email.trim().toLowerCase()), serverSettings.site.publicUrl.startsWith("https:")),
  );
  return new Response(response.body, { status: response.status, statusText: response.statusText, headers });
}
