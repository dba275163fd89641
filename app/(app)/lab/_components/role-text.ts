import type { LabRole } from "@/lib/contracts/roles";

export const ROLES: readonly LabRole[] = ["owner", "editor", "viewer"];

export const ROLE_LABEL: Record<LabRole, string> = { owner: "Owner", editor: "Editor", viewer: "Viewer" };

export const ROLE_MEANING: Record<LabRole, string> = {
  owner: "manages members and edits sets",
  editor: "creates, edits and deletes sets",
  viewer: "reads sets",
};
