import { and, eq, inArray, isNull } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { fleetReadinessCounts, fleetReadinessStates, loadFleetReadiness, readinessByVehicle, readinessStatesFromFigures } from "@/db/readiness";
import { varianceFiguresFor } from "@/db/variance-summary";
import { defects, editionLines, fitments, vehicles, vehicleVarianceSummaries } from "@/db/schema";
import type { Actor } from "@/lib/permissions";
import { useTestDatabase } from "../helpers/db";
import { signedInAs } from "../helpers/users";

// Readiness in brief (lib/readiness/brief.ts, read from the variance summaries) must give the
// state the full judgement gives (db/readiness.ts, loadFleetReadiness). Every check compares the
// two on the demo fleet, after one kind of change; the expected states are the full judgement's
// own, computed in the same test, none typed in by hand.

const database = await useTestDatabase();
const manager = await signedInAs(database, "manager@mirrabel-health.example");
const driver = await signedInAs(database, "driver@mirrabel-health.example");
const contractor = await signedInAs(database, "contractor@tallowbark-fitout.example");
const DAY_MS = 86_400_000;

const vehicleOf = async (fleetNumber: string) =>
  (await database.query.vehicles.findFirst({ where: and(eq(vehicles.orgId, manager.orgId), eq(vehicles.fleetNumber, fleetNumber)) }))!;

/** The states in brief of the named vehicles, as the register's readiness filter reads them. */
async function readinessStatesFor(actor: Actor, ids: string[], now: Date) {
  return (await readinessStatesFromFigures(database, actor, await varianceFiguresFor(database, actor, ids, now), now)).byVehicle;
}

async function expectBriefAsFull(actor: Actor = manager, now = new Date()) {
  const full = await loadFleetReadiness(database, actor, now);
  const counts = await fleetReadinessCounts(database, actor, now);
  expect(counts).toEqual({
    ready: full.filter((r) => r.state === "ready").length,
    limited: full.filter((r) => r.state === "limited").length,
    notReady: full.filter((r) => r.state === "not_ready").length,
    total: full.length,
  });
  const everyone = await loadFleetReadiness(database, actor, now, { includeRetired: true });
  const states = await readinessStatesFor(actor, everyone.map((r) => r.vehicleId), now);
  expect(Object.fromEntries(states)).toEqual(Object.fromEntries(everyone.map((r) => [r.vehicleId, r.state])));
  return everyone;
}

describe("readiness in brief equals the full judgement", () => {
  it("on the demo fleet as seeded, which has every state", async () => {
    const all = await expectBriefAsFull();
    expect(new Set(all.map((r) => r.state))).toEqual(new Set(["ready", "limited", "not_ready"]));
  });

  it("cold (no summaries) and warm", async () => {
    await database.delete(vehicleVarianceSummaries);
    await expectBriefAsFull();
    await expectBriefAsFull();
  });

  it("for a driver's and a contractor's own vehicles", async () => {
    expect((await expectBriefAsFull(driver)).length).toBeGreaterThan(0);
    expect((await expectBriefAsFull(contractor)).length).toBeGreaterThan(0);
  });

  it("weeks and a year ahead, as expiries pass", async () => {
    await expectBriefAsFull(manager, new Date(Date.now() + 20 * DAY_MS));
    await expectBriefAsFull(manager, new Date(Date.now() + 45 * DAY_MS));
    await expectBriefAsFull(manager, new Date(Date.now() + 400 * DAY_MS));
  });

  it("after defects are raised at each severity and one is closed", async () => {
    const [a, b, c] = [await vehicleOf("MH-001"), await vehicleOf("MH-002"), await vehicleOf("MH-003")];
    const raised = (vehicleId: string, severity: "stop" | "before_next_trip" | "watch") =>
      ({ orgId: manager.orgId, vehicleId, clientId: crypto.randomUUID(), reportedBy: driver.userId, category: "brakes", description: "Noted on the track", severity }) as const;
    await database.insert(defects).values([raised(a.id, "stop"), raised(b.id, "before_next_trip"), raised(c.id, "watch")]);
    await expectBriefAsFull();
    await database.update(defects).set({ state: "closed" }).where(eq(defects.vehicleId, a.id));
    await expectBriefAsFull();
  });

  it("after vehicles change state and registrations come due or lapse", async () => {
    await database.update(vehicles).set({ state: "in_fitout" }).where(eq(vehicles.id, (await vehicleOf("MH-004")).id));
    await database.update(vehicles).set({ state: "grounded", groundedReason: "Cracked chassis rail" }).where(eq(vehicles.id, (await vehicleOf("MH-005")).id));
    await database.update(vehicles).set({ state: "retired" }).where(eq(vehicles.id, (await vehicleOf("MH-006")).id));
    await database.update(vehicles).set({ registrationExpiry: new Date(Date.now() + 5 * DAY_MS) }).where(eq(vehicles.id, (await vehicleOf("MH-007")).id));
    await database.update(vehicles).set({ registrationExpiry: new Date(Date.now() - DAY_MS) }).where(eq(vehicles.id, (await vehicleOf("MH-008")).id));
    await expectBriefAsFull();
  });

  it("after fitments expire or come due, on vehicles with an edition and without", async () => {
    const withEdition = await vehicleOf("MH-009");
    const [first] = await database.select({ id: fitments.id }).from(fitments).where(and(eq(fitments.vehicleId, withEdition.id), isNull(fitments.removedAt))).limit(1);
    await database.update(fitments).set({ expiresAt: new Date(Date.now() + 10 * DAY_MS) }).where(eq(fitments.id, first!.id));
    await expectBriefAsFull();
    await database.update(fitments).set({ expiresAt: new Date(Date.now() - DAY_MS) }).where(eq(fitments.id, first!.id));
    await expectBriefAsFull();

    const noEdition = (await database.select().from(vehicles).where(and(eq(vehicles.orgId, manager.orgId), isNull(vehicles.editionId))))[0]!;
    await database.insert(fitments).values({ orgId: manager.orgId, vehicleId: noEdition.id, label: "Snatch strap", fittedAt: new Date(Date.now() - 30 * DAY_MS), expiresAt: new Date(Date.now() + 12 * DAY_MS) });
    await expectBriefAsFull();
    expect((await readinessStatesFor(manager, [noEdition.id], new Date())).get(noEdition.id)).not.toBe("ready");
  });

  it("after an edition line's expiry in months changes (the fitments' dates then follow from it)", async () => {
    const editionId = (await vehicleOf("MH-010")).editionId!;
    const lines = await database.select({ id: editionLines.id }).from(editionLines).where(eq(editionLines.editionId, editionId)).limit(3);
    await database.update(editionLines).set({ expiryMonths: 1 }).where(inArray(editionLines.id, lines.map((l) => l.id)));
    await expectBriefAsFull();
    await expectBriefAsFull(manager, new Date(Date.now() + 40 * DAY_MS));
  });
});

describe("the home page's list of vehicles not ready", () => {
  it("names the same vehicles, in the same fleet-number order, as the full judgement", async () => {
    const now = new Date();
    const full = (await loadFleetReadiness(database, manager, now)).filter((r) => r.state === "not_ready");
    const brief = [...(await fleetReadinessStates(database, manager, now))].filter(([, state]) => state === "not_ready").map(([id]) => id);
    expect(brief).toEqual(full.map((r) => r.vehicleId));
    expect(brief.length).toBeGreaterThan(0);
  });
});

describe("readiness of named vehicles", () => {
  it("is the full judgement of those vehicles only, and leaves out ones the actor may not see", async () => {
    const all = await loadFleetReadiness(database, manager, new Date(), { includeRetired: true });
    const some = all.slice(0, 4);
    const named = await readinessByVehicle(database, manager, some.map((r) => r.vehicleId));
    expect([...named.keys()].sort()).toEqual(some.map((r) => r.vehicleId).sort());
    for (const r of some) expect(named.get(r.vehicleId)).toEqual(r);
    const forDriver = await readinessByVehicle(database, driver, all.map((r) => r.vehicleId));
    expect(forDriver.size).toBeLessThan(all.length);
    expect(forDriver.size).toBe((await loadFleetReadiness(database, driver, new Date(), { includeRetired: true })).length);
  });
});
