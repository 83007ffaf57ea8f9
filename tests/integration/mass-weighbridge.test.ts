import { and, eq } from "drizzle-orm";
import { beforeAll, describe, expect, it, vi } from "vitest";
import { GET as massRoute } from "@/app/api/vehicles/[id]/mass/route";
import { GET as statementRoute } from "@/app/api/vehicles/[id]/statement/route";
import { GET as listTicketsRoute, POST as postTicketRoute } from "@/app/api/vehicles/[id]/weighbridge/route";
import { auditEntries, contractorFirms, jobs, vehicles, weighbridgeTickets } from "@/db/schema";
import type { MassResponse } from "@/lib/commands/mass";
import { useTestDatabase } from "../helpers/db";
import { callRoute, requestUser } from "../helpers/route";
import { signedInAs } from "../helpers/users";

vi.mock("@/lib/server/session", async (original) => ({
  ...(await original<typeof import("@/lib/server/session")>()),
  currentUser: async () => requestUser.current,
}));

const database = await useTestDatabase();
type Signed = Awaited<ReturnType<typeof signedInAs>>;
let manager: Signed;
let finance: Signed;
let driver: Signed;
let contractor: Signed;
let otherManager: Signed;

async function vehicleRow(fleetNumber: string) {
  const row = await database.query.vehicles.findFirst({ where: eq(vehicles.fleetNumber, fleetNumber) });
  if (!row) throw new Error(`no vehicle ${fleetNumber}`);
  return row;
}

type Reconciled = {
  ticket: { id: string };
  measuredUpdated: boolean;
  reconciliation: { rows: { what: string; computedKg: number; measuredKg: number; differenceKg: number; withinTolerance: boolean }[]; flags: { code: string }[]; ok: boolean; toleranceKg: number };
};

beforeAll(async () => {
  manager = await signedInAs(database, "manager@mirrabel-health.example");
  finance = await signedInAs(database, "finance@mirrabel-health.example");
  driver = await signedInAs(database, "driver@mirrabel-health.example");
  contractor = await signedInAs(database, "contractor@tallowbark-fitout.example");
  otherManager = await signedInAs(database, "manager@gidgee-trust.example");
});

describe("POST /api/vehicles/{id}/weighbridge", () => {
  it("records the ticket, updates the measured masses in one go and flags a difference", async () => {
    const vehicle = await vehicleRow("MH-039"); // nothing fitted: computed = kerb 1240 front, 910 rear, 2150
    const { status, json } = await callRoute(postTicketRoute, {
      user: manager,
      params: { id: vehicle.id },
      body: { weighedAt: "2026-03-02", ticketNumber: "WB-20931", frontKg: 1255, rearKg: 1010, grossKg: 2265 },
    });
    expect(status).toBe(201);
    const r = json as Reconciled;
    expect(r.measuredUpdated).toBe(true);
    const after = await vehicleRow("MH-039");
    expect(after).toMatchObject({ measuredFrontKg: 1255, measuredRearKg: 1010, measuredGrossKg: 2265, version: vehicle.version + 1 });
    expect(after.measuredAt?.toISOString().slice(0, 10)).toBe("2026-03-02");
    // Reconciliation, hand-worked against the organisation's 50 kg tolerance:
    // front 1255 − 1240 = +15 (within), rear 1010 − 910 = +100 (flagged), gross 2265 − 2150 = +115 (flagged).
    expect(r.reconciliation.toleranceKg).toBe(50);
    expect(r.reconciliation.rows.map((row) => [row.what, row.differenceKg, row.withinTolerance])).toEqual([
      ["front", 15, true],
      ["rear", 100, false],
      ["gross", 115, false],
    ]);
    expect(r.reconciliation.flags.map((f) => f.code)).toEqual(["rear-differs", "gross-differs"]);
    const audits = await database.select().from(auditEntries).where(eq(auditEntries.entityId, after.id));
    expect(audits.map((a) => a.action)).toContain("vehicle.measured_masses");
    expect(await database.query.auditEntries.findFirst({ where: eq(auditEntries.entityId, r.ticket.id) })).toMatchObject({ action: "weighbridge.record" });

    // The mass figures now start from the weighed masses.
    const mass = await callRoute(massRoute, { user: manager, params: { id: vehicle.id }, url: `http://localhost/api/vehicles/${vehicle.id}/mass` });
    expect((mass.json as MassResponse).base).toMatchObject({ source: "measured", frontKg: 1255, rearKg: 1010 });

    // Readers see the ticket and the same reconciliation.
    const list = await callRoute(listTicketsRoute, { user: finance, params: { id: vehicle.id } });
    expect(list.status).toBe(200);
    expect((list.json as { items: { ticketNumber: string }[] }).items.map((t) => t.ticketNumber)).toEqual(["WB-20931"]);
    expect((list.json as { reconciliation: { ok: boolean } }).reconciliation.ok).toBe(false);
  });

  it("keeps a ticket within tolerance unflagged, and an older ticket does not replace newer masses", async () => {
    const vehicle = await vehicleRow("MH-037"); // Corvane, nothing fitted: 1300 front, 965 rear, 2265
    const within = await callRoute(postTicketRoute, {
      user: manager,
      params: { id: vehicle.id },
      body: { weighedAt: "2026-03-10", ticketNumber: "T-1", frontKg: 1320, rearKg: 990, grossKg: 2310 },
    });
    // Hand-worked: +20, +25, +45 kg, all within 50 kg.
    expect((within.json as Reconciled).reconciliation).toMatchObject({ ok: true, flags: [] });
    const older = await callRoute(postTicketRoute, {
      user: manager,
      params: { id: vehicle.id },
      body: { weighedAt: "2026-01-05", ticketNumber: "T-0", frontKg: 1200, rearKg: 900, grossKg: 2100 },
    });
    expect(older.status).toBe(201);
    expect((older.json as Reconciled).measuredUpdated).toBe(false);
    expect(await vehicleRow("MH-037")).toMatchObject({ measuredFrontKg: 1320, measuredRearKg: 990 });
  });

  it("flags a ticket whose gross disagrees with its own axles", async () => {
    const vehicle = await vehicleRow("MH-038");
    const { json } = await callRoute(postTicketRoute, {
      user: manager,
      params: { id: vehicle.id },
      body: { weighedAt: "2026-03-11", ticketNumber: "G-7", frontKg: 1390, rearKg: 1190, grossKg: 2700 },
    });
    // 2700 against an axle sum of 2580: 120 kg apart, beyond 50 kg.
    expect((json as Reconciled).reconciliation.flags.map((f) => f.code)).toContain("gross-inconsistent");
  });

  it("answers 422 naming the field and changes nothing for bad input", async () => {
    const vehicle = await vehicleRow("MH-036");
    for (const [body, field] of [
      [{ weighedAt: "2026-03-02", ticketNumber: "X", frontKg: "", rearKg: 1000, grossKg: 2000 }, "frontKg"],
      [{ weighedAt: "yesterday-ish", ticketNumber: "X", frontKg: 1000, rearKg: 1000, grossKg: 2000 }, "weighedAt"],
      [{ weighedAt: "2099-01-01", ticketNumber: "X", frontKg: 1000, rearKg: 1000, grossKg: 2000 }, "weighedAt"],
      [{ weighedAt: "2026-03-02", ticketNumber: "", frontKg: 1000, rearKg: 1000, grossKg: 2000 }, "ticketNumber"],
      [{ weighedAt: "2026-03-02", ticketNumber: "X", frontKg: 1000, rearKg: -5, grossKg: 2000 }, "rearKg"],
    ] as const) {
      const { status, json } = await callRoute(postTicketRoute, { user: manager, params: { id: vehicle.id }, body });
      expect(status, JSON.stringify(body)).toBe(422);
      expect((json as { error: { details: { field: string }[] } }).error.details.map((d) => d.field)).toContain(field);
    }
    expect(await database.select().from(weighbridgeTickets).where(eq(weighbridgeTickets.vehicleId, vehicle.id))).toHaveLength(0);
    expect((await vehicleRow("MH-036")).measuredAt).toBe(vehicle.measuredAt);
  });

  it("refuses a duplicate ticket number with 409", async () => {
    const vehicle = await vehicleRow("MH-039");
    const { status, json } = await callRoute(postTicketRoute, {
      user: manager,
      params: { id: vehicle.id },
      body: { weighedAt: "2026-03-03", ticketNumber: "WB-20931", frontKg: 1, rearKg: 1, grossKg: 2 },
    });
    expect(status).toBe(409);
    expect(json).toMatchObject({ error: { code: "conflict", details: [{ field: "ticketNumber" }] } });
  });

  it("lets roles record or read tickets as the permission table says", async () => {
    const vehicle = await vehicleRow("MH-035");
    const body = { weighedAt: "2026-03-02", ticketNumber: "R-1", frontKg: 1300, rearKg: 1000, grossKg: 2300 };
    expect((await callRoute(postTicketRoute, { user: finance, params: { id: vehicle.id }, body })).status).toBe(403);
    expect((await callRoute(postTicketRoute, { user: driver, params: { id: vehicle.id }, body })).status).toBe(403);
    expect((await callRoute(listTicketsRoute, { user: driver, params: { id: vehicle.id } })).status).toBe(403);
    expect((await callRoute(postTicketRoute, { user: otherManager, params: { id: vehicle.id }, body })).status).toBe(404);
    // A contractor records on a job awarded to their firm, and only then.
    expect((await callRoute(postTicketRoute, { user: contractor, params: { id: vehicle.id }, body })).status).toBe(404);
    const firm = await database.query.contractorFirms.findFirst({ where: eq(contractorFirms.name, "Tallowbark Fit-Out Workshop") });
    const [job] = await database
      .insert(jobs)
      .values({ orgId: manager.orgId, number: 9201, vehicleId: vehicle.id, title: "Weigh after fit-out", state: "awarded", awardedFirmId: firm!.id })
      .returning();
    const noJob = await callRoute(postTicketRoute, { user: contractor, params: { id: vehicle.id }, body });
    expect(noJob.status).toBe(422);
    expect(noJob.json).toMatchObject({ error: { details: [{ field: "jobId" }] } });
    const ok = await callRoute(postTicketRoute, { user: contractor, params: { id: vehicle.id }, body: { ...body, jobId: job!.id } });
    expect(ok.status).toBe(201);
    const stored = await database.query.weighbridgeTickets.findFirst({ where: and(eq(weighbridgeTickets.vehicleId, vehicle.id), eq(weighbridgeTickets.ticketNumber, "R-1")) });
    expect(stored).toMatchObject({ jobId: job!.id, recordedBy: contractor.userId });
  });
});

describe("GET /api/vehicles/{id}/statement", () => {
  it("answers a PDF that names the vehicle", async () => {
    const vehicle = await vehicleRow("MH-039");
    const { status, response } = await callRoute(statementRoute, {
      user: manager,
      params: { id: vehicle.id },
      url: `http://localhost/api/vehicles/${vehicle.id}/statement?occupants=2&includePlanned=1`,
    });
    expect(status).toBe(200);
    expect(response.headers.get("content-type")).toBe("application/pdf");
    expect(response.headers.get("content-disposition")).toContain("mass-statement-MH-039.pdf");
    const bytes = Buffer.from(await response.arrayBuffer());
    expect(bytes.subarray(0, 5).toString("latin1")).toBe("%PDF-");
    expect(bytes.toString("latin1")).toContain("MH-039");
    expect(bytes.length).toBeGreaterThan(2000);
  });

  it("is refused to a driver, unknown to another organisation, and checks its loading", async () => {
    const vehicle = await vehicleRow("MH-039");
    expect((await callRoute(statementRoute, { user: driver, params: { id: vehicle.id } })).status).toBe(403);
    expect((await callRoute(statementRoute, { user: otherManager, params: { id: vehicle.id } })).status).toBe(404);
    const bad = await callRoute(statementRoute, { user: manager, params: { id: vehicle.id }, url: "http://localhost/x?waterL=-3" });
    expect(bad.status).toBe(422);
    expect(bad.json).toMatchObject({ error: { details: [{ field: "waterL" }] } });
  });
});
