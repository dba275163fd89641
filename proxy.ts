import { NextResponse, type NextRequest } from "next/server";
import { isSessionCookieName } from "@/lib/auth/session-cookie";

/*
 * Runs before routing. Two jobs:
 * - API paths with a malformed percent-encoding (`/api/parameter-sets/%C0%AF`) would make the
 *   router's own decoding throw and answer a plain-text 500 before any handler runs; they get the
 *   API's JSON 400 here instead.
 * - Optimistic redirect only: a signed-out visitor of an app page goes to /sign-in. It looks for
 *   the Auth.js session cookie without decoding it (no database, no pg import here); every page,
 *   route handler and action still checks the session itself.
 */

function hasSessionCookie(request: NextRequest): boolean {
  return request.cookies.getAll().some(({ name }) => isSessionCookieName(name));
}

function decodesCleanly(path: string): boolean {
  try {
    decodeURIComponent(path);
    return true;
  } catch {
    return false;
  }
}

export function proxy(request: NextRequest): NextResponse {
  const rawPath = new URL(request.url).pathname;
  if (rawPath.startsWith("/api/")) {
    if (decodesCleanly(rawPath)) return NextResponse.next();
    return NextResponse.json(
      { error: { code: "validation", message: "The request path has a malformed percent-encoding." } },
      { status: 400 },
    );
  }
  if (hasSessionCookie(request)) return NextResponse.next();
  const url = request.nextUrl.clone();
  const target = `${request.nextUrl.pathname}${request.nextUrl.search}`;
  url.pathname = "/sign-in";
  url.search = "";
  url.searchParams.set("redirectTo", target);
  return NextResponse.redirect(url);
}

export const config = {
  matcher: [
    "/api/:path*",
    "/parameter-sets/:path*",
    "/materials/:path*",
    "/workbench/:path*",
    "/measurement-sets/:path*",
    "/lab-runs/:path*",
    "/planner/:path*",
    "/lab/:path*",
    "/settings/:path*",
    "/audit/:path*",
    "/admin/:path*",
    "/api-reference/:path*",
  ],
};
