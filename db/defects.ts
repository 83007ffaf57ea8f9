import { and, asc, count, desc, eq, inArray, sql, type SQL } from "drizzle-orm";
import type { Actor } from "@/lib/permissions";
import type { DbOrTx } from "./client";
import { defects, editionLines, evidence, jobOffers, jobs, memberships, platforms, preTripChecks, users, vehicles } from "./schema";
import { vehicleScope } from "./scope";

/**
 * Defects and pre-trip checks as each role may see them. Always inside the actor's organisation;
 * a driver sees only what they reported (and checks they made); a contractor only defects linked
 * to jobs offered or awarded to their firm; managers, admins and finance the whole organisation.
 */

export type DefectRow = typeof defects.$inferSelect;
export type DefectState = DefectRow["state"];
export type DefectSeverity = DefectRow["severity"];

export function defectScope(actor: Actor): SQL {
  const inOrg = eq(defects.orgId, actor.orgId);
  if (actor.role === "driver") return and(inOrg, eq(defects.reportedBy, actor.userId))!;
  if (actor.role === "contractor") {
    const firm = actor.firmId ?? "__none__";
    return and(
      inOrg,
      inArray(
        defects.jobId,
        sql`(select ${jobs.id} from ${jobs} where ${jobs.orgId} = ${actor.orgId} and (${jobs.awardedFirmId} = ${firm} or ${jobs.id} in (select ${jobOffers.jobId} from ${jobOffers} where ${jobOffers.firmId} = ${firm})))`,
      ),
    )!;
  }
  return inOrg;
}

export function checkScope(actor: Actor): SQL {
  const inOrg = eq(preTripChecks.orgId, actor.orgId);
  if (actor.role === "driver") return and(inOrg, eq(preTripChecks.driverId, actor.userId))!;
  if (actor.role === "admin" || actor.role === "manager") return inOrg;
  // The permission table gives nobody else checks; answer nothing rather than everything.
  return sql`0`;
}

export type DefectFilter = {
  states?: readonly DefectState[] | undefined;
  severity?: DefectSeverity | undefined;
  vehicleId?: string | undefined;
  limit?: number | undefined;
  offset?: number | undefined;
};

function filterWhere(actor: Actor, filter: DefectFilter): SQL {
  const parts: SQL[] = [defectScope(actor)];
  if (filter.states && filter.states.length > 0) parts.push(inArray(defects.state, [...filter.states]));
  if (filter.severity) parts.push(eq(defects.severity, filter.severity));
  if (filter.vehicleId) parts.push(eq(defects.vehicleId, filter.vehicleId));
  return and(...parts)!;
}

const listColumns = {
  id: defects.id,
  clientId: defects.clientId,
  vehicleId: defects.vehicleId,
  fleetNumber: vehicles.fleetNumber,
  registration: vehicles.registration,
  vehicleState: vehicles.state,
  severity: defects.severity,
  category: defects.category,
  description: defects.description,
  state: defects.state,
  reportedBy: defects.reportedBy,
  reporterName: users.name,
  jobId: defects.jobId,
  jobNumber: jobs.number,
  jobState: jobs.state,
  mergedIntoId: defects.mergedIntoId,
  createdAt: defects.createdAt,
  updatedAt: defects.updatedAt,
  photoCount: sql<number>`(select count(*) from ${evidence} where ${evidence.defectId} = ${defects.id})`.mapWith(Number),
};

/** Most urgent first (stop, before next trip, watch), then newest. */
const severityOrder = sql`case ${defects.severity} when 'stop' then 0 when 'before_next_trip' then 1 else 2 end`;

export async function listDefects(db: DbOrTx, actor: Actor, filter: DefectFilter = {}) {
  return db
    .select(listColumns)
    .from(defects)
    .innerJoin(vehicles, eq(vehicles.id, defects.vehicleId))
    .leftJoin(users, eq(users.id, defects.reportedBy))
    .leftJoin(jobs, eq(jobs.id, defects.jobId))
    .where(filterWhere(actor, filter))
    .orderBy(severityOrder, desc(defects.createdAt))
    .limit(Math.min(filter.limit ?? 50, 200))
    .offset(filter.offset ?? 0);
}

export type DefectListRow = Awaited<ReturnType<typeof listDefects>>[number];

export async function countDefects(db: DbOrTx, actor: Actor, filter: DefectFilter = {}): Promise<number> {
  const [row] = await db.select({ n: count() }).from(defects).where(filterWhere(actor, filter));
  return row?.n ?? 0;
}

/** Defects the actor may see, counted by state (for the triage page's tabs). */
export async function defectCountsByState(db: DbOrTx, actor: Actor): Promise<Partial<Record<DefectState, number>>> {
  const rows = await db.select({ state: defects.state, n: count() }).from(defects).where(defectScope(actor)).groupBy(defects.state);
  return Object.fromEntries(rows.map((r) => [r.state, r.n]));
}

/** One defect the actor may see, with its vehicle, reporter, job, photos and merged reports; or null. */
export async function findDefect(db: DbOrTx, actor: Actor, id: string) {
  const [row] = await db
    .select({
      defect: defects,
      fleetNumber: vehicles.fleetNumber,
      registration: vehicles.registration,
      vehicleState: vehicles.state,
      groundedReason: vehicles.groundedReason,
      reporterName: users.name,
      jobNumber: jobs.number,
      jobState: jobs.state,
      jobTitle: jobs.title,
    })
    .from(defects)
    .innerJoin(vehicles, eq(vehicles.id, defects.vehicleId))
    .leftJoin(users, eq(users.id, defects.reportedBy))
    .leftJoin(jobs, eq(jobs.id, defects.jobId))
    .where(and(defectScope(actor), eq(defects.id, id)))
    .limit(1);
  if (!row) return null;
  const [photos, mergedIn, mergedInto] = await Promise.all([
    db
      .select({ id: evidence.id, filename: evidence.filename, contentType: evidence.contentType, sizeBytes: evidence.sizeBytes, createdAt: evidence.createdAt })
      .from(evidence)
      .where(and(eq(evidence.orgId, actor.orgId), eq(evidence.defectId, id)))
      .orderBy(asc(evidence.createdAt)),
    db
      .select({ id: defects.id, description: defects.description, category: defects.category, severity: defects.severity, createdAt: defects.createdAt })
      .from(defects)
      .where(and(defectScope(actor), eq(defects.mergedIntoId, id)))
      .orderBy(asc(defects.createdAt)),
    row.defect.mergedIntoId
      ? db
          .select({ id: defects.id, description: defects.description, category: defects.category, state: defects.state })
          .from(defects)
          .where(and(defectScope(actor), eq(defects.id, row.defect.mergedIntoId)))
          .limit(1)
      : Promise.resolve([]),
  ]);
  return { ...row, photos, mergedIn, mergedInto: mergedInto[0] ?? null };
}

export type DefectDetail = NonNullable<Awaited<ReturnType<typeof findDefect>>>;

/** The defect an organisation already holds for a device id (idempotent reports). */
export async function findDefectByClientId(db: DbOrTx, orgId: string, clientId: string) {
  const [row] = await db
    .select()
    .from(defects)
    .where(and(eq(defects.orgId, orgId), eq(defects.clientId, clientId)))
    .limit(1);
  return row ?? null;
}

/** Other open reports on the same vehicle: the candidates a duplicate can be merged into. */
export async function mergeCandidates(db: DbOrTx, actor: Actor, defect: { id: string; vehicleId: string }) {
  return db
    .select({ id: defects.id, category: defects.category, description: defects.description, severity: defects.severity, state: defects.state, createdAt: defects.createdAt })
    .from(defects)
    .where(
      and(
        defectScope(actor),
        eq(defects.vehicleId, defect.vehicleId),
        sql`${defects.id} <> ${defect.id}`,
        inArray(defects.state, ["reported", "triaged", "in_repair"]),
      ),
    )
    .orderBy(desc(defects.createdAt))
    .limit(50);
}

/** Jobs on the vehicle that a defect can be linked to (not cancelled or closed). */
export async function linkableJobs(db: DbOrTx, orgId: string, vehicleId: string) {
  return db
    .select({ id: jobs.id, number: jobs.number, title: jobs.title, state: jobs.state })
    .from(jobs)
    .where(and(eq(jobs.orgId, orgId), eq(jobs.vehicleId, vehicleId), inArray(jobs.state, ["open", "quoting", "awarded", "in_workshop", "evidence_lodged"])))
    .orderBy(desc(jobs.number))
    .limit(50);
}

/** Every active manager of the organisation, for the notices that must reach them all. */
export async function managerRecipients(db: DbOrTx, orgId: string) {
  return db
    .select({ userId: users.id, email: users.email, name: users.name })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(and(eq(memberships.orgId, orgId), eq(memberships.role, "manager"), eq(memberships.active, true)))
    .orderBy(asc(users.email));
}

/** The vehicle as the actor may see it (for reports: a driver only their assigned vehicles). */
export async function vehicleForReport(db: DbOrTx, actor: Actor, vehicleId: string) {
  const [row] = await db
    .select({ id: vehicles.id, fleetNumber: vehicles.fleetNumber, registration: vehicles.registration, state: vehicles.state, groundedReason: vehicles.groundedReason, editionId: vehicles.editionId, version: vehicles.version })
    .from(vehicles)
    .where(and(vehicleScope(actor), eq(vehicles.id, vehicleId)))
    .limit(1);
  return row ?? null;
}

/** The vehicles on a driver's screens (for a driver: those assigned), by fleet number. */
export async function driverVehicles(db: DbOrTx, actor: Actor) {
  return db
    .select({
      id: vehicles.id,
      fleetNumber: vehicles.fleetNumber,
      registration: vehicles.registration,
      state: vehicles.state,
      groundedReason: vehicles.groundedReason,
      odometerKm: vehicles.odometerKm,
      make: platforms.make,
      model: platforms.model,
      variant: platforms.variant,
    })
    .from(vehicles)
    .innerJoin(platforms, eq(platforms.id, vehicles.platformId))
    .where(and(vehicleScope(actor), sql`${vehicles.state} <> 'retired'`))
    .orderBy(asc(vehicles.fleetNumber))
    .limit(100);
}

// ─── Pre-trip checks ───────────────────────────────────────────────────────────

/** The checkable lines of the edition a vehicle points at (none without an edition). */
export async function checkableLines(db: DbOrTx, orgId: string, editionId: string | null) {
  if (!editionId) return [];
  return db
    .select({ key: editionLines.key, code: editionLines.code, title: editionLines.title, category: editionLines.category, quantity: editionLines.quantity, checkable: editionLines.checkable })
    .from(editionLines)
    .where(and(eq(editionLines.orgId, orgId), eq(editionLines.editionId, editionId), eq(editionLines.checkable, true)))
    .orderBy(asc(editionLines.sortOrder), asc(editionLines.code));
}

export async function listChecks(db: DbOrTx, actor: Actor, filter: { vehicleId?: string | undefined; limit?: number | undefined } = {}) {
  const parts: SQL[] = [checkScope(actor)];
  if (filter.vehicleId) parts.push(eq(preTripChecks.vehicleId, filter.vehicleId));
  const rows = await db
    .select({
      id: preTripChecks.id,
      clientId: preTripChecks.clientId,
      vehicleId: preTripChecks.vehicleId,
      fleetNumber: vehicles.fleetNumber,
      driverId: preTripChecks.driverId,
      driverName: users.name,
      items: preTripChecks.items,
      completedAt: preTripChecks.completedAt,
    })
    .from(preTripChecks)
    .innerJoin(vehicles, eq(vehicles.id, preTripChecks.vehicleId))
    .leftJoin(users, eq(users.id, preTripChecks.driverId))
    .where(and(...parts))
    .orderBy(desc(preTripChecks.completedAt))
    .limit(Math.min(filter.limit ?? 20, 100));
  return rows.map((r) => ({ ...r, faults: r.items.filter((i) => i.result === "fail").length }));
}

export async function findCheck(db: DbOrTx, actor: Actor, id: string) {
  const [row] = await db
    .select({ check: preTripChecks, fleetNumber: vehicles.fleetNumber, driverName: users.name })
    .from(preTripChecks)
    .innerJoin(vehicles, eq(vehicles.id, preTripChecks.vehicleId))
    .leftJoin(users, eq(users.id, preTripChecks.driverId))
    .where(and(checkScope(actor), eq(preTripChecks.id, id)))
    .limit(1);
  return row ?? null;
}

export async function findCheckByClientId(db: DbOrTx, orgId: string, clientId: string) {
  const [row] = await db
    .select()
    .from(preTripChecks)
    .where(and(eq(preTripChecks.orgId, orgId), eq(preTripChecks.clientId, clientId)))
    .limit(1);
  return row ?? null;
}

/** A photo of a defect or check the actor may see (the record's own scope decides). */
export async function findPhoto(db: DbOrTx, actor: Actor, owner: { defectId: string } | { checkId: string }, photoId: string) {
  if ("defectId" in owner) {
    const [row] = await db
      .select({ photo: evidence })
      .from(evidence)
      .innerJoin(defects, eq(defects.id, evidence.defectId))
      .where(and(defectScope(actor), eq(defects.id, owner.defectId), eq(evidence.id, photoId)))
      .limit(1);
    return row?.photo ?? null;
  }
  const [row] = await db
    .select({ photo: evidence })
    .from(evidence)
    .innerJoin(preTripChecks, eq(preTripChecks.id, evidence.checkId))
    .where(and(checkScope(actor), eq(preTripChecks.id, owner.checkId), eq(evidence.id, photoId)))
    .limit(1);
  return row?.photo ?? null;
}

/** The latest check of each vehicle that the actor may see (a driver: their own checks). */
export async function latestChecksByVehicle(db: DbOrTx, actor: Actor, vehicleIds: readonly string[]) {
  const out = new Map<string, { id: string; completedAt: Date; faults: number; driverName: string | null }>();
  if (vehicleIds.length === 0) return out;
  // One bound parameter for any number of ids.
  const ids = sql`(select value from json_each(${JSON.stringify([...new Set(vehicleIds)])}))`;
  const rows = await db
    .select({ id: preTripChecks.id, vehicleId: preTripChecks.vehicleId, completedAt: preTripChecks.completedAt, items: preTripChecks.items, driverName: users.name })
    .from(preTripChecks)
    .leftJoin(users, eq(users.id, preTripChecks.driverId))
    .where(and(checkScope(actor), inArray(preTripChecks.vehicleId, ids)))
    .orderBy(desc(preTripChecks.completedAt))
    .limit(1000);
  for (const r of rows) {
    if (out.has(r.vehicleId)) continue;
    out.set(r.vehicleId, { id: r.id, completedAt: r.completedAt, faults: r.items.filter((i) => i.result === "fail").length, driverName: r.driverName });
  }
  return out;
}
