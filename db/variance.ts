import { and, asc, eq, inArray, isNotNull, isNull, ne, sql, type SQL } from "drizzle-orm";
import { isScoped, type Actor } from "@/lib/permissions";
import {
  fleetVariance,
  vehicleVariance,
  type Concession,
  type EditionLine,
  type EvidenceKind,
  type EvidenceStatus,
  type FleetVariance,
  type Fitment,
  type VehicleVariance,
} from "@/lib/variance";
import type { DbOrTx } from "./client";
import { concessions, editionLines, editions, evidence, fitments, jobs, lineDependencies, vehicles } from "./schema";
import { namedVehicles, vehicleScope } from "./scope";

/**
 * Variance read from the database: rows of editions, fitments, concessions and evidence mapped
 * to the shapes of lib/variance, then judged there.
 *
 * Every loader runs the same seven queries whatever the fleet size (vehicles, lines,
 * dependencies, fitments, concessions, evidence by fitment, evidence by line key; an eighth only
 * when some fitment's key is missing from its vehicle's edition): the vehicles are named by one
 * subquery, never one query per vehicle. A fitment points at a line by key, so it is matched to the line with that key in the
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
  /** Fitments on the vehicle that have not been removed, mapped to the edition's lines (label is
   * filled for extras only; a fitment for a line is named by its line). */
  fitments: KeyedFitment[];
  /** Concessions on lines of the current edition. */
  concessions: Concession[];
  /** Every concession of the vehicle by line key (also those for keys the edition lacks). */
  concessionsByKey: KeyedConcession[];
  /** null when the vehicle has no edition assigned. */
  variance: VehicleVariance | null;
};

/** A fitment with the line key it was recorded against (null for an extra). */
export type KeyedFitment = Fitment & { lineKey: string | null };
export type KeyedConcession = Omit<Concession, "lineId"> & { lineKey: string };

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

/** Accepted evidence, one shared object per kind (the judgement only asks "is there an accepted one"). */
const ACCEPTED: Record<string, EvidenceRef> = Object.fromEntries(
  ["photo", "certificate", "weighbridge_ticket", "engineering_signoff"].map((kind) => [kind, Object.freeze({ kind, status: "accepted" }) as EvidenceRef]),
);

const EMPTY_ATTRIBUTES: Record<string, number | string> = Object.freeze({}) as Record<string, number | string>;

/** One fitment as the fleet query packs it: [id, vehicleId, lineKey, label (extras only), quantity, attributes text, fittedAt, removedAt, expiresAt]. */
type PackedFitment = [string, string, string | null, string | null, number, string, number, number | null, number | null];
type PackedVehicle = [string, string, string | null, string, string | null];

/**
 * Loads and judges the vehicles matched by `where` (already scoped to the actor).
 *
 * A fleet has hundreds of thousands of fitments, and fetching them row by row costs far more than
 * judging them, so the two large reads (vehicles, fitments) come back as one packed JSON array
 * each and are unpacked here. `narrow` says the vehicle set is small (one vehicle, a driver's
 * or contractor's, a filtered list): evidence is then read for those vehicles only rather than
 * for the whole organisation.
 */
async function loadVariances(db: DbOrTx, orgId: string, where: SQL, now: Date, narrow: boolean): Promise<LoadedVehicleVariance[]> {
  const inVehicles = sql`(select ${vehicles.id} from ${vehicles} where ${where})`;
  const inEditions = sql`(select ${vehicles.editionId} from ${vehicles} where ${where} and ${vehicles.editionId} is not null)`;
  const nowMs = now.getTime();

  const [vehiclePack, lineRows, dependencyRows, fitmentPack, concessionRows, evidenceByFitmentPack, evidenceByKeyRows] = await Promise.all([
    db.get<{ j: string | null }>(
      sql`select json_group_array(json_array(id, fleet_number, depot_id, platform_id, edition_id)) as j from (select ${vehicles.id} as id, ${vehicles.fleetNumber} as fleet_number, ${vehicles.depotId} as depot_id, ${vehicles.platformId} as platform_id, ${vehicles.editionId} as edition_id from ${vehicles} where ${where} order by ${vehicles.fleetNumber})`,
    ),
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
    // A fitment removed before now counts for nothing; it stays in the database.
    db.get<{ j: string | null }>(
      sql`select json_group_array(json_array(f.id, f.vehicle_id, f.line_key, case when f.line_key is null then f.label end, f.quantity, f.attributes, f.fitted_at, f.removed_at, f.expires_at)) as j
          from ${fitments} f
          where f.vehicle_id in ${inVehicles} and (f.removed_at is null or f.removed_at > ${nowMs})`,
    ),
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
    // Only accepted evidence changes a judgement (lodged and missing both leave a line unproven).
    db.get<{ j: string | null }>(
      narrow
        ? sql`select json_group_array(json_array(e.fitment_id, e.kind)) as j from ${evidence} e
              where e.status = 'accepted' and e.fitment_id in (select f.id from ${fitments} f where f.vehicle_id in ${inVehicles})`
        : sql`select json_group_array(json_array(e.fitment_id, e.kind)) as j from ${evidence} e
              where e.org_id = ${orgId} and e.status = 'accepted' and e.fitment_id is not null`,
    ),
    // Evidence lodged on a job for a line (not yet tied to one fitment) proves that line's fitments.
    db
      .select({ vehicleId: jobs.vehicleId, lineKey: evidence.lineKey, kind: evidence.kind })
      .from(evidence)
      .innerJoin(jobs, eq(jobs.id, evidence.jobId))
      .where(
        and(
          eq(evidence.orgId, orgId),
          eq(evidence.status, "accepted"),
          isNull(evidence.fitmentId),
          isNotNull(evidence.lineKey),
          inArray(jobs.vehicleId, inVehicles),
        ),
      ),
  ]);

  const vehicleRows: VehicleRow[] = (unpack<PackedVehicle>(vehiclePack)).map(([id, fleetNumber, depotId, platformId, editionId]) => ({
    id,
    fleetNumber,
    depotId,
    platformId,
    editionId,
  }));

  // Lines by edition, with their dependencies.
  const dependsOn = new Map<string, string[]>();
  for (const d of dependencyRows) push(dependsOn, d.lineId, d.dependsOnLineId);
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

  const evidenceByFitment = new Map<string, EvidenceRef[]>();
  for (const [fitmentId, kind] of unpack<[string, string]>(evidenceByFitmentPack)) {
    const ref = ACCEPTED[kind];
    if (ref) push(evidenceByFitment, fitmentId, ref);
  }
  const evidenceByVehicleKey = new Map<string, EvidenceRef[]>();
  for (const e of evidenceByKeyRows) {
    const ref = ACCEPTED[e.kind];
    if (ref && e.lineKey) push(evidenceByVehicleKey, `${e.vehicleId}\u0000${e.lineKey}`, ref);
  }

  const vehicleById = new Map(vehicleRows.map((v) => [v.id, v]));
  const fitmentsByVehicle = new Map<string, KeyedFitment[]>();
  const unlabelled: KeyedFitment[] = [];
  // Fitments of one fleet repeat the same attributes and dates over and over: read each once.
  const attributesOf = new Map<string, Record<string, number | string>>([["{}", EMPTY_ATTRIBUTES]]);
  const dateOf = new Map<number, Date>();
  const readAttributes = (text: string | null) => {
    if (!text) return EMPTY_ATTRIBUTES;
    let value = attributesOf.get(text);
    if (!value) attributesOf.set(text, (value = Object.freeze(JSON.parse(text) as Record<string, number | string>)));
    return value;
  };
  const readDate = (ms: number) => {
    let value = dateOf.get(ms);
    if (!value) dateOf.set(ms, (value = new Date(ms)));
    return value;
  };
  for (const [id, vehicleId, lineKey, label, quantity, attributes, fittedAt, removedAt, expiresAt] of unpack<PackedFitment>(fitmentPack)) {
    const vehicle = vehicleById.get(vehicleId);
    if (!vehicle) continue;
    const keys = vehicle.editionId ? lineIdByEditionKey.get(vehicle.editionId) : undefined;
    const lineId = lineKey && keys ? (keys.get(lineKey) ?? null) : null;
    const own = evidenceByFitment.get(id);
    const byKey = lineKey && evidenceByVehicleKey.size > 0 ? evidenceByVehicleKey.get(`${vehicleId}\u0000${lineKey}`) : undefined;
    const fitment: KeyedFitment = {
      id,
      lineId,
      lineKey,
      label: label ?? "",
      quantity,
      attributes: readAttributes(attributes),
      fittedAt: readDate(fittedAt),
      removedAt: removedAt === null ? null : readDate(removedAt),
      expiresAt: expiresAt === null ? null : readDate(expiresAt),
      evidence: own && byKey ? [...own, ...byKey] : (own ?? byKey ?? []),
    };
    // An extra keeps its own label; a fitment for a line is named by the line.
    if (lineId === null && label === null) unlabelled.push(fitment);
    push(fitmentsByVehicle, vehicleId, fitment);
  }
  if (unlabelled.length > 0) {
    // Fitments whose key the vehicle's current edition does not have: they show as extras, by label.
    const labels = await db
      .select({ id: fitments.id, label: fitments.label })
      .from(fitments)
      .where(inArray(fitments.id, sql`(select value from json_each(${JSON.stringify(unlabelled.map((f) => f.id))}))`));
    const labelOf = new Map(labels.map((l) => [l.id, l.label]));
    for (const f of unlabelled) f.label = labelOf.get(f.id) ?? f.label;
  }

  const concessionsByVehicle = new Map<string, Concession[]>();
  const keyedConcessions = new Map<string, KeyedConcession[]>();
  for (const c of concessionRows) {
    push(keyedConcessions, c.vehicleId, { lineKey: c.lineKey, reason: c.reason, expiresAt: c.expiresAt, approvedBy: c.approvedBy });
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
      concessionsByKey: keyedConcessions.get(v.id) ?? [],
      variance: v.editionId
        ? vehicleVariance({ lines, fitments: vehicleFitments, concessions: vehicleConcessions, now })
        : null,
    };
  });
}

function unpack<T>(row: { j: string | null } | undefined): T[] {
  return row?.j ? (JSON.parse(row.j) as T[]) : [];
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

/** The vehicles a fleet read covers: the actor's scope, the filter, retired ones left out unless asked for. */
export function filterWhere(actor: Actor, filter: VarianceFilter = {}): SQL {
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
  const [one] = await loadVariances(db, actor.orgId, and(vehicleScope(actor), eq(vehicles.id, vehicleId))!, now, true);
  return one ?? null;
}

/** Variance of every vehicle the actor may see (optionally filtered), rolled up for the fleet. */
export async function loadFleetVariance(
  db: DbOrTx,
  actor: Actor,
  filter: VarianceFilter | undefined,
  now: Date,
): Promise<LoadedFleetVariance> {
  const narrow = isScoped(actor, "read", "Variance") || Boolean(filter?.depotId || filter?.platformId || filter?.editionId || filter?.standardId || filter?.state);
  const details = await loadVariances(db, actor.orgId, filterWhere(actor, filter), now, narrow);
  const fleet = fleetVariance(
    details.map((d) => ({ vehicleId: d.vehicleId, depotId: d.depotId, platformId: d.platformId, variance: d.variance })),
  );
  return { ...fleet, details };
}

/** The variances of the given vehicles the actor may see (ids it may not see are left out). */
export async function loadVariancesFor(
  db: DbOrTx,
  actor: Actor,
  vehicleIds: readonly string[],
  now: Date,
): Promise<LoadedVehicleVariance[]> {
  if (vehicleIds.length === 0) return [];
  return loadVariances(db, actor.orgId, namedVehicles(actor, vehicleIds), now, vehicleIds.length < 1000);
}

// The register's status filter reads the stored summaries (db/variance-summary.ts).
export { varianceStatusByVehicle, type VarianceStatuses } from "./variance-summary";
