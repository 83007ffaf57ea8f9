import { and, asc, count, desc, eq, inArray, isNotNull, isNull, or, sql, type AnyColumn, type SQL } from "drizzle-orm";
import type { Actor } from "@/lib/permissions";
import type { VehicleVarianceStatus } from "@/lib/variance";
import type { DbOrTx } from "./client";
import { depots, editions, platforms, standards, users, vehicleDrivers, vehicles, type VehicleState } from "./schema";
import { vehicleScope } from "./scope";
import { readinessStatesFromFigures } from "./readiness";
import { varianceStatusByVehicle, type VarianceStatuses } from "./variance";
import { statusesOf, varianceFiguresFor } from "./variance-summary";

export async function countVehiclesByState(db: DbOrTx, actor: Actor) {
  const rows = await db
    .select({ state: vehicles.state, n: count() })
    .from(vehicles)
    .where(vehicleScope(actor))
    .groupBy(vehicles.state);
  return Object.fromEntries(rows.map((r) => [r.state, r.n])) as Partial<Record<(typeof vehicles.state.enumValues)[number], number>>;
}

const summaryColumns = {
  id: vehicles.id,
  fleetNumber: vehicles.fleetNumber,
  registration: vehicles.registration,
  vin: vehicles.vin,
  state: vehicles.state,
  odometerKm: vehicles.odometerKm,
  costCentre: vehicles.costCentre,
  make: platforms.make,
  model: platforms.model,
  variant: platforms.variant,
  depotName: depots.name,
};

export async function listVehicleSummaries(db: DbOrTx, actor: Actor, options: { state?: string; limit?: number } = {}) {
  const where = options.state
    ? and(vehicleScope(actor), eq(vehicles.state, options.state as (typeof vehicles.state.enumValues)[number]))
    : vehicleScope(actor);
  return db
    .select(summaryColumns)
    .from(vehicles)
    .innerJoin(platforms, eq(platforms.id, vehicles.platformId))
    .leftJoin(depots, eq(depots.id, vehicles.depotId))
    .where(where)
    .orderBy(asc(vehicles.fleetNumber))
    .limit(options.limit ?? 500);
}

/** One vehicle the actor may see, or null (another organisation's id is simply not found). */
export async function findVehicle(db: DbOrTx, actor: Actor, id: string) {
  const [row] = await db
    .select({ vehicle: vehicles, platform: platforms, depotName: depots.name })
    .from(vehicles)
    .innerJoin(platforms, eq(platforms.id, vehicles.platformId))
    .leftJoin(depots, eq(depots.id, vehicles.depotId))
    .where(and(vehicleScope(actor), eq(vehicles.id, id)))
    .limit(1);
  if (!row) return null;
  const drivers = await db
    .select({ id: users.id, name: users.name })
    .from(vehicleDrivers)
    .innerJoin(users, eq(users.id, vehicleDrivers.userId))
    .where(eq(vehicleDrivers.vehicleId, id));
  return { ...row, drivers };
}

// ─── The register: one page of vehicles, filtered, searched and sorted on the server ───

export const VEHICLE_SORTS = ["fleetNumber", "registration", "platform", "depot", "state", "odometerKm", "updatedAt"] as const;
export type VehicleSort = (typeof VEHICLE_SORTS)[number];
export const VARIANCE_FILTERS = ["meets_standard", "gaps", "no_edition"] as const;
export type VarianceFilterValue = (typeof VARIANCE_FILTERS)[number];
export const READINESS_FILTERS = ["ready", "limited", "not_ready"] as const;
export type ReadinessFilterValue = (typeof READINESS_FILTERS)[number];

export type VehicleListParams = {
  page: number;
  pageSize: number;
  sort: VehicleSort;
  dir: "asc" | "desc";
  depotId?: string;
  platformId?: string;
  state?: VehicleState;
  editionId?: string;
  standardId?: string;
  variance?: VarianceFilterValue;
  readiness?: ReadinessFilterValue;
  q?: string;
};

export type RegisterRow = {
  id: string;
  fleetNumber: string;
  vin: string | null;
  registration: string | null;
  registrationExpiry: Date | null;
  state: VehicleState;
  groundedReason: string | null;
  odometerKm: number | null;
  buildYear: number | null;
  costCentre: string | null;
  updatedAt: Date;
  version: number;
  platform: { id: string; make: string; model: string; variant: string; ratingsMissing: boolean };
  depot: { id: string; name: string; code: string } | null;
  edition: { id: string; number: number; status: string; standardId: string; standardName: string } | null;
  variance: VehicleVarianceStatus;
  drivers: { id: string; name: string }[];
};

export type RegisterPage = { items: RegisterRow[]; page: number; pageSize: number; total: number; pageCount: number };

/** LIKE pattern that matches `text` anywhere, with LIKE's own wildcards taken literally. */
function containsPattern(text: string): string {
  return `%${text.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
}

function registerWhere(actor: Actor, p: VehicleListParams): SQL {
  const parts: SQL[] = [vehicleScope(actor)];
  if (p.depotId) parts.push(eq(vehicles.depotId, p.depotId));
  if (p.platformId) parts.push(eq(vehicles.platformId, p.platformId));
  if (p.state) parts.push(eq(vehicles.state, p.state));
  if (p.editionId) parts.push(eq(vehicles.editionId, p.editionId));
  if (p.standardId) {
    parts.push(
      inArray(
        vehicles.editionId,
        sql`(select ${editions.id} from ${editions} where ${editions.standardId} = ${p.standardId} and ${editions.orgId} = ${actor.orgId})`,
      ),
    );
  }
  if (p.variance === "no_edition") parts.push(isNull(vehicles.editionId));
  if (p.variance === "meets_standard" || p.variance === "gaps") parts.push(isNotNull(vehicles.editionId));
  const q = p.q?.trim();
  if (q) {
    // Registrations and VINs are often typed without their dashes or spaces.
    const compact = q.replace(/[\s-]+/g, "");
    const any = containsPattern(q);
    const squeezed = containsPattern(compact || q);
    parts.push(
      or(
        sql`${vehicles.fleetNumber} like ${any} escape '\\'`,
        sql`replace(replace(coalesce(${vehicles.registration}, ''), '-', ''), ' ', '') like ${squeezed} escape '\\'`,
        sql`coalesce(${vehicles.vin}, '') like ${squeezed} escape '\\'`,
      )!,
    );
  }
  return and(...parts)!;
}

const STATE_ORDER = sql`case ${vehicles.state} when 'in_service' then 1 when 'in_fitout' then 2 when 'grounded' then 3 else 4 end`;

function registerOrder(p: VehicleListParams): SQL[] {
  const d = (x: SQL | AnyColumn) => (p.dir === "desc" ? desc(x) : asc(x));
  // Empty values sort last whichever way the column is sorted.
  const nullsLast = (x: AnyColumn) => [sql`${x} is null`, d(x)];
  const primary: SQL[] = (() => {
    switch (p.sort) {
      case "fleetNumber":
        return [d(vehicles.fleetNumber)];
      case "registration":
        return nullsLast(vehicles.registration);
      case "platform":
        return [d(platforms.make), d(platforms.model), d(platforms.variant)];
      case "depot":
        return nullsLast(depots.name);
      case "state":
        return [d(STATE_ORDER)];
      case "odometerKm":
        return nullsLast(vehicles.odometerKm);
      case "updatedAt":
        return [d(vehicles.updatedAt)];
    }
  })();
  return [...primary, asc(vehicles.fleetNumber), asc(vehicles.id)];
}

const registerColumns = {
  id: vehicles.id,
  fleetNumber: vehicles.fleetNumber,
  vin: vehicles.vin,
  registration: vehicles.registration,
  registrationExpiry: vehicles.registrationExpiry,
  state: vehicles.state,
  groundedReason: vehicles.groundedReason,
  odometerKm: vehicles.odometerKm,
  buildYear: vehicles.buildYear,
  costCentre: vehicles.costCentre,
  updatedAt: vehicles.updatedAt,
  version: vehicles.version,
  editionId: vehicles.editionId,
  platformId: platforms.id,
  platformMake: platforms.make,
  platformModel: platforms.model,
  platformVariant: platforms.variant,
  platformRatingsMissing: platforms.ratingsMissing,
  depotId: depots.id,
  depotName: depots.name,
  depotCode: depots.code,
  editionNumber: editions.number,
  editionStatus: editions.status,
  standardId: standards.id,
  standardName: standards.name,
};

function registerBase(db: DbOrTx) {
  return db
    .select(registerColumns)
    .from(vehicles)
    .innerJoin(platforms, eq(platforms.id, vehicles.platformId))
    .leftJoin(depots, eq(depots.id, vehicles.depotId))
    .leftJoin(editions, eq(editions.id, vehicles.editionId))
    .leftJoin(standards, eq(standards.id, editions.standardId));
}

type RegisterDbRow = Awaited<ReturnType<typeof registerBase>>[number];

/**
 * One page of the register. Filters, search and sort run in SQL; the variance status comes
 * from db/variance in one batch for the page (or, when filtering by it, for every candidate),
 * never one query per vehicle. The app reads it through db/register-cache.ts.
 */
export async function listVehiclesPage(db: DbOrTx, actor: Actor, p: VehicleListParams, now: Date): Promise<RegisterPage> {
  return (await computeRegisterPage(db, actor, p, now)).page;
}

/**
 * The page, and the first instant at which time alone could change it (a variance status
 * turning as a fitment or concession expires); null when only a change of data can.
 */
export async function computeRegisterPage(
  db: DbOrTx,
  actor: Actor,
  p: VehicleListParams,
  now: Date,
): Promise<{ page: RegisterPage; validUntil: number | null }> {
  const where = registerWhere(actor, p);
  const order = registerOrder(p);
  let total: number;
  let pageRows: RegisterDbRow[];
  let statuses: VarianceStatuses;
  /** When time alone could turn the page: a variance status, or (filtered by it) a readiness state. */
  let validUntil: number | null;
  let page = p.page;

  if (p.variance === "meets_standard" || p.variance === "gaps" || p.readiness) {
    const candidates = await db
      .select({ id: vehicles.id })
      .from(vehicles)
      .innerJoin(platforms, eq(platforms.id, vehicles.platformId))
      .leftJoin(depots, eq(depots.id, vehicles.depotId))
      .where(where)
      .orderBy(...order);
    const candidateIds = candidates.map((c) => c.id);
    const figures = await varianceFiguresFor(db, actor, candidateIds, now);
    statuses = statusesOf(figures);
    // Trip readiness (variance, defects, grounding, expiries) is judged in brief from the same figures.
    const readiness = p.readiness ? await readinessStatesFromFigures(db, actor, figures, now) : null;
    validUntil = readiness ? earliestOf(statuses.validUntil, readiness.validUntil) : statuses.validUntil;
    const matched = candidates
      .filter((c) => (p.variance === "meets_standard" || p.variance === "gaps" ? statuses.byVehicle.get(c.id) === p.variance : true))
      .filter((c) => (readiness ? readiness.byVehicle.get(c.id) === p.readiness : true))
      .map((c) => c.id);
    total = matched.length;
    page = clampPage(page, total, p.pageSize);
    const ids = matched.slice((page - 1) * p.pageSize, page * p.pageSize);
    const rows = ids.length === 0 ? [] : await registerBase(db).where(and(where, inArray(vehicles.id, ids)));
    const byId = new Map(rows.map((r) => [r.id, r]));
    pageRows = ids.map((id) => byId.get(id)).filter((r) => r !== undefined);
  } else {
    const [counted] = await db
      .select({ n: count() })
      .from(vehicles)
      .where(where);
    total = counted?.n ?? 0;
    page = clampPage(page, total, p.pageSize);
    pageRows = await registerBase(db)
      .where(where)
      .orderBy(...order)
      .limit(p.pageSize)
      .offset((page - 1) * p.pageSize);
    const withEdition = pageRows.filter((r) => r.editionId !== null).map((r) => r.id);
    statuses = await varianceStatusByVehicle(db, actor, withEdition, now);
    validUntil = statuses.validUntil;
  }

  const ids = pageRows.map((r) => r.id);
  const driverRows =
    ids.length === 0
      ? []
      : await db
          .select({ vehicleId: vehicleDrivers.vehicleId, id: users.id, name: users.name })
          .from(vehicleDrivers)
          .innerJoin(users, eq(users.id, vehicleDrivers.userId))
          .where(inArray(vehicleDrivers.vehicleId, ids))
          .orderBy(asc(users.name));
  const driversOf = new Map<string, { id: string; name: string }[]>();
  for (const d of driverRows) driversOf.set(d.vehicleId, [...(driversOf.get(d.vehicleId) ?? []), { id: d.id, name: d.name }]);

  const items: RegisterRow[] = pageRows.map((r) => ({
    id: r.id,
    fleetNumber: r.fleetNumber,
    vin: r.vin,
    registration: r.registration,
    registrationExpiry: r.registrationExpiry,
    state: r.state,
    groundedReason: r.groundedReason,
    odometerKm: r.odometerKm,
    buildYear: r.buildYear,
    costCentre: r.costCentre,
    updatedAt: r.updatedAt,
    version: r.version,
    platform: { id: r.platformId, make: r.platformMake, model: r.platformModel, variant: r.platformVariant, ratingsMissing: r.platformRatingsMissing },
    depot: r.depotId ? { id: r.depotId, name: r.depotName ?? "", code: r.depotCode ?? "" } : null,
    edition:
      r.editionId && r.standardId
        ? { id: r.editionId, number: r.editionNumber ?? 0, status: r.editionStatus ?? "draft", standardId: r.standardId, standardName: r.standardName ?? "" }
        : null,
    variance: r.editionId ? (statuses.byVehicle.get(r.id) ?? "gaps") : "no_edition",
    drivers: driversOf.get(r.id) ?? [],
  }));
  return { page: { items, page, pageSize: p.pageSize, total, pageCount: Math.ceil(total / p.pageSize) }, validUntil };
}

function earliestOf(a: number | null, b: number | null): number | null {
  return a === null ? b : b === null ? a : Math.min(a, b);
}

function clampPage(page: number, total: number, pageSize: number): number {
  const last = Math.max(1, Math.ceil(total / pageSize));
  return Math.min(Math.max(1, page), last);
}

/** What the register's filters offer: only what the actor can see. */
export async function registerFilterOptions(db: DbOrTx, actor: Actor) {
  const scopedRole = actor.role === "driver" || actor.role === "contractor";
  const visibleDepots = sql`(select ${vehicles.depotId} from ${vehicles} where ${vehicleScope(actor)})`;
  const [depotRows, editionRows] = await Promise.all([
    db
      .select({ id: depots.id, name: depots.name, code: depots.code })
      .from(depots)
      .where(scopedRole ? and(eq(depots.orgId, actor.orgId), inArray(depots.id, visibleDepots)) : eq(depots.orgId, actor.orgId))
      .orderBy(asc(depots.name)),
    scopedRole
      ? Promise.resolve([])
      : db
          .select({ id: editions.id, number: editions.number, status: editions.status, standardId: standards.id, standardName: standards.name })
          .from(editions)
          .innerJoin(standards, eq(standards.id, editions.standardId))
          .where(eq(editions.orgId, actor.orgId))
          .orderBy(asc(standards.name), asc(editions.number)),
  ]);
  const standardMap = new Map<string, { id: string; name: string }>();
  for (const e of editionRows) standardMap.set(e.standardId, { id: e.standardId, name: e.standardName });
  return { depots: depotRows, editions: editionRows, standards: [...standardMap.values()] };
}
