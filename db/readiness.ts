import { and, eq, inArray, sql, type SQL } from "drizzle-orm";
import type { Actor } from "@/lib/permissions";
import { defectTitle } from "@/lib/defects";
import { tripReadiness, type ExpiringItem, type OpenDefect, type ReadinessState, type TripReadiness } from "@/lib/readiness";
import type { EditionLine, Fitment } from "@/lib/variance";
import type { DbOrTx } from "./client";
import { defects, vehicles } from "./schema";
import { vehicleScope } from "./scope";
import { loadFleetVariance, loadVehicleVariance, type LoadedVehicleVariance, type VarianceFilter } from "./variance";

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

/** A date plus whole calendar months (31 Jan + 1 month → 28/29 Feb: the month's last day). */
export function addMonths(date: Date, months: number): Date {
  const d = new Date(date.getTime());
  const day = d.getUTCDate();
  d.setUTCDate(1);
  d.setUTCMonth(d.getUTCMonth() + months);
  const lastDay = new Date(Date.UTC(d.getUTCFullYear(), d.getUTCMonth() + 1, 0)).getUTCDate();
  d.setUTCDate(Math.min(day, lastDay));
  return d;
}

/** What expires on a vehicle: fitments (own date, else line expiry in months) and registration. */
export function expiringItemsOf(
  lines: readonly EditionLine[],
  fitments: readonly Fitment[],
  registration: { registration: string | null; registrationExpiry: Date | null },
): ExpiringItem[] {
  const lineById = new Map(lines.map((l) => [l.id, l]));
  const items: ExpiringItem[] = [];
  for (const f of fitments) {
    const line = f.lineId ? lineById.get(f.lineId) : undefined;
    let expiresAt = f.expiresAt;
    if (!expiresAt && line?.expiryMonths && line.expiryMonths > 0) expiresAt = addMonths(f.fittedAt, line.expiryMonths);
    if (!expiresAt) continue;
    items.push({ label: line ? `${line.title} (${line.code})` : f.label, expiresAt });
  }
  if (registration.registrationExpiry) {
    items.push({ label: `Registration${registration.registration ? ` ${registration.registration}` : ""}`, expiresAt: registration.registrationExpiry });
  }
  return items.sort((a, b) => a.expiresAt.getTime() - b.expiresAt.getTime());
}

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

/** Readiness of a set of vehicles by id (ids the actor may not see are absent), in one pass. */
export async function readinessByVehicle(db: DbOrTx, actor: Actor, vehicleIds: readonly string[], now: Date = new Date()): Promise<Map<string, VehicleReadiness>> {
  const wanted = new Set(vehicleIds);
  const out = new Map<string, VehicleReadiness>();
  if (wanted.size === 0) return out;
  for (const r of await loadFleetReadiness(db, actor, now, { includeRetired: true })) {
    if (wanted.has(r.vehicleId)) out.set(r.vehicleId, r);
  }
  return out;
}

/**
 * How many of the actor's vehicles are ready, limited or not ready (retired vehicles are not
 * counted: they are out of the fleet). For the manager's home page.
 */
export async function fleetReadinessCounts(db: DbOrTx, actor: Actor, now: Date = new Date()): Promise<ReadinessCounts> {
  const counts: Record<ReadinessState, number> = { ready: 0, limited: 0, not_ready: 0 };
  const fleet = await loadFleetReadiness(db, actor, now);
  for (const r of fleet) counts[r.state] += 1;
  return { ready: counts.ready, limited: counts.limited, notReady: counts.not_ready, total: fleet.length };
}
