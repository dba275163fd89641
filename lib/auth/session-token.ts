import "server-only";
import { decode } from "next-auth/jwt";
import { serverSettings } from "@/lib/settings/server";
import { isSessionCookieName } from "./session-cookie";

/*
 * The session cookie's claims, read without Auth.js's full request pipeline. auth() builds a
 * Request, runs the session action, re-encrypts a fresh token and parses its own JSON answer on
 * every call; an API request only needs to know who the cookie names, and lib/auth/access.ts then
 * checks that user's session version in the database anyway. Decryption is a pure function of the
 * cookie and the secret, so decoded claims are kept per cookie value (bounded, each entry until
 * the token's own expiry): a browser sending the same cookie a hundred times is decrypted once.
 */

export interface SessionClaims {
  id: string;
  sv: number;
}

const CACHE_MAX = 5000;
const cache = new Map<string, { claims: SessionClaims | null; expiresAtMs: number }>();

/** The session token and the cookie name it was read under (its chunks joined in order), or null. */
export function sessionTokenFrom(cookieHeader: string | null): { token: string; name: string } | null {
  if (!cookieHeader) return null;
  const parts = new Map<string, string>();
  for (const part of cookieHeader.split(";")) {
    const at = part.indexOf("=");
    if (at <= 0) continue;
    const name = part.slice(0, at).trim();
    if (isSessionCookieName(name) && !parts.has(name)) parts.set(name, part.slice(at + 1).trim());
  }
  for (const base of ["__Secure-authjs.session-token", "authjs.session-token"]) {
    const whole = parts.get(base);
    if (whole) return { token: whole, name: base };
    const chunks: string[] = [];
    for (let i = 0; parts.has(`${base}.${i}`); i++) chunks.push(parts.get(`${base}.${i}`)!);
    if (chunks.length > 0) return { token: chunks.join(""), name: base };
  }
  return null;
}

function remember(token: string, claims: SessionClaims | null, expiresAtMs: number): void {
  if (cache.size >= CACHE_MAX) {
    const oldest = cache.keys().next().value;
    if (oldest !== undefined) cache.delete(oldest);
  }
  cache.set(token, { claims, expiresAtMs });
}

/** Who the request's session cookie names (not yet checked against the session version), or null. */
export async function sessionClaims(cookieHeader: string | null): Promise<SessionClaims | null> {
  const found = sessionTokenFrom(cookieHeader);
  const secret = serverSettings.auth.secret;
  if (!found || !secret || found.token.length > 16_384) return null;
  const now = Date.now();
  const cached = cache.get(found.token);
  if (cached && cached.expiresAtMs > now) return cached.claims;
  let claims: SessionClaims | null = null;
  let expiresAtMs = now + 60_000;
  try {
    const payload = await decode({ token: found.token, secret, salt: found.name });
    if (payload && typeof payload.id === "string" && typeof payload.sv === "number") {
      claims = { id: payload.id, sv: payload.sv };
      if (typeof payload.exp === "number") expiresAtMs = payload.exp * 1000;
    }
  } catch {
    // A forged, truncated or expired cookie names nobody; remembered briefly like any other.
  }
  if (claims === null || expiresAtMs > now) remember(found.token, claims, claims ? expiresAtMs : now + 60_000);
  return claims;
}
