import { and, asc, desc, eq, gte, lt, lte, sql, type SQL } from "drizzle-orm";
import type { LedgerEntry } from "@/lib/exports";
import type { Actor } from "@/lib/permissions";
import type { DbOrTx } from "./client";
import { fleetReadinessCounts } from "./readiness";
import { budgets, costs, depots, editions, fleetSnapshots, jobs, organisations, platforms, standards, vehicles } from "./schema";
import { loadFleetVarianceFigures } from "./variance-summary";

/**
 * The cost ledger, budgets and daily fleet figures. Every query is inside the actor's
 * organisation; who may read at all is the permission table's business (read Cost).
 */

export type CostFilter = {
  /** First day, inclusive (UTC midnight). */
  from?: Date | null;
  /** Last day, inclusive (UTC midnight). */
  to?: Date | null;
  costCentre?: string | null;
  depotId?: string | null;
  vehicleId?: string | null;
  category?: LedgerEntry["category"] | null;
  kind?: LedgerEntry["kind"] | null;
  source?: LedgerEntry["source"] | null;
};

const DAY_MS = 86_400_000;

function costWhere(actor: Actor, filter: CostFilter): SQL {
  const parts: (SQL | undefined)[] = [eq(costs.orgId, actor.orgId)];
  if (filter.from) parts.push(gte(costs.incurredOn, filter.from));
  if (filter.to) parts.push(lt(costs.incurredOn, new Date(filter.to.getTime() + DAY_MS)));
  if (filter.costCentre) parts.push(eq(costs.costCentre, filter.costCentre));
  if (filter.depotId) parts.push(eq(costs.depotId, filter.depotId));
  if (filter.vehicleId) parts.push(eq(costs.vehicleId, filter.vehicleId));
  if (filter.category) parts.push(eq(costs.category, filter.category));
  if (filter.kind) parts.push(eq(costs.kind, filter.kind));
  if (filter.source) parts.push(eq(costs.source, filter.source));
  return and(...parts)!;
}

export type LedgerListEntry = LedgerEntry & {
  vehicleId: string | null;
  depotId: string | null;
  jobId: string | null;
  jobNumber: number | null;
  createdAt: Date;
};

const ledgerColumns = {
  id: costs.id,
  incurredOn: costs.incurredOn,
  vehicleId: costs.vehicleId,
  fleetNumber: vehicles.fleetNumber,
  costCentre: costs.costCentre,
  depotId: costs.depotId,
  depotName: depots.name,
  category: costs.category,
  kind: costs.kind,
  source: costs.source,
  description: costs.description,
  reference: costs.reference,
  amountExGstCents: costs.amountExGstCents,
  gstCents: costs.gstCents,
  jobId: costs.jobId,
  jobNumber: jobs.number,
  createdAt: costs.createdAt,
};

/** Ledger entries, newest first; `limit`/`offset` for a page, or every entry when limit is absent. */
export async function listCostEntries(
  db: DbOrTx,
  actor: Actor,
  filter: CostFilter,
  page: { limit?: number; offset?: number } = {},
): Promise<LedgerListEntry[]> {
  const query = db
    .select(ledgerColumns)
    .from(costs)
    // Joins are on the organisation too: a row can never pick up another organisation's names.
    .leftJoin(vehicles, and(eq(vehicles.id, costs.vehicleId), eq(vehicles.orgId, costs.orgId)))
    .leftJoin(depots, and(eq(depots.id, costs.depotId), eq(depots.orgId, costs.orgId)))
    .leftJoin(jobs, and(eq(jobs.id, costs.jobId), eq(jobs.orgId, costs.orgId)))
    .where(costWhere(actor, filter))
    .orderBy(desc(costs.incurredOn), desc(costs.createdAt), asc(costs.id));
  if (page.limit !== undefined) return query.limit(page.limit).offset(page.offset ?? 0);
  return query;
}

export type CostTotals = {
  entries: number;
  exGstCents: number;
  gstCents: number;
  totalCents: number;
  capitalExGstCents: number;
  operatingExGstCents: number;
};

/** Totals of every entry the filter matches (not only the page shown). */
export async function costTotals(db: DbOrTx, actor: Actor, filter: CostFilter): Promise<CostTotals> {
  const [row] = await db
    .select({
      entries: sql<number>`count(*)`,
      exGstCents: sql<number>`coalesce(sum(${costs.amountExGstCents}), 0)`,
      gstCents: sql<number>`coalesce(sum(${costs.gstCents}), 0)`,
      capitalExGstCents: sql<number>`coalesce(sum(case when ${costs.kind} = 'capital' then ${costs.amountExGstCents} else 0 end), 0)`,
    })
    .from(costs)
    .where(costWhere(actor, filter));
  const entries = Number(row?.entries ?? 0);
  const exGstCents = Number(row?.exGstCents ?? 0);
  const gstCents = Number(row?.gstCents ?? 0);
  const capitalExGstCents = Number(row?.capitalExGstCents ?? 0);
  return {
    entries,
    exGstCents,
    gstCents,
    totalCents: exGstCents + gstCents,
    capitalExGstCents,
    operatingExGstCents: exGstCents - capitalExGstCents,
  };
}

export type MonthCategorySpend = { month: string; category: LedgerEntry["category"]; exGstCents: number };

/** Ex-GST spend per calendar month (YYYY-MM, UTC) and category, for the stacked chart. */
export async function spendByMonth(db: DbOrTx, actor: Actor, filter: CostFilter): Promise<MonthCategorySpend[]> {
  const month = sql<string>`strftime('%Y-%m', ${costs.incurredOn} / 1000, 'unixepoch')`;
  const rows = await db
    .select({ month, category: costs.category, exGstCents: sql<number>`sum(${costs.amountExGstCents})` })
    .from(costs)
    .where(costWhere(actor, filter))
    .groupBy(month, costs.category)
    .orderBy(month, costs.category);
  return rows.map((r) => ({ month: r.month, category: r.category, exGstCents: Number(r.exGstCents) }));
}

export type CategorySpend = { category: LedgerEntry["category"]; exGstCents: number; entries: number };

export async function spendByCategory(db: DbOrTx, actor: Actor, filter: CostFilter): Promise<CategorySpend[]> {
  const rows = await db
    .select({ category: costs.category, exGstCents: sql<number>`sum(${costs.amountExGstCents})`, entries: sql<number>`count(*)` })
    .from(costs)
    .where(costWhere(actor, filter))
    .groupBy(costs.category)
    .orderBy(desc(sql`sum(${costs.amountExGstCents})`));
  return rows.map((r) => ({ category: r.category, exGstCents: Number(r.exGstCents), entries: Number(r.entries) }));
}

export type FilterOptions = {
  costCentres: string[];
  depots: { id: string; name: string }[];
  vehicles: { id: string; fleetNumber: string }[];
};

/** What the ledger's filters offer: the organisation's cost centres (vehicles, costs, budgets), depots and vehicles. */
export async function costFilterOptions(db: DbOrTx, actor: Actor): Promise<FilterOptions> {
  const centres = await db.all<{ centre: string }>(sql`
    select cost_centre as centre from ${vehicles} where org_id = ${actor.orgId} and cost_centre is not null
    union select cost_centre from ${costs} where org_id = ${actor.orgId}
    union select cost_centre from ${budgets} where org_id = ${actor.orgId}
    order by 1`);
  const depotRows = await db.select({ id: depots.id, name: depots.name }).from(depots).where(eq(depots.orgId, actor.orgId)).orderBy(asc(depots.name));
  const vehicleRows = await db
    .select({ id: vehicles.id, fleetNumber: vehicles.fleetNumber })
    .from(vehicles)
    .where(eq(vehicles.orgId, actor.orgId))
    .orderBy(asc(vehicles.fleetNumber));
  return { costCentres: centres.map((c) => c.centre), depots: depotRows, vehicles: vehicleRows };
}

export async function findCost(db: DbOrTx, actor: Actor, id: string) {
  return (await db.query.costs.findFirst({ where: and(eq(costs.id, id), eq(costs.orgId, actor.orgId)) })) ?? null;
}

// ─── Budgets ─────────────────────────────────────────────────────────────────────

export type BudgetAgainstActual = {
  id: string;
  costCentre: string;
  periodStart: Date;
  /** Last day of the period, inclusive. */
  periodEnd: Date;
  budgetCents: number;
  /** Ex-GST spend booked to the cost centre within the period. */
  actualCents: number;
  remainingCents: number;
  entries: number;
};

/**
 * Every budget whose period overlaps [from, to] (all budgets when no window is given), with the
 * ex-GST spend of its cost centre inside the budget's own period, in one query.
 */
export async function budgetsAgainstActual(
  db: DbOrTx,
  actor: Actor,
  window: { from?: Date | null; to?: Date | null; costCentre?: string | null } = {},
): Promise<BudgetAgainstActual[]> {
  const parts: (SQL | undefined)[] = [eq(budgets.orgId, actor.orgId)];
  if (window.from) parts.push(gte(budgets.periodEnd, window.from));
  if (window.to) parts.push(lte(budgets.periodStart, window.to));
  if (window.costCentre) parts.push(eq(budgets.costCentre, window.costCentre));
  const rows = await db
    .select({
      id: budgets.id,
      costCentre: budgets.costCentre,
      periodStart: budgets.periodStart,
      periodEnd: budgets.periodEnd,
      budgetCents: budgets.amountCents,
      actualCents: sql<number>`coalesce(sum(${costs.amountExGstCents}), 0)`,
      entries: sql<number>`count(${costs.id})`,
    })
    .from(budgets)
    .leftJoin(
      costs,
      and(
        eq(costs.orgId, budgets.orgId),
        eq(costs.costCentre, budgets.costCentre),
        gte(costs.incurredOn, budgets.periodStart),
        lt(costs.incurredOn, sql`${budgets.periodEnd} + ${DAY_MS}`),
      ),
    )
    .where(and(...parts))
    .groupBy(budgets.id)
    .orderBy(desc(budgets.periodStart), asc(budgets.costCentre));
  return rows.map((r) => {
    const actualCents = Number(r.actualCents);
    return { ...r, actualCents, entries: Number(r.entries), remainingCents: r.budgetCents - actualCents };
  });
}

/** A budget of the same cost centre whose period overlaps [start, end], other than `exceptId`. */
export async function overlappingBudget(db: DbOrTx, actor: Actor, costCentre: string, start: Date, end: Date, exceptId?: string) {
  const rows = await db
    .select()
    .from(budgets)
    .where(
      and(
        eq(budgets.orgId, actor.orgId),
        eq(budgets.costCentre, costCentre),
        lte(budgets.periodStart, end),
        gte(budgets.periodEnd, start),
        exceptId ? sql`${budgets.id} <> ${exceptId}` : undefined,
      ),
    )
    .limit(1);
  return rows[0] ?? null;
}

export async function findBudget(db: DbOrTx, actor: Actor, id: string) {
  return (await db.query.budgets.findFirst({ where: and(eq(budgets.id, id), eq(budgets.orgId, actor.orgId)) })) ?? null;
}

// ─── Daily fleet figures ─────────────────────────────────────────────────────────

export type FleetSnapshot = {
  day: string;
  ready: number;
  limited: number;
  notReady: number;
  meetingStandard: number;
  openGaps: number;
};

/** The organisation's daily figures from `fromDay` (YYYY-MM-DD) on, oldest first. */
export async function listFleetSnapshots(db: DbOrTx, actor: Actor, fromDay?: string): Promise<FleetSnapshot[]> {
  return db
    .select({
      day: fleetSnapshots.day,
      ready: fleetSnapshots.ready,
      limited: fleetSnapshots.limited,
      notReady: fleetSnapshots.notReady,
      meetingStandard: fleetSnapshots.meetingStandard,
      openGaps: fleetSnapshots.openGaps,
    })
    .from(fleetSnapshots)
    .where(and(eq(fleetSnapshots.orgId, actor.orgId), fromDay ? gte(fleetSnapshots.day, fromDay) : undefined))
    .orderBy(asc(fleetSnapshots.day));
}

/**
 * Records (or replaces) one day's fleet figures for an organisation: readiness counts, vehicles
 * meeting their standard and open gap lines. Run once a day (a scheduler, or on demand); running
 * it twice on one day keeps the later figures.
 */
export async function recordFleetSnapshot(db: DbOrTx, orgId: string, snapshot: FleetSnapshot): Promise<void> {
  const asDate = new Date(`${snapshot.day}T00:00:00.000Z`);
  if (!/^\d{4}-\d{2}-\d{2}$/.test(snapshot.day) || Number.isNaN(asDate.getTime()) || asDate.toISOString().slice(0, 10) !== snapshot.day) {
    throw new Error(`snapshot day must be a real date YYYY-MM-DD, got ${snapshot.day}`);
  }
  for (const key of ["ready", "limited", "notReady", "meetingStandard", "openGaps"] as const) {
    if (!Number.isSafeInteger(snapshot[key]) || snapshot[key] < 0) throw new Error(`snapshot ${key} must be a whole number ≥ 0`);
  }
  const { day, ...figures } = snapshot;
  await db
    .insert(fleetSnapshots)
    .values({ orgId, day, ...figures })
    .onConflictDoUpdate({ target: [fleetSnapshots.orgId, fleetSnapshots.day], set: figures });
}

/** Today's fleet figures from the live readiness and variance of every vehicle (retired left out). */
export async function fleetFiguresNow(db: DbOrTx, orgId: string, now: Date): Promise<FleetSnapshot> {
  // The figures are the whole organisation's, whoever asks: an organisation-wide view.
  const orgWide: Actor = { userId: "fleet-snapshot", orgId, role: "admin", firmId: null, depotId: null };
  const [readiness, variance] = await Promise.all([fleetReadinessCounts(db, orgWide, now), loadFleetVarianceFigures(db, orgWide, {}, now)]);
  const gaps = variance.statusCounts;
  return {
    day: now.toISOString().slice(0, 10),
    ready: readiness.ready,
    limited: readiness.limited,
    notReady: readiness.notReady,
    meetingStandard: variance.overall.fullyMeeting,
    openGaps: gaps.short + gaps.offSpec + gaps.unproven + gaps.prohibitedFitted,
  };
}

/**
 * Takes today's figures for the organisation unless today's are already recorded; true when it
 * took them. Safe to call any number of times a day, from the scheduler and from a page visit.
 */
export async function recordTodaysSnapshotOnce(db: DbOrTx, orgId: string, now = new Date()): Promise<boolean> {
  const day = now.toISOString().slice(0, 10);
  const [held] = await db
    .select({ day: fleetSnapshots.day })
    .from(fleetSnapshots)
    .where(and(eq(fleetSnapshots.orgId, orgId), eq(fleetSnapshots.day, day)))
    .limit(1);
  if (held) return false;
  await recordFleetSnapshot(db, orgId, await fleetFiguresNow(db, orgId, now));
  return true;
}

/** Today's figures for every organisation that has none yet; the number of snapshots taken. */
export async function recordTodaysSnapshots(db: DbOrTx, now = new Date()): Promise<number> {
  const orgs = await db.select({ id: organisations.id }).from(organisations).orderBy(asc(organisations.id));
  let taken = 0;
  for (const org of orgs) if (await recordTodaysSnapshotOnce(db, org.id, now)) taken++;
  return taken;
}

/** Records today's figures for the organisation (replacing any taken earlier today). */
export async function recordTodaysSnapshot(db: DbOrTx, orgId: string, now = new Date()): Promise<FleetSnapshot> {
  const figures = await fleetFiguresNow(db, orgId, now);
  await recordFleetSnapshot(db, orgId, figures);
  return figures;
}

/** Names for the variance export: depots, platforms and "standard, edition n" of the organisation. */
export async function varianceNames(db: DbOrTx, actor: Actor) {
  const [depotRows, platformRows, editionRows] = await Promise.all([
    db.select({ id: depots.id, name: depots.name }).from(depots).where(eq(depots.orgId, actor.orgId)),
    db.select({ id: platforms.id, make: platforms.make, model: platforms.model, variant: platforms.variant }).from(platforms).where(eq(platforms.orgId, actor.orgId)),
    db
      .select({ id: editions.id, number: editions.number, standard: standards.name })
      .from(editions)
      .innerJoin(standards, eq(standards.id, editions.standardId))
      .where(eq(editions.orgId, actor.orgId)),
  ]);
  return {
    depot: new Map(depotRows.map((d) => [d.id, d.name])),
    platform: new Map(platformRows.map((p) => [p.id, [p.make, p.model, p.variant].filter(Boolean).join(" ")])),
    edition: new Map(editionRows.map((e) => [e.id, `${e.standard}, edition ${e.number}`])),
  };
}

// ─── The daily snapshot, taken in the server process ───────────────────────────

export type DailyOptions = {
  /** Minutes after midnight UTC (the day a snapshot is filed under) at which the task runs. */
  atUtcMinute?: number;
  /** Wait after start-up before the first (catch-up) run, so the server answers first. */
  firstRunAfterMs?: number;
  now?: () => Date;
  onError?: (error: unknown) => void;
};

/**
 * Runs `task` once soon after start-up, then every day at `atUtcMinute` past midnight UTC. The
 * next run is worked out from the clock each time (no drift); a failed run is reported and the
 * schedule goes on. Returns the function that stops it.
 */
export function scheduleDaily(task: () => Promise<unknown>, options: DailyOptions = {}): () => void {
  const { atUtcMinute = 5, firstRunAfterMs = 10_000, now = () => new Date(), onError = (e) => console.error("[rigline] daily task", e) } = options;
  let timer: ReturnType<typeof setTimeout> | undefined;
  let stopped = false;

  const untilNext = () => {
    const at = now();
    let next = Date.UTC(at.getUTCFullYear(), at.getUTCMonth(), at.getUTCDate()) + atUtcMinute * 60_000;
    if (next <= at.getTime()) next += DAY_MS;
    return next - at.getTime();
  };
  const arm = (ms: number) => {
    if (stopped) return;
    timer = setTimeout(run, ms);
    timer.unref?.();
  };
  // The next run is armed only once this one has finished, so runs never overlap.
  async function run() {
    try {
      await task();
    } catch (error) {
      onError(error);
    }
    arm(untilNext());
  }

  arm(firstRunAfterMs);
  return () => {
    stopped = true;
    if (timer) clearTimeout(timer);
  };
}

const globalForSnapshots = globalThis as unknown as { riglineSnapshots?: () => void };

/**
 * Starts the daily fleet snapshot for every organisation (once per process; a second call does
 * nothing). The trends page still takes the day's figures on a visit if none are recorded yet.
 */
export function startSnapshotScheduler(db: () => DbOrTx, options: DailyOptions = {}): void {
  if (globalForSnapshots.riglineSnapshots) return;
  const now = options.now ?? (() => new Date());
  globalForSnapshots.riglineSnapshots = scheduleDaily(() => recordTodaysSnapshots(db(), now()), options);
}

/** Stops the daily snapshot (tests). */
export function stopSnapshotScheduler(): void {
  globalForSnapshots.riglineSnapshots?.();
  delete globalForSnapshots.riglineSnapshots;
}
