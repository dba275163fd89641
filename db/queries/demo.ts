import { and, eq } from "drizzle-orm";
import { DEMO_LAB, DEMO_USERS } from "../demo-data";
import type { Executor } from "../executor";
import { labMemberships, users } from "../schema";

/**
 * Whether the demo lab and its owner exist, so the sign-in page can offer the demo accounts.
 * False (not an error) when the database is unreachable: the page must still render.
 */
export async function isDemoSeeded(db: Executor): Promise<boolean> {
  try {
    const rows = await db
      .select({ labId: labMemberships.labId })
      .from(labMemberships)
      .innerJoin(users, eq(users.id, labMemberships.userId))
      .where(and(eq(labMemberships.labId, DEMO_LAB.id), eq(users.email, DEMO_USERS.lead.email)))
      .limit(1);
    return rows.length > 0;
  } catch {
    return false;
  }
}
