import { and, eq } from "drizzle-orm";
import { beforeAll, describe, expect, it, vi } from "vitest";
import { DELETE as deleteBudgetRoute, PATCH as patchBudgetRoute } from "@/app/api/budgets/[id]/route";
import { GET as listBudgetsRoute, POST as createBudgetRoute } from "@/app/api/budgets/route";
import { auditEntries, budgets, costs } from "@/db/schema";
import { createBudget, deleteBudget, listBudgets, updateBudget } from "@/lib/commands/costs";
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

beforeAll(async () => {
  finance = await signedInAs(database, "finance@mirrabel-health.example");
  manager = await signedInAs(database, "manager@mirrabel-health.example");
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

const day = (iso: string) => new Date(`${iso}T00:00:00.000Z`);
const CENTRE = "CC-BUDGET-TEST";

async function book(iso: string, cents: number, costCentre = CENTRE) {
  await database.insert(costs).values({
    orgId: finance.orgId,
    costCentre,
    category: "tyres",
    kind: "operating",
    source: "manual",
    amountExGstCents: cents,
    gstCents: Math.round(cents / 10),
    incurredOn: day(iso),
    description: "Budget test",
  });
}

describe("the seeded budgets", () => {
  it("cover every cost centre of the fleet and each match the ledger's spend in their period", async () => {
    const { items } = await execute(listBudgets, finance, {});
    expect(items.length).toBeGreaterThanOrEqual(12);
    const all = await database.select().from(costs).where(eq(costs.orgId, finance.orgId));
    for (const b of items) {
      const expected = all
        .filter((c) => c.costCentre === b.costCentre && c.incurredOn >= b.periodStart && c.incurredOn <= b.periodEnd)
        .reduce((s, c) => s + c.amountExGstCents, 0);
      expect(b.actualCents, `${b.costCentre} ${b.periodStart.toISOString()}`).toBe(expected);
      expect(b.remainingCents).toBe(b.budgetCents - b.actualCents);
    }
    expect(items.some((b) => b.actualCents > b.budgetCents) || items.some((b) => b.actualCents < b.budgetCents)).toBe(true);
  });
});

describe("budget against actual", () => {
  it("counts ex-GST spend of the cost centre inside the period, both ends included", async () => {
    const created = await execute(createBudget, finance, { costCentre: CENTRE, periodStart: "2025-07-01", periodEnd: "2026-06-30", amount: "10,000" });
    expect(created).toMatchObject({ costCentre: CENTRE, periodStart: "2025-07-01", periodEnd: "2026-06-30", amountCents: 1_000_000 });
    await book("2025-06-30", 50_000); // the day before: not counted
    await book("2025-07-01", 120_000);
    await book("2026-01-15", 300_000);
    await book("2026-06-30", 80_000);
    await book("2026-07-01", 70_000); // the day after: not counted
    await book("2026-01-15", 999_999, "CC-ANOTHER-CENTRE");
    const { items } = await execute(listBudgets, finance, { costCentre: CENTRE });
    expect(items).toHaveLength(1);
    // hand-worked: 1,200.00 + 3,000.00 + 800.00 = 5,000.00 of a 10,000.00 budget
    expect(items[0]).toMatchObject({ budgetCents: 1_000_000, actualCents: 500_000, remainingCents: 500_000, entries: 3 });
    const audit = await database.query.auditEntries.findFirst({ where: and(eq(auditEntries.action, "budget.create"), eq(auditEntries.entityId, created.id)) });
    expect(audit?.actorId).toBe(finance.userId);
  });

  it("lists only budgets overlapping the window asked for", async () => {
    const inWindow = await execute(listBudgets, finance, { costCentre: CENTRE, from: "2026-06-01", to: "2026-06-30" });
    expect(inWindow.items).toHaveLength(1);
    const outside = await execute(listBudgets, finance, { costCentre: CENTRE, from: "2026-07-01", to: "2026-09-30" });
    expect(outside.items).toHaveLength(0);
  });

  it("refuses an overlapping period for the same cost centre with 409, and saves nothing", async () => {
    const before = (await database.select().from(budgets)).length;
    const error = await failure(execute(createBudget, finance, { costCentre: CENTRE, periodStart: "2026-01-01", periodEnd: "2026-12-31", amount: "5000" }));
    expect(error.code).toBe("conflict");
    expect(error.message).toContain(CENTRE);
    expect(await database.select().from(budgets)).toHaveLength(before);
    // The next financial year is fine.
    await execute(createBudget, finance, { costCentre: CENTRE, periodStart: "2026-07-01", periodEnd: "2027-06-30", amount: "12000.50" });
  });

  it("names the bad field", async () => {
    for (const [input, field] of [
      [{ costCentre: "", periodStart: "2027-07-01", periodEnd: "2028-06-30", amount: "1" }, "costCentre"],
      [{ costCentre: "CC-Z", periodStart: "2027-07-01", periodEnd: "2027-06-30", amount: "1" }, "periodEnd"],
      [{ costCentre: "CC-Z", periodStart: "2027-07-01", periodEnd: "2031-06-30", amount: "1" }, "periodEnd"],
      [{ costCentre: "CC-Z", periodStart: "July", periodEnd: "2027-06-30", amount: "1" }, "periodStart"],
      [{ costCentre: "CC-Z", periodStart: "2027-07-01", periodEnd: "2028-06-30", amount: "0" }, "amount"],
      [{ costCentre: "CC-Z", periodStart: "2027-07-01", periodEnd: "2028-06-30", amount: "1.001" }, "amount"],
    ] as const) {
      const error = await failure(execute(createBudget, finance, input));
      expect(error.code, JSON.stringify(input)).toBe("validation_failed");
      expect(error.details.map((d) => d.field)).toContain(field);
    }
  });

  it("updates and deletes with audit entries; another organisation's budget is not found", async () => {
    const created = await execute(createBudget, finance, { costCentre: "CC-UPDATE-TEST", periodStart: "2025-07-01", periodEnd: "2026-06-30", amount: "2000" });
    const updated = await execute(updateBudget, finance, { id: created.id, costCentre: "CC-UPDATE-TEST", periodStart: "2025-07-01", periodEnd: "2026-06-30", amount: "2500" });
    expect(updated.amountCents).toBe(250_000);
    const audit = await database.query.auditEntries.findFirst({ where: and(eq(auditEntries.action, "budget.update"), eq(auditEntries.entityId, created.id)) });
    expect(audit?.before).toMatchObject({ amountCents: 200_000 });
    expect(audit?.after).toMatchObject({ amountCents: 250_000 });

    const gidgeeFinance = await signedInAs(database, "finance@gidgee-trust.example");
    expect((await failure(execute(deleteBudget, gidgeeFinance, { id: created.id }))).code).toBe("not_found");
    expect((await failure(execute(updateBudget, gidgeeFinance, { id: created.id, costCentre: "X", periodStart: "2025-07-01", periodEnd: "2026-06-30", amount: "1" }))).code).toBe("not_found");
    expect((await execute(listBudgets, gidgeeFinance, {})).items.some((b) => b.id === created.id)).toBe(false);

    await execute(deleteBudget, finance, { id: created.id });
    expect(await database.query.budgets.findFirst({ where: eq(budgets.id, created.id) })).toBeUndefined();
    expect(await database.query.auditEntries.findFirst({ where: and(eq(auditEntries.action, "budget.delete"), eq(auditEntries.entityId, created.id)) })).toBeDefined();
  });
});

describe("budget routes and who may use them", () => {
  it("answers GET to admin, manager and finance; POST, PATCH and DELETE only to finance", async () => {
    const made = await callRoute(createBudgetRoute, { user: finance, body: { costCentre: "CC-ROUTE", periodStart: "2025-07-01", periodEnd: "2026-06-30", amount: "900" } });
    expect(made.status).toBe(201);
    const id = (made.json as { id: string }).id;
    const list = await callRoute(listBudgetsRoute, { user: manager, url: "http://localhost/api/budgets?costCentre=CC-ROUTE" });
    expect(list.status).toBe(200);
    expect((list.json as { items: { id: string }[] }).items.map((b) => b.id)).toEqual([id]);

    expect((await callRoute(createBudgetRoute, { user: manager, body: { costCentre: "CC-M", periodStart: "2025-07-01", periodEnd: "2026-06-30", amount: "1" } })).status).toBe(403);
    expect((await callRoute(patchBudgetRoute, { user: manager, method: "PATCH", params: { id }, body: { costCentre: "CC-ROUTE", periodStart: "2025-07-01", periodEnd: "2026-06-30", amount: "1" } })).status).toBe(403);
    expect((await callRoute(deleteBudgetRoute, { user: manager, method: "DELETE", params: { id } })).status).toBe(403);
    for (const email of ["driver@mirrabel-health.example", "contractor@spindleflat-4x4.example"]) {
      expect((await callRoute(listBudgetsRoute, { user: await signedInAs(database, email) })).status, email).toBe(403);
    }

    const patched = await callRoute(patchBudgetRoute, { user: finance, method: "PATCH", params: { id }, body: { costCentre: "CC-ROUTE", periodStart: "2025-07-01", periodEnd: "2026-06-30", amount: "950" } });
    expect(patched.status).toBe(200);
    expect(patched.json).toMatchObject({ amountCents: 95_000 });
    expect((await callRoute(deleteBudgetRoute, { user: finance, method: "DELETE", params: { id } })).status).toBe(200);
    expect((await callRoute(deleteBudgetRoute, { user: finance, method: "DELETE", params: { id } })).status).toBe(404);
  });
});
