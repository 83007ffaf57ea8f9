import { and, asc, eq } from "drizzle-orm";
import type { DbOrTx } from "./client";
import { apiTokens, memberships, organisations, users } from "./schema";

export async function findUserByEmail(db: DbOrTx, email: string) {
  return db.query.users.findFirst({ where: eq(users.email, email.trim().toLowerCase()) });
}

/** The memberships a user may sign in with, oldest first. */
export async function activeMemberships(db: DbOrTx, userId: string) {
  return db
    .select({
      orgId: memberships.orgId,
      orgName: organisations.name,
      role: memberships.role,
      firmId: memberships.firmId,
      depotId: memberships.depotId,
    })
    .from(memberships)
    .innerJoin(organisations, eq(organisations.id, memberships.orgId))
    .where(and(eq(memberships.userId, userId), eq(memberships.active, true)))
    .orderBy(asc(memberships.createdAt));
}

/** Re-reads the signed-in user's standing, so a deactivation ends their session at once. */
export async function loadStanding(db: DbOrTx, userId: string, orgId: string) {
  const [row] = await db
    .select({
      userId: users.id,
      email: users.email,
      name: users.name,
      sessionVersion: users.sessionVersion,
      orgId: memberships.orgId,
      orgName: organisations.name,
      orgTimeZone: organisations.timeZone,
      role: memberships.role,
      active: memberships.active,
      firmId: memberships.firmId,
      depotId: memberships.depotId,
    })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .innerJoin(organisations, eq(organisations.id, memberships.orgId))
    .where(and(eq(memberships.userId, userId), eq(memberships.orgId, orgId)))
    .limit(1);
  return row ?? null;
}

export async function findApiToken(db: DbOrTx, tokenHash: string) {
  return db.query.apiTokens.findFirst({ where: eq(apiTokens.tokenHash, tokenHash) });
}
