import { and, asc, eq, inArray, isNull, sql } from "drizzle-orm";
import type { Caller, ResourceAccess } from "@/lib/contracts/access";
import type { LabSummary, MemberSummary } from "@/lib/contracts/labs";
import type { Page, PageQuery } from "@/lib/contracts/paging";
import { LAB_ROLES, type LabRole } from "@/lib/contracts/roles";
import type { Executor } from "../executor";
import { decodeCursor, offsetCursor, toPage } from "../paging";
import { labMemberships, labs, parameterSets, shareLinks, users } from "../schema";
import { recordAudit } from "./audit";

/** The caller's labs; a site admin gets every lab, as owner. */
export async function listLabs(db: Executor, options: { caller: Caller }): Promise<LabSummary[]> {
  if (options.caller.siteRole === "admin") {
    const rows = await db.select({ id: labs.id, name: labs.name }).from(labs).orderBy(asc(labs.name));
    return rows.map((row) => ({ ...row, role: "owner" as const }));
  }
  return db
    .select({ id: labs.id, name: labs.name, role: labMemberships.role })
    .from(labMemberships)
    .innerJoin(labs, eq(labs.id, labMemberships.labId))
    .where(eq(labMemberships.userId, options.caller.id))
    .orderBy(asc(labs.name));
}

const memberColumns = { userId: users.id, email: users.email, name: users.name, role: labMemberships.role };

// Members are listed highest role first, in the contract's one order of roles (constants only).
const ROLE_ORDER = sql.raw(`array[${LAB_ROLES.map((role) => `'${role}'`).join(", ")}]::text[]`);

/** Members of the lab, a page at a time. */
export async function listMembers(db: Executor, options: { access: ResourceAccess<"lab">; page: PageQuery }): Promise<Page<MemberSummary>> {
  const offset = decodeCursor(options.page.cursor, offsetCursor)?.[1] ?? 0;
  const rows = await db
    .select(memberColumns)
    .from(labMemberships)
    .innerJoin(users, eq(users.id, labMemberships.userId))
    .where(eq(labMemberships.labId, options.access.labId))
    .orderBy(sql`array_position(${ROLE_ORDER}, ${labMemberships.role}::text)`, asc(users.name), asc(users.id))
    .limit(options.page.limit + 1)
    .offset(offset);
  return toPage(
    rows,
    options.page.limit,
    (row) => row,
    () => ["o", offset + options.page.limit],
  );
}

export type ChangeMemberResult =
  | { ok: true; member: MemberSummary | null }
  | { ok: false; reason: "not_member" | "last_owner" | "not_owner" };

/**
 * Changes a member's role (role given) or removes them (role null), as the access's caller. The
 * lab must keep an owner: the membership rows are locked so two owners demoting each other at once
 * cannot both succeed.
 */
export async function changeMember(
  db: Executor,
  options: { access: ResourceAccess<"lab">; userId: string; role: LabRole | null },
): Promise<ChangeMemberResult> {
  const { caller, labId } = options.access;
  return db.transaction(async (tx) => {
    const rows = await tx
      .select({ userId: labMemberships.userId, role: labMemberships.role })
      .from(labMemberships)
      .where(eq(labMemberships.labId, labId))
      .for("update");
    // The caller's role was checked before the transaction; an owner demoted since then must not
    // still change roles, so the check is repeated on the locked rows. Site admins act as owner
    // everywhere and hold no membership row.
    const actor = rows.find((row) => row.userId === caller.id);
    if (caller.siteRole !== "admin" && actor?.role !== "owner") return { ok: false as const, reason: "not_owner" as const };
    const target = rows.find((row) => row.userId === options.userId);
    if (!target) return { ok: false as const, reason: "not_member" as const };
    const otherOwners = rows.filter((row) => row.role === "owner" && row.userId !== options.userId).length;
    if (target.role === "owner" && options.role !== "owner" && otherOwners === 0) {
      return { ok: false as const, reason: "last_owner" as const };
    }
    const where = and(eq(labMemberships.labId, labId), eq(labMemberships.userId, options.userId));
    let shareLinksRevoked = 0;
    if (options.role === null) {
      await tx.delete(labMemberships).where(where);
      // A share link speaks for its maker: once they leave the lab, the links they made stop working.
      const revoked = await tx
        .update(shareLinks)
        .set({ revokedAt: new Date() })
        .where(
          and(
            eq(shareLinks.createdById, options.userId),
            isNull(shareLinks.revokedAt),
            inArray(shareLinks.setId, tx.select({ id: parameterSets.id }).from(parameterSets).where(eq(parameterSets.labId, labId))),
          ),
        )
        .returning({ id: shareLinks.id });
      shareLinksRevoked = revoked.length;
    } else {
      await tx.update(labMemberships).set({ role: options.role }).where(where);
    }
    await recordAudit(tx, {
      entry: {
        actorId: caller.id,
        action: options.role === null ? "member.remove" : "member.role",
        targetType: "user",
        targetId: options.userId,
        labId,
        details: { from: target.role, to: options.role, ...(options.role === null ? { shareLinksRevoked } : {}) },
      },
    });
    if (options.role === null) return { ok: true as const, member: null };
    const [member] = await tx.select(memberColumns).from(labMemberships).innerJoin(users, eq(users.id, labMemberships.userId)).where(where);
    return { ok: true as const, member: member ?? null };
  });
}

/** A personal lab with the user as its only owner, in the caller's transaction; its id. */
export async function insertPersonalLab(tx: Executor, options: { userId: string; name: string }): Promise<string> {
  const [lab] = await tx.insert(labs).values({ name: options.name, personal: true }).returning({ id: labs.id });
  if (!lab) throw new Error("insert into labs returned no row");
  await tx.insert(labMemberships).values({ labId: lab.id, userId: options.userId, role: "owner" });
  return lab.id;
}

export type CreatePersonalLabResult = { ok: true; lab: LabSummary } | { ok: false; reason: "has_personal_lab" };

/**
 * The caller's own personal lab, for someone who joined through an invitation (no personal lab at
 * sign-up) or was removed from every lab. One per person: the user's row is locked so two clicks
 * at once make one lab. Named "<name>'s lab" unless a name is given.
 */
export async function createPersonalLab(db: Executor, options: { caller: Caller; name?: string }): Promise<CreatePersonalLabResult> {
  const { caller } = options;
  return db.transaction(async (tx) => {
    const [user] = await tx.select({ name: users.name }).from(users).where(eq(users.id, caller.id)).for("update");
    if (!user) throw new Error("the caller has no user row");
    const [own] = await tx
      .select({ id: labs.id })
      .from(labMemberships)
      .innerJoin(labs, eq(labs.id, labMemberships.labId))
      .where(and(eq(labMemberships.userId, caller.id), eq(labMemberships.role, "owner"), eq(labs.personal, true)))
      .limit(1);
    if (own) return { ok: false as const, reason: "has_personal_lab" as const };
    const name = options.name ?? `${user.name}'s lab`;
    const labId = await insertPersonalLab(tx, { userId: caller.id, name });
    await recordAudit(tx, {
      entry: { actorId: caller.id, action: "lab.create", targetType: "user", targetId: caller.id, labId, details: { name } },
    });
    return { ok: true as const, lab: { id: labId, name, role: "owner" as const } };
  });
}
