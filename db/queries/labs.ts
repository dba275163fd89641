import "server-only";
import { and, asc, eq, sql } from "drizzle-orm";
import type { LabSummary, MemberSummary } from "@/lib/contracts/labs";
import { decodeCursor, offsetCursor, toPage } from "@/db/paging";
import { type Page } from "@/lib/contracts/paging";
import type { PageQuery } from "@/lib/contracts/paging";
import { db } from "../client";
import { labMemberships, labs, users } from "../schema";
import { type LabRole, type SiteRole } from "@/lib/contracts/roles";
import { recordAudit } from "./audit";

/** A lab and the user's own membership role in it (null when not a member); null when no such lab. */
export async function getLabAccess(options: {
  labId: string;
  userId: string;
}): Promise<{ labId: string; labName: string; role: LabRole | null } | null> {
  const [row] = await db
    .select({ labId: labs.id, labName: labs.name, role: labMemberships.role })
    .from(labs)
    .leftJoin(labMemberships, and(eq(labMemberships.labId, labs.id), eq(labMemberships.userId, options.userId)))
    .where(eq(labs.id, options.labId))
    .limit(1);
  return row ?? null;
}

/** The caller's labs; a site admin gets every lab, as owner. */
export async function listLabs(options: { userId: string; siteRole: SiteRole }): Promise<LabSummary[]> {
  if (options.siteRole === "admin") {
    const rows = await db.select({ id: labs.id, name: labs.name }).from(labs).orderBy(asc(labs.name));
    return rows.map((row) => ({ ...row, role: "owner" as const }));
  }
  return db
    .select({ id: labs.id, name: labs.name, role: labMemberships.role })
    .from(labMemberships)
    .innerJoin(labs, eq(labs.id, labMemberships.labId))
    .where(eq(labMemberships.userId, options.userId))
    .orderBy(asc(labs.name));
}

const memberColumns = { userId: users.id, email: users.email, name: users.name, role: labMemberships.role };

/** Members of a lab the caller was already authorized for (requireLabRole), a page at a time. */
export async function listMembers(options: { labId: string; page: PageQuery }): Promise<Page<MemberSummary>> {
  const offset = decodeCursor(options.page.cursor, offsetCursor)?.[1] ?? 0;
  const rows = await db
    .select(memberColumns)
    .from(labMemberships)
    .innerJoin(users, eq(users.id, labMemberships.userId))
    .where(eq(labMemberships.labId, options.labId))
    .orderBy(sql`case ${labMemberships.role} when 'owner' then 0 when 'editor' then 1 else 2 end`, asc(users.name), asc(users.id))
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
 * Changes a member's role (role given) or removes them (role null). The lab must keep an owner:
 * the membership rows are locked so two owners demoting each other at once cannot both succeed.
 */
export async function changeMember(options: {
  actorId: string;
  /** Site admins act as owner everywhere and hold no membership row. */
  actorIsSiteAdmin: boolean;
  labId: string;
  userId: string;
  role: LabRole | null;
}): Promise<ChangeMemberResult> {
  return db.transaction(async (tx) => {
    const rows = await tx
      .select({ userId: labMemberships.userId, role: labMemberships.role })
      .from(labMemberships)
      .where(eq(labMemberships.labId, options.labId))
      .for("update");
    // The route checked the caller's role before the transaction; an owner demoted since then
    // must not still change roles, so the check is repeated on the locked rows.
    const actor = rows.find((row) => row.userId === options.actorId);
    if (!options.actorIsSiteAdmin && actor?.role !== "owner") return { ok: false as const, reason: "not_owner" as const };
    const target = rows.find((row) => row.userId === options.userId);
    if (!target) return { ok: false as const, reason: "not_member" as const };
    const otherOwners = rows.filter((row) => row.role === "owner" && row.userId !== options.userId).length;
    if (target.role === "owner" && options.role !== "owner" && otherOwners === 0) {
      return { ok: false as const, reason: "last_owner" as const };
    }
    const where = and(eq(labMemberships.labId, options.labId), eq(labMemberships.userId, options.userId));
    if (options.role === null) {
      await tx.delete(labMemberships).where(where);
    } else {
      await tx.update(labMemberships).set({ role: options.role }).where(where);
    }
    await recordAudit({
      tx,
      entry: {
        actorId: options.actorId,
        action: options.role === null ? "member.remove" : "member.role",
        targetType: "user",
        targetId: options.userId,
        labId: options.labId,
        details: { from: target.role, to: options.role },
      },
    });
    if (options.role === null) return { ok: true as const, member: null };
    const [member] = await tx.select(memberColumns).from(labMemberships).innerJoin(users, eq(users.id, labMemberships.userId)).where(where);
    return { ok: true as const, member: member ?? null };
  });
}
