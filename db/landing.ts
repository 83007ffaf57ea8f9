import { and, count, eq, gte, inArray, isNotNull, isNull, sum } from "drizzle-orm";
import type { Actor } from "@/lib/permissions";
import type { DbOrTx } from "./client";
import { costs, defects, evidence, jobOffers, jobs, memberships, outboxMessages, quotes, users } from "./schema";

/** The figures each role's home page opens with. All scoped to the actor's organisation. */
export async function quoteCounts(db: DbOrTx, actor: Actor) {
  const rows = await db
    .select({ status: quotes.status, n: count() })
    .from(quotes)
    .where(eq(quotes.orgId, actor.orgId))
    .groupBy(quotes.status);
  return Object.fromEntries(rows.map((r) => [r.status, r.n])) as Record<string, number>;
}

export async function peopleCounts(db: DbOrTx, actor: Actor) {
  const [row] = await db
    .select({ n: count() })
    .from(memberships)
    .where(and(eq(memberships.orgId, actor.orgId), eq(memberships.active, true)));
  const [invited] = await db
    .select({ n: count() })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(and(eq(memberships.orgId, actor.orgId), isNull(users.passwordHash)));
  return { active: row?.n ?? 0, invited: invited?.n ?? 0 };
}

export async function outboxCounts(db: DbOrTx, actor: Actor) {
  const rows = await db
    .select({ status: outboxMessages.status, n: count() })
    .from(outboxMessages)
    .where(eq(outboxMessages.orgId, actor.orgId))
    .groupBy(outboxMessages.status);
  return Object.fromEntries(rows.map((r) => [r.status, r.n])) as Record<string, number>;
}

export async function spendSince(db: DbOrTx, actor: Actor, since: Date) {
  const [row] = await db
    .select({ total: sum(costs.amountExGstCents) })
    .from(costs)
    .where(and(eq(costs.orgId, actor.orgId), gte(costs.incurredOn, since)));
  return Number(row?.total ?? 0);
}

export async function contractorCounts(db: DbOrTx, actor: Actor) {
  const firm = actor.firmId ?? "__none__";
  const [offered] = await db
    .select({ n: count() })
    .from(jobOffers)
    .innerJoin(jobs, eq(jobs.id, jobOffers.jobId))
    .where(and(eq(jobOffers.firmId, firm), eq(jobs.orgId, actor.orgId), inArray(jobs.state, ["open", "quoting"])));
  const [awarded] = await db
    .select({ n: count() })
    .from(jobs)
    .where(and(eq(jobs.awardedFirmId, firm), eq(jobs.orgId, actor.orgId), inArray(jobs.state, ["awarded", "in_workshop", "evidence_lodged"])));
  return { offered: offered?.n ?? 0, awarded: awarded?.n ?? 0 };
}

export async function myOpenDefects(db: DbOrTx, actor: Actor) {
  const [row] = await db
    .select({ n: count() })
    .from(defects)
    .where(and(eq(defects.orgId, actor.orgId), eq(defects.reportedBy, actor.userId), inArray(defects.state, ["reported", "triaged", "in_repair"])));
  return row?.n ?? 0;
}

/** What waits on a manager: workshop evidence to review and driver reports to triage. */
export async function managerQueues(db: DbOrTx, actor: Actor) {
  const [lodged] = await db
    .select({ n: count() })
    .from(evidence)
    .where(and(eq(evidence.orgId, actor.orgId), eq(evidence.status, "lodged"), isNotNull(evidence.jobId)));
  const [reported] = await db
    .select({ n: count() })
    .from(defects)
    .where(and(eq(defects.orgId, actor.orgId), eq(defects.state, "reported")));
  return { evidenceToReview: lodged?.n ?? 0, defectsToTriage: reported?.n ?? 0 };
}
