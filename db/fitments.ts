import { aliasedTable, and, desc, eq, inArray, isNull } from "drizzle-orm";
import type { DbOrTx } from "./client";
import { concessions, evidence, fitments, users } from "./schema";

/** What is (and was) fitted to one vehicle, with who recorded it and the evidence on each item. */
export async function listVehicleFitments(db: DbOrTx, orgId: string, vehicleId: string, options: { includeRemoved?: boolean } = {}) {
  const rows = await db
    .select({ fitment: fitments, recordedByName: users.name })
    .from(fitments)
    .leftJoin(users, eq(users.id, fitments.recordedBy))
    .where(
      and(
        eq(fitments.orgId, orgId),
        eq(fitments.vehicleId, vehicleId),
        options.includeRemoved ? undefined : isNull(fitments.removedAt),
      ),
    )
    .orderBy(desc(fitments.fittedAt), desc(fitments.createdAt));
  const ids = rows.map((r) => r.fitment.id);
  const proofs = ids.length
    ? await db
        .select({ fitmentId: evidence.fitmentId, kind: evidence.kind, status: evidence.status, filename: evidence.filename })
        .from(evidence)
        .where(and(eq(evidence.orgId, orgId), inArray(evidence.fitmentId, ids)))
    : [];
  const byFitment = new Map<string, { kind: string; status: string; filename: string }[]>();
  for (const p of proofs) {
    if (!p.fitmentId) continue;
    byFitment.set(p.fitmentId, [...(byFitment.get(p.fitmentId) ?? []), { kind: p.kind, status: p.status, filename: p.filename }]);
  }
  return rows.map(({ fitment, recordedByName }) => ({ ...fitment, recordedByName, evidence: byFitment.get(fitment.id) ?? [] }));
}

export type FitmentListItem = Awaited<ReturnType<typeof listVehicleFitments>>[number];

export async function findFitment(db: DbOrTx, orgId: string, id: string) {
  const [row] = await db.select().from(fitments).where(and(eq(fitments.orgId, orgId), eq(fitments.id, id))).limit(1);
  return row ?? null;
}

const approver = aliasedTable(users, "approver");

/** Every concession of a vehicle, newest first, with who approved it. */
export async function listVehicleConcessions(db: DbOrTx, orgId: string, vehicleId: string) {
  return db
    .select({
      id: concessions.id,
      lineKey: concessions.lineKey,
      reason: concessions.reason,
      expiresAt: concessions.expiresAt,
      createdAt: concessions.createdAt,
      approvedByName: approver.name,
    })
    .from(concessions)
    .leftJoin(approver, eq(approver.id, concessions.approvedBy))
    .where(and(eq(concessions.orgId, orgId), eq(concessions.vehicleId, vehicleId)))
    .orderBy(desc(concessions.createdAt));
}
