import { createHash, randomBytes } from "node:crypto";

/*
 * API tokens: "glx_" + 32 random bytes in base64url (256 bits, so a fast sha256 is enough; no
 * salt or slow hash is needed for secrets that cannot be guessed). Only the hash is stored.
 */
export const TOKEN_PREFIX = "glx_";

export function generateToken(): { token: string; tokenHash: string } {
  const token = `${TOKEN_PREFIX}${randomBytes(32).toString("base64url")}`;
  return { token, tokenHash: hashToken(token) };
}

export function hashToken(token: string): string {
  return createHash("sha256").update(token, "utf8").digest("hex");
}

/** The token from `Authorization: Bearer glx_…`, null when there is no bearer header at all. */
export function bearerToken(headers: Headers): string | null | "malformed" {
  const header = headers.get("authorization");
  if (header === null) return null;
  const match = /^Bearer\s+(\S+)\s*$/i.exec(header);
  if (!match?.[1]?.startsWith(TOKEN_PREFIX) || match[1].length > 200) return "malformed";
  return match[1];
}

/** A secret for a link (invitation, password reset, share link): 256 random bits, base64url. */
export function generateLinkSecret(): { secret: string; secretHash: string } {
  const secret = randomBytes(32).toString("base64url");
  return { secret, secretHash: hashToken(secret) };
}

/** Link secrets are 43 base64url characters; anything else cannot name a link (and is not hashed). */
export function isLinkSecret(value: string): boolean {
  return /^[A-Za-z0-9_-]{43}$/.test(value);
}
