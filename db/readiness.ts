import { and, eq, inArray, sql, type SQL } from "drizzle-orm";
import type { Actor } from "@/lib/permissions";
import { defectTitle } from "@/lib/defects";
import {
  earliestExpiry,
  expiringItemsOf,
  nextReadinessChange,
  readinessStateOf,
  type ReadinessFacts,
  tripReadiness,
  type ExpiringItem,
  type OpenDefect,
  type ReadinessState,
  type TripReadiness,
} from "@/lib/readiness";
import type { DbOrTx } from "./client";
import { defects, vehicles } from "./schema";
import { namedVehicles, vehicleScope } from "./scope";
import { loadFleetVariance, loadVariancesFor, loadVehicleVariance, type LoadedVehicleVariance, type VarianceFilter } from "./variance";
import { loadFleetVarianceFigures, nextChangeAfter, type VehicleVarianceFigures } from "./variance-summary";

/**
 * Trip readiness read from the database: each vehicle's variance (db/variance.ts), its open
 * defects by severity, its state, and what on it expires — a fitment's own expiry date, or for a
 * fitment with none, its fitting date plus its line's expiry in months; and the registration.
 * A fixed number of queries whatever the fleet size: the variance loader's six, one for the
 * vehicles' state and registration, one for the open defects.
 */

export type VehicleReadiness = TripReadiness & {
  vehicleId: string;
  fleetNumber: string;
  vehicleState: (typeof vehicles.state.enumValues)[number];
  /** Everything on the vehicle that has an expiry, soonest first (expired ones included). */
  expiringItems: ExpiringItem[];
};

export type ReadinessCounts = { ready: number; limited: number; notReady: number; total: number };

const OPEN_STATES = ["reported", "triaged", "in_repair"] as const;

type VehicleFacts = {
  id: string;
  fleetNumber: string;
  state: (typeof vehicles.state.enumValues)[number];
  registration: string | null;
  registrationExpiry: Date | null;
};

async function factsAndDefects(db: DbOrTx, where: SQL) {
  const inVehicles = sql`(select ${vehicles.id} from ${vehicles} where ${where})`;
  const [facts, open] = await Promise.all([
    db
      .select({ id: vehicles.id, fleetNumber: vehicles.fleetNumber, state: vehicles.state, registration: vehicles.registration, registrationExpiry: vehicles.registrationExpiry })
      .from(vehicles)
      .where(where) as Promise<VehicleFacts[]>,
    db
      .select({ id: defects.id, vehicleId: defects.vehicleId, severity: defects.severity, category: defects.category, description: defects.description })
      .from(defects)
      .where(and(inArray(defects.vehicleId, inVehicles), inArray(defects.state, [...OPEN_STATES])))
      .orderBy(defects.createdAt),
  ]);
  const defectsByVehicle = new Map<string, OpenDefect[]>();
  for (const d of open) {
    const list = defectsByVehicle.get(d.vehicleId) ?? [];
    list.push({ id: d.id, severity: d.severity, title: defectTitle(d.category, d.description) });
    defectsByVehicle.set(d.vehicleId, list);
  }
  return { factsById: new Map(facts.map((f) => [f.id, f])), defectsByVehicle };
}

function judge(loaded: LoadedVehicleVariance, facts: VehicleFacts, open: OpenDefect[], now: Date): VehicleReadiness {
  const expiringItems = expiringItemsOf(loaded.lines, loaded.fitments, facts);
  const result = tripReadiness({ vehicleState: facts.state, variance: loaded.variance, openDefects: open, expiringItems, now });
  return { ...result, vehicleId: facts.id, fleetNumber: facts.fleetNumber, vehicleState: facts.state, expiringItems };
}

/** One vehicle's readiness, or null when the actor may not see the vehicle. */
export async function loadVehicleReadiness(db: DbOrTx, actor: Actor, vehicleId: string, now: Date = new Date()): Promise<VehicleReadiness | null> {
  const where = and(vehicleScope(actor), eq(vehicles.id, vehicleId))!;
  const [loaded, { factsById, defectsByVehicle }] = await Promise.all([loadVehicleVariance(db, actor, vehicleId, now), factsAndDefects(db, where)]);
  const facts = factsById.get(vehicleId);
  if (!loaded || !facts) return null;
  return judge(loaded, facts, defectsByVehicle.get(vehicleId) ?? [], now);
}

/** Readiness of every vehicle the actor may see (retired vehicles left out unless asked for). */
export async function loadFleetReadiness(db: DbOrTx, actor: Actor, now: Date = new Date(), filter: VarianceFilter = {}): Promise<VehicleReadiness[]> {
  const where = and(vehicleScope(actor), filter.includeRetired || filter.state === "retired" ? undefined : sql`${vehicles.state} <> 'retired'`)!;
  const [fleet, { factsById, defectsByVehicle }] = await Promise.all([loadFleetVariance(db, actor, filter, now), factsAndDefects(db, where)]);
  const out: VehicleReadiness[] = [];
  for (const loaded of fleet.details) {
    const facts = factsById.get(loaded.vehicleId);
    if (facts) out.push(judge(loaded, facts, defectsByVehicle.get(loaded.vehicleId) ?? [], now));
  }
  return out;
}

/** Readiness of a set of vehicles by id (ids the actor may not see are absent), judged for those vehicles only. */
export async function readinessByVehicle(db: DbOrTx, actor: Actor, vehicleIds: readonly string[], now: Date = new Date()): Promise<Map<string, VehicleReadiness>> {
  const out = new Map<string, VehicleReadiness>();
  if (vehicleIds.length === 0) return out;
  const [loaded, { factsById, defectsByVehicle }] = await Promise.all([loadVariancesFor(db, actor, vehicleIds, now), factsAndDefects(db, namedVehicles(actor, vehicleIds))]);
  for (const l of loaded) {
    const facts = factsById.get(l.vehicleId);
    if (facts) out.set(l.vehicleId, judge(l, facts, defectsByVehicle.get(l.vehicleId) ?? [], now));
  }
  return out;
}

// ─── Readiness in brief: the state only, for counts and filters over the whole fleet ───

type BriefRow = [id: string, state: VehicleFacts["state"], registrationExpiry: number | null, stopDefects: number, beforeTripDefects: number];

/**
 * The state (ready / limited / not ready) of each vehicle given its variance figures, judged in
 * brief (lib/readiness/brief.ts): the figures' counts and readiness facts from the variance
 * summaries, the vehicle's state and registration, its open defects counted by severity. The
 * same state the full judgement gives, without loading every line and fitment. Vehicles with no
 * edition have no summary: their fitments' expiries are read with the full loader (they carry
 * no edition lines, so that is cheap).
 */
export async function readinessStatesFromFigures(db: DbOrTx, actor: Actor, figures: readonly VehicleVarianceFigures[], now: Date): Promise<ReadinessStates> {
  const out = new Map<string, ReadinessState>();
  let validUntil: number | null = null;
  const holdUntil = (at: number | null) => {
    if (at !== null && (validUntil === null || at < validUntil)) validUntil = at;
  };
  if (figures.length === 0) return { byVehicle: out, validUntil };
  const ids = figures.map((f) => f.vehicleId);
  const withoutEdition = figures.filter((f) => f.readinessFacts === null).map((f) => f.vehicleId);
  const open = sql.join(OPEN_STATES.map((s) => sql`${s}`), sql`, `);
  const [pack, unsummarised] = await Promise.all([
    db.get<{ j: string | null }>(sql`
      select json_group_array(json_array(v.id, v.state, v.registration_expiry, coalesce(d.stop, 0), coalesce(d.before_trip, 0))) as j
      from (select ${vehicles.id} as id, ${vehicles.state} as state, ${vehicles.registrationExpiry} as registration_expiry
            from ${vehicles} where ${namedVehicles(actor, ids)}) as v
      left join (
        select ${defects.vehicleId} as vehicle_id,
          sum(${defects.severity} = 'stop') as stop, sum(${defects.severity} = 'before_next_trip') as before_trip
        from ${defects}
        where ${defects.orgId} = ${actor.orgId} and ${defects.state} in (${open})
        group by ${defects.vehicleId}
      ) as d on d.vehicle_id = v.id`),
    loadVariancesFor(db, actor, withoutEdition, now),
  ]);
  const rows = new Map((pack?.j ? (JSON.parse(pack.j) as BriefRow[]) : []).map((r) => [r[0], r]));
  const fitmentExpiry = new Map<string, number | null>(
    unsummarised.map((l) => [l.vehicleId, earliestExpiry(expiringItemsOf(l.lines, l.fitments, { registration: null, registrationExpiry: null }))?.getTime() ?? null]),
  );
  // Their fitments also come and go by date (fitted later, removed later), as a summary's valid_until would say.
  for (const l of unsummarised) holdUntil(nextChangeAfter(l, now.getTime()));
  for (const f of figures) {
    const row = rows.get(f.vehicleId);
    if (!row) continue;
    const [, vehicleState, registrationExpiry, stopDefects, beforeTripDefects] = row;
    const fitted = f.readinessFacts ? f.readinessFacts.earliestExpiryMs : (fitmentExpiry.get(f.vehicleId) ?? null);
    const earliest = [fitted, registrationExpiry].filter((t): t is number => t !== null);
    const s = f.summary;
    const facts: ReadinessFacts = {
      vehicleState,
      stopDefects,
      beforeTripDefects,
      criticalGaps: f.readinessFacts?.criticalGaps ?? 0,
      limitingLines: s ? s.short + s.offSpec + s.unproven + s.prohibitedFitted : 0,
      earliestExpiry: earliest.length ? new Date(Math.min(...earliest)) : null,
    };
    out.set(f.vehicleId, readinessStateOf(facts, now));
    // Time turns a state through the variance (a fitment or concession lapsing) or an expiry nearing.
    holdUntil(f.validUntil);
    holdUntil(nextReadinessChange(facts, now));
  }
  return { byVehicle: out, validUntil };
}

/** Each vehicle's readiness state, and the first instant at which time alone could turn one. */
export type ReadinessStates = { byVehicle: Map<string, ReadinessState>; validUntil: number | null };

/**
 * How many of the actor's vehicles are ready, limited or not ready (retired vehicles are not
 * counted: they are out of the fleet). For the manager's home page and the daily snapshot.
 */
export async function fleetReadinessCounts(db: DbOrTx, actor: Actor, now: Date = new Date()): Promise<ReadinessCounts> {
  return readinessCountsOf(await fleetReadinessStates(db, actor, now));
}

/** Each vehicle's readiness state (retired ones left out), in brief, in fleet-number order. */
export async function fleetReadinessStates(db: DbOrTx, actor: Actor, now: Date = new Date()): Promise<Map<string, ReadinessState>> {
  const { details } = await loadFleetVarianceFigures(db, actor, {}, now);
  return (await readinessStatesFromFigures(db, actor, details, now)).byVehicle;
}

export function readinessCountsOf(states: ReadonlyMap<string, ReadinessState>): ReadinessCounts {
  const counts: Record<ReadinessState, number> = { ready: 0, limited: 0, not_ready: 0 };
  for (const state of states.values()) counts[state] += 1;
  return { ready: counts.ready, limited: counts.limited, notReady: counts.not_ready, total: states.size };
}
