import { and, asc, desc, eq, inArray, lt, or, sql, type SQL } from "drizzle-orm";
import type { Actor } from "@/lib/permissions";
import { OPEN_JOB_STATES, type JobState } from "@/lib/jobs";
import type { EditionLine, LineVariance } from "@/lib/variance";
import type { DbOrTx } from "./client";
import { loadVehicleVariance } from "./variance";
import { contractorFirms, defects, depots, jobLines, jobOffers, jobs, platforms, vehicles } from "./schema";

/**
 * The jobs a user may see: always inside their organisation; a contractor only jobs offered or
 * awarded to their firm; a driver only jobs raised from defects they reported.
 */
export function jobScope(actor: Actor): SQL {
  const inOrg = eq(jobs.orgId, actor.orgId);
  if (actor.role === "contractor") {
    const firm = actor.firmId ?? "__none__";
    return and(
      inOrg,
      or(
        eq(jobs.awardedFirmId, firm),
        inArray(jobs.id, sql`(select ${jobOffers.jobId} from ${jobOffers} where ${jobOffers.firmId} = ${firm})`),
      ),
    )!;
  }
  if (actor.role === "driver") {
    return and(
      inOrg,
      inArray(jobs.id, sql`(select ${defects.jobId} from ${defects} where ${defects.reportedBy} = ${actor.userId} and ${defects.jobId} is not null)`),
    )!;
  }
  return inOrg;
}

export type JobFilters = {
  state?: JobState | undefined;
  firmId?: string | undefined;
  depotId?: string | undefined;
  vehicleId?: string | undefined;
  overdue?: boolean | undefined;
};

export async function listJobRows(db: DbOrTx, actor: Actor, filters: JobFilters, now: Date) {
  const where: SQL[] = [jobScope(actor)];
  if (filters.state) where.push(eq(jobs.state, filters.state));
  if (filters.vehicleId) where.push(eq(jobs.vehicleId, filters.vehicleId));
  if (filters.depotId) where.push(eq(vehicles.depotId, filters.depotId));
  if (filters.firmId) {
    where.push(
      or(
        eq(jobs.awardedFirmId, filters.firmId),
        inArray(jobs.id, sql`(select ${jobOffers.jobId} from ${jobOffers} where ${jobOffers.firmId} = ${filters.firmId})`),
      )!,
    );
  }
  if (filters.overdue) {
    where.push(lt(jobs.dueAt, now), inArray(jobs.state, [...OPEN_JOB_STATES]));
  }
  const rows = await db
    .select({
      id: jobs.id,
      number: jobs.number,
      title: jobs.title,
      state: jobs.state,
      dueAt: jobs.dueAt,
      costKind: jobs.costKind,
      createdAt: jobs.createdAt,
      vehicleId: vehicles.id,
      fleetNumber: vehicles.fleetNumber,
      depotId: vehicles.depotId,
      depotName: depots.name,
      awardedFirmId: jobs.awardedFirmId,
      awardedFirmName: contractorFirms.name,
    })
    .from(jobs)
    .innerJoin(vehicles, eq(vehicles.id, jobs.vehicleId))
    .leftJoin(depots, eq(depots.id, vehicles.depotId))
    .leftJoin(contractorFirms, eq(contractorFirms.id, jobs.awardedFirmId))
    .where(and(...where))
    .orderBy(desc(jobs.number))
    .limit(500);
  const ids = rows.map((r) => r.id);
  const offers = ids.length
    ? await db
        .select({ jobId: jobOffers.jobId, firmId: jobOffers.firmId, firmName: contractorFirms.name, dueAt: jobOffers.dueAt })
        .from(jobOffers)
        .innerJoin(contractorFirms, eq(contractorFirms.id, jobOffers.firmId))
        .where(inArray(jobOffers.jobId, ids))
    : [];
  return rows.map((row) => ({
    ...row,
    // A contractor sees only their own firm's offer, never who else was asked.
    offers: offers.filter((o) => o.jobId === row.id && (actor.role !== "contractor" || o.firmId === actor.firmId)),
  }));
}

export async function loadJobRow(db: DbOrTx, actor: Actor, id: string) {
  const [row] = await db
    .select({ job: jobs, vehicle: vehicles, platform: platforms, depotName: depots.name, awardedFirmName: contractorFirms.name })
    .from(jobs)
    .innerJoin(vehicles, eq(vehicles.id, jobs.vehicleId))
    .innerJoin(platforms, eq(platforms.id, vehicles.platformId))
    .leftJoin(depots, eq(depots.id, vehicles.depotId))
    .leftJoin(contractorFirms, eq(contractorFirms.id, jobs.awardedFirmId))
    .where(and(jobScope(actor), eq(jobs.id, id)))
    .limit(1);
  return row ?? null;
}

export async function loadJobLines(db: DbOrTx, jobId: string) {
  return db.select().from(jobLines).where(eq(jobLines.jobId, jobId)).orderBy(asc(jobLines.sortOrder));
}

export async function loadJobOffers(db: DbOrTx, actor: Actor, jobId: string) {
  const rows = await db
    .select({ firmId: jobOffers.firmId, firmName: contractorFirms.name, firmEmail: contractorFirms.email, dueAt: jobOffers.dueAt, offeredAt: jobOffers.offeredAt })
    .from(jobOffers)
    .innerJoin(contractorFirms, eq(contractorFirms.id, jobOffers.firmId))
    .where(eq(jobOffers.jobId, jobId))
    .orderBy(asc(contractorFirms.name));
  return actor.role === "contractor" ? rows.filter((r) => r.firmId === actor.firmId) : rows;
}

/** The next job number of the organisation (numbers are per organisation, from 1). */
export async function nextJobNumber(db: DbOrTx, orgId: string): Promise<number> {
  const [row] = await db.select({ n: sql<number>`coalesce(max(${jobs.number}), 0)` }).from(jobs).where(eq(jobs.orgId, orgId));
  return Number(row?.n ?? 0) + 1;
}

export type VehicleGapLine = LineVariance & { dependsOn: string[] };

/**
 * A vehicle's edition lines with their variance (through db/variance: fitments, accepted
 * evidence, concessions) and their dependencies, for raising jobs and showing the build order.
 */
export async function loadVehicleLines(db: DbOrTx, actor: Actor, vehicleId: string, now: Date) {
  const loaded = await loadVehicleVariance(db, actor, vehicleId, now);
  if (!loaded?.variance) return { editionId: loaded?.editionId ?? null, lines: [] as VehicleGapLine[], editionLines: [] as EditionLine[] };
  const dependsOn = new Map(loaded.lines.map((l) => [l.id, l.dependsOn]));
  const lines: VehicleGapLine[] = loaded.variance.lines.map((l) => ({ ...l, dependsOn: dependsOn.get(l.lineId) ?? [] }));
  return { editionId: loaded.editionId, lines, editionLines: loaded.lines };
}
