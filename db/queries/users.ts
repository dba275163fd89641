import "server-only";
import { eq, sql } from "drizzle-orm";
import { uniqueViolation } from "@/lib/api/db-errors";
import { db } from "../client";
import { labMemberships, labs, users, type User } from "../schema";
import { recordAudit } from "./audit";

export async function findUserByEmail(options: { email: string }): Promise<User | null> {
  const [row] = await db
    .select()
    .from(users)
    .where(eq(sql`lower(${users.email})`, options.email.trim().toLowerCase()))
    .limit(1);
  return row ?? null;
}

export async function findUserById(options: { id: string }): Promise<User | null> {
  const [row] = await db.select().from(users).where(eq(users.id, options.id)).limit(1);
  return row ?? null;
}

export type CreateAccountResult =
  | { ok: true; user: Pick<User, "id" | "email" | "name">; labId: string }
  | { ok: false; reason: "email_taken" };

/** Creates a user and their personal lab (the user owns it) in one transaction. */
export async function createAccount(options: { name: string; email: string; passwordHash: string }): Promise<CreateAccountResult> {
  try {
    return await db.transaction(async (tx) => {
      const [user] = await tx
        .insert(users)
        .values({ name: options.name, email: options.email.trim().toLowerCase(), passwordHash: options.passwordHash })
        .returning({ id: users.id, email: users.email, name: users.name });
      if (!user) throw new Error("insert into users returned no row");
      const [lab] = await tx
        .insert(labs)
        .values({ name: `${options.name}'s lab`, personal: true })
        .returning({ id: labs.id });
      if (!lab) throw new Error("insert into labs returned no row");
      await tx.insert(labMemberships).values({ labId: lab.id, userId: user.id, role: "owner" });
      await recordAudit({
        tx,
        entry: { actorId: user.id, action: "user.sign_up", targetType: "user", targetId: user.id, labId: lab.id, details: {} },
      });
      return { ok: true as const, user, labId: lab.id };
    });
  } catch (error) {
    if (uniqueViolation(error) === "users_email_lower_unique") return { ok: false, reason: "email_taken" };
    throw error;
  }
}

/** Ends every session of the user (sign-out, password change or reset, "end all sessions"). */
export async function bumpSessionVersion(options: { userId: string; executor?: Pick<typeof db, "update"> }): Promise<void> {
  await (options.executor ?? db)
    .update(users)
    .set({ sessionVersion: sql`${users.sessionVersion} + 1`, updatedAt: new Date() })
    .where(eq(users.id, options.userId));
}
