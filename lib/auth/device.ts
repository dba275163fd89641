import { createHmac, randomBytes, timingSafeEqual } from "node:crypto";

/*
 * A browser that once signed in to an account keeps a signed device cookie for that account. A
 * sign-in carrying it is counted under its own key, so strangers failing against the address
 * (which slows every unknown client down) never lock out the browser the owner already uses.
 * The value is `<id>.<mac>`, the mac an HMAC-SHA256 under AUTH_SECRET of the e-mail and the id:
 * it proves nothing but "this browser signed in to this e-mail before", which is all it grants.
 */

export const DEVICE_COOKIE = "glx_device";
export const DEVICE_COOKIE_MAX_AGE_S = 365 * 24 * 60 * 60;

function mac(secret: string, email: string, id: string): string {
  return createHmac("sha256", secret).update(`${email.trim().toLowerCase()}\n${id}`).digest("base64url");
}

/** A fresh cookie value for this e-mail. */
export function newDeviceCookie(secret: string, email: string): string {
  const id = randomBytes(16).toString("base64url");
  return `${id}.${mac(secret, email, id)}`;
}

/** The device id when the cookie value is one we issued for this e-mail, else null. */
export function verifiedDeviceId(secret: string, email: string, value: string | undefined | null): string | null {
  if (!value || value.length > 200) return null;
  const [id, given, extra] = value.split(".");
  if (!id || !given || extra !== undefined || !/^[A-Za-z0-9_-]{16,32}$/.test(id)) return null;
  const expected = Buffer.from(mac(secret, email, id));
  const actual = Buffer.from(given);
  return expected.length === actual.length && timingSafeEqual(expected, actual) ? id : null;
}

/** One cookie's value from a Cookie header (the first one of that name). */
export function cookieValue(cookieHeader: string | null, name: string): string | null {
  if (!cookieHeader) return null;
  for (const part of cookieHeader.split(";")) {
    const at = part.indexOf("=");
    if (at > 0 && part.slice(0, at).trim() === name) return part.slice(at + 1).trim();
  }
  return null;
}

/** The Set-Cookie header value of a device cookie. */
export function deviceSetCookie(value: string, secure: boolean): string {
  return `${DEVICE_COOKIE}=${value}; Path=/; Max-Age=${DEVICE_COOKIE_MAX_AGE_S}; HttpOnly; SameSite=Lax${secure ? "; Secure" : ""}`;
}
