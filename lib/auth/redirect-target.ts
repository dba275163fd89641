/** Only same-site paths: an open redirect to another host would make a fine phishing link. */
export function safeRedirectTarget(value: unknown, fallback = "/parameter-sets"): string {
  if (typeof value !== "string" || !value.startsWith("/") || value.startsWith("//") || value.startsWith("/\\")) return fallback;
  if (value.startsWith("/sign-in") || value.startsWith("/sign-up") || value.startsWith("/api/")) return fallback;
  return value;
}
