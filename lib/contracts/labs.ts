import { z } from "zod";
import type { UserRef } from "./common";
import { type LabRole, labRoleSchema } from "./roles";
import { emailSchema, safeString } from "./validation";

/* Labs, their members and invitations: request schemas and answer shapes. */

export const createInvitationSchema = z.object({ email: emailSchema, role: labRoleSchema });

/** POST /api/invitations/accept: the secret from the invitation link. */
export const acceptInvitationSchema = z.object({
  token: safeString({ error: "The invitation link is incomplete." }).max(200, "The invitation link is not valid."),
});

export const changeMemberSchema = z.object({ role: labRoleSchema });

/** A lab with the caller's role in it (GET /api/labs). */
export interface LabSummary {
  id: string;
  name: string;
  role: LabRole;
}

export interface MemberSummary {
  userId: string;
  email: string;
  name: string;
  role: LabRole;
}

/** A pending invitation to a lab (GET /api/labs/{id}/invitations). */
export interface InvitationSummary {
  id: string;
  email: string;
  role: LabRole;
  createdAt: string;
  expiresAt: string;
  invitedBy: UserRef | null;
}
