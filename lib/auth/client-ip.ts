/**
 * The client address for rate limiting. Behind a proxy the first X-Forwarded-For hop is the
 * client; without one (a direct `next start`), all requests share "local", which makes the limit
 * per e-mail only, the safer direction.
 */
export function clientIp(headers: Headers): string {
  const forwarded = headers.get("x-forwarded-for")?.split(",")[0]?.trim();
  const real = headers.get("x-real-ip")?.trim();
  return (forwarded || real || "local").slice(0, 64);
}
