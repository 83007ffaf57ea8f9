import { and, eq } from "drizzle-orm";
import { beforeAll, describe, expect, it, vi } from "vitest";
import { GET as listCostsRoute, POST as createCostRoute } from "@/app/api/costs/route";
import { GET as summaryRoute } from "@/app/api/costs/summary/route";
import { costs, depots, organisations, vehicles } from "@/db/schema";
import { ledgerSummary, listLedger, vehicleCosts } from "@/lib/commands/costs";
import { AppError } from "@/lib/server/errors";
import { execute } from "@/lib/server/operation";
import type { SignedIn } from "@/lib/server/session";
import { useTestDatabase } from "../helpers/db";
import { callRoute, requestUser } from "../helpers/route";
import { signedInAs } from "../helpers/users";

vi.mock("@/lib/server/session", async (original) => ({
  ...(await original<typeof import("@/lib/server/session")>()),
  currentUser: async () => requestUser.current,
}));

const database = await useTestDatabase();
let finance: SignedIn;
let manager: SignedIn;
let mirrabelId: string;

beforeAll(async () => {
  finance = await signedInAs(database, "finance@mirrabel-health.example");
  manager = await signedInAs(database, "manager@mirrabel-health.example");
  mirrabelId = finance.orgId;
});

async function failure(promise: Promise<unknown>): Promise<AppError> {
  try {
    await promise;
  } catch (error) {
    if (error instanceof AppError) return error;
    throw error;
  }
  throw new Error("expected the operation to fail");
}

/** Every cost of the organisation straight from the table, filtered here in plain code. */
async function allCosts(orgId = mirrabelId) {
  return database.select().from(costs).where(eq(costs.orgId, orgId));
}

const sum = (rows: { amountExGstCents: number }[]) => rows.reduce((s, r) => s + r.amountExGstCents, 0);
const day = (iso: string) => new Date(`${iso}T00:00:00.000Z`);

describe("the seeded ledger", () => {
  it("holds about a year of costs across several cost centres and categories, inside each organisation", async () => {
    const rows = await allCosts();
    expect(rows.length).toBeGreaterThan(200);
    expect(new Set(rows.map((r) => r.costCentre)).size).toBeGreaterThanOrEqual(6);
    expect(new Set(rows.map((r) => r.category)).size).toBeGreaterThanOrEqual(8);
    const spanDays = (Math.max(...rows.map((r) => r.incurredOn.getTime())) - Math.min(...rows.map((r) => r.incurredOn.getTime()))) / 86_400_000;
    expect(spanDays).toBeGreaterThan(300);
    const vehicleOrgs = await database.select({ id: vehicles.id, orgId: vehicles.orgId }).from(vehicles);
    const orgOf = new Map(vehicleOrgs.map((v) => [v.id, v.orgId]));
    for (const r of rows) if (r.vehicleId) expect(orgOf.get(r.vehicleId)).toBe(mirrabelId);
  });
});

describe("listing and filtering the ledger", () => {
  it("totals every matching entry, not only the page shown", async () => {
    const rows = await allCosts();
    const result = await execute(listLedger, finance, { pageSize: "20" });
    expect(result.items).toHaveLength(20);
    expect(result.total).toBe(rows.length);
    expect(result.pageCount).toBe(Math.ceil(rows.length / 20));
    expect(result.totals.exGstCents).toBe(sum(rows));
    expect(result.totals.gstCents).toBe(rows.reduce((s, r) => s + r.gstCents, 0));
    expect(result.totals.totalCents).toBe(result.totals.exGstCents + result.totals.gstCents);
    expect(result.totals.capitalExGstCents + result.totals.operatingExGstCents).toBe(result.totals.exGstCents);
    expect(result.totals.capitalExGstCents).toBe(sum(rows.filter((r) => r.kind === "capital")));
  });

  it("pages newest first without repeating or losing an entry", async () => {
    const rows = await allCosts();
    const seen = new Set<string>();
    let previous = Infinity;
    for (let page = 1; page <= Math.ceil(rows.length / 100); page++) {
      const result = await execute(listLedger, finance, { page: String(page), pageSize: "100" });
      for (const item of result.items) {
        expect(seen.has(item.id)).toBe(false);
        seen.add(item.id);
        expect(item.incurredOn.getTime()).toBeLessThanOrEqual(previous);
        previous = item.incurredOn.getTime();
      }
    }
    expect(seen.size).toBe(rows.length);
  });

  it("filters by cost centre, depot, vehicle, category and kind, and the totals follow", async () => {
    const rows = await allCosts();
    const sample = rows.find((r) => r.vehicleId && r.depotId)!;
    const cases: [Record<string, string>, (r: (typeof rows)[number]) => boolean][] = [
      [{ costCentre: sample.costCentre }, (r) => r.costCentre === sample.costCentre],
      [{ depotId: sample.depotId! }, (r) => r.depotId === sample.depotId],
      [{ vehicleId: sample.vehicleId! }, (r) => r.vehicleId === sample.vehicleId],
      [{ category: sample.category }, (r) => r.category === sample.category],
      [{ kind: "operating" }, (r) => r.kind === "operating"],
      [{ source: "adjustment" }, (r) => r.source === "adjustment"],
      [{ costCentre: sample.costCentre, category: sample.category }, (r) => r.costCentre === sample.costCentre && r.category === sample.category],
    ];
    for (const [filter, keep] of cases) {
      const expected = rows.filter(keep);
      expect(expected.length, JSON.stringify(filter)).toBeGreaterThan(0);
      const result = await execute(listLedger, finance, { ...filter, pageSize: "500" });
      expect(result.total, JSON.stringify(filter)).toBe(expected.length);
      expect(new Set(result.items.map((i) => i.id))).toEqual(new Set(expected.map((e) => e.id)));
      expect(result.totals.exGstCents).toBe(sum(expected));
    }
  });

  it("treats the period as whole days, both ends included", async () => {
    const [vehicle] = await database.select().from(vehicles).where(and(eq(vehicles.orgId, mirrabelId), eq(vehicles.fleetNumber, "MH-003")));
    const base = { orgId: mirrabelId, vehicleId: vehicle!.id, costCentre: "CC-PERIOD-TEST", category: "safety" as const, kind: "operating" as const, source: "manual" as const, gstCents: 0, description: "Period test" };
    await database.insert(costs).values([
      { ...base, amountExGstCents: 100, incurredOn: day("2026-02-28") },
      { ...base, amountExGstCents: 200, incurredOn: day("2026-03-01") },
      { ...base, amountExGstCents: 400, incurredOn: day("2026-03-31") },
      { ...base, amountExGstCents: 800, incurredOn: day("2026-04-01") },
    ]);
    const march = await execute(listLedger, finance, { costCentre: "CC-PERIOD-TEST", from: "2026-03-01", to: "2026-03-31" });
    expect(march.items.map((i) => i.amountExGstCents).sort((a, b) => a - b)).toEqual([200, 400]);
    expect(march.totals.exGstCents).toBe(600);
    const oneDay = await execute(listLedger, finance, { costCentre: "CC-PERIOD-TEST", from: "2026-04-01", to: "2026-04-01" });
    expect(oneDay.totals.exGstCents).toBe(800);
    const open = await execute(listLedger, finance, { costCentre: "CC-PERIOD-TEST", from: "2026-03-31", to: "" });
    expect(open.totals.exGstCents).toBe(1200);
  });

  it("answers 422 naming the field for a bad filter", async () => {
    for (const [input, field] of [
      [{ from: "2026-04-01", to: "2026-03-01" }, "to"],
      [{ from: "2026-02-30" }, "from"],
      [{ category: "chrome" }, "category"],
      [{ kind: "leased" }, "kind"],
      [{ page: "0" }, "page"],
    ] as const) {
      const error = await failure(execute(listLedger, finance, input));
      expect(error.code, JSON.stringify(input)).toBe("validation_failed");
      expect(error.details.map((d) => d.field)).toContain(field);
    }
  });

  it("never shows another organisation's costs, even when asked for its vehicle", async () => {
    const gidgeeFinance = await signedInAs(database, "finance@gidgee-trust.example");
    const mine = await execute(listLedger, gidgeeFinance, { pageSize: "500" });
    const gidgee = await database.query.organisations.findFirst({ where: eq(organisations.slug, "gidgee-trust") });
    expect(mine.total).toBe((await allCosts(gidgee!.id)).length);
    expect(mine.items.every((i) => i.fleetNumber === null || i.fleetNumber.startsWith("GT-"))).toBe(true);
    const mirrabelVehicle = (await allCosts()).find((r) => r.vehicleId)!.vehicleId!;
    const asked = await execute(listLedger, gidgeeFinance, { vehicleId: mirrabelVehicle });
    expect(asked.total).toBe(0);
    const tab = await failure(execute(vehicleCosts, gidgeeFinance, { vehicleId: mirrabelVehicle }));
    expect(tab.code).toBe("not_found");
  });

  it("names each entry's vehicle and depot", async () => {
    const result = await execute(listLedger, finance, { pageSize: "5" });
    const item = result.items.find((i) => i.vehicleId)!;
    const vehicle = await database.query.vehicles.findFirst({ where: eq(vehicles.id, item.vehicleId!) });
    const depot = await database.query.depots.findFirst({ where: eq(depots.id, item.depotId!) });
    expect(item.fleetNumber).toBe(vehicle!.fleetNumber);
    expect(item.depotName).toBe(depot!.name);
  });
});

describe("summary for the charts", () => {
  it("adds up by month and by category to the same total as the ledger", async () => {
    const rows = await allCosts();
    const summary = await execute(ledgerSummary, finance, {});
    expect(summary.byMonth.reduce((s, m) => s + m.exGstCents, 0)).toBe(sum(rows));
    expect(summary.byCategory.reduce((s, c) => s + c.exGstCents, 0)).toBe(sum(rows));
    const march = rows.filter((r) => r.incurredOn.toISOString().startsWith("2026-03"));
    const marchSpend = summary.byMonth.filter((m) => m.month === "2026-03").reduce((s, m) => s + m.exGstCents, 0);
    expect(marchSpend).toBe(sum(march));
  });
});

describe("the vehicle's Costs tab", () => {
  it("lists only that vehicle's costs with their totals", async () => {
    const rows = await allCosts();
    const vehicleId = rows.find((r) => r.vehicleId)!.vehicleId!;
    const tab = await execute(vehicleCosts, manager, { vehicleId });
    const expected = rows.filter((r) => r.vehicleId === vehicleId);
    expect(tab.entries).toHaveLength(expected.length);
    expect(tab.totals.exGstCents).toBe(sum(expected));
    expect(tab.byCategory.reduce((s, c) => s + c.exGstCents, 0)).toBe(sum(expected));
  });
});

describe("who may read the ledger", () => {
  it("lets admin, manager and finance read; refuses driver and contractor with 403 and nobody with 401", async () => {
    for (const email of ["admin@mirrabel-health.example", "manager@mirrabel-health.example", "finance@mirrabel-health.example"]) {
      const { status } = await callRoute(listCostsRoute, { user: await signedInAs(database, email), url: "http://localhost/api/costs?pageSize=5" });
      expect(status, email).toBe(200);
    }
    for (const email of ["driver@mirrabel-health.example", "contractor@tallowbark-fitout.example", "contractor@quandong-road.example"]) {
      const user = await signedInAs(database, email);
      for (const handler of [listCostsRoute, summaryRoute]) {
        const { status, json } = await callRoute(handler, { user, url: "http://localhost/api/costs" });
        expect(status, email).toBe(403);
        expect(json).toEqual({ error: { code: "forbidden", message: expect.any(String), details: [] } });
      }
      const post = await callRoute(createCostRoute, { user, body: { incurredOn: "2026-03-01", costCentre: "CC-X", category: "safety", kind: "operating", description: "x", amount: "10" } });
      expect(post.status, email).toBe(403);
    }
    expect((await callRoute(listCostsRoute, { user: null })).status).toBe(401);
  });

  it("gives the page of entries and totals in the JSON answer", async () => {
    const { status, json } = await callRoute(listCostsRoute, { user: finance, url: "http://localhost/api/costs?pageSize=3&kind=capital" });
    expect(status).toBe(200);
    const body = json as { items: { kind: string }[]; total: number; totals: { exGstCents: number } };
    expect(body.items).toHaveLength(3);
    expect(body.items.every((i) => i.kind === "capital")).toBe(true);
    expect(body.totals.exGstCents).toBe(sum((await allCosts()).filter((r) => r.kind === "capital")));
  });
});
