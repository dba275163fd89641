import { randomBytes } from "node:crypto";
import { eq, sql } from "drizzle-orm";
import { hashPassword, verifyPassword } from "@/lib/auth/password";
import { scriptSettings } from "@/lib/settings/scripts";
import { modelParamsSchema } from "@/lib/physics/schema";
import { createDb, createPool } from "./connection";
import { seedDemoMeasurements } from "./demo-measurements";
import { DEMO_LAB, DEMO_PASSWORD, DEMO_SETS, DEMO_USERS, OTHER_LAB } from "./demo-data";
import { seedDemoLightSources } from "./demo-light-sources";
import { recordAudit } from "./queries/audit";
import { labMemberships, labs, parameterSets, parameterSetVersions, users } from "./schema";

/*
 * Idempotent demo seed: fixed ids + "on conflict do nothing", so running it twice (or on a
 * database where people already edited the demo sets) changes nothing that exists.
 */

const DAY_MS = 24 * 60 * 60 * 1000;

async function main(): Promise<void> {
  const pool = createPool({ url: scriptSettings.database.url, max: 1 });
  const db = createDb(pool);
  const now = Date.now();
  let created = 0;
  try {
    const passwordHash = await hashPassword(DEMO_PASSWORD);
    // The site admin acts as owner in every lab, so it never gets the published demo password:
    // GYROLUX_ADMIN_PASSWORD when set (the test run sets one), else a random one shown once below.
    const adminPassword = scriptSettings.seed.adminPassword ?? randomBytes(18).toString("base64url");
    const adminHash = await hashPassword(adminPassword);
    await db.transaction(async (tx) => {
      await tx
        .insert(labs)
        .values([
          { id: DEMO_LAB.id, name: DEMO_LAB.name },
          { id: OTHER_LAB.id, name: OTHER_LAB.name },
        ])
        .onConflictDoNothing();

      const userIds = new Map<string, string>();
      for (const [key, user] of Object.entries(DEMO_USERS)) {
        const inserted = await tx
          .insert(users)
          .values({
            id: user.id,
            email: user.email,
            name: user.name,
            passwordHash: user.siteRole === "admin" ? adminHash : passwordHash,
            siteRole: user.siteRole,
          })
          .onConflictDoNothing()
          .returning({ id: users.id });
        created += inserted.length;
        if (inserted.length > 0 && user.siteRole === "admin" && !scriptSettings.seed.adminPassword) {
          console.log(`[seed] site admin ${user.email} — password (shown only now): ${adminPassword}`);
        }
        // Someone may have signed up with a demo address before the seed ran: use that row.
        const [row] = await tx
          .select({ id: users.id })
          .from(users)
          .where(eq(sql`lower(${users.email})`, user.email.toLowerCase()));
        if (!row) throw new Error(`demo user ${user.email} missing after insert`);
        // An admin seeded by an older version still has the published password: replace it.
        if (inserted.length === 0 && user.siteRole === "admin") {
          const [old] = await tx.select({ hash: users.passwordHash }).from(users).where(eq(users.id, row.id));
          if (old && (await verifyPassword(DEMO_PASSWORD, old.hash))) {
            await tx
              .update(users)
              .set({ passwordHash: adminHash, sessionVersion: sql`${users.sessionVersion} + 1` })
              .where(eq(users.id, row.id));
            if (!scriptSettings.seed.adminPassword)
              console.log(`[seed] site admin ${user.email} had the demo password; new password (shown only now): ${adminPassword}`);
          }
        }
        userIds.set(key, row.id);
        for (const membership of user.memberships) {
          await tx.insert(labMemberships).values({ labId: membership.labId, userId: row.id, role: membership.role }).onConflictDoNothing();
        }
      }

      for (const set of DEMO_SETS) {
        const existing = await tx.select({ id: parameterSets.id }).from(parameterSets).where(eq(parameterSets.id, set.id));
        if (existing.length > 0) continue;
        const first = set.versions[0];
        const last = set.versions[set.versions.length - 1];
        if (!first || !last) continue;
        const idOf = (who: keyof typeof DEMO_USERS) => {
          const id = userIds.get(who);
          if (!id) throw new Error(`unknown demo user ${who}`);
          return id;
        };
        const at = (daysAgo: number) => new Date(now - daysAgo * DAY_MS);
        // The seed is data at rest like any other: validate it with the same schema as the API.
        for (const version of set.versions) modelParamsSchema.parse(version.params);
        const inserted = await tx
          .insert(parameterSets)
          .values({
            id: set.id,
            labId: set.labId,
            name: last.name,
            description: last.description,
            tags: last.tags,
            params: last.params,
            version: set.versions.length,
            createdById: idOf(first.by),
            createdAt: at(first.daysAgo),
            updatedById: idOf(last.by),
            updatedAt: at(last.daysAgo),
          })
          .onConflictDoNothing()
          .returning({ id: parameterSets.id });
        if (inserted.length === 0) continue;
        created += 1;
        await tx.insert(parameterSetVersions).values(
          set.versions.map((version, index) => ({
            setId: set.id,
            version: index + 1,
            name: version.name,
            description: version.description,
            tags: version.tags,
            params: version.params,
            provenance: version.provenance ?? null,
            createdById: idOf(version.by),
            createdAt: at(version.daysAgo),
          })),
        );
        await recordAudit(tx, {
          entry: {
            actorId: null,
            action: "demo.seed",
            targetType: "parameter_set",
            targetId: set.id,
            labId: set.labId,
            details: { versions: set.versions.length },
          },
        });
      }
      created += await seedDemoLightSources(tx);
    });
    created += await seedDemoMeasurements(db);
    console.log(created > 0 ? `[seed] demo data seeded (${created} new rows of users/sets)` : "[seed] demo data already present");
  } finally {
    await pool.end();
  }
}

main().catch((error: unknown) => {
  console.error("[seed] failed:", error instanceof Error ? error.message : error);
  process.exit(1);
});
