import "server-only";
import { and, eq } from "drizzle-orm";
import { z } from "zod";
import { db, type Tx } from "@/db/client";
import {
  fleetFiguresNow,
  recordFleetSnapshot,
  varianceNames,
  budgetsAgainstActual,
  costFilterOptions,
  costTotals,
  findBudget,
  listCostEntries,
  listFleetSnapshots,
  overlappingBudget,
  spendByCategory,
  spendByMonth,
  type CostFilter,
} from "@/db/costs";
import { budgets, costs, depots, vehicles } from "@/db/schema";
import { findVehicle } from "@/db/vehicles";
import { InputError } from "@/lib/errors";
import { loadFleetVarianceFigures } from "@/db/variance-summary";
import { COST_CATEGORIES, COST_KINDS, COST_SOURCES, isoDay, ledgerTable, tableToCsv, tableToXlsx, varianceTable, XLSX_CONTENT_TYPE } from "@/lib/exports";
import { gstInInclusive, gstOnExclusive, parseMoneyToCents } from "@/lib/money";
import { AppError, conflict, forbidden, notFound } from "@/lib/server/errors";
import { fileResponse } from "@/lib/server/files";
import { command, query } from "@/lib/server/operation";
import type { SignedIn } from "@/lib/server/session";
import { formatCalendarDay } from "@/lib/format/dates";

// ─── Input pieces (shared by forms, route handlers and the OpenAPI document) ───────

const DAY_MS = 86_400_000;

/** A calendar day YYYY-MM-DD (a real date), read as UTC midnight of that day. */
const day = (label: string) =>
  z.iso.date({ error: `${label} must be a date (YYYY-MM-DD)` }).transform((s) => new Date(`${s}T00:00:00.000Z`));

/** An optional filter value: absent or "" both mean "any". */
const optionalDay = (label: string) =>
  z
    .union([z.literal(""), z.iso.date({ error: `${label} must be a date (YYYY-MM-DD)` })])
    .optional()
    .transform((s) => (s ? new Date(`${s}T00:00:00.000Z`) : null));
const optionalParam = (max = 64) =>
  z
    .string()
    .trim()
    .max(max, { error: `At most ${max} characters` })
    .optional()
    .transform((v) => (v ? v : null));
const optionalEnum = <T extends readonly [string, ...string[]]>(values: T, label: string) =>
  z
    .union([z.literal(""), z.enum(values, { error: `${label} must be one of ${values.join(", ")}` })])
    .optional()
    .transform((v) => (v ? (v as T[number]) : null));

const filterFields = {
  from: optionalDay("from").meta({ description: "First day, inclusive (YYYY-MM-DD)" }),
  to: optionalDay("to").meta({ description: "Last day, inclusive (YYYY-MM-DD)" }),
  costCentre: optionalParam(64).meta({ description: "Cost centre code" }),
  depotId: optionalParam(64).meta({ description: "Depot id" }),
  vehicleId: optionalParam(64).meta({ description: "Vehicle id" }),
  category: optionalEnum(COST_CATEGORIES, "category"),
  kind: optionalEnum(COST_KINDS, "kind"),
  source: optionalEnum(COST_SOURCES, "source"),
};

const fromBeforeTo = (f: { from: Date | null; to: Date | null }) => !f.from || !f.to || f.from.getTime() <= f.to.getTime();
const FROM_BEFORE_TO = { error: "The first day must not be after the last day", path: ["to"] };

/** The ledger filters, as query parameters. */
export const costFilterSchema = z.object(filterFields).refine(fromBeforeTo, FROM_BEFORE_TO).meta({ id: "CostFilter" });
export type CostFilterInput = z.output<typeof costFilterSchema>;

export const LEDGER_PAGE_SIZE = 25;

export const costListSchema = z
  .object({
    ...filterFields,
    page: z.coerce.number({ error: "page must be a whole number" }).int().min(1).max(100_000).default(1),
    pageSize: z.coerce.number({ error: "pageSize must be a whole number" }).int().min(1).max(500).default(LEDGER_PAGE_SIZE),
  })
  .refine(fromBeforeTo, FROM_BEFORE_TO)
  .meta({ id: "CostListQuery" });

export const EXPORT_FORMATS = ["csv", "xlsx"] as const;
export type ExportFormat = (typeof EXPORT_FORMATS)[number];
const formatField = z.enum(EXPORT_FORMATS, { error: "format must be csv or xlsx" }).meta({ description: "File format" });

export const costExportSchema = z.object({ ...filterFields, format: formatField }).refine(fromBeforeTo, FROM_BEFORE_TO).meta({ id: "CostExportQuery" });

function toFilter(input: CostFilterInput): CostFilter {
  return { ...input };
}

// ─── Ledger reads ───────────────────────────────────────────────────────────────

/** GET /api/costs — one page of the filtered ledger with the totals of all of it. */
export const listLedger = query({
  name: "cost.list",
  input: costListSchema,
  permission: ["read", "Cost"],
  run: async ({ user, input }) => {
    const { page, pageSize, ...filter } = input;
    const database = db();
    const totals = await costTotals(database, user, filter);
    const pageCount = Math.max(1, Math.ceil(totals.entries / pageSize));
    const current = Math.min(page, pageCount);
    const items = await listCostEntries(database, user, filter, { limit: pageSize, offset: (current - 1) * pageSize });
    return { items, page: current, pageSize, total: totals.entries, pageCount, totals };
  },
});

/** Totals, spend by month and by category for the filtered ledger (the charts). */
export const ledgerSummary = query({
  name: "cost.summary",
  input: costFilterSchema,
  permission: ["read", "Cost"],
  run: async ({ user, input }) => {
    const database = db();
    const filter = toFilter(input);
    const [totals, byMonth, byCategory] = await Promise.all([
      costTotals(database, user, filter),
      spendByMonth(database, user, filter),
      spendByCategory(database, user, filter),
    ]);
    return { totals, byMonth, byCategory };
  },
});

/** What the ledger filters offer: cost centres, depots and vehicles of the organisation. */
export const ledgerFilterOptions = query({
  name: "cost.filter_options",
  input: z.object({}),
  permission: ["read", "Cost"],
  run: async ({ user }) => costFilterOptions(db(), user),
});

/** The costs of one vehicle (its Costs tab): entries, totals and spend by category. */
export const vehicleCosts = query({
  name: "cost.vehicle",
  input: z.object({ vehicleId: z.string().trim().min(1, { error: "vehicleId is required" }).max(64) }),
  permission: ["read", "Cost"],
  run: async ({ user, input }) => {
    const database = db();
    const found = await findVehicle(database, user, input.vehicleId);
    if (!found) throw notFound("That vehicle");
    const filter: CostFilter = { vehicleId: input.vehicleId };
    const [entries, totals, byCategory] = await Promise.all([
      listCostEntries(database, user, filter),
      costTotals(database, user, filter),
      spendByCategory(database, user, filter),
    ]);
    return { vehicle: { id: found.vehicle.id, fleetNumber: found.vehicle.fleetNumber, costCentre: found.vehicle.costCentre }, entries, totals, byCategory };
  },
});

// ─── Manual entries ─────────────────────────────────────────────────────────────

export const GST_MODES = ["add", "included", "entered", "none"] as const;
export type GstMode = (typeof GST_MODES)[number];

const MAX_ENTRY_CENTS = 1_000_000_000; // $10 million: more than any one fit-out invoice

const dollars = z
  .union([z.string(), z.number()], { error: "Enter an amount in dollars" })
  .transform((v) => (typeof v === "number" ? String(v) : v).trim());

/**
 * A cost entered by hand for an invoice outside Rigline (or an adjustment, which may be a
 * credit). Amounts are typed in dollars and stored in integer cents; GST is added at 10 %,
 * taken out of a GST-inclusive amount (1/11), typed as on the invoice, or none (GST-free).
 */
export const manualCostSchema = z
  .object({
    incurredOn: day("Date").meta({ description: "Invoice date (YYYY-MM-DD)" }),
    vehicleId: optionalParam(64).meta({ description: "The vehicle the cost is for; its cost centre and depot are the defaults" }),
    costCentre: optionalParam(64).meta({ description: "Required when no vehicle is given" }),
    depotId: optionalParam(64),
    category: z.enum(COST_CATEGORIES, { error: "Choose a category" }),
    kind: z.enum(COST_KINDS, { error: "Choose capital or operating" }),
    source: z.enum(["manual", "adjustment"], { error: "source must be manual or adjustment" }).default("manual"),
    description: z
      .string({ error: "Describe what the invoice is for" })
      .trim()
      .min(1, { error: "Describe what the invoice is for" })
      .max(300, { error: "Keep the description under 300 characters" }),
    reference: optionalParam(60).meta({ description: "Invoice or credit note number" }),
    amount: dollars.meta({ description: "Dollars, e.g. 1,234.50; ex GST unless gstMode is included" }),
    gstMode: z.enum(GST_MODES, { error: "Choose how GST applies" }).default("add"),
    gst: z
      .union([z.string(), z.number()])
      .optional()
      .transform((v) => (v === undefined ? "" : String(v).trim()))
      .meta({ description: "GST in dollars as on the invoice, when gstMode is entered" }),
  })
  .transform((input, ctx) => {
    const issue = (path: string, message: string) => {
      ctx.issues.push({ code: "custom", message, path: [path], input });
      return z.NEVER;
    };
    let amountCents: number;
    try {
      amountCents = parseMoneyToCents(input.amount, "amount");
    } catch (error) {
      return issue("amount", error instanceof InputError ? "Enter the amount in dollars and cents, such as 1,234.50" : "Enter an amount");
    }
    if (input.source === "manual" && amountCents <= 0) return issue("amount", "An invoice amount must be more than $0.00 (enter a credit as an adjustment)");
    if (amountCents === 0) return issue("amount", "An adjustment cannot be $0.00");
    if (Math.abs(amountCents) > MAX_ENTRY_CENTS) return issue("amount", "That amount is more than $10,000,000; split it or check it");
    let exGstCents = amountCents;
    let gstCents = 0;
    switch (input.gstMode) {
      case "add":
        gstCents = gstOnExclusive(amountCents);
        break;
      case "included":
        gstCents = gstInInclusive(amountCents);
        exGstCents = amountCents - gstCents;
        break;
      case "entered": {
        if (input.gst === "") return issue("gst", "Enter the GST shown on the invoice");
        try {
          gstCents = parseMoneyToCents(input.gst, "gst");
        } catch {
          return issue("gst", "Enter the GST in dollars and cents, such as 123.45");
        }
        if (Math.sign(gstCents) !== 0 && Math.sign(gstCents) !== Math.sign(amountCents)) return issue("gst", "GST must have the same sign as the amount");
        if (Math.abs(gstCents) > Math.abs(amountCents)) return issue("gst", "GST cannot be more than the amount before GST");
        break;
      }
      case "none":
        gstCents = 0;
        break;
    }
    const { amount: _amount, gst: _gst, ...rest } = input;
    return { ...rest, amountExGstCents: exGstCents, gstCents };
  })
  .meta({ id: "ManualCostInput" });

/** POST /api/costs — books a manual entry (finance only). */
export const createManualCost = command({
  name: "cost.create",
  input: manualCostSchema,
  permission: ["manage", "Cost"],
  run: async ({ user, input, tx, audit, now }) => {
    if (input.incurredOn.getTime() > Date.UTC(now.getUTCFullYear(), now.getUTCMonth(), now.getUTCDate()) + DAY_MS) {
      throw new AppError("validation_failed", "The date is in the future", [{ field: "incurredOn", message: "An invoice cannot be dated after today" }]);
    }
    if (input.incurredOn.getUTCFullYear() < 2000) {
      throw new AppError("validation_failed", "The date looks wrong", [{ field: "incurredOn", message: "Enter a date from 2000 on" }]);
    }
    let costCentre = input.costCentre;
    let depotId = input.depotId;
    if (input.vehicleId) {
      const vehicle = await tx.query.vehicles.findFirst({ where: and(eq(vehicles.id, input.vehicleId), eq(vehicles.orgId, user.orgId)) });
      if (!vehicle) throw new AppError("validation_failed", "That vehicle does not exist", [{ field: "vehicleId", message: "Choose a vehicle of this organisation" }]);
      costCentre ??= vehicle.costCentre;
      depotId ??= vehicle.depotId;
    }
    if (!costCentre) {
      throw new AppError("validation_failed", "A cost needs a cost centre", [{ field: "costCentre", message: "Enter the cost centre, or choose a vehicle that has one" }]);
    }
    if (depotId) {
      const depot = await tx.query.depots.findFirst({ where: and(eq(depots.id, depotId), eq(depots.orgId, user.orgId)) });
      if (!depot) throw new AppError("validation_failed", "That depot does not exist", [{ field: "depotId", message: "Choose a depot of this organisation" }]);
    }
    const [row] = await tx
      .insert(costs)
      .values({
        orgId: user.orgId,
        vehicleId: input.vehicleId,
        costCentre,
        depotId,
        category: input.category,
        kind: input.kind,
        amountExGstCents: input.amountExGstCents,
        gstCents: input.gstCents,
        incurredOn: input.incurredOn,
        source: input.source,
        reference: input.reference,
        description: input.description,
        createdBy: user.userId,
      })
      .returning();
    if (!row) throw new Error("cost insert returned nothing");
    await audit({
      action: "cost.create",
      entityType: "cost",
      entityId: row.id,
      after: {
        incurredOn: isoDay(row.incurredOn),
        vehicleId: row.vehicleId,
        costCentre: row.costCentre,
        depotId: row.depotId,
        category: row.category,
        kind: row.kind,
        source: row.source,
        reference: row.reference,
        description: row.description,
        amountExGstCents: row.amountExGstCents,
        gstCents: row.gstCents,
      },
    });
    return { id: row.id, costCentre: row.costCentre, amountExGstCents: row.amountExGstCents, gstCents: row.gstCents, totalCents: row.amountExGstCents + row.gstCents };
  },
});

// ─── Exports ────────────────────────────────────────────────────────────────────

export type ExportFile = { filename: string; contentType: string; body: string | Buffer; rows: number };

export const EXPORT_ROW_LIMIT = 200_000;

function exportName(kind: string, from: Date | null, to: Date | null, now: Date, format: ExportFormat): string {
  const span = from || to ? `${from ? isoDay(from) : "start"}-to-${to ? isoDay(to) : isoDay(now)}` : isoDay(now);
  return `rigline-${kind}-${span}.${format}`;
}

export async function writeExport(table: Parameters<typeof tableToCsv>[0], format: ExportFormat, now: Date): Promise<Pick<ExportFile, "contentType" | "body">> {
  if (format === "csv") return { contentType: "text/csv; charset=utf-8", body: tableToCsv(table) };
  return { contentType: XLSX_CONTENT_TYPE, body: await tableToXlsx(table, { created: now }) };
}

function requireCostRead(user: SignedIn) {
  if (!user.ability.can("read", "Cost")) throw forbidden();
}

/** GET /api/costs/export — the filtered ledger as CSV or XLSX (session or personal API token). */
export const exportLedger = query({
  name: "cost.export",
  input: costExportSchema,
  permission: ["use", "Export"],
  run: async ({ user, input, now }): Promise<ExportFile> => {
    requireCostRead(user);
    const { format, ...filter } = input;
    const entries = await listCostEntries(db(), user, filter, { limit: EXPORT_ROW_LIMIT + 1 });
    if (entries.length > EXPORT_ROW_LIMIT) {
      throw new AppError("payload_too_large", `More than ${EXPORT_ROW_LIMIT.toLocaleString("en-AU")} entries match; narrow the period or filters`);
    }
    const file = await writeExport(ledgerTable(entries), format, now);
    return { ...file, filename: exportName("costs", filter.from, filter.to, now, format), rows: entries.length };
  },
});

export const varianceExportSchema = z
  .object({
    format: formatField,
    depotId: optionalParam(64).meta({ description: "Only vehicles of this depot" }),
    platformId: optionalParam(64).meta({ description: "Only vehicles of this platform" }),
    standardId: optionalParam(64).meta({ description: "Only vehicles on an edition of this standard" }),
    editionId: optionalParam(64).meta({ description: "Only vehicles on this edition" }),
  })
  .meta({ id: "VarianceExportQuery" });

/** GET /api/variance/export — every vehicle's variance against its edition, as CSV or XLSX. */
export const exportVariance = query({
  name: "variance.export",
  input: varianceExportSchema,
  permission: ["use", "Export"],
  run: async ({ user, input, now }): Promise<ExportFile> => {
    if (!user.ability.can("read", "Variance")) throw forbidden();
    const { format, ...filter } = input;
    const database = db();
    const [fleet, names] = await Promise.all([loadFleetVarianceFigures(database, user, filter, now), varianceNames(database, user)]);
    const rows = fleet.details.map((d) => ({
      fleetNumber: d.fleetNumber,
      depotName: d.depotId ? (names.depot.get(d.depotId) ?? null) : null,
      platformName: names.platform.get(d.platformId) ?? null,
      editionName: d.editionId ? (names.edition.get(d.editionId) ?? null) : null,
      status: d.status,
      summary: d.summary,
      costToCloseCents: d.costToCloseCents,
      massToCloseKg: d.massToCloseKg,
    }));
    const file = await writeExport(varianceTable(rows), format, now);
    return { ...file, filename: `rigline-variance-${isoDay(now)}.${format}`, rows: rows.length };
  },
});

// ─── Budgets ────────────────────────────────────────────────────────────────────

export const budgetListSchema = z
  .object({
    from: optionalDay("from"),
    to: optionalDay("to"),
    costCentre: optionalParam(64),
  })
  .refine(fromBeforeTo, FROM_BEFORE_TO)
  .meta({ id: "BudgetListQuery" });

/** GET /api/budgets — budgets overlapping the window, each against its actual spend (ex GST). */
export const listBudgets = query({
  name: "budget.list",
  input: budgetListSchema,
  permission: ["read", "Cost"],
  run: async ({ user, input }) => {
    const items = await budgetsAgainstActual(db(), user, input);
    const budgetCents = items.reduce((s, b) => s + b.budgetCents, 0);
    const actualCents = items.reduce((s, b) => s + b.actualCents, 0);
    return { items, totals: { budgetCents, actualCents, remainingCents: budgetCents - actualCents } };
  },
});

const MAX_BUDGET_DAYS = 3 * 366;

const budgetFields = {
  costCentre: z
    .string({ error: "Enter the cost centre" })
    .trim()
    .min(1, { error: "Enter the cost centre" })
    .max(64, { error: "At most 64 characters" }),
  periodStart: day("First day").meta({ description: "First day of the budget period (YYYY-MM-DD)" }),
  periodEnd: day("Last day").meta({ description: "Last day of the budget period, inclusive (YYYY-MM-DD)" }),
  amount: dollars.meta({ description: "Budget in dollars, ex GST, e.g. 120,000" }),
};

function budgetTransform<T extends { periodStart: Date; periodEnd: Date; amount: string }>(input: T, ctx: z.RefinementCtx) {
  const issue = (path: string, message: string) => {
    ctx.issues.push({ code: "custom", message, path: [path], input });
    return z.NEVER;
  };
  if (input.periodEnd.getTime() < input.periodStart.getTime()) return issue("periodEnd", "The last day must be on or after the first day");
  if ((input.periodEnd.getTime() - input.periodStart.getTime()) / DAY_MS > MAX_BUDGET_DAYS) return issue("periodEnd", "A budget period can be at most three years");
  let amountCents: number;
  try {
    amountCents = parseMoneyToCents(input.amount, "amount");
  } catch {
    return issue("amount", "Enter the budget in dollars, such as 120,000");
  }
  if (amountCents <= 0) return issue("amount", "A budget must be more than $0.00");
  if (amountCents > 100 * MAX_ENTRY_CENTS) return issue("amount", "That budget is more than $1,000,000,000; check it");
  const { amount: _amount, ...rest } = input;
  return { ...rest, amountCents };
}

export const budgetInputSchema = z.object(budgetFields).transform(budgetTransform).meta({ id: "BudgetInput" });
export const budgetUpdateSchema = z
  .object({ id: z.string().trim().min(1, { error: "id is required" }).max(64), ...budgetFields })
  .transform(budgetTransform)
  .meta({ id: "BudgetUpdate" });


async function refuseOverlap(user: SignedIn, tx: Tx, costCentre: string, start: Date, end: Date, exceptId?: string) {
  const other = await overlappingBudget(tx, user, costCentre, start, end, exceptId);
  if (other) {
    throw conflict(`${costCentre} already has a budget for ${formatCalendarDay(other.periodStart)} – ${formatCalendarDay(other.periodEnd)}; periods of one cost centre must not overlap`);
  }
}

/** POST /api/budgets — a budget for a cost centre and period (finance only). */
export const createBudget = command({
  name: "budget.create",
  input: budgetInputSchema,
  permission: ["manage", "Cost"],
  run: async ({ user, input, tx, audit }) => {
    await refuseOverlap(user, tx, input.costCentre, input.periodStart, input.periodEnd);
    const [row] = await tx
      .insert(budgets)
      .values({ orgId: user.orgId, costCentre: input.costCentre, periodStart: input.periodStart, periodEnd: input.periodEnd, amountCents: input.amountCents })
      .returning();
    if (!row) throw new Error("budget insert returned nothing");
    const after = { costCentre: row.costCentre, periodStart: isoDay(row.periodStart), periodEnd: isoDay(row.periodEnd), amountCents: row.amountCents };
    await audit({ action: "budget.create", entityType: "budget", entityId: row.id, after });
    return { id: row.id, ...after };
  },
});

/** PATCH /api/budgets/{id} — change a budget's cost centre, period or amount (finance only). */
export const updateBudget = command({
  name: "budget.update",
  input: budgetUpdateSchema,
  permission: ["manage", "Cost"],
  run: async ({ user, input, tx, audit }) => {
    const before = await findBudget(tx, user, input.id);
    if (!before) throw notFound("That budget");
    await refuseOverlap(user, tx, input.costCentre, input.periodStart, input.periodEnd, before.id);
    await tx
      .update(budgets)
      .set({ costCentre: input.costCentre, periodStart: input.periodStart, periodEnd: input.periodEnd, amountCents: input.amountCents })
      .where(and(eq(budgets.id, before.id), eq(budgets.orgId, user.orgId)));
    const after = { costCentre: input.costCentre, periodStart: isoDay(input.periodStart), periodEnd: isoDay(input.periodEnd), amountCents: input.amountCents };
    await audit({
      action: "budget.update",
      entityType: "budget",
      entityId: before.id,
      before: { costCentre: before.costCentre, periodStart: isoDay(before.periodStart), periodEnd: isoDay(before.periodEnd), amountCents: before.amountCents },
      after,
    });
    return { id: before.id, ...after };
  },
});

export const budgetIdSchema = z.object({ id: z.string().trim().min(1, { error: "id is required" }).max(64) }).meta({ id: "BudgetId" });

/** DELETE /api/budgets/{id} (finance only). */
export const deleteBudget = command({
  name: "budget.delete",
  input: budgetIdSchema,
  permission: ["manage", "Cost"],
  run: async ({ user, input, tx, audit }) => {
    const before = await findBudget(tx, user, input.id);
    if (!before) throw notFound("That budget");
    await tx.delete(budgets).where(and(eq(budgets.id, before.id), eq(budgets.orgId, user.orgId)));
    await audit({
      action: "budget.delete",
      entityType: "budget",
      entityId: before.id,
      before: { costCentre: before.costCentre, periodStart: isoDay(before.periodStart), periodEnd: isoDay(before.periodEnd), amountCents: before.amountCents },
    });
    return { id: before.id, deleted: true };
  },
});

// ─── Fleet over time ────────────────────────────────────────────────────────────

export const fleetTrendsSchema = z
  .object({ from: optionalDay("from").meta({ description: "First day (YYYY-MM-DD); default: a year ago" }) })
  .meta({ id: "FleetTrendsQuery" });

/**
 * Daily readiness and variance figures (from fleet_snapshots) for the charts over time. They are
 * whole-fleet figures, so only the roles that see the whole fleet's costs and variance read them.
 */
export const fleetTrends = query({
  name: "fleet.trends",
  input: fleetTrendsSchema,
  permission: ["read", "Cost"],
  run: async ({ user, input, now }) => {
    if (!user.ability.can("read", "Variance")) throw forbidden();
    const from = input.from ?? new Date(now.getTime() - 365 * DAY_MS);
    const database = db();
    let items = await listFleetSnapshots(database, user, isoDay(from));
    // Fallback: the daily scheduler normally took today's figures already; otherwise this visit does.
    if (items[items.length - 1]?.day !== isoDay(now)) {
      await recordFleetSnapshot(database, user.orgId, await fleetFiguresNow(database, user.orgId, now));
      items = await listFleetSnapshots(database, user, isoDay(from));
    }
    return { items };
  },
});

/** An export as a download: the right type, an attachment name, never cached. */
export function exportResponse(file: ExportFile): Response {
  return fileResponse({ body: file.body, contentType: file.contentType, filename: file.filename, headers: { "x-rigline-rows": String(file.rows) } });
}
