import { and, eq, inArray, sql } from "drizzle-orm";
import { beforeEach, describe, expect, it, vi } from "vitest";

vi.mock("@/lib/server/session", async (original) => ({
  ...(await original<typeof import("@/lib/server/session")>()),
  currentUser: async () => requestUser.current,
}));
import { makeDb, openClient } from "@/db/client";
import { clearRegisterPages, readRegisterRevision, registerPage } from "@/db/register-cache";
import {
  concessions,
  contractorFirms,
  defects,
  depots,
  editionLines,
  editions,
  evidence,
  fitments,
  jobOffers,
  jobs,
  lineDependencies,
  platforms,
  standards,
  users,
  vehicleDrivers,
  vehicles,
} from "@/db/schema";
import { listVehiclesPage, type RegisterPage, type VehicleListParams } from "@/db/vehicles";
import { listVehicles } from "@/lib/commands/vehicles";
import { execute } from "@/lib/server/operation";
import type { SignedIn } from "@/lib/server/session";
import { GET as listRoute } from "@/app/api/vehicles/route";
import { statementsDuring as statementsSent, useTestDatabase } from "../helpers/db";
import { callRoute, requestUser } from "../helpers/route";
import { signedInAs } from "../helpers/users";

// A kept register page must be exactly what the register would compute now. Every check below
// compares the page served (db/register-cache.ts) with the page computed afresh
// (listVehiclesPage) at the same instant; no expected page is typed in by hand.

const database = await useTestDatabase();
const manager = await signedInAs(database, "manager@mirrabel-health.example");
const contractor = await signedInAs(database, "contractor@tallowbark-fitout.example");
const FIRST_PAGE: VehicleListParams = { page: 1, pageSize: 25, sort: "fleetNumber", dir: "asc" };
const HOUR_MS = 3_600_000;
const DAY_MS = 24 * HOUR_MS;

const vehicleOf = async (fleetNumber: string) =>
  (await database.query.vehicles.findFirst({ where: and(eq(vehicles.orgId, manager.orgId), eq(vehicles.fleetNumber, fleetNumber)) }))!;

/** Serves the page, checks it against the page computed afresh, and returns it. */
async function expectServedCurrent(actor: SignedIn = manager, params: VehicleListParams = FIRST_PAGE, now = new Date()): Promise<RegisterPage> {
  const served = await registerPage(database, actor, params, now);
  const fresh = await listVehiclesPage(database, actor, params, now);
  expect(served).toEqual(fresh);
  return served;
}

/** Statements sent to the database while `run` runs. */
const statementsDuring = (run: () => Promise<unknown>) => statementsSent(database, run);

beforeEach(() => {
  clearRegisterPages(database);
});

describe("a kept register page", () => {
  it("is served again while nothing changes, with one statement (the revision) instead of the page's queries", async () => {
    const computed = await statementsDuring(() => expectServedCurrent());
    const kept = await statementsDuring(() => registerPage(database, manager, FIRST_PAGE, new Date()));
    expect(computed).toBeGreaterThan(3);
    expect(kept).toBe(1);
    expect(await registerPage(database, manager, FIRST_PAGE, new Date())).toBe(await registerPage(database, manager, FIRST_PAGE, new Date()));
  });

  it("is kept per request: another page, sort, filter or search is computed for itself", async () => {
    const first = await expectServedCurrent();
    const second = await expectServedCurrent(manager, { ...FIRST_PAGE, page: 2 });
    const byOdometer = await expectServedCurrent(manager, { ...FIRST_PAGE, sort: "odometerKm", dir: "desc" });
    const searched = await expectServedCurrent(manager, { ...FIRST_PAGE, q: "MH-01" });
    const noEdition = await expectServedCurrent(manager, { ...FIRST_PAGE, variance: "no_edition" });
    expect(second.items[0]!.fleetNumber).not.toBe(first.items[0]!.fleetNumber);
    expect(byOdometer.items.map((i) => i.id)).not.toEqual(first.items.map((i) => i.id));
    expect(searched.items.every((i) => i.fleetNumber.startsWith("MH-01"))).toBe(true);
    expect(noEdition.items.every((i) => i.variance === "no_edition")).toBe(true);
  });

  it("is kept per user: a contractor never gets the manager's page", async () => {
    const managers = await expectServedCurrent(manager);
    const contractors = await expectServedCurrent(contractor);
    expect(contractors.total).toBeLessThan(managers.total);
  });

  it("filtered by trip readiness is kept too, and a defect raised turns it at once", async () => {
    const params: VehicleListParams = { ...FIRST_PAGE, pageSize: 100, readiness: "ready" };
    const before = await expectServedCurrent(manager, params);
    expect(await statementsDuring(() => registerPage(database, manager, params, new Date()))).toBe(1);
    const vehicle = before.items[0]!;
    await database.insert(defects).values({
      orgId: manager.orgId,
      vehicleId: vehicle.id,
      clientId: crypto.randomUUID(),
      reportedBy: manager.userId,
      severity: "stop",
      category: "brakes",
      description: "Pedal sinks to the floor",
    });
    const after = await expectServedCurrent(manager, params);
    expect(after.items.map((i) => i.id)).not.toContain(vehicle.id);
  });

  it("filtered by trip readiness holds until an expiry comes within the look-ahead, then turns", async () => {
    const params: VehicleListParams = { ...FIRST_PAGE, pageSize: 100, readiness: "ready" };
    const now = new Date();
    const vehicle = (await listVehiclesPage(database, manager, params, now)).items[0]!;
    // Ready now; the registration runs out in 40 days, so the vehicle is limited from day 10 (30 days ahead, lib/readiness).
    await database.update(vehicles).set({ registrationExpiry: new Date(now.getTime() + 40 * DAY_MS) }).where(eq(vehicles.id, vehicle.id));
    expect((await expectServedCurrent(manager, params, now)).items.map((i) => i.id)).toContain(vehicle.id);
    // An hour on, nothing in the demo fleet has come due: the kept page is served.
    expect(await statementsDuring(() => registerPage(database, manager, params, new Date(now.getTime() + HOUR_MS)))).toBe(1);
    const day11 = new Date(now.getTime() + 11 * DAY_MS);
    expect((await expectServedCurrent(manager, params, day11)).items.map((i) => i.id)).not.toContain(vehicle.id);
  });

  it("is not served for an earlier instant than it was computed for", async () => {
    const now = new Date();
    await expectServedCurrent(manager, FIRST_PAGE, now);
    const earlier = new Date(now.getTime() - 400 * 24 * HOUR_MS);
    expect(await statementsDuring(() => expectServedCurrent(manager, FIRST_PAGE, earlier))).toBeGreaterThan(2);
  });
});

describe("time alone", () => {
  it("a page is not served past the first instant a fitment's expiry turns a status", async () => {
    const now = new Date();
    const page = await listVehiclesPage(database, manager, FIRST_PAGE, now);
    const meeting = page.items.find((i) => i.variance === "meets_standard");
    expect(meeting).toBeDefined();
    const [fitted] = await database.select({ id: fitments.id }).from(fitments).where(and(eq(fitments.vehicleId, meeting!.id), inArray(fitments.lineKey, sql`(select ${editionLines.key} from ${editionLines} where ${editionLines.editionId} = ${meeting!.edition!.id} and ${editionLines.requirement} = 'must_fit')`))).limit(1);
    // Every fitment on that line expires within the hour: the vehicle falls short when it does.
    const lineKey = (await database.query.fitments.findFirst({ where: eq(fitments.id, fitted!.id) }))!.lineKey!;
    await database.update(fitments).set({ expiresAt: new Date(now.getTime() + HOUR_MS) }).where(and(eq(fitments.vehicleId, meeting!.id), eq(fitments.lineKey, lineKey)));

    const atNow = await expectServedCurrent(manager, FIRST_PAGE, now);
    expect(atNow.items.find((i) => i.id === meeting!.id)!.variance).toBe("meets_standard");
    const halfAnHour = new Date(now.getTime() + HOUR_MS / 2);
    expect(await statementsDuring(() => registerPage(database, manager, FIRST_PAGE, halfAnHour))).toBe(1);
    const later = await expectServedCurrent(manager, FIRST_PAGE, new Date(now.getTime() + 2 * HOUR_MS));
    expect(later.items.find((i) => i.id === meeting!.id)!.variance).toBe("gaps");
  });
});

/** A write, and what it changes on the first page (null: nothing visible there, only the revision). */
type Write = [name: string, write: () => Promise<unknown>, actor?: SignedIn];

const writes: Write[] = [
  ["a vehicle's odometer", async () => database.update(vehicles).set({ odometerKm: 123_456 }).where(eq(vehicles.id, (await vehicleOf("MH-001")).id))],
  ["a vehicle added", async () => {
    const template = await vehicleOf("MH-001");
    await database.insert(vehicles).values({ orgId: manager.orgId, platformId: template.platformId, depotId: template.depotId, fleetNumber: "MH-000", state: "in_service" });
  }],
  ["a platform's model", async () => database.update(platforms).set({ model: "Renamed model" }).where(eq(platforms.id, (await vehicleOf("MH-002")).platformId))],
  ["a depot's name", async () => database.update(depots).set({ name: "Renamed depot" }).where(eq(depots.id, (await vehicleOf("MH-002")).depotId!))],
  ["a standard's name", async () => {
    const edition = await database.query.editions.findFirst({ where: eq(editions.id, (await vehicleOf("MH-002")).editionId!) });
    await database.update(standards).set({ name: "Renamed standard" }).where(eq(standards.id, edition!.standardId));
  }],
  ["an edition's status", async () => database.update(editions).set({ status: "retired" }).where(eq(editions.id, (await vehicleOf("MH-002")).editionId!))],
  ["a driver assigned", async () => {
    const driver = await database.query.users.findFirst({ where: eq(users.email, "driver2@mirrabel-health.example") });
    await database.insert(vehicleDrivers).values({ vehicleId: (await vehicleOf("MH-003")).id, userId: driver!.id }).onConflictDoNothing();
  }],
  ["an assigned driver's name", async () => {
    const [assigned] = await database
      .select({ userId: vehicleDrivers.userId })
      .from(vehicleDrivers)
      .innerJoin(vehicles, eq(vehicles.id, vehicleDrivers.vehicleId))
      .where(eq(vehicles.orgId, manager.orgId))
      .limit(1);
    await database.update(users).set({ name: "Renamed Driver" }).where(eq(users.id, assigned!.userId));
  }],
  ["a concession withdrawn", async () => database.delete(concessions).where(eq(concessions.orgId, manager.orgId))],
  ["every fitment of a vehicle meeting its standard removed", async () => {
    const page = await listVehiclesPage(database, manager, FIRST_PAGE, new Date());
    const meeting = page.items.find((i) => i.variance === "meets_standard");
    await database.delete(fitments).where(eq(fitments.vehicleId, meeting!.id));
  }],
  ["a must-fit line added to an edition in use", async () => {
    const editionId = (await vehicleOf("MH-004")).editionId!;
    await database.insert(editionLines).values({ orgId: manager.orgId, editionId, key: "cache-test-line", code: "Z9", category: "safety", title: "Cache test line", requirement: "must_fit", massKg: 1 });
  }],
  ["a job offered to a contractor's firm brings its vehicle into their register", async () => {
    const firm = await database.query.contractorFirms.findFirst({ where: eq(contractorFirms.id, contractor.firmId!) });
    const seen = new Set((await listVehiclesPage(database, contractor, { ...FIRST_PAGE, pageSize: 100 }, new Date())).items.map((i) => i.id));
    const all = await database.select({ id: vehicles.id }).from(vehicles).where(eq(vehicles.orgId, manager.orgId));
    const unseen = all.find((v) => !seen.has(v.id))!;
    const [{ n }] = (await database.select({ n: sql<number>`coalesce(max(${jobs.number}), 0) + 1` }).from(jobs).where(eq(jobs.orgId, manager.orgId))) as [{ n: number }];
    const [job] = await database.insert(jobs).values({ orgId: manager.orgId, number: n, vehicleId: unseen.id, title: "Cache test job" }).returning();
    await database.insert(jobOffers).values({ jobId: job!.id, firmId: firm!.id });
  }, contractor],
];

describe("after a write to anything a page shows, the page served is the page computed now", () => {
  it.each(writes)("%s", async (_name, write, actor = manager) => {
    const params = actor === contractor ? { ...FIRST_PAGE, pageSize: 100 } : FIRST_PAGE;
    const before = await expectServedCurrent(actor, params);
    const revision = await readRegisterRevision(database);
    await write();
    expect(await readRegisterRevision(database)).toBeGreaterThan(revision);
    const after = await expectServedCurrent(actor, params);
    expect(after).not.toEqual(before);
  });

  it("evidence, line dependencies and jobs raise the revision too", async () => {
    const editionId = (await vehicleOf("MH-005")).editionId!;
    const lines = await database.select({ id: editionLines.id }).from(editionLines).where(eq(editionLines.editionId, editionId)).limit(2);
    const steps: (() => Promise<unknown>)[] = [
      () => database.insert(lineDependencies).values({ lineId: lines[1]!.id, dependsOnLineId: lines[0]!.id }).onConflictDoNothing(),
      () => database.delete(lineDependencies).where(eq(lineDependencies.lineId, lines[1]!.id)),
      async () => database.update(jobs).set({ title: "Renamed job" }).where(eq(jobs.orgId, manager.orgId)),
      async () => database.update(evidence).set({ reviewReason: "Looked at again" }).where(eq(evidence.orgId, manager.orgId)),
    ];
    for (const step of steps) {
      await expectServedCurrent();
      const revision = await readRegisterRevision(database);
      await step();
      expect(await readRegisterRevision(database)).toBeGreaterThan(revision);
      await expectServedCurrent();
    }
  });

  it("every table a page reads has its triggers (insert, update, delete)", async () => {
    const tables = ["vehicles", "platforms", "depots", "editions", "standards", "vehicle_drivers", "jobs", "job_offers", "fitments", "concessions", "evidence", "edition_lines", "line_dependencies", "defects"];
    const triggers = await database.all<{ name: string; tbl_name: string }>(sql`select name, tbl_name from sqlite_master where type = 'trigger' and name like 'rr\\_%' escape '\\'`);
    for (const table of tables) {
      for (const event of ["insert", "update", "delete"]) expect(triggers).toContainEqual({ name: `rr_${table}_${event}`, tbl_name: table });
    }
    expect(triggers).toContainEqual({ name: "rr_users_name", tbl_name: "users" });
  });

  it("a write rolled back leaves the revision and the kept page as they were", async () => {
    const before = await expectServedCurrent();
    const revision = await readRegisterRevision(database);
    await expect(
      database.transaction(async (tx) => {
        await tx.update(vehicles).set({ odometerKm: 1 }).where(eq(vehicles.orgId, manager.orgId));
        throw new Error("undone for the test");
      }),
    ).rejects.toThrow("undone for the test");
    expect(await readRegisterRevision(database)).toBe(revision);
    expect(await expectServedCurrent()).toEqual(before);
  });

  it("a write through another connection to the same file is seen at once", async () => {
    const before = await expectServedCurrent();
    const [{ file }] = (await database.all<{ file: string }>(sql`select file from pragma_database_list where name = 'main'`)) as [{ file: string }];
    const other = openClient(`file:${file}`);
    try {
      await makeDb(other).update(vehicles).set({ costCentre: "CC-OTHER" }).where(eq(vehicles.id, before.items[0]!.id));
    } finally {
      other.close();
    }
    const after = await expectServedCurrent();
    expect(after.items[0]!.costCentre).toBe("CC-OTHER");
  });

  it("an API read through the operation serves the same page", async () => {
    const viaApi = await execute(listVehicles, manager, { pageSize: "25" });
    expect(viaApi).toEqual(await listVehiclesPage(database, manager, FIRST_PAGE, new Date()));
  });

  it("the route answers a kept page with the same JSON as the page computed afresh", async () => {
    const url = "http://localhost/api/vehicles?pageSize=25";
    const first = await callRoute(listRoute, { user: manager, url });
    const second = await callRoute(listRoute, { user: manager, url });
    const fresh = JSON.parse(JSON.stringify(await listVehiclesPage(database, manager, FIRST_PAGE, new Date())));
    for (const answer of [first, second]) {
      expect(answer.status).toBe(200);
      expect(answer.response.headers.get("content-type")).toBe("application/json");
      expect(answer.json).toEqual(fresh);
    }
    const refused = await callRoute(listRoute, { user: manager, url: "http://localhost/api/vehicles?pageSize=500" });
    expect(refused.status).toBe(422);
  });
});
