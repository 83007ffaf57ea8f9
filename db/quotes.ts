import { and, asc, desc, eq, inArray, type SQL } from "drizzle-orm";
import type { Actor } from "@/lib/permissions";
import type { QuoteState } from "@/lib/jobs";
import type { DbOrTx } from "./client";
import { contractorFirms, decisions, jobs, quoteLines, quoteRevisions, quotes, users, vehicles } from "./schema";

/**
 * The quotes a user may see: inside their organisation; a contractor only their own firm's
 * quotes (never another firm's prices); drivers none at all (the permission table refuses them).
 */
export function quoteScope(actor: Actor): SQL {
  const inOrg = eq(quotes.orgId, actor.orgId);
  if (actor.role === "contractor") return and(inOrg, eq(quotes.firmId, actor.firmId ?? "__none__"))!;
  if (actor.role === "driver") return and(inOrg, eq(quotes.id, "__none__"))!;
  return inOrg;
}

export type QuoteFilters = { jobId?: string | undefined; status?: QuoteState | readonly QuoteState[] | undefined };

export async function listQuoteRows(db: DbOrTx, actor: Actor, filters: QuoteFilters = {}) {
  const where: SQL[] = [quoteScope(actor)];
  if (filters.jobId) where.push(eq(quotes.jobId, filters.jobId));
  if (typeof filters.status === "string") where.push(eq(quotes.status, filters.status));
  else if (filters.status) where.push(inArray(quotes.status, [...filters.status]));
  return db
    .select({
      id: quotes.id,
      jobId: quotes.jobId,
      jobNumber: jobs.number,
      jobTitle: jobs.title,
      vehicleId: jobs.vehicleId,
      fleetNumber: vehicles.fleetNumber,
      firmId: quotes.firmId,
      firmName: contractorFirms.name,
      status: quotes.status,
      revision: quotes.revision,
      version: quotes.version,
      validUntil: quotes.validUntil,
      subtotalCents: quotes.subtotalCents,
      gstCents: quotes.gstCents,
      totalCents: quotes.totalCents,
      gstMethod: quotes.gstMethod,
      submittedAt: quotes.submittedAt,
      updatedAt: quotes.updatedAt,
    })
    .from(quotes)
    .innerJoin(jobs, eq(jobs.id, quotes.jobId))
    .innerJoin(vehicles, eq(vehicles.id, jobs.vehicleId))
    .innerJoin(contractorFirms, eq(contractorFirms.id, quotes.firmId))
    .where(and(...where))
    .orderBy(desc(quotes.updatedAt))
    .limit(500);
}

export async function loadQuoteRow(db: DbOrTx, actor: Actor, id: string) {
  const [row] = await db
    .select({ quote: quotes, firmName: contractorFirms.name, job: jobs })
    .from(quotes)
    .innerJoin(contractorFirms, eq(contractorFirms.id, quotes.firmId))
    .innerJoin(jobs, eq(jobs.id, quotes.jobId))
    .where(and(quoteScope(actor), eq(quotes.id, id)))
    .limit(1);
  return row ?? null;
}

export async function loadQuoteLines(db: DbOrTx, quoteIds: string[]) {
  if (quoteIds.length === 0) return [];
  return db.select().from(quoteLines).where(inArray(quoteLines.quoteId, quoteIds)).orderBy(asc(quoteLines.sortOrder));
}

export async function loadQuoteRevisions(db: DbOrTx, quoteId: string) {
  return db.select().from(quoteRevisions).where(eq(quoteRevisions.quoteId, quoteId)).orderBy(asc(quoteRevisions.revision));
}

export async function loadDecisions(db: DbOrTx, quoteIds: string[]) {
  if (quoteIds.length === 0) return [];
  return db
    .select({
      id: decisions.id,
      quoteId: decisions.quoteId,
      decision: decisions.decision,
      reason: decisions.reason,
      quoteVersion: decisions.quoteVersion,
      decidedAt: decisions.decidedAt,
      decidedBy: decisions.decidedBy,
      decidedByName: users.name,
    })
    .from(decisions)
    .innerJoin(users, eq(users.id, decisions.decidedBy))
    .where(inArray(decisions.quoteId, quoteIds))
    .orderBy(asc(decisions.decidedAt));
}
