import { z } from "zod";
import { pageQuerySchema } from "./paging";
import { type LabRole, roleAtLeast } from "./roles";

/*
 * The audit trail: every action a writer may record, the kinds a reader may filter by, and the
 * entry shape the list answers with. The action strings are stored in audit_log.action, so they
 * never change once written; a kind is the part before the dot.
 */

export const AUDIT_ACTIONS = [
  "demo.seed",
  "invitation.accept",
  "invitation.create",
  "invitation.revoke",
  "lab.create",
  "light_source.create",
  "light_source.delete",
  "light_source.update",
  "measurement_set.create",
  "measurement_set.delete",
  "measurement_set.revise",
  "member.remove",
  "member.role",
  "parameter_set.create",
  "parameter_set.delete",
  "parameter_set.fit",
  "parameter_set.restore",
  "parameter_set.update",
  "parameter_set.view_state",
  "plan.delete",
  "plan.save",
  "run.cancel",
  "run.submit",
  "share_link.create",
  "share_link.revoke",
  "token.create",
  "token.revoke",
  "user.email_verified",
  "user.end_sessions",
  "user.password_change",
  "user.password_reset",
  "user.sign_up",
] as const;
export type AuditAction = (typeof AUDIT_ACTIONS)[number];

/** What an entry is about (audit_log.target_type). */
export const AUDIT_TARGETS = [
  "api_token",
  "invitation",
  "lab_run",
  "light_source",
  "measurement_set",
  "parameter_set",
  "plan",
  "user",
] as const;
export type AuditTarget = (typeof AUDIT_TARGETS)[number];

/** The kinds the audit page filters by (the part of the action before the dot). */
export const AUDIT_KINDS = [
  "parameter_set",
  "member",
  "invitation",
  "share_link",
  "measurement_set",
  "plan",
  "run",
  "light_source",
] as const;
export type AuditKind = (typeof AUDIT_KINDS)[number];

export const auditQuerySchema = pageQuerySchema.extend({
  labId: z.uuid({ error: "Choose a lab." }),
  setId: z.uuid({ error: "Not a parameter set id." }).optional(),
  actorId: z.uuid({ error: "Not a person's id." }).optional(),
  /** Entries about this person (a role changed, a member removed), whoever made them. */
  subjectId: z.uuid({ error: "Not a person's id." }).optional(),
  kind: z.enum(AUDIT_KINDS, { error: "Unknown kind." }).optional(),
  from: z.iso.date({ error: "Use a date like 2026-01-31." }).optional(),
  to: z.iso.date({ error: "Use a date like 2026-01-31." }).optional(),
});

/** One entry as the audit list answers it. */
export interface AuditEntry {
  id: string;
  /** ISO 8601 */
  at: string;
  action: string;
  actor: { id: string; name: string } | null;
  targetType: string;
  targetId: string;
  /** The target's name as it is now (a person, a set, a file, a plan), or as recorded when it is gone; null when unknown. */
  targetName: string | null;
  /** The parameter set an entry about something else concerns (a plan's set), with its name. */
  set: { id: string; name: string | null } | null;
  details: Record<string, unknown>;
}

/** Who may read a lab's audit trail: its owners (and site admins, who act as owners). */
export const AUDIT_MIN_ROLE: LabRole = "owner";

/** Whether someone with these lab roles can open the audit page at all (the menu shows it only then). */
export function canReadAnyAudit(roles: readonly LabRole[]): boolean {
  return roles.some((role) => roleAtLeast(role, AUDIT_MIN_ROLE));
}
