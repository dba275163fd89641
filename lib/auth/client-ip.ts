import { serverSettings } from "@/lib/settings/server";

/*
 * The client address for rate limiting. `next start` does not hand route handlers the socket's
 * peer address, and any client can send X-Forwarded-For, so the header is believed only when the
 * operator says a reverse proxy in front appends to it: GYROLUX_TRUSTED_PROXY_HOPS = the number of
 * such proxies (0, the default: ignore the header). With N proxies the client is the N-th address
 * from the right, the one the outermost trusted proxy saw; entries further left are the client's
 * own claims.
 */

export const DIRECT_CLIENT = "direct";

export function clientIpFrom(headers: Headers, trustedHops: number): string {
  if (trustedHops === 0) return DIRECT_CLIENT;
  const chain = (headers.get("x-forwarded-for") ?? "")
    .split(",")
    .map((part) => part.trim())
    .filter(Boolean);
  const client = chain[chain.length - trustedHops] ?? chain[0];
  return (client || DIRECT_CLIENT).slice(0, 64);
}

export function clientIp(headers: Headers): string {
  return clientIpFrom(headers, serverSettings.auth.trustedProxyHops);
}
