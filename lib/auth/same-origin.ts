/*
 * A cookie rides along with any request the browser makes, including a form or fetch that
 * another page starts. Browsers send Origin (and Sec-Fetch-Site) with every request that is not
 * GET/HEAD, so a cookie-authenticated change must come from our own origin: scheme, host and port
 * of GYROLUX_PUBLIC_URL, all three (http://our.host is not https://our.host, and a Host header is
 * whatever the client wrote). Clients that send neither header (scripts) are not browsers and
 * cannot be made to carry the cookie by a page.
 */

const SAFE_METHODS = new Set(["GET", "HEAD", "OPTIONS"]);

/** True when a cookie-authenticated request with these headers may change something. */
export function isSameOriginRequest(options: { method: string; headers: Headers; publicUrl: string }): boolean {
  if (SAFE_METHODS.has(options.method.toUpperCase())) return true;
  const fetchSite = options.headers.get("sec-fetch-site");
  if (fetchSite !== null && fetchSite !== "same-origin" && fetchSite !== "none") return false;
  const origin = options.headers.get("origin");
  if (origin === null) return true;
  try {
    return new URL(origin).origin === new URL(options.publicUrl).origin;
  } catch {
    return false;
  }
}
