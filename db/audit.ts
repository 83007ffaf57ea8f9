import type { DbOrTx } from "./client";
import { auditEntries } from "./schema";

export type AuditInput = {
  orgId: string;
  actorId: string | null;
  action: string;
  entityType: string;
  entityId?: string | null;
  before?: unknown;
  after?: unknown;
  reason?: string | null;
};

/** Writes one audit entry in the caller's transaction: who, when, what, before, after, why. */
export async function writeAudit(tx: DbOrTx, entry: AuditInput): Promise<void> {
  await tx.insert(auditEntries).values({
    orgId: entry.orgId,
    actorId: entry.actorId,
    action: entry.action,
    entityType: entry.entityType,
    entityId: entry.entityId ?? null,
    before: entry.before ?? null,
    after: entry.after ?? null,
    reason: entry.reason ?? null,
  });
}
