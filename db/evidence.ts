import { and, asc, eq, type SQL } from "drizzle-orm";
import type { Actor } from "@/lib/permissions";
import type { DbOrTx } from "./client";
import { jobScope } from "./jobs";
import { evidence, jobs, users, weighbridgeTickets } from "./schema";

/**
 * Job evidence a user may see: that of jobs they may see; a contractor only that of jobs awarded
 * to their own firm (the only firm that lodges evidence on a job).
 */
export function jobEvidenceScope(actor: Actor): SQL {
  const base = and(eq(evidence.orgId, actor.orgId), jobScope(actor))!;
  if (actor.role === "contractor") return and(base, eq(jobs.awardedFirmId, actor.firmId ?? "__none__"))!;
  return base;
}

const columns = {
  id: evidence.id,
  jobId: evidence.jobId,
  lineKey: evidence.lineKey,
  fitmentId: evidence.fitmentId,
  kind: evidence.kind,
  status: evidence.status,
  filename: evidence.filename,
  contentType: evidence.contentType,
  sizeBytes: evidence.sizeBytes,
  sha256: evidence.sha256,
  storageKey: evidence.storageKey,
  uploadedBy: evidence.uploadedBy,
  uploadedByName: users.name,
  reviewedAt: evidence.reviewedAt,
  reviewReason: evidence.reviewReason,
  createdAt: evidence.createdAt,
};

export async function listJobEvidence(db: DbOrTx, actor: Actor, jobId: string) {
  const rows = await db
    .select(columns)
    .from(evidence)
    .innerJoin(jobs, eq(jobs.id, evidence.jobId))
    .leftJoin(users, eq(users.id, evidence.uploadedBy))
    .where(and(jobEvidenceScope(actor), eq(evidence.jobId, jobId)))
    .orderBy(asc(evidence.createdAt));
  const tickets = await db
    .select()
    .from(weighbridgeTickets)
    .where(and(eq(weighbridgeTickets.orgId, actor.orgId), eq(weighbridgeTickets.jobId, jobId)));
  return rows.map((row) => ({ ...row, ticket: tickets.find((t) => t.evidenceId === row.id) ?? null }));
}

export async function loadEvidenceRow(db: DbOrTx, actor: Actor, id: string) {
  const [row] = await db
    .select({ ...columns, job: jobs })
    .from(evidence)
    .innerJoin(jobs, eq(jobs.id, evidence.jobId))
    .leftJoin(users, eq(users.id, evidence.uploadedBy))
    .where(and(jobEvidenceScope(actor), eq(evidence.id, id)))
    .limit(1);
  return row ?? null;
}
