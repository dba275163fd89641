import { and, desc, eq, gt, isNull, sql } from "drizzle-orm";
import type { Caller, ResourceAccess } from "@/lib/contracts/access";
import type { InvitationRefusal, InvitationSummary } from "@/lib/contracts/labs";
import type { Page, PageQuery } from "@/lib/contracts/paging";
import type { LabRole } from "@/lib/contracts/roles";
import type { Executor } from "../executor";
import { decodeCursor, timeIdCursor, toPage } from "../paging";
import { invitations, labMemberships, labs, users } from "../schema";
import { recordAudit } from "./audit";

/*
 * Invitations to a lab. Nobody joins a lab without accepting; a link works once, expires after
 * INVITATION_DAYS and can be revoked. Inviting an address reveals nothing about whether it has an
 * account: the same invitation is made either way.
 */

export const INVITATION_DAYS = 7;

export async function createInvitation(
  db: Executor,
  options: { access: ResourceAccess<"lab">; email: string; role: LabRole; tokenHash: string },
): Promise<InvitationSummary> {
  const { caller, labId } = options.access;
  return db.transaction(async (tx) => {
    // A new invitation to the same address replaces the pending one: only the newest link works.
    await tx
      .update(invitations)
      .set({ revokedAt: new Date() })
      .where(
        and(
          eq(invitations.labId, labId),
          eq(invitations.email, options.email),
          isNull(invitations.acceptedAt),
          isNull(invitations.revokedAt),
        ),
      );
    const [row] = await tx
      .insert(invitations)
      .values({
        labId,
        email: options.email,
        role: options.role,
        tokenHash: options.tokenHash,
        invitedById: caller.id,
        expiresAt: new Date(Date.now() + INVITATION_DAYS * 24 * 60 * 60 * 1000),
      })
      .returning();
    if (!row) throw new Error("insert into invitations returned no row");
    await recordAudit(tx, {
      entry: {
        actorId: caller.id,
        action: "invitation.create",
        targetType: "invitation",
        targetId: row.id,
        labId,
        details: { email: row.email, role: row.role },
      },
    });
    const [actor] = await tx.select({ id: users.id, name: users.name }).from(users).where(eq(users.id, caller.id));
    return {
      id: row.id,
      email: row.email,
      role: row.role,
      createdAt: row.createdAt.toISOString(),
      expiresAt: row.expiresAt.toISOString(),
      invitedBy: actor ?? null,
    };
  });
}

/** Pending invitations of a lab (not accepted, not revoked, not expired), newest first. */
export async function listPendingInvitations(
  db: Executor,
  options: { access: ResourceAccess<"lab">; page: PageQuery },
): Promise<Page<InvitationSummary>> {
  const after = decodeCursor(options.page.cursor, timeIdCursor);
  const rows = await db
    .select({
      id: invitations.id,
      email: invitations.email,
      role: invitations.role,
      createdAt: invitations.createdAt,
      expiresAt: invitations.expiresAt,
      invitedById: users.id,
      invitedByName: users.name,
      cursorAt: sql<string>`${invitations.createdAt}::text`,
    })
    .from(invitations)
    .leftJoin(users, eq(users.id, invitations.invitedById))
    .where(
      and(
        eq(invitations.labId, options.access.labId),
        isNull(invitations.acceptedAt),
        isNull(invitations.revokedAt),
        gt(invitations.expiresAt, new Date()),
        after ? sql`(${invitations.createdAt}, ${invitations.id}) < (${after[0]}::timestamptz, ${after[1]}::uuid)` : undefined,
      ),
    )
    .orderBy(desc(invitations.createdAt), desc(invitations.id))
    .limit(options.page.limit + 1);
  return toPage(
    rows,
    options.page.limit,
    (row) => ({
      id: row.id,
      email: row.email,
      role: row.role,
      createdAt: row.createdAt.toISOString(),
      expiresAt: row.expiresAt.toISOString(),
      invitedBy: row.invitedById && row.invitedByName ? { id: row.invitedById, name: row.invitedByName } : null,
    }),
    (row) => [row.cursorAt, row.id],
  );
}

/** Withdraws a pending invitation of the lab; false when there is no such pending invitation. */
export async function revokeInvitation(db: Executor, options: { access: ResourceAccess<"lab">; id: string }): Promise<boolean> {
  const { caller, labId } = options.access;
  return db.transaction(async (tx) => {
    const [row] = await tx
      .update(invitations)
      .set({ revokedAt: new Date() })
      .where(
        and(eq(invitations.id, options.id), eq(invitations.labId, labId), isNull(invitations.acceptedAt), isNull(invitations.revokedAt)),
      )
      .returning({ id: invitations.id, email: invitations.email });
    if (!row) return false;
    await recordAudit(tx, {
      entry: {
        actorId: caller.id,
        action: "invitation.revoke",
        targetType: "invitation",
        targetId: row.id,
        labId,
        details: { email: row.email },
      },
    });
    return true;
  });
}

export type InvitationState = "pending" | "accepted" | "revoked" | "expired";

export interface InvitationView {
  labName: string;
  email: string;
  role: LabRole;
  invitedByName: string | null;
  expiresAt: string;
  state: InvitationState;
}

function stateOf(row: { acceptedAt: Date | null; revokedAt: Date | null; expiresAt: Date }): InvitationState {
  if (row.acceptedAt) return "accepted";
  if (row.revokedAt) return "revoked";
  if (row.expiresAt.getTime() <= Date.now()) return "expired";
  return "pending";
}

/** What the invitee's link shows; null when the token names no invitation. */
export async function findInvitationByToken(db: Executor, options: { tokenHash: string }): Promise<InvitationView | null> {
  const [row] = await db
    .select({
      labName: labs.name,
      email: invitations.email,
      role: invitations.role,
      invitedByName: users.name,
      expiresAt: invitations.expiresAt,
      acceptedAt: invitations.acceptedAt,
      revokedAt: invitations.revokedAt,
    })
    .from(invitations)
    .innerJoin(labs, eq(labs.id, invitations.labId))
    .leftJoin(users, eq(users.id, invitations.invitedById))
    .where(eq(invitations.tokenHash, options.tokenHash))
    .limit(1);
  if (!row) return null;
  return {
    labName: row.labName,
    email: row.email,
    role: row.role,
    invitedByName: row.invitedByName,
    expiresAt: row.expiresAt.toISOString(),
    state: stateOf(row),
  };
}

export type AcceptResult =
  | { ok: true; labId: string; labName: string; role: LabRole; alreadyMember: boolean }
  | ({ ok: false } & InvitationRefusal);

type InvitationRow = typeof invitations.$inferSelect;

/**
 * The invitation of the link, row locked for the rest of the caller's transaction (a link works
 * exactly once even when used twice at once), if it is pending and made out to the e-mail address.
 */
export async function lockPendingInvitation(
  tx: Executor,
  options: { tokenHash: string; email: string },
): Promise<{ ok: true; invitation: InvitationRow } | ({ ok: false } & InvitationRefusal)> {
  const [row] = await tx.select().from(invitations).where(eq(invitations.tokenHash, options.tokenHash)).for("update");
  if (!row) return { ok: false, reason: "unknown" };
  const state = stateOf(row);
  if (state !== "pending") return { ok: false, reason: state };
  if (row.email !== options.email.trim().toLowerCase()) return { ok: false, reason: "other_email", email: row.email };
  return { ok: true, invitation: row };
}

/** The user joins the invitation's lab with its role and the invitation is used, in the caller's transaction (audited). */
export async function joinByInvitation(
  tx: Executor,
  options: { invitation: InvitationRow; userId: string },
): Promise<{ labId: string; labName: string; role: LabRole; alreadyMember: boolean }> {
  const row = options.invitation;
  const inserted = await tx
    .insert(labMemberships)
    .values({ labId: row.labId, userId: options.userId, role: row.role })
    .onConflictDoNothing()
    .returning({ role: labMemberships.role });
  await tx.update(invitations).set({ acceptedAt: new Date(), acceptedById: options.userId }).where(eq(invitations.id, row.id));
  await recordAudit(tx, {
    entry: {
      actorId: options.userId,
      action: "invitation.accept",
      targetType: "invitation",
      targetId: row.id,
      labId: row.labId,
      details: { email: row.email, role: row.role, alreadyMember: inserted.length === 0 },
    },
  });
  const [lab] = await tx.select({ name: labs.name }).from(labs).where(eq(labs.id, row.labId));
  return { labId: row.labId, labName: lab?.name ?? "", role: row.role, alreadyMember: inserted.length === 0 };
}

/** The caller accepts, in one transaction with the invitation row locked, so a link works exactly once. */
export async function acceptInvitation(db: Executor, options: { caller: Caller; tokenHash: string }): Promise<AcceptResult> {
  const { caller } = options;
  return db.transaction(async (tx) => {
    const locked = await lockPendingInvitation(tx, { tokenHash: options.tokenHash, email: caller.email });
    if (!locked.ok) return locked;
    return { ok: true as const, ...(await joinByInvitation(tx, { invitation: locked.invitation, userId: caller.id })) };
  });
}
