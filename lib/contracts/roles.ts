import { z } from "zod";

/*
 * Who may do what: the site roles and the lab roles with their one order. The database enums
 * (db/schema.ts), the request schemas, the server's authorization (lib/auth) and the screens'
 * hiding of controls all read these lists, so a role is added or reordered in one place.
 */

export const SITE_ROLES = ["admin", "member"] as const;
export type SiteRole = (typeof SITE_ROLES)[number];

/** Highest first: the order in which members are listed and roles are offered. */
export const LAB_ROLES = ["owner", "editor", "viewer"] as const;
export type LabRole = (typeof LAB_ROLES)[number];

const RANK: Record<LabRole, number> = { owner: 3, editor: 2, viewer: 1 };

/** owner > editor > viewer. The server decides with this; screens use it only to hide controls. */
export function roleAtLeast(role: LabRole | null | undefined, min: LabRole): boolean {
  return role !== null && role !== undefined && RANK[role] >= RANK[min];
}

export const labRoleSchema = z.enum(LAB_ROLES, { error: 'Role must be "owner", "editor" or "viewer".' });

/** How every screen and e-mail names each lab role, and what it may do (one wording for the lab page and the invitation mail). */
export const ROLE_LABEL: Record<LabRole, string> = { owner: "Owner", editor: "Editor", viewer: "Viewer" };

export const ROLE_MEANING: Record<LabRole, string> = {
  owner: "manages members and edits sets",
  editor: "creates, edits and deletes sets",
  viewer: "reads sets",
};

/** "viewer (reads sets)": a role in running text. */
export function roleInWords(role: LabRole): string {
  return `${ROLE_LABEL[role].toLowerCase()} (${ROLE_MEANING[role]})`;
}
