import { sql, type SQL } from "drizzle-orm";
import type { Actor } from "@/lib/permissions";
import { criticalGapCount, earliestExpiry, expiringItemsOf } from "@/lib/readiness";
import {
  rollUpFleet,
  vehicleFigures,
  type FleetVariance,
  type VarianceSummary,
  type VehicleVarianceStatus,
} from "@/lib/variance";
import type { DbOrTx } from "./client";
import { vehicles, vehicleVarianceSummaries } from "./schema";
import { namedVehicles } from "./scope";
import { filterWhere, loadVariancesFor, type LoadedVehicleVariance, type VarianceFilter } from "./variance";

/**
 * Fleet variance figures from the stored per-vehicle summaries (vehicle_variance_summaries).
 *
 * Judging a fleet means reading every fitment of every vehicle; the figures the fleet view, the
 * register's status filter and the daily snapshot need are a handful of numbers per vehicle. So
 * each vehicle's figures are stored once judged, and read back while they still hold:
 * - the triggers of migration `variance_summary_triggers` delete a vehicle's row whenever a row
 *   its judgement reads changes (fitments, concessions, accepted evidence, its edition, that
 *   edition's lines), so no write can leave a stale figure behind;
 * - time alone changes a judgement only at known instants (a fitment fitted, removed or expiring,
 *   a concession lapsing), so a row holds from `computed_at` until `valid_until`, the first of
 *   those after the moment it was judged at;
 * - a vehicle without a current row is judged with the full loader (db/variance.ts) and its row
 *   written back. The figures returned are always the ones just judged; the write-back only
 *   saves work for the next read, and a failed one is ignored.
 *
 * Writing back safely without holding the writer for the whole judgement: the refresh first
 * claims the rows (one statement: a placeholder with its own token), then judges, then writes
 * the figures only into rows still carrying its token. A change committed after the claim fires
 * a trigger that deletes the placeholder, so figures judged from older rows are never stored.
 */

/**
 * The version of the rules the stored figures were judged by. Rows of another version are never
 * read as current, so raise this whenever a change to lib/variance or to the mapping in
 * db/variance.ts could change any vehicle's status, counts, cost or mass, or to the readiness
 * facts kept beside them (lib/readiness: critical categories, expiries): every row is then
 * judged again on its next read.
 */
export const SUMMARY_RULES_VERSION = 2;

/** One vehicle's variance figures, as the fleet view and the export show them. */
export type VehicleVarianceFigures = {
  vehicleId: string;
  fleetNumber: string;
  depotId: string | null;
  platformId: string;
  editionId: string | null;
  status: VehicleVarianceStatus;
  /** Line counts by status; null when the vehicle has no edition assigned. */
  summary: VarianceSummary | null;
  costToCloseCents: number;
  /** Rounded to the gram. */
  massToCloseKg: number;
  /** The first instant (ms) at which time alone could change these figures; null: none. */
  validUntil: number | null;
  /**
   * What trip readiness in brief needs besides the counts (lib/readiness/brief.ts): critical
   * gaps and the earliest fitment expiry (ms). Null when the vehicle has no edition (its
   * fitments' expiries are then not summarised).
   */
  readinessFacts: { criticalGaps: number; earliestExpiryMs: number | null } | null;
};

export type FleetVarianceFigures = FleetVariance & {
  /** Each vehicle's figures, in fleet-number order. */
  details: VehicleVarianceFigures[];
};

/** What one read did: vehicles read from stored rows, judged again, and rows written back. */
export type SummaryReadStats = { stored: number; judged: number; written: number };

export type SummaryReadOptions = {
  /** Filled in with what the read did (the benchmark and tests look). */
  stats?: SummaryReadStats;
  /** Tests only: runs after a refresh has judged and before it writes, to change rows meanwhile. */
  beforeWrite?: () => Promise<void>;
};

type Judged = Pick<VehicleVarianceFigures, "editionId" | "status" | "summary" | "costToCloseCents" | "massToCloseKg" | "validUntil" | "readinessFacts">;

/**
 * One vehicle as the fleet read packs it: [id, fleet number, depot, platform, edition, current
 * (1 when its stored row holds at now, else 0), then the stored row's status, the seven counts,
 * cost in cents, mass in grams, valid until, critical gaps and earliest expiry (absent when not current)].
 */
type PackedRow = [
  string,
  string,
  string | null,
  string,
  string | null,
  0 | 1,
  VehicleVarianceStatus,
  number,
  number,
  number,
  number,
  number,
  number,
  number,
  number,
  number,
  number | null,
  number,
  number | null,
];

/** The earliest instant after `nowMs` at which time alone changes this vehicle's judgement. */
export function nextChangeAfter(loaded: Pick<LoadedVehicleVariance, "fitments" | "concessions">, nowMs: number): number | null {
  let next = Infinity;
  const consider = (at: Date | null) => {
    if (at === null) return;
    const t = at.getTime();
    if (t > nowMs && t < next) next = t;
  };
  // A fitment counts from fittedAt, stops counting at removedAt and stops filling its line at
  // expiresAt (lib/variance). Fitments removed on or before now are not loaded: they never count again.
  for (const f of loaded.fitments) {
    consider(f.fittedAt);
    consider(f.removedAt);
    consider(f.expiresAt);
  }
  // A concession covers its line until it expires.
  for (const c of loaded.concessions) consider(c.expiresAt);
  return next === Infinity ? null : next;
}

const NO_REGISTRATION = { registration: null, registrationExpiry: null };

function judgedOf(loaded: LoadedVehicleVariance, nowMs: number): Judged {
  const figures = vehicleFigures(loaded.variance);
  const readinessFacts = loaded.editionId
    ? {
        criticalGaps: criticalGapCount(loaded.variance),
        earliestExpiryMs: earliestExpiry(expiringItemsOf(loaded.lines, loaded.fitments, NO_REGISTRATION))?.getTime() ?? null,
      }
    : null;
  return { editionId: loaded.editionId, ...figures, validUntil: loaded.editionId ? nextChangeAfter(loaded, nowMs) : null, readinessFacts };
}

/**
 * Judges the given vehicles with the full loader and stores their figures (see the claim above).
 * Returns the figures judged, whether or not they could be stored.
 */
async function judgeAndStore(db: DbOrTx, actor: Actor, ids: readonly string[], now: Date, options: SummaryReadOptions): Promise<Map<string, Judged>> {
  const nowMs = now.getTime();
  const claim = crypto.randomUUID();
  const idList = JSON.stringify(ids);
  let claimed = false;
  try {
    await db.run(sql`
      insert into ${vehicleVarianceSummaries} (vehicle_id, org_id, edition_id, status, computed_at, valid_until, claim, rules_version)
      select v.id, v.org_id, v.edition_id, null, ${nowMs}, null, ${claim}, ${SUMMARY_RULES_VERSION}
      from ${vehicles} v
      where v.id in (select value from json_each(${idList})) and v.edition_id is not null
      on conflict (vehicle_id) do update set
        org_id = excluded.org_id, edition_id = excluded.edition_id, status = null,
        computed_at = excluded.computed_at, valid_until = null, claim = excluded.claim, rules_version = excluded.rules_version`);
    claimed = true;
  } catch (error) {
    // Busy or read-only: judge anyway, store nothing.
    warnOnce("claim", error);
  }

  const judged = new Map<string, Judged>();
  for (const loaded of await loadVariancesFor(db, actor, ids, now)) judged.set(loaded.vehicleId, judgedOf(loaded, nowMs));

  if (claimed) {
    if (options.beforeWrite) await options.beforeWrite();
    const rows = [...judged]
      .filter(([, j]) => j.editionId !== null && j.summary !== null && j.status !== "no_edition")
      .map(([id, j]) => {
        const s = j.summary!;
        return [id, j.editionId, j.status, s.meets, s.short, s.offSpec, s.unproven, s.concession, s.prohibitedFitted, s.extra, j.costToCloseCents, Math.round(j.massToCloseKg * 1000), j.validUntil,
          j.readinessFacts?.criticalGaps ?? 0, j.readinessFacts?.earliestExpiryMs ?? null];
      });
    try {
      // Only rows still carrying this claim: a change since the claim deleted its row.
      const result = await db.run(sql`
        update ${vehicleVarianceSummaries} set
          status = j.status, meets = j.meets, short = j.short, off_spec = j.off_spec, unproven = j.unproven,
          concession = j.concession, prohibited_fitted = j.prohibited_fitted, extra = j.extra,
          cost_to_close_cents = j.cost, mass_to_close_g = j.mass_g, valid_until = j.valid_until, critical_gaps = j.critical_gaps,
          earliest_expiry_at = j.earliest_expiry_at, claim = null
        from (
          select json_extract(value, '$[0]') as vehicle_id, json_extract(value, '$[1]') as edition_id,
            json_extract(value, '$[2]') as status, json_extract(value, '$[3]') as meets, json_extract(value, '$[4]') as short,
            json_extract(value, '$[5]') as off_spec, json_extract(value, '$[6]') as unproven, json_extract(value, '$[7]') as concession,
            json_extract(value, '$[8]') as prohibited_fitted, json_extract(value, '$[9]') as extra, json_extract(value, '$[10]') as cost,
            json_extract(value, '$[11]') as mass_g, json_extract(value, '$[12]') as valid_until,
            json_extract(value, '$[13]') as critical_gaps, json_extract(value, '$[14]') as earliest_expiry_at
          from json_each(${JSON.stringify(rows)})
        ) as j
        where vehicle_variance_summaries.vehicle_id = j.vehicle_id
          and vehicle_variance_summaries.claim = ${claim}
          and vehicle_variance_summaries.edition_id = j.edition_id`);
      if (options.stats) options.stats.written += Number((result as { rowsAffected?: number }).rowsAffected ?? 0);
    } catch (error) {
      warnOnce("write", error);
    }
  }
  return judged;
}

const warned = new Set<string>();
function warnOnce(step: string, error: unknown): void {
  if (warned.has(step)) return;
  warned.add(step);
  console.warn(`variance summaries: the ${step} step failed; the figures were judged in full and not stored`, error);
}

/** Figures of the vehicles matched by `where` (already scoped to the actor), in fleet-number order. */
async function figuresWhere(db: DbOrTx, actor: Actor, where: SQL, now: Date, options: SummaryReadOptions): Promise<VehicleVarianceFigures[]> {
  const nowMs = now.getTime();
  const s = vehicleVarianceSummaries;
  // A stored row holds when it is judged (not a bare claim) by these rules, for the vehicle's
  // current edition, at or before now, and time has not yet reached its valid_until.
  const current = sql`(${s.status} is not null and ${s.rulesVersion} = ${SUMMARY_RULES_VERSION} and ${s.editionId} = ${vehicles.editionId}
    and ${s.computedAt} <= ${nowMs} and (${s.validUntil} is null or ${s.validUntil} > ${nowMs}))`;
  const pack = await db.get<{ j: string | null }>(sql`
    select json_group_array(case when current then json_array(id, fleet_number, depot_id, platform_id, edition_id, 1, status, meets, short, off_spec,
        unproven, concession, prohibited_fitted, extra, cost_to_close_cents, mass_to_close_g, valid_until, critical_gaps, earliest_expiry_at)
      else json_array(id, fleet_number, depot_id, platform_id, edition_id, 0) end) as j
    from (
      select ${vehicles.id} as id, ${vehicles.fleetNumber} as fleet_number, ${vehicles.depotId} as depot_id, ${vehicles.platformId} as platform_id,
        ${vehicles.editionId} as edition_id, coalesce(${current}, 0) as current, ${s.status} as status, ${s.meets} as meets, ${s.short} as short,
        ${s.offSpec} as off_spec, ${s.unproven} as unproven, ${s.concession} as concession, ${s.prohibitedFitted} as prohibited_fitted,
        ${s.extra} as extra, ${s.costToCloseCents} as cost_to_close_cents, ${s.massToCloseG} as mass_to_close_g,
        ${s.validUntil} as valid_until, ${s.criticalGaps} as critical_gaps, ${s.earliestExpiryAt} as earliest_expiry_at
      from ${vehicles} left join ${s} on ${s.vehicleId} = ${vehicles.id}
      where ${where}
      order by ${vehicles.fleetNumber}
    )`);
  const rows = pack?.j ? (JSON.parse(pack.j) as PackedRow[]) : [];

  const stale: string[] = [];
  for (const r of rows) if (r[4] !== null && r[5] === 0) stale.push(r[0]);
  const judged = stale.length > 0 ? await judgeAndStore(db, actor, stale, now, options) : null;
  if (options.stats) {
    options.stats.judged += stale.length;
    options.stats.stored += rows.length - stale.length;
  }

  const out: VehicleVarianceFigures[] = [];
  for (const r of rows) {
    const editionId = r[4];
    if (editionId === null) {
      out.push({ vehicleId: r[0], fleetNumber: r[1], depotId: r[2], platformId: r[3], editionId: null, status: "no_edition", summary: null, costToCloseCents: 0, massToCloseKg: 0, validUntil: null, readinessFacts: null });
    } else if (r[5] === 1) {
      out.push({
        vehicleId: r[0],
        fleetNumber: r[1],
        depotId: r[2],
        platformId: r[3],
        editionId,
        status: r[6],
        summary: { meets: r[7], short: r[8], offSpec: r[9], unproven: r[10], concession: r[11], prohibitedFitted: r[12], extra: r[13] },
        costToCloseCents: r[14],
        massToCloseKg: r[15] / 1000,
        validUntil: r[16],
        readinessFacts: { criticalGaps: r[17], earliestExpiryMs: r[18] },
      });
    } else {
      const fresh = judged?.get(r[0]);
      // Judged again but gone by then (deleted, or no longer visible): left out, as the full loader would.
      if (!fresh) continue;
      const { editionId: judgedEdition, status, summary, costToCloseCents, massToCloseKg, validUntil, readinessFacts } = fresh;
      out.push({ vehicleId: r[0], fleetNumber: r[1], depotId: r[2], platformId: r[3], editionId: judgedEdition, status, summary, costToCloseCents, massToCloseKg, validUntil, readinessFacts });
    }
  }
  return out;
}

/**
 * Variance figures of every vehicle the actor may see (optionally filtered), rolled up for the
 * fleet: the same result as loadFleetVariance without the per-line detail.
 */
export async function loadFleetVarianceFigures(
  db: DbOrTx,
  actor: Actor,
  filter: VarianceFilter | undefined,
  now: Date,
  options: SummaryReadOptions = {},
): Promise<FleetVarianceFigures> {
  const details = await figuresWhere(db, actor, filterWhere(actor, filter), now, options);
  // The figures carry every field the roll-up reads; they come from this module, already checked.
  const fleet = rollUpFleet(details, false);
  return { ...fleet, details };
}

/** Figures of the given vehicles the actor may see (ids it may not see are left out), in fleet-number order. */
export async function varianceFiguresFor(
  db: DbOrTx,
  actor: Actor,
  vehicleIds: readonly string[],
  now: Date,
  options: SummaryReadOptions = {},
): Promise<VehicleVarianceFigures[]> {
  if (vehicleIds.length === 0) return [];
  return figuresWhere(db, actor, namedVehicles(actor, vehicleIds), now, options);
}

/** Each vehicle's status, and the first instant at which time alone could change any of them. */
export type VarianceStatuses = { byVehicle: Map<string, VehicleVarianceStatus>; validUntil: number | null };

/**
 * meets_standard / gaps / no_edition for each of the given vehicles the actor may see (ids it
 * may not see are simply absent), for filtering and badging a register page.
 */
export async function varianceStatusByVehicle(
  db: DbOrTx,
  actor: Actor,
  vehicleIds: readonly string[],
  now: Date,
): Promise<VarianceStatuses> {
  return statusesOf(await varianceFiguresFor(db, actor, vehicleIds, now));
}

/** The statuses of figures already read, and the first instant at which time alone could turn one. */
export function statusesOf(figures: readonly VehicleVarianceFigures[]): VarianceStatuses {
  const byVehicle = new Map<string, VehicleVarianceStatus>();
  let validUntil: number | null = null;
  for (const f of figures) {
    byVehicle.set(f.vehicleId, f.status);
    if (f.validUntil !== null && (validUntil === null || f.validUntil < validUntil)) validUntil = f.validUntil;
  }
  return { byVehicle, validUntil };
}
