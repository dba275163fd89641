import "server-only";
import { serverSettings } from "@/lib/settings/server";
import { safeRedirectTarget } from "./redirect-target";

/** The page to open after signing in: a same-origin path of GYROLUX_PUBLIC_URL, else the sets list. */
export function afterSignInTarget(value: unknown): string {
  return safeRedirectTarget(value, serverSettings.site.publicUrl);
}
