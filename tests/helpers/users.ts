import { and, eq } from "drizzle-orm";
import type { Database } from "@/db/client";
import { memberships, organisations, users } from "@/db/schema";
import { defineAbilityFor, type Actor } from "@/lib/permissions";
import type { SignedIn } from "@/lib/server/session";

/** The signed-in user of a demo account, as the session layer would build it. */
export async function signedInAs(database: Database, email: string): Promise<SignedIn> {
  const [row] = await database
    .select({ user: users, membership: memberships, org: organisations })
    .from(users)
    .innerJoin(memberships, eq(memberships.userId, users.id))
    .innerJoin(organisations, eq(organisations.id, memberships.orgId))
    .where(and(eq(users.email, email)))
    .limit(1);
  if (!row) throw new Error(`no demo user ${email}`);
  const actor: Actor = {
    userId: row.user.id,
    orgId: row.org.id,
    role: row.membership.role,
    firmId: row.membership.firmId,
    depotId: row.membership.depotId,
  };
  return { ...actor, email: row.user.email, name: row.user.name, orgName: row.org.name, timeZone: row.org.timeZone, via: "session", ability: defineAbilityFor(actor) };
}
