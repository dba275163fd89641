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
