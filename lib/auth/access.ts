import "server-only";
import { headers as nextHeaders } from "next/headers";
import type { Caller } from "@/lib/contracts/access";
import { getLabAccess } from "@/db/queries/labs";
import { findUserByTokenHash } from "@/db/queries/tokens";
import { findUserById } from "@/db/queries/users";
import type { LabRole } from "@/lib/contracts/roles";
import { DomainError, forbidden, notFound, unauthenticated } from "@/lib/contracts/errors";
import { isUuid } from "@/lib/api/ids";
import { auth } from "./config";
import { bearerToken, hashToken } from "./tokens";

/*
 * The one authorization module. Route handlers and server actions get the caller here and ask
 * requireLabRole for every lab-scoped resource; nothing else decides who may do what.
 */

const RANK: Record<LabRole, number> = { viewer: 1, editor: 2, owner: 3 };

export function roleAtLeast(role: LabRole, min: LabRole): boolean {
  return RANK[role] >= RANK[min];
}

/**
 * The caller from `Authorization: Bearer glx_…` or else the session cookie; null when neither.
 * A bearer header that is present but wrong is an error, not a fall-back to the cookie, so a
 * script with a revoked token fails loudly. The user row is re-read so deleted users lose access.
 */
export async function getCaller(request?: Request): Promise<Caller | null> {
  const headers = request?.headers ?? (await nextHeaders());
  const token = bearerToken(headers);
  if (token === "malformed") throw new DomainError("unauthenticated", "The Authorization header must be `Bearer glx_…`.");
  if (token !== null) {
    const user = await findUserByTokenHash({ tokenHash: hashToken(token) });
    if (!user) throw new DomainError("unauthenticated", "This API token is unknown or revoked.");
    return { id: user.id, email: user.email, name: user.name, siteRole: user.siteRole, via: "token" };
  }
  const user = await getSessionUser();
  if (!user) return null;
  if (request) requireSameOrigin(request);
  return { id: user.id, email: user.email, name: user.name, siteRole: user.siteRole, via: "session" };
}

/**
 * The user of the session cookie, or null. The cookie is a JWT that cannot be recalled, so the
 * user's session version is checked on every request: sign-out, a password change or reset and
 * "end all sessions" move it on, and older cookies stop working at once.
 */
export async function getSessionUser() {
  const session = await auth();
  const id = session?.user?.id;
  if (!id || !isUuid(id)) return null;
  const user = await findUserById({ id });
  if (!user || user.sessionVersion !== session.user.sessionVersion) return null;
  return user;
}

const SAFE_METHODS = new Set(["GET", "HEAD", "OPTIONS"]);

/**
 * A cookie rides along with any request the browser makes, including a form or fetch that
 * another page of the same site starts. Browsers send Origin (and Sec-Fetch-Site) with every
 * request that is not GET/HEAD, so a cookie-authenticated change must come from our own origin;
 * clients that send neither header (scripts) are not browsers and cannot be made to carry the
 * cookie by a page.
 */
export function requireSameOrigin(request: Request): void {
  if (SAFE_METHODS.has(request.method.toUpperCase())) return;
  const fetchSite = request.headers.get("sec-fetch-site");
  if (fetchSite !== null && fetchSite !== "same-origin" && fetchSite !== "none") throw crossOrigin();
  const origin = request.headers.get("origin");
  if (origin === null) return;
  const host = request.headers.get("host");
  let originHost: string | null = null;
  try {
    originHost = new URL(origin).host;
  } catch {
    originHost = null;
  }
  if (!host || originHost !== host) throw crossOrigin();
}

const crossOrigin = () => new DomainError("forbidden", "This change must come from a Gyrolux page: the request came from another origin.");

/** A caller signed in through the browser; API tokens may not manage tokens or passwords. */
export async function requireSessionCaller(request: Request, what = "Managing API tokens"): Promise<Caller> {
  const caller = await requireCaller(request);
  if (caller.via !== "session") throw new DomainError("forbidden", `${what} needs a signed-in browser session; an API token cannot do it.`);
  return caller;
}

/** The caller, or 401. */
export async function requireCaller(request?: Request): Promise<Caller> {
  const caller = await getCaller(request);
  if (!caller) throw unauthenticated();
  return caller;
}

export interface LabAccess {
  labId: string;
  labName: string;
  /** The caller's effective role; site admins act as owner. */
  role: LabRole;
}

/**
 * Non-member (or unknown/malformed lab id) → 404, so a lab's existence does not leak;
 * member below `minRole` → 403; site admin → owner everywhere.
 */
export async function requireLabRole(
  caller: Caller,
  labId: string,
  minRole: LabRole,
  options: { notFoundMessage?: string } = {},
): Promise<LabAccess> {
  const missing = () => notFound(options.notFoundMessage ?? "No such lab.");
  if (!isUuid(labId)) throw missing();
  const access = await getLabAccess({ labId, userId: caller.id });
  if (!access) throw missing();
  const role: LabRole | null = caller.siteRole === "admin" ? "owner" : access.role;
  if (!role) throw missing();
  if (!roleAtLeast(role, minRole)) throw forbidden(`This needs the ${minRole} role in ${access.labName}; you are ${role}.`);
  return { labId: access.labId, labName: access.labName, role };
}
