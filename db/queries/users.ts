import { and, eq, isNull, sql } from "drizzle-orm";
import type { Caller } from "@/lib/contracts/access";
import { uniqueViolation } from "../errors";
import type { Executor } from "../executor";
import type { InvitationRefusal } from "@/lib/contracts/labs";
import { apiTokens, emailVerifications, passwordResets, type User, users } from "../schema";
import { recordAudit } from "./audit";
import { joinByInvitation, lockPendingInvitation } from "./invitations";
import { insertPersonalLab } from "./labs";

export async function findUserByEmail(db: Executor, options: { email: string }): Promise<User | null> {
  const [row] = await db
    .select()
    .from(users)
    .where(eq(sql`lower(${users.email})`, options.email.trim().toLowerCase()))
    .limit(1);
  return row ?? null;
}

export async function findUserById(db: Executor, options: { id: string }): Promise<User | null> {
  const [row] = await db.select().from(users).where(eq(users.id, options.id)).limit(1);
  return row ?? null;
}

export type CreateAccountResult =
  | { ok: true; user: Pick<User, "id" | "email" | "name">; labId: string }
  | { ok: false; reason: "email_taken" }
  | { ok: false; reason: "invitation"; refusal: InvitationRefusal };

/**
 * Creates a user in one transaction, with their personal lab (the user owns it), or, when the
 * sign-up comes with an invitation link, in the invited lab with the invitation's role and no
 * personal lab. The invitation is checked (row locked) before anything is written: an unusable
 * link creates no account, and a taken address rolls the whole sign-up back, leaving the link pending.
 */
export async function createAccount(
  db: Executor,
  options: { name: string; email: string; passwordHash: string; invitationTokenHash?: string },
): Promise<CreateAccountResult> {
  const email = options.email.trim().toLowerCase();
  try {
    return await db.transaction(async (tx) => {
      const locked =
        options.invitationTokenHash === undefined
          ? null
          : await lockPendingInvitation(tx, { tokenHash: options.invitationTokenHash, email });
      if (locked && !locked.ok) {
        const { ok: _, ...refusal } = locked;
        return { ok: false as const, reason: "invitation" as const, refusal };
      }
      const [user] = await tx
        .insert(users)
        .values({ name: options.name, email, passwordHash: options.passwordHash, emailVerified: false })
        .returning({ id: users.id, email: users.email, name: users.name });
      if (!user) throw new Error("insert into users returned no row");
      const labId = locked ? locked.invitation.labId : await insertPersonalLab(tx, { userId: user.id, name: `${options.name}'s lab` });
      await recordAudit(tx, {
        entry: {
          actorId: user.id,
          action: "user.sign_up",
          targetType: "user",
          targetId: user.id,
          labId,
          details: locked ? { invitationId: locked.invitation.id } : {},
        },
      });
      // After the sign-up entry, so the lab's trail reads in order: signed up, then accepted.
      if (locked) await joinByInvitation(tx, { invitation: locked.invitation, userId: user.id });
      return { ok: true as const, user, labId };
    });
  } catch (error) {
    if (uniqueViolation(error) === "users_email_lower_unique") return { ok: false, reason: "email_taken" };
    throw error;
  }
}

/** Ends every session of the user (sign-out, password change or reset, "end all sessions"). */
export async function bumpSessionVersion(db: Executor, options: { userId: string }): Promise<void> {
  await db
    .update(users)
    .set({ sessionVersion: sql`${users.sessionVersion} + 1`, updatedAt: new Date() })
    .where(eq(users.id, options.userId));
}

/** Revokes every live API token of the user; the number revoked. */
async function revokeAllTokens(tx: Executor, userId: string): Promise<number> {
  const rows = await tx
    .update(apiTokens)
    .set({ revokedAt: new Date() })
    .where(and(eq(apiTokens.userId, userId), isNull(apiTokens.revokedAt)))
    .returning({ id: apiTokens.id });
  return rows.length;
}

/** Every unused reset link of the user stops working (a password change or reset makes them stale). */
async function expireResetLinks(tx: Executor, userId: string): Promise<void> {
  await tx
    .update(passwordResets)
    .set({ usedAt: new Date() })
    .where(and(eq(passwordResets.userId, userId), isNull(passwordResets.usedAt)));
}

/**
 * "Sign out everywhere" for a user, on the caller's request, recorded in the audit trail: every
 * browser session ends and every API token is revoked (a token is a session that never expires).
 */
export async function endSessions(db: Executor, options: { caller: Caller; userId: string }): Promise<{ tokensRevoked: number }> {
  return db.transaction(async (tx) => {
    await bumpSessionVersion(tx, { userId: options.userId });
    const tokensRevoked = await revokeAllTokens(tx, options.userId);
    await recordAudit(tx, {
      entry: {
        actorId: options.caller.id,
        action: "user.end_sessions",
        targetType: "user",
        targetId: options.userId,
        details: { tokensRevoked },
      },
    });
    return { tokensRevoked };
  });
}

/** A new single-use reset link for the user; earlier unused ones stop working. */
export async function createPasswordReset(db: Executor, options: { userId: string; tokenHash: string; ttlMs: number }): Promise<void> {
  await db.transaction(async (tx) => {
    await expireResetLinks(tx, options.userId);
    await tx
      .insert(passwordResets)
      .values({ userId: options.userId, tokenHash: options.tokenHash, expiresAt: new Date(Date.now() + options.ttlMs) });
  });
}

/** Whether a reset link is live (unused, unexpired): checked before any password is hashed for it. */
export async function isPasswordResetLive(db: Executor, options: { tokenHash: string }): Promise<boolean> {
  const [reset] = await db
    .select({ id: passwordResets.id })
    .from(passwordResets)
    .where(and(eq(passwordResets.tokenHash, options.tokenHash), isNull(passwordResets.usedAt), sql`${passwordResets.expiresAt} > now()`))
    .limit(1);
  return reset !== undefined;
}

/**
 * Sets the new password if the reset link is live, marks it (and every other link of the user)
 * used, ends every session and revokes every API token, in one transaction with the link's row
 * locked (a link works once even when clicked twice at once). A reset means the account may be in
 * someone else's hands, so nothing issued before it keeps working.
 */
export async function resetPasswordWithToken(
  db: Executor,
  options: { tokenHash: string; passwordHash: string },
): Promise<{ ok: true; email: string; tokensRevoked: number } | { ok: false }> {
  return db.transaction(async (tx) => {
    const [reset] = await tx.select().from(passwordResets).where(eq(passwordResets.tokenHash, options.tokenHash)).for("update");
    if (!reset || reset.usedAt || reset.expiresAt.getTime() <= Date.now()) return { ok: false as const };
    await expireResetLinks(tx, reset.userId);
    const tokensRevoked = await revokeAllTokens(tx, reset.userId);
    const [user] = await tx
      .update(users)
      .set({ passwordHash: options.passwordHash, sessionVersion: sql`${users.sessionVersion} + 1`, updatedAt: new Date() })
      .where(eq(users.id, reset.userId))
      .returning({ email: users.email });
    if (!user) return { ok: false as const };
    await recordAudit(tx, {
      entry: {
        actorId: reset.userId,
        action: "user.password_reset",
        targetType: "user",
        targetId: reset.userId,
        details: { tokensRevoked },
      },
    });
    return { ok: true as const, email: user.email, tokensRevoked };
  });
}

/**
 * A password change: new hash, a new session version (the caller re-issues its own cookie) and
 * every outstanding reset link expired, so a link mailed before the change cannot undo it.
 */
export async function changePassword(db: Executor, options: { userId: string; passwordHash: string }): Promise<void> {
  await db.transaction(async (tx) => {
    await expireResetLinks(tx, options.userId);
    await tx
      .update(users)
      .set({ passwordHash: options.passwordHash, sessionVersion: sql`${users.sessionVersion} + 1`, updatedAt: new Date() })
      .where(eq(users.id, options.userId));
    await recordAudit(tx, {
      entry: { actorId: options.userId, action: "user.password_change", targetType: "user", targetId: options.userId, details: {} },
    });
  });
}

/** A new single-use link confirming the user's address; earlier unused ones stop working. */
export async function createEmailVerification(db: Executor, options: { userId: string; tokenHash: string; ttlMs: number }): Promise<void> {
  await db
    .update(emailVerifications)
    .set({ usedAt: new Date() })
    .where(and(eq(emailVerifications.userId, options.userId), isNull(emailVerifications.usedAt)));
  await db
    .insert(emailVerifications)
    .values({ userId: options.userId, tokenHash: options.tokenHash, expiresAt: new Date(Date.now() + options.ttlMs) });
}

/** Confirms the address of the link's user if the link is live; marks it used (row locked: works once). */
export async function confirmEmailVerification(
  db: Executor,
  options: { tokenHash: string },
): Promise<{ ok: true; email: string } | { ok: false }> {
  return db.transaction(async (tx) => {
    const [link] = await tx.select().from(emailVerifications).where(eq(emailVerifications.tokenHash, options.tokenHash)).for("update");
    if (!link || link.usedAt || link.expiresAt.getTime() <= Date.now()) return { ok: false as const };
    await tx.update(emailVerifications).set({ usedAt: new Date() }).where(eq(emailVerifications.id, link.id));
    const [user] = await tx
      .update(users)
      .set({ emailVerified: true, updatedAt: new Date() })
      .where(eq(users.id, link.userId))
      .returning({ email: users.email });
    if (!user) return { ok: false as const };
    await recordAudit(tx, {
      entry: { actorId: link.userId, action: "user.email_verified", targetType: "user", targetId: link.userId, details: {} },
    });
    return { ok: true as const, email: user.email };
  });
}
