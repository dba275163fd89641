/*
 * Where to go after signing in: only a path of our own origin. Browsers drop TAB, CR and LF from
 * URLs and read a backslash as a slash, so "/\t/evil.test" would leave for another host; such
 * characters (and any whitespace, which also breaks the Location header) refuse the value outright.
 * What passes is resolved against the public URL and must keep its origin; the answer is the
 * resolved, percent-encoded path, so the Location header is always plain ASCII.
 */

// C0 and C1 controls, DEL, every Unicode space (\s covers U+3000 and friends) and backslashes.
// biome-ignore lint/suspicious/noControlCharactersInRegex: finding control characters is the point
const UNSAFE = /[\u0000-\u001f\u007f-\u009f\s\\]/u;
const NEVER_AFTER_SIGN_IN = ["/sign-in", "/sign-up", "/api/"];

export function safeRedirectTarget(value: unknown, publicUrl: string, fallback = "/parameter-sets"): string {
  if (typeof value !== "string" || value.length > 2000 || !value.startsWith("/") || value.startsWith("//")) return fallback;
  if (UNSAFE.test(value)) return fallback;
  let base: URL;
  let target: URL;
  try {
    base = new URL(publicUrl);
    target = new URL(value, base);
  } catch {
    return fallback;
  }
  if (target.origin !== base.origin) return fallback;
  const path = `${target.pathname}${target.search}${target.hash}`;
  if (path.startsWith("//") || NEVER_AFTER_SIGN_IN.some((prefix) => path.startsWith(prefix))) return fallback;
  return path;
}
