import { serverSettings } from "@/lib/settings/server";

/*
 * The client address for rate limiting. Any client can send X-Forwarded-For, so that header is
 * believed only when the operator says a reverse proxy in front appends to it:
 * GYROLUX_TRUSTED_PROXY_HOPS = the number of such proxies. With N proxies the client is the N-th
 * address from the right, the one the outermost trusted proxy saw; entries further left are the
 * client's own claims. With none (the default), the address is the socket's peer, which
 * scripts/serve.mjs (the web server) writes into PEER_HEADER after dropping any value the client
 * sent; it also raises PEER_MARK so a server started some other way never believes the header.
 */

export const DIRECT_CLIENT = "direct";
export const PEER_HEADER = "x-gyrolux-peer";
const PEER_MARK = Symbol.for("gyrolux.socket-peer-header");

export function clientIpFrom(headers: Headers, trustedHops: number, peerHeaderTrusted = false): string {
  if (trustedHops === 0) {
    const peer = peerHeaderTrusted ? headers.get(PEER_HEADER)?.trim() : undefined;
    return (peer || DIRECT_CLIENT).slice(0, 64);
  }
  const chain = (headers.get("x-forwarded-for") ?? "")
    .split(",")
    .map((part) => part.trim())
    .filter(Boolean);
  const client = chain[chain.length - trustedHops] ?? chain[0];
  return (client || DIRECT_CLIENT).slice(0, 64);
}

export function clientIp(headers: Headers): string {
  const peerTrusted = (globalThis as Record<symbol, unknown>)[PEER_MARK] === true;
  return clientIpFrom(headers, serverSettings.auth.trustedProxyHops, peerTrusted);
}
