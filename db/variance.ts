import { and, asc, eq, inArray, isNotNull, ne, or, sql, type SQL } from "drizzle-orm";
import type { Actor } from "@/lib/permissions";
import {
  fleetVariance,
  varianceStatus,
  vehicleVariance,
  type Concession,
  type EditionLine,
  type EvidenceKind,
  type EvidenceStatus,
  type FleetVariance,
  type Fitment,
  type VehicleVariance,
  type VehicleVarianceStatus,
} from "@/lib/variance";
import type { DbOrTx } from "./client";
import { concessions, editionLines, editions, evidence, fitments, jobs, lineDependencies, vehicles } from "./schema";
import { vehicleScope } from "./scope";

/**
 * Variance read from the database: rows of editions, fitments, concessions and evidence mapped
 * to the shapes of lib/variance, then judged there.
 *
 * Every loader runs the same six queries whatever the fleet size (vehicles, lines, dependencies,
 * fitments, concessions, evidence): the vehicles are named by one subquery, never one query per
 * vehicle. A fitment points at a line by key, so it is matched to the line with that key in the
 * vehicle's current edition (and becomes an extra when that edition has no such line).
 */

export type VarianceFilter = {
  depotId?: string | null;
  platformId?: string | null;
  editionId?: string | null;
  standardId?: string | null;
  state?: (typeof vehicles.state.enumValues)[number];
  /** Retired vehicles are left out of fleet figures unless asked for. */
  includeRetired?: boolean;
};

/** One vehicle's variance with the rows it was judged from. */
export type LoadedVehicleVariance = {
  vehicleId: string;
  fleetNumber: string;
  depotId: string | null;
  platformId: string;
  editionId: string | null;
  /** The edition's lines in display order (empty without an edition). */
  lines: EditionLine[];
  /** Fitments on the vehicle that have not been removed, mapped to the edition's lines. */
  fitments: Fitment[];
  concessions: Concession[];
  /** null when the vehicle has no edition assigned. */
  variance: VehicleVariance | null;
};

export type LoadedFleetVariance = FleetVariance & {
  /** Each vehicle's own variance, in fleet-number order. */
  details: LoadedVehicleVariance[];
};

type VehicleRow = {
  id: string;
  fleetNumber: string;
  depotId: string | null;
  platformId: string;
  editionId: string | null;
};

type EvidenceRef = { kind: EvidenceKind; status: EvidenceStatus };

/** Loads and judges the vehicles matched by `where` (already scoped to the actor). */
async function loadVariances(db: DbOrTx, where: SQL, now: Date): Promise<LoadedVehicleVariance[]> {
  const inVehicles = sql`(select ${vehicles.id} from ${vehicles} where ${where})`;
  const inEditions = sql`(select ${vehicles.editionId} from ${vehicles} where ${where} and ${vehicles.editionId} is not null)`;
  const nowMs = now.getTime();

  const [vehicleRows, lineRows, dependencyRows, fitmentRows, concessionRows, evidenceRows] = await Promise.all([
    db
      .select({
        id: vehicles.id,
        fleetNumber: vehicles.fleetNumber,
        depotId: vehicles.depotId,
        platformId: vehicles.platformId,
        editionId: vehicles.editionId,
      })
      .from(vehicles)
      .where(where)
      .orderBy(asc(vehicles.fleetNumber)) as Promise<VehicleRow[]>,
    db
      .select()
      .from(editionLines)
      .where(inArray(editionLines.editionId, inEditions))
      .orderBy(asc(editionLines.editionId), asc(editionLines.sortOrder), asc(editionLines.code)),
    db
      .select({ lineId: lineDependencies.lineId, dependsOnLineId: lineDependencies.dependsOnLineId })
      .from(lineDependencies)
      .innerJoin(editionLines, eq(editionLines.id, lineDependencies.lineId))
      .where(inArray(editionLines.editionId, inEditions)),
    db
      .select({
        id: fitments.id,
        vehicleId: fitments.vehicleId,
        lineKey: fitments.lineKey,
        label: fitments.label,
        quantity: fitments.quantity,
        attributes: fitments.attributes,
        fittedAt: fitments.fittedAt,
        removedAt: fitments.removedAt,
        expiresAt: fitments.expiresAt,
      })
      .from(fitments)
      .where(
        and(
          inArray(fitments.vehicleId, inVehicles),
          // A fitment removed before now counts for nothing; leave it in the database.
          or(sql`${fitments.removedAt} is null`, sql`${fitments.removedAt} > ${nowMs}`),
        ),
      )
      .orderBy(asc(fitments.fittedAt)),
    db
      .select({
        vehicleId: concessions.vehicleId,
        lineKey: concessions.lineKey,
        reason: concessions.reason,
        expiresAt: concessions.expiresAt,
        approvedBy: concessions.approvedBy,
      })
      .from(concessions)
      .where(inArray(concessions.vehicleId, inVehicles)),
    db
      .select({
        fitmentId: evidence.fitmentId,
        lineKey: evidence.lineKey,
        kind: evidence.kind,
        status: evidence.status,
        jobVehicleId: jobs.vehicleId,
      })
      .from(evidence)
      .leftJoin(jobs, eq(jobs.id, evidence.jobId))
      .where(
        and(
          ne(evidence.status, "rejected"),
          or(
            inArray(evidence.fitmentId, sql`(select ${fitments.id} from ${fitments} where ${fitments.vehicleId} in ${inVehicles})`),
            and(isNotNull(evidence.lineKey), inArray(jobs.vehicleId, inVehicles)),
          ),
        ),
      ),
  ]);

  // Lines by edition, with their dependencies.
  const dependsOn = new Map<string, string[]>();
  for (const d of dependencyRows) {
    const list = dependsOn.get(d.lineId);
    if (list) list.push(d.dependsOnLineId);
    else dependsOn.set(d.lineId, [d.dependsOnLineId]);
  }
  const linesByEdition = new Map<string, EditionLine[]>();
  const lineIdByEditionKey = new Map<string, Map<string, string>>();
  for (const row of lineRows) {
    const line = toEditionLine(row, dependsOn.get(row.id) ?? []);
    let list = linesByEdition.get(row.editionId);
    if (!list) {
      list = [];
      linesByEdition.set(row.editionId, list);
      lineIdByEditionKey.set(row.editionId, new Map());
    }
    list.push(line);
    lineIdByEditionKey.get(row.editionId)!.set(row.key, row.id);
  }

  // Evidence by fitment, and by vehicle + line key (evidence lodged on a job for a line).
  const evidenceByFitment = new Map<string, EvidenceRef[]>();
  const evidenceByVehicleKey = new Map<string, EvidenceRef[]>();
  for (const e of evidenceRows) {
    const ref: EvidenceRef = { kind: e.kind, status: e.status };
    if (e.fitmentId) push(evidenceByFitment, e.fitmentId, ref);
    else if (e.lineKey && e.jobVehicleId) push(evidenceByVehicleKey, `${e.jobVehicleId}\u0000${e.lineKey}`, ref);
  }

  const vehicleById = new Map(vehicleRows.map((v) => [v.id, v]));
  const fitmentsByVehicle = new Map<string, Fitment[]>();
  for (const f of fitmentRows) {
    const vehicle = vehicleById.get(f.vehicleId);
    if (!vehicle) continue;
    const keys = vehicle.editionId ? lineIdByEditionKey.get(vehicle.editionId) : undefined;
    const lineId = f.lineKey && keys ? (keys.get(f.lineKey) ?? null) : null;
    const own = evidenceByFitment.get(f.id);
    const byKey = f.lineKey ? evidenceByVehicleKey.get(`${f.vehicleId}\u0000${f.lineKey}`) : undefined;
    const fitment: Fitment = {
      id: f.id,
      lineId,
      label: f.label,
      quantity: f.quantity,
      attributes: f.attributes ?? {},
      fittedAt: f.fittedAt,
      removedAt: f.removedAt,
      expiresAt: f.expiresAt,
      evidence: own && byKey ? [...own, ...byKey] : (own ?? byKey ?? []),
    };
    push(fitmentsByVehicle, f.vehicleId, fitment);
  }

  const concessionsByVehicle = new Map<string, Concession[]>();
  for (const c of concessionRows) {
    const vehicle = vehicleById.get(c.vehicleId);
    const lineId = vehicle?.editionId ? lineIdByEditionKey.get(vehicle.editionId)?.get(c.lineKey) : undefined;
    // A concession for a key the current edition does not have covers nothing.
    if (!lineId) continue;
    push(concessionsByVehicle, c.vehicleId, { lineId, reason: c.reason, expiresAt: c.expiresAt, approvedBy: c.approvedBy });
  }

  const none: EditionLine[] = [];
  return vehicleRows.map((v) => {
    const lines = v.editionId ? (linesByEdition.get(v.editionId) ?? none) : none;
    const vehicleFitments = fitmentsByVehicle.get(v.id) ?? [];
    const vehicleConcessions = concessionsByVehicle.get(v.id) ?? [];
    return {
      vehicleId: v.id,
      fleetNumber: v.fleetNumber,
      depotId: v.depotId,
      platformId: v.platformId,
      editionId: v.editionId,
      lines,
      fitments: vehicleFitments,
      concessions: vehicleConcessions,
      variance: v.editionId
        ? vehicleVariance({ lines, fitments: vehicleFitments, concessions: vehicleConcessions, now })
        : null,
    };
  });
}

function push<T>(map: Map<string, T[]>, key: string, value: T): void {
  const list = map.get(key);
  if (list) list.push(value);
  else map.set(key, [value]);
}

/** An edition_lines row (and the ids it depends on) as lib/variance's EditionLine. */
export function toEditionLine(row: typeof editionLines.$inferSelect, dependsOn: string[]): EditionLine {
  return {
    id: row.id,
    key: row.key,
    code: row.code,
    category: row.category,
    title: row.title,
    requirement: row.requirement,
    quantity: row.quantity,
    massKg: row.massKg,
    xMm: row.xMm,
    zone: row.zone,
    massKind: row.massKind,
    criteria: row.criteria ?? [],
    evidenceNeeded: row.evidenceNeeded ?? [],
    standardCostCents: row.standardCostCents,
    dependsOn,
    checkable: row.checkable,
    expiryMonths: row.expiryMonths,
  };
}

function filterWhere(actor: Actor, filter: VarianceFilter = {}): SQL {
  const parts: SQL[] = [vehicleScope(actor)];
  if (!filter.includeRetired && filter.state !== "retired") parts.push(ne(vehicles.state, "retired"));
  if (filter.state) parts.push(eq(vehicles.state, filter.state));
  if (filter.depotId) parts.push(eq(vehicles.depotId, filter.depotId));
  if (filter.platformId) parts.push(eq(vehicles.platformId, filter.platformId));
  if (filter.editionId) parts.push(eq(vehicles.editionId, filter.editionId));
  if (filter.standardId) {
    parts.push(
      inArray(
        vehicles.editionId,
        sql`(select ${editions.id} from ${editions} where ${editions.standardId} = ${filter.standardId} and ${editions.orgId} = ${actor.orgId})`,
      ),
    );
  }
  return and(...parts)!;
}

/** The vehicle's variance against its edition, or null when the actor may not see the vehicle. */
export async function loadVehicleVariance(
  db: DbOrTx,
  actor: Actor,
  vehicleId: string,
  now: Date,
): Promise<LoadedVehicleVariance | null> {
  const [one] = await loadVariances(db, and(vehicleScope(actor), eq(vehicles.id, vehicleId))!, now);
  return one ?? null;
}

/** Variance of every vehicle the actor may see (optionally filtered), rolled up for the fleet. */
export async function loadFleetVariance(
  db: DbOrTx,
  actor: Actor,
  filter: VarianceFilter | undefined,
  now: Date,
): Promise<LoadedFleetVariance> {
  const details = await loadVariances(db, filterWhere(actor, filter), now);
  const fleet = fleetVariance(
    details.map((d) => ({ vehicleId: d.vehicleId, depotId: d.depotId, platformId: d.platformId, variance: d.variance })),
  );
  return { ...fleet, details };
}

/**
 * meets_standard / gaps / no_edition for each of the given vehicles the actor may see (ids it
 * may not see are simply absent), for filtering and badging a register page.
 */
export async function varianceStatusByVehicle(
  db: DbOrTx,
  actor: Actor,
  vehicleIds: readonly string[],
  now: Date,
): Promise<Map<string, VehicleVarianceStatus>> {
  const out = new Map<string, VehicleVarianceStatus>();
  if (vehicleIds.length === 0) return out;
  // One bound parameter for any number of ids (SQLite caps bound parameters per statement).
  const ids = sql`(select value from json_each(${JSON.stringify([...new Set(vehicleIds)])}))`;
  const details = await loadVariances(db, and(vehicleScope(actor), inArray(vehicles.id, ids))!, now);
  for (const d of details) out.set(d.vehicleId, varianceStatus(d.variance));
  return out;
}
