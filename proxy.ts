import { NextResponse, type NextRequest } from "next/server";

/*
 * Optimistic redirect only: a signed-out visitor of an app page goes to /sign-in. It looks for
 * the Auth.js session cookie without decoding it (no database, no pg import here); every page,
 * route handler and action still checks the session itself.
 */

const SESSION_COOKIES = ["authjs.session-token", "__Secure-authjs.session-token"];

function hasSessionCookie(request: NextRequest): boolean {
  // Large JWTs are split into chunks named "<cookie>.0", "<cookie>.1", …
  return request.cookies.getAll().some(({ name }) => SESSION_COOKIES.some((base) => name === base || name.startsWith(`${base}.`)));
}

export function proxy(request: NextRequest): NextResponse {
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
    "/parameter-sets/:path*",
    "/workbench/:path*",
    "/measurements/:path*",
    "/planner/:path*",
    "/lab/:path*",
    "/settings/:path*",
  ],
};
