/**
 * The client address for rate limiting: the first X-Forwarded-For hop (what a reverse proxy
 * reports), else X-Real-IP. A client talking to `next start` directly can forge this header, so
 * the limiter also caps failures per e-mail across all addresses (lib/auth/rate-limit.ts).
 */
export function clientIp(headers: Headers): string {
  const first = headers.get("x-forwarded-for")?.split(",")[0]?.trim();
  return (first || headers.get("x-real-ip")?.trim() || "local").slice(0, 64);
}
