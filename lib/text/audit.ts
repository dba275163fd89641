import type { AuditAction, AuditEntry, AuditKind } from "@/lib/contracts/audit";
import { countOf, noun } from "./plural";

/*
 * An audit entry in words, with its target: "changed Dr. Elbrecht's role from editor to viewer",
 * "made a share link to “TGG — handbook values”". The action keys stay as stored (they never
 * change once written); these are the words a reader sees. Every action has its sentence (the
 * Record type makes a new action without words fail to compile).
 */

type Entry = Pick<AuditEntry, "action" | "details" | "targetName" | "set">;

const str = (v: unknown): string | null => (typeof v === "string" && v !== "" ? v : typeof v === "number" ? String(v) : null);
const quoted = (name: string | null, fallback: string): string => (name ? `“${name}”` : fallback);

function sentence(entry: Entry): Record<AuditAction, () => string> {
  const d = entry.details;
  const target = entry.targetName;
  const set = quoted(entry.set?.name ?? null, "a parameter set");
  const setTarget = quoted(target, "a parameter set");
  const version = str(d.version);
  const role = str(d.role);
  return {
    "demo.seed": () => "seeded the demo data",
    "invitation.accept": () => `accepted the invitation${role ? ` as ${role}` : ""}`,
    "invitation.create": () => `invited ${target ?? "someone"}${role ? ` as ${role}` : ""}`,
    "invitation.revoke": () => `withdrew the invitation of ${target ?? "someone"}`,
    "lab.create": () => `created the personal lab ${quoted(str(d.name), "")}`.trim(),
    "light_source.create": () =>
      `added the light source ${quoted(target, "")}${str(d.wavelengthNm) ? ` (${str(d.wavelengthNm)} nm)` : ""}`.trim(),
    "light_source.delete": () => `removed the light source ${quoted(target, "")}`.trim(),
    "light_source.update": () => `changed the light source ${quoted(target, "")}`.trim(),
    "measurement_set.create": () => `uploaded the measurement set ${quoted(target, "")}`.trim(),
    "measurement_set.revise": () => {
      const points = typeof d.points === "number" ? countOf(d.points, noun("point")) : "points";
      return `edited ${points} of the measurement set ${quoted(target, "")}${str(d.revision) ? ` (revision ${str(d.revision)})` : ""}`;
    },
    "measurement_set.delete": () => `deleted the measurement set ${quoted(target, "")}`.trim(),
    "member.remove": () => `removed ${target ?? "a member"} from the lab${str(d.from) ? ` (was ${str(d.from)})` : ""}`,
    "member.role": () =>
      `changed the role of ${target ?? "a member"}${str(d.from) ? ` from ${str(d.from)}` : ""}${str(d.to) ? ` to ${str(d.to)}` : ""}`,
    "parameter_set.create": () => `created the parameter set ${setTarget}`,
    "parameter_set.delete": () => `deleted the parameter set ${setTarget}`,
    "parameter_set.fit": () => `saved a fit to ${setTarget}${version ? ` as version ${version}` : ""}`,
    "parameter_set.restore": () =>
      `restored version ${str(d.restoredVersion) ?? "?"} of ${setTarget}${version ? ` as version ${version}` : ""}`,
    "parameter_set.update": () => `saved ${version ? `version ${version}` : "a new version"} of ${setTarget}`,
    "parameter_set.view_state": () =>
      d.cleared === true ? `cleared the lab's workbench view of ${setTarget}` : `shared a workbench view of ${setTarget} with the lab`,
    "plan.delete": () => `deleted the plan ${quoted(target, "")} of ${set}`.replace("  ", " "),
    "plan.save": () => `saved the plan ${quoted(target, "")} for ${set}`.replace("  ", " "),
    "run.cancel": () => `cancelled a lab run${target ? ` (${target})` : ""}`,
    "run.submit": () => {
      const cells = typeof d.cells === "number" ? `, ${countOf(d.cells, noun("cell"))}` : "";
      return `submitted a lab run${str(d.kind) ? ` (${str(d.kind)}${cells})` : ""}`;
    },
    "share_link.create": () => `made a share link to ${setTarget}`,
    "share_link.revoke": () => `revoked a share link to ${setTarget}`,
    "token.create": () => `made the API token ${quoted(target, "")}`.trim(),
    "token.revoke": () => `revoked the API token ${quoted(target, "")}`.trim(),
    "user.email_verified": () => "confirmed their e-mail address",
    "user.end_sessions": () => `ended every session of ${target ?? "an account"}`,
    "user.password_change": () => "changed their password",
    "user.password_reset": () => "reset their password",
    "user.sign_up": () => "signed up",
  };
}

/** What the entry's actor did, in words with its target; an action this version does not know is shown by its key. */
export function describeAuditEntry(entry: Entry): string {
  const words = sentence(entry) as Record<string, (() => string) | undefined>;
  return words[entry.action]?.() ?? `recorded “${entry.action}”`;
}

/** The secondary details of an entry that its sentence does not already say (which fields a save changed). */
export function auditDetailText(entry: Pick<AuditEntry, "details">): string {
  const changed = entry.details.changed;
  return Array.isArray(changed) && changed.length > 0 ? `changed ${changed.join(", ")}` : "";
}

/** The audit page's kind filter, in words. */
export const AUDIT_KIND_LABEL: Record<AuditKind, string> = {
  parameter_set: "Parameter sets",
  member: "Members and roles",
  invitation: "Invitations",
  share_link: "Share links",
  measurement_set: "Measurement sets",
  plan: "Plans",
  run: "Lab runs",
  light_source: "Light sources",
};
