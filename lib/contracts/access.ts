import type { LabRole, SiteRole } from "./roles";

/*
 * Who is asking, and the proof that they may. lib/auth alone resolves a resource to its lab,
 * checks the caller's role there and hands back a LabAccess; every query of a lab's data takes
 * that proof instead of a bare lab id, so a forgotten check does not compile. The brand is a
 * type-only symbol: nothing outside lib/auth can build a LabAccess without a cast, and a unit test
 * (tests/unit/auth/access-proof.test.ts) fails on such a cast anywhere else.
 */

/** Who is making a request, as the queries need it (session or API token alike). */
export interface Caller {
  id: string;
  email: string;
  name: string;
  siteRole: SiteRole;
  via: "session" | "token";
}

declare const accessProof: unique symbol;

/** The lab-scoped things a caller can be authorized for. */
export type ResourceKind = "lab" | "parameter_set" | "measurement_set" | "light_source" | "lab_run";

/** Proof that `caller` holds at least the asked role in `labId` (site admins act as owner). */
export interface LabAccess {
  readonly caller: Caller;
  readonly labId: string;
  readonly labName: string;
  /** The caller's effective role in the lab. */
  readonly role: LabRole;
  readonly [accessProof]: true;
}

/** Proof of access to one resource: its id, and the lab it belongs to. */
export interface ResourceAccess<K extends ResourceKind = ResourceKind> extends LabAccess {
  readonly kind: K;
  readonly id: string;
}
