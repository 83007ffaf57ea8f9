import { and, desc, eq } from "drizzle-orm";
import { beforeAll, describe, expect, it, vi } from "vitest";
import { POST as createCostRoute } from "@/app/api/costs/route";
import { auditEntries, costs, vehicles } from "@/db/schema";
import { createManualCost } from "@/lib/commands/costs";
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
let vehicle: typeof vehicles.$inferSelect;

beforeAll(async () => {
  finance = await signedInAs(database, "finance@mirrabel-health.example");
  const [found] = await database.select().from(vehicles).where(and(eq(vehicles.orgId, finance.orgId), eq(vehicles.fleetNumber, "MH-005")));
  if (!found) throw new Error("demo vehicle MH-005 is missing");
  vehicle = found;
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

const invoice = (overrides: Record<string, unknown> = {}) => ({
  incurredOn: "2026-03-12",
  vehicleId: vehicle.id,
  category: "recovery",
  kind: "capital",
  description: "Recovery boards, pair",
  reference: "INV-7788",
  amount: "100.00",
  ...overrides,
});

async function stored(id: string) {
  return database.query.costs.findFirst({ where: eq(costs.id, id) });
}

describe("GST on a manual entry", () => {
  it("adds 10 % to an amount entered before GST", async () => {
    const result = await execute(createManualCost, finance, invoice({ amount: "100.00", gstMode: "add" }));
    // A New Tax System (Goods and Services Tax Imposition—General) Act 1999 s 4 (P): $100.00 excl. → $10.00
    expect(result).toMatchObject({ amountExGstCents: 10_000, gstCents: 1_000, totalCents: 11_000 });
    expect(await stored(result.id)).toMatchObject({ amountExGstCents: 10_000, gstCents: 1_000, source: "manual" });
  });

  it("takes one eleventh out of a GST-inclusive amount", async () => {
    const result = await execute(createManualCost, finance, invoice({ amount: "$110.00", gstMode: "included" }));
    // GST Act (P): GST in a fully taxable GST-inclusive price = 1/11 of it; $110.00 incl. → $10.00
    expect(result).toMatchObject({ amountExGstCents: 10_000, gstCents: 1_000 });
  });

  it("rounds half a cent up", async () => {
    const result = await execute(createManualCost, finance, invoice({ amount: "12.35" }));
    // GST Act s 9-90 (P): $12.35 excl., one line → 1.235 → $1.24
    expect(result.gstCents).toBe(124);
  });

  it("keeps GST as typed from the invoice, or none for a GST-free supply", async () => {
    const typed = await execute(createManualCost, finance, invoice({ amount: "1,234.50", gstMode: "entered", gst: "123.45" }));
    expect(typed).toMatchObject({ amountExGstCents: 123_450, gstCents: 12_345 });
    const free = await execute(createManualCost, finance, invoice({ amount: "80", gstMode: "none" }));
    expect(free).toMatchObject({ amountExGstCents: 8_000, gstCents: 0 });
  });
});

describe("a manual entry", () => {
  it("takes the cost centre and depot from the vehicle and writes an audit entry", async () => {
    const result = await execute(createManualCost, finance, invoice());
    const row = await stored(result.id);
    expect(row).toMatchObject({
      orgId: finance.orgId,
      vehicleId: vehicle.id,
      costCentre: vehicle.costCentre,
      depotId: vehicle.depotId,
      category: "recovery",
      kind: "capital",
      reference: "INV-7788",
      createdBy: finance.userId,
    });
    expect(row!.incurredOn.toISOString()).toBe("2026-03-12T00:00:00.000Z");
    const audit = await database.query.auditEntries.findFirst({ where: and(eq(auditEntries.entityType, "cost"), eq(auditEntries.entityId, result.id)) });
    expect(audit).toMatchObject({ action: "cost.create", actorId: finance.userId, orgId: finance.orgId });
    expect(audit!.after).toMatchObject({ amountExGstCents: 10_000, gstCents: 1_000, incurredOn: "2026-03-12" });
  });

  it("may carry its own cost centre with no vehicle", async () => {
    const result = await execute(createManualCost, finance, invoice({ vehicleId: "", costCentre: "CC-HEAD-OFFICE", description: "Fleet-wide radio licence" }));
    expect(await stored(result.id)).toMatchObject({ vehicleId: null, costCentre: "CC-HEAD-OFFICE", depotId: null });
  });

  it("allows a credit as an adjustment, with negative GST", async () => {
    const result = await execute(createManualCost, finance, invoice({ source: "adjustment", amount: "-45.00", description: "Credit note for returned shackle" }));
    // GST Act (P): 10 % of −$45.00 = −$4.50
    expect(result).toMatchObject({ amountExGstCents: -4_500, gstCents: -450 });
  });

  it("refuses bad input naming each field, and saves nothing", async () => {
    const before = (await database.select().from(costs)).length;
    const cases: [Record<string, unknown>, string][] = [
      [{ amount: "12.345" }, "amount"],
      [{ amount: "twelve" }, "amount"],
      [{ amount: "0" }, "amount"],
      [{ amount: "-20" }, "amount"],
      [{ amount: "20000000" }, "amount"],
      [{ description: "  " }, "description"],
      [{ category: "chrome" }, "category"],
      [{ kind: "" }, "kind"],
      [{ incurredOn: "12/03/2026" }, "incurredOn"],
      [{ incurredOn: "2999-01-01" }, "incurredOn"],
      [{ gstMode: "entered", gst: "" }, "gst"],
      [{ gstMode: "entered", gst: "500" }, "gst"],
      [{ vehicleId: "", costCentre: "" }, "costCentre"],
      [{ vehicleId: "no-such-vehicle" }, "vehicleId"],
      [{ depotId: "no-such-depot" }, "depotId"],
    ];
    for (const [overrides, field] of cases) {
      const error = await failure(execute(createManualCost, finance, invoice(overrides)));
      expect(error.code, JSON.stringify(overrides)).toBe("validation_failed");
      expect(error.details.map((d) => d.field), JSON.stringify(overrides)).toContain(field);
    }
    expect(await database.select().from(costs)).toHaveLength(before);
  });

  it("refuses another organisation's vehicle as if it did not exist", async () => {
    const [other] = await database.select().from(vehicles).where(eq(vehicles.fleetNumber, "GT-002"));
    const error = await failure(execute(createManualCost, finance, invoice({ vehicleId: other!.id })));
    expect(error.details[0]).toMatchObject({ field: "vehicleId" });
  });

  it("is for finance only: a manager or admin reads the ledger but cannot book into it", async () => {
    for (const email of ["manager@mirrabel-health.example", "admin@mirrabel-health.example", "driver@mirrabel-health.example", "contractor@tallowbark-fitout.example"]) {
      const error = await failure(execute(createManualCost, await signedInAs(database, email), invoice()));
      expect(error.code, email).toBe("forbidden");
    }
  });

  it("answers 201 from POST /api/costs with the amounts in cents, and 422 in the one error shape", async () => {
    const created = await callRoute(createCostRoute, { user: finance, body: invoice({ amount: 250.5 }) });
    expect(created.status).toBe(201);
    expect(created.json).toMatchObject({ amountExGstCents: 25_050, gstCents: 2_505, totalCents: 27_555 });
    const latest = await database.select().from(costs).orderBy(desc(costs.createdAt)).limit(1);
    expect(latest[0]?.id).toBe((created.json as { id: string }).id);
    const bad = await callRoute(createCostRoute, { user: finance, body: invoice({ amount: "1,23" }) });
    expect(bad.status).toBe(422);
    expect(bad.json).toMatchObject({ error: { code: "validation_failed", details: [{ field: "amount" }] } });
    const malformed = await callRoute(createCostRoute, { user: finance, body: "{not json" });
    expect(malformed.status).toBe(400);
  });
});
