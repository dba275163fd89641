import "server-only";
import { headers as nextHeaders } from "next/headers";
import { db } from "@/db/client";
import { findResourceMembership } from "@/db/queries/resource-labs";
import { findUserByTokenHash } from "@/db/queries/tokens";
import { findUserById } from "@/db/queries/users";
import type { Caller, ResourceAccess, ResourceKind } from "@/lib/contracts/access";
import { DomainError, forbidden, notFound, unauthenticated } from "@/lib/contracts/errors";
import { type LabRole, roleAtLeast } from "@/lib/contracts/roles";
import { isUuid } from "@/lib/contracts/validation";
import { serverSettings } from "@/lib/settings/server";
import { isSameOriginRequest } from "./same-origin";
import { sessionClaims } from "./session-token";
import { bearerToken, hashToken } from "./tokens";

/*
 * The one authorization module. Route handlers and server actions get the caller here and ask
 * authorize() for every lab-scoped resource; nothing else decides who may do what.
 */

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
    const user = await findUserByTokenHash(db, { tokenHash: hashToken(token) });
    if (!user) throw new DomainError("unauthenticated", "This API token is unknown or revoked.");
    return { id: user.id, email: user.email, name: user.name, siteRole: user.siteRole, via: "token" };
  }
  const user = await getSessionUser(request);
  if (!user) return null;
  if (request) requireSameOrigin(request);
  return { id: user.id, email: user.email, name: user.name, siteRole: user.siteRole, via: "session" };
}

/**
 * The user of the session cookie, or null. The cookie is a JWT that cannot be recalled, so the
 * user's session version is checked on every request: sign-out, a password change or reset and
 * "end all sessions" move it on, and older cookies stop working at once.
 */
export async function getSessionUser(request?: Request) {
  const headers = request?.headers ?? (await nextHeaders());
  const claims = await sessionClaims(headers.get("cookie"));
  if (!claims || !isUuid(claims.id)) return null;
  const user = await findUserById(db, { id: claims.id });
  if (!user || user.sessionVersion !== claims.sv) return null;
  return user;
}

/** Refuses a cookie-authenticated change that did not come from our own origin (lib/auth/same-origin.ts). */
export function requireSameOrigin(request: Request): void {
  if (!isSameOriginRequest({ method: request.method, headers: request.headers, publicUrl: serverSettings.site.publicUrl })) {
    throw crossOrigin();
  }
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

const NOT_FOUND: Record<ResourceKind, string> = {
  lab: "No such lab.",
  parameter_set: "No such parameter set.",
  measurement_set: "No such measurement set.",
  light_source: "No such light source.",
  lab_run: "No such run.",
};

/**
 * The one authorization step: resolves the resource to its lab, checks the caller's role there
 * and returns the proof every lab-scoped query takes. Unknown or malformed ids and labs the caller
 * is not a member of are all 404 (so a lab's existence does not leak); a member below `minRole`
 * is 403; a site admin acts as owner everywhere.
 */
export async function authorize<K extends ResourceKind>(
  caller: Caller,
  resource: { kind: K; id: string },
  minRole: LabRole,
): Promise<ResourceAccess<K>> {
  const missing = () => notFound(NOT_FOUND[resource.kind]);
  if (!isUuid(resource.id)) throw missing();
  const membership = await findResourceMembership(db, { kind: resource.kind, id: resource.id, userId: caller.id });
  if (!membership) throw missing();
  const labId = membership.labId;
  const role: LabRole | null = caller.siteRole === "admin" ? "owner" : membership.role;
  if (!role) throw missing();
  if (!roleAtLeast(role, minRole)) throw forbidden(`This needs the ${minRole} role in ${membership.labName}; you are ${role}.`);
  // The only place a proof is made: the brand cannot be written outside this module.
  return { caller, kind: resource.kind, id: resource.id, labId, labName: membership.labName, role } as ResourceAccess<K>;
}

/** authorize() for a lab itself (lists and creations inside a lab). */
export function authorizeLab(caller: Caller, labId: string, minRole: LabRole): Promise<ResourceAccess<"lab">> {
  return authorize(caller, { kind: "lab", id: labId }, minRole);
}
