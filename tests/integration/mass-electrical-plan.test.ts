import { and, eq } from "drizzle-orm";
import { describe, expect, it, vi } from "vitest";
import { GET as getRoute, PUT as putRoute } from "@/app/api/vehicles/[id]/electrical-plan/route";
import { GET as statementRoute } from "@/app/api/vehicles/[id]/statement/route";
import { auditEntries, electricalPlans, vehicles } from "@/db/schema";
import { renderStatementPdf } from "@/lib/statement";
import { electricalStatement, statementQuery } from "@/lib/commands/mass";
import { execute } from "@/lib/server/operation";
import { useTestDatabase } from "../helpers/db";
import { callRoute, requestUser } from "../helpers/route";
import { signedInAs } from "../helpers/users";

vi.mock("@/lib/server/session", async (original) => ({
  ...(await original<typeof import("@/lib/server/session")>()),
  currentUser: async () => requestUser.current,
}));

const database = await useTestDatabase();
const manager = await signedInAs(database, "manager@mirrabel-health.example");
const admin = await signedInAs(database, "admin@mirrabel-health.example");
const finance = await signedInAs(database, "finance@mirrabel-health.example");
const driver = await signedInAs(database, "driver@mirrabel-health.example");
const contractor = await signedInAs(database, "contractor@tallowbark-fitout.example");
const otherManager = await signedInAs(database, "manager@gidgee-trust.example");
const vehicle = (await database.query.vehicles.findFirst({ where: eq(vehicles.fleetNumber, "MH-014") }))!;

// An invented camping plan.
const plan = {
  systemV: 12,
  daysAutonomy: 2,
  chemistry: "lithium-iron-phosphate",
  consumers: [
    { label: "Fridge", currentA: 4, hoursPerDay: 10 },
    { label: "UHF radio", currentA: 0.5, hoursPerDay: 12 },
    { label: "Camp lights", currentA: 2, hoursPerDay: 3 },
  ],
  sources: [
    { kind: "dc-dc", amount: 25, unit: "A", hoursPerDay: 2 },
    { kind: "solar", amount: 200, unit: "W", hoursPerDay: 5 },
  ],
  runs: [{ label: "Battery to fridge outlet", currentA: 5, lengthOneWayM: 4, circuit: "critical" }],
};

type Saved = {
  plan: typeof plan | null;
  version: number;
  summary: { battery: { dailyAh: number; requiredCapacityAh: number }; runs: { sizeLabel: string; dropPct: number; fuseA: number; withinLimit: boolean }[] } | null;
  caution: string;
};

const put = (body: unknown, user: typeof manager | null = manager, id = vehicle.id) => callRoute(putRoute, { user, method: "PUT", params: { id }, body });

describe("the saved 12 V plan", () => {
  it("has none until one is saved", async () => {
    const { status, json } = await callRoute(getRoute, { user: manager, params: { id: vehicle.id } });
    expect(status).toBe(200);
    expect(json).toMatchObject({ plan: null, summary: null, version: 0 });
    expect((json as Saved).caution).toContain("Wiring follows the equipment makers' instructions");
  });

  it("saves, loads back the same plan with its results, and writes an audit entry", async () => {
    const saved = await put(plan);
    expect(saved.status).toBe(200);
    const s = saved.json as Saved;
    expect(s.version).toBe(1);
    // Hand-worked: 4 A × 10 h + 0.5 A × 12 h + 2 A × 3 h = 52 Ah a day; for 2 days at the 80 %
    // usable depth of lithium iron phosphate (common practice) 52 × 2 / 0.8 = 130 Ah.
    expect(s.summary!.battery.dailyAh).toBeCloseTo(52, 6);
    expect(s.summary!.battery.requiredCapacityAh).toBeCloseTo(130, 6);
    // A 5 A fridge run of 4 m one way on a 3 % critical circuit (ABYC E-11 as published guidance) stays within its limit.
    expect(s.summary!.runs[0]).toMatchObject({ withinLimit: true });
    expect(s.summary!.runs[0]!.dropPct).toBeLessThanOrEqual(3);

    const loaded = await callRoute(getRoute, { user: finance, params: { id: vehicle.id } });
    expect(loaded.status).toBe(200);
    expect((loaded.json as Saved).plan).toEqual(plan);
    expect((loaded.json as Saved).summary).toEqual(s.summary);

    const row = (await database.query.electricalPlans.findFirst({ where: eq(electricalPlans.vehicleId, vehicle.id) }))!;
    const audit = await database.query.auditEntries.findFirst({ where: and(eq(auditEntries.entityId, row.id), eq(auditEntries.action, "electrical_plan.save")) });
    expect(audit).toMatchObject({ actorId: manager.userId, entityType: "electrical_plan" });
    expect(audit?.after).toMatchObject({ vehicleId: vehicle.id, version: 1, daysAutonomy: 2 });
  });

  it("replaces the one current plan on a second save and keeps the change in the audit trail", async () => {
    const changed = { ...plan, daysAutonomy: 3, chemistry: "agm" };
    const { status, json } = await put(changed, admin);
    expect(status).toBe(200);
    expect((json as Saved).version).toBe(2);
    expect(await database.select().from(electricalPlans).where(eq(electricalPlans.vehicleId, vehicle.id))).toHaveLength(1);
    const loaded = await callRoute(getRoute, { user: manager, params: { id: vehicle.id } });
    expect((loaded.json as Saved).plan).toMatchObject({ daysAutonomy: 3, chemistry: "agm" });
    const row = (await database.query.electricalPlans.findFirst({ where: eq(electricalPlans.vehicleId, vehicle.id) }))!;
    const audits = await database.select().from(auditEntries).where(and(eq(auditEntries.entityId, row.id), eq(auditEntries.action, "electrical_plan.save")));
    expect(audits).toHaveLength(2);
    expect(audits.find((a) => (a.after as { version: number }).version === 2)?.before).toMatchObject({ version: 1, daysAutonomy: 2, chemistry: "lithium-iron-phosphate" });
  });

  it("answers 422 naming the field and keeps the saved plan", async () => {
    for (const [body, field] of [
      [{ ...plan, daysAutonomy: 0 }, "daysAutonomy"],
      [{ ...plan, chemistry: "nickel" }, "chemistry"],
      [{ ...plan, systemV: 48 }, "systemV"],
      [{ ...plan, consumers: [] }, "consumers"],
      [{ ...plan, consumers: [{ label: "Fridge", currentA: "", hoursPerDay: 10 }] }, "consumers.0.currentA"],
      [{ ...plan, consumers: [{ label: "Fridge", currentA: 4, hoursPerDay: 30 }] }, "consumers.0.hoursPerDay"],
      [{ ...plan, sources: [{ kind: "solar", amount: 200, unit: "W" }] }, "sources.0.hoursPerDay"],
      [{ ...plan, runs: [{ label: "Winch", currentA: 300, lengthOneWayM: -2, circuit: "other" }] }, "runs.0.lengthOneWayM"],
      [{ ...plan, runs: [{ label: "", currentA: 5, lengthOneWayM: 2, circuit: "other" }] }, "runs.0.label"],
    ] as const) {
      const { status, json } = await put(body);
      expect(status, JSON.stringify(body)).toBe(422);
      expect((json as { error: { details: { field: string }[] } }).error.details.map((d) => d.field), JSON.stringify(body)).toContain(field);
    }
    const loaded = await callRoute(getRoute, { user: manager, params: { id: vehicle.id } });
    expect((loaded.json as Saved).version).toBe(2);
  });

  it("lets only admins and managers save; readers read; other organisations find nothing", async () => {
    expect((await put(plan, finance)).status).toBe(403);
    expect((await put(plan, contractor)).status).toBe(403);
    expect((await put(plan, driver)).status).toBe(403);
    expect((await put(plan, null)).status).toBe(401);
    expect((await callRoute(getRoute, { user: driver, params: { id: vehicle.id } })).status).toBe(403);
    expect((await put(plan, otherManager)).status).toBe(404);
    expect((await callRoute(getRoute, { user: otherManager, params: { id: vehicle.id } })).status).toBe(404);
    const audits = await database.select().from(auditEntries).where(eq(auditEntries.action, "electrical_plan.save"));
    expect(audits).toHaveLength(2);
  });

  it("puts the saved plan's summary into the statement", async () => {
    const { data } = await execute(statementQuery, manager, { id: vehicle.id });
    expect(data.electrical).toMatchObject({ systemV: 12, daysAutonomy: 3, chemistry: "AGM", consumers: 3 });
    // 52 Ah a day for 3 days at the 50 % usable depth of AGM (common practice): 52 × 3 / 0.5 = 312 Ah.
    expect(data.electrical!.requiredCapacityAh).toBeCloseTo(312, 6);
    expect(data.electrical!.runs[0]).toMatchObject({ label: "Battery to fridge outlet" });
    expect(data.electrical!.runs[0]!.size).toMatch(/mm²$/);
    expect(data.cautions.some((c) => c.includes("Wiring follows"))).toBe(true);
    expect(electricalStatement(null, "Australia/Darwin")).toBeNull();
    const pdf = await renderStatementPdf(data);
    expect(pdf.subarray(0, 5).toString("latin1")).toBe("%PDF-");
    const served = await callRoute(statementRoute, { user: manager, params: { id: vehicle.id }, url: `http://localhost/api/vehicles/${vehicle.id}/statement` });
    expect(served.status).toBe(200);
  });
});
