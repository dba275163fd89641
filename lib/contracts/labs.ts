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

/** POST /api/labs: the caller's personal lab (for someone left with no lab of their own). */
export const createPersonalLabSchema = z.object({
  name: safeString({ error: "Name the lab." }).trim().min(1, "Name the lab.").max(120, "At most 120 characters.").optional(),
});

/** Why an invitation link cannot be used (accepting it, or signing up with it). */
export type InvitationRefusal = { reason: "unknown" | "accepted" | "revoked" | "expired" } | { reason: "other_email"; email: string };

/** The error code of each refusal: an unknown link is not found; a used, withdrawn or expired one conflicts. */
export const INVITATION_REFUSAL_CODE = { unknown: "not_found", accepted: "conflict", revoked: "conflict", expired: "conflict" } as const;

/** One wording for every place that refuses an invitation link. */
export const INVITATION_REFUSED: Record<Exclude<InvitationRefusal["reason"], "other_email">, string> = {
  unknown: "This invitation link is not valid. Check that you copied all of it.",
  accepted: "This invitation has already been used.",
  revoked: "This invitation was withdrawn by the lab's owner.",
  expired: "This invitation has expired. Ask the lab's owner to invite you again.",
};

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
