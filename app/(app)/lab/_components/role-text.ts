import type { LabRole } from "@/lib/contracts/roles";

/* How the lab screens name and explain each role (the roles and their order: lib/contracts/roles.ts). */

export const ROLE_LABEL: Record<LabRole, string> = { owner: "Owner", editor: "Editor", viewer: "Viewer" };

export const ROLE_MEANING: Record<LabRole, string> = {
  owner: "manages members and edits sets",
  editor: "creates, edits and deletes sets",
  viewer: "reads sets",
};
