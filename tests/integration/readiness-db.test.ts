import { and, count, eq, ne } from "drizzle-orm";
import type { Client } from "@libsql/client";
import { drizzle } from "drizzle-orm/libsql";
import { beforeAll, describe, expect, it, vi } from "vitest";
import { GET as readinessRoute } from "@/app/api/vehicles/[id]/readiness/route";
import type { Database } from "@/db/client";
import { fleetReadinessCounts, loadFleetReadiness, loadVehicleReadiness } from "@/db/readiness";
import { addMonths } from "@/lib/readiness";
import * as schema from "@/db/schema";
import { defects, memberships, users, vehicles } from "@/db/schema";
import { defineAbilityFor, type Actor } from "@/lib/permissions";
import { useTestDatabase } from "../helpers/db";
import { callRoute, requestUser } from "../helpers/route";
import { signedInAs } from "../helpers/users";
import { MIRRABEL, makeEdition, makeFitment, makeVehicle, orgId, userId, uuid, type LineSpec } from "../unit/defects/db-fixtures";

vi.mock("@/lib/server/session", async (original) => ({
  ...(await original<typeof import("@/lib/server/session")>()),
  currentUser: async () => requestUser.current,
}));

// Readiness rules are Rigline's own (lib/readiness: not ready / limited / ready, with reasons);
// every expectation below is worked out by hand in its comment from those rules and the
// fixture dates. No external source.

const database = await useTestDatabase();
const NOW = new Date("2026-06-15T00:00:00Z");
const day = (iso: string) => new Date(`${iso}T00:00:00Z`);

const LINES: LineSpec[] = [
  { key: "extinguisher", code: "SA-01", title: "Fire extinguisher", category: "safety", checkable: true, expiryMonths: 12 },
  { key: "tracks", code: "RC-01", title: "Recovery tracks", category: "recovery", quantity: 2 },
  { key: "uhf", code: "CM-01", title: "UHF radio", category: "communications", evidenceNeeded: ["photo"] },
  { key: "drawers", code: "ST-01", title: "Cargo drawers", category: "storage" },
];

let org: string;
let edition: string;
let manager: Actor;
let driver: Actor;
const DRIVER_EMAIL = "driver.readiness@mirrabel-health.example";

/** A vehicle fitted to the whole edition; `skip` leaves lines out, `extinguisher` overrides its fitment. */
async function fittedVehicle(
  options: { skip?: string[]; extinguisher?: { fittedAt: Date; expiresAt?: Date | null }; tracks?: number; uhfProven?: boolean; state?: (typeof vehicles.state.enumValues)[number]; registrationExpiry?: Date; forDriver?: boolean } = {},
): Promise<string> {
  const id = await makeVehicle(database, org, {
    editionId: edition,
    state: options.state ?? "in_service",
    registration: `RD${Math.floor(Math.random() * 1e6)}`,
    registrationExpiry: options.registrationExpiry ?? day("2027-01-01"),
    drivers: options.forDriver ? [DRIVER_EMAIL] : [],
  });
  const skip = new Set(options.skip ?? []);
  if (!skip.has("extinguisher")) {
    await makeFitment(database, org, id, { lineKey: "extinguisher", label: "2.5 kg dry powder extinguisher", fittedAt: options.extinguisher?.fittedAt ?? day("2026-03-01"), expiresAt: options.extinguisher?.expiresAt ?? null });
  }
  if (!skip.has("tracks")) await makeFitment(database, org, id, { lineKey: "tracks", label: "Recovery tracks", quantity: options.tracks ?? 2, fittedAt: day("2026-01-10") });
  if (!skip.has("uhf")) await makeFitment(database, org, id, { lineKey: "uhf", label: "5 W UHF radio", fittedAt: day("2026-01-10"), acceptedEvidence: options.uhfProven === false ? [] : ["photo"] });
  if (!skip.has("drawers")) await makeFitment(database, org, id, { lineKey: "drawers", label: "Drawer set", fittedAt: day("2026-01-10") });
  return id;
}

async function openDefect(vehicleId: string, severity: "stop" | "before_next_trip" | "watch", description: string, state: (typeof defects.state.enumValues)[number] = "reported") {
  await database.insert(defects).values({ orgId: org, vehicleId, clientId: uuid(), severity, category: "other", description, state });
}

const readiness = async (vehicleId: string) => (await loadVehicleReadiness(database, manager, vehicleId, NOW))!;
const codes = (r: { reasons: { code: string }[] }) => r.reasons.map((x) => x.code);

beforeAll(async () => {
  org = await orgId(database, MIRRABEL);
  edition = await makeEdition(database, org, LINES);
  const m = await signedInAs(database, "manager@mirrabel-health.example");
  manager = { userId: m.userId, orgId: m.orgId, role: m.role, firmId: null, depotId: null };
  const [u] = await database.insert(users).values({ email: DRIVER_EMAIL, name: "Test Readiness Driver" }).returning();
  await database.insert(memberships).values({ orgId: org, userId: u!.id, role: "driver" });
  driver = { userId: u!.id, orgId: org, role: "driver", firmId: null, depotId: null };
});

describe("readiness of one vehicle, read from the database", () => {
  it("is ready when every line is met, nothing expires soon and no defect is open", async () => {
    // Extinguisher fitted 2026-03-01 + 12 months = 2027-03-01, registration 2027-01-01: both
    // more than 30 days after 2026-06-15. All four lines met (the radio's photo accepted).
    const r = await readiness(await fittedVehicle());
    expect(r.state).toBe("ready");
    expect(r.headline).toBe("Ready for the trip.");
    expect(r.reasons).toEqual([]);
    expect(r.expiringItems.map((i) => [i.label, i.expiresAt.toISOString().slice(0, 10)])).toEqual([
      ["Registration " + (await database.query.vehicles.findFirst({ where: eq(vehicles.id, r.vehicleId) }))!.registration, "2027-01-01"],
      ["Fire extinguisher (SA-01)", "2027-03-01"],
    ]);
  });

  it("is limited when a line's expiry in months runs out within 30 days", async () => {
    // Fitted 2025-07-01 + 12 months = 2026-07-01; from 2026-06-15 that is 16 days (15 left in
    // June + 1): within 30 → limited, "in 16 days".
    const r = await readiness(await fittedVehicle({ extinguisher: { fittedAt: day("2025-07-01") } }));
    expect(r.state).toBe("limited");
    expect(r.reasons).toEqual([
      { code: "item_expiring_soon", severity: "limited", message: "Fire extinguisher (SA-01) expires on 2026-07-01 (in 16 days). Town and graded roads only until it is replaced." },
    ]);
  });

  it("is not ready when a fitment's own expiry date has passed (the line is short as well)", async () => {
    // expiresAt 2026-06-01 ≤ 2026-06-15: the extinguisher no longer counts, so the safety line
    // is short by 1 (a critical category) and the item itself has expired.
    const r = await readiness(await fittedVehicle({ extinguisher: { fittedAt: day("2026-01-01"), expiresAt: day("2026-06-01") } }));
    expect(r.state).toBe("not_ready");
    expect(codes(r)).toEqual(["critical_line_short", "item_expired"]);
    expect(r.reasons[1]?.message).toBe("Fire extinguisher (SA-01) expired on 2026-06-01: replace it before the trip.");
  });

  it("is not ready with an expired registration", async () => {
    const r = await readiness(await fittedVehicle({ registrationExpiry: day("2026-06-10") }));
    expect(r.state).toBe("not_ready");
    expect(r.reasons).toEqual([expect.objectContaining({ code: "item_expired", message: expect.stringMatching(/^Registration RD\d+ expired on 2026-06-10/) })]);
  });

  it("is not ready with one recovery track of two (a critical category short)", async () => {
    const r = await readiness(await fittedVehicle({ tracks: 1 }));
    expect(r.reasons).toEqual([
      { code: "critical_line_short", severity: "not_ready", ref: expect.any(String), message: 'Recovery line RC-01 "Recovery tracks" is short: 1 item missing.' },
    ]);
  });

  it("is limited when the radio is fitted but its photo is not accepted, or a storage line is missing", async () => {
    expect(codes(await readiness(await fittedVehicle({ uhfProven: false })))).toEqual(["line_unproven"]);
    const noDrawers = await readiness(await fittedVehicle({ skip: ["drawers"] }));
    expect(noDrawers.state).toBe("limited");
    expect(codes(noDrawers)).toEqual(["line_short"]);
  });

  it("counts open defects by severity, and only open ones", async () => {
    const id = await fittedVehicle();
    await openDefect(id, "watch", "Wiper blade smears");
    // A watch defect is a note only: still ready.
    expect((await readiness(id)).state).toBe("ready");
    await openDefect(id, "stop", "Already fixed", "resolved");
    await openDefect(id, "stop", "Duplicate", "merged");
    await openDefect(id, "before_next_trip", "Tailgate strut weak", "triaged");
    const limited = await readiness(id);
    expect(limited.state).toBe("limited");
    expect(codes(limited)).toEqual(["before_next_trip_defect", "watch_defect"]);
    expect(limited.reasons[0]?.message).toBe('Defect "Other: Tailgate strut weak" must be fixed before the next trip; until then, town and graded roads only.');
    await openDefect(id, "stop", "Brake line weeping", "in_repair");
    const stopped = await readiness(id);
    expect(stopped.state).toBe("not_ready");
    expect(codes(stopped)).toEqual(["stop_defect", "before_next_trip_defect", "watch_defect"]);
  });

  it("follows the vehicle's state: grounded not ready, in fit-out limited", async () => {
    expect(codes(await readiness(await fittedVehicle({ state: "grounded" })))).toEqual(["vehicle_grounded"]);
    expect(codes(await readiness(await fittedVehicle({ state: "in_fitout" })))).toEqual(["vehicle_in_fitout"]);
  });

  it("notes a vehicle with no edition and judges it on the rest", async () => {
    const id = await makeVehicle(database, org, { registrationExpiry: day("2027-01-01") });
    const r = await readiness(id);
    expect(r.state).toBe("ready");
    expect(codes(r)).toEqual(["no_edition"]);
  });

  it("adds calendar months, keeping the day or the month's last day", () => {
    expect(addMonths(day("2025-07-01"), 12).toISOString().slice(0, 10)).toBe("2026-07-01");
    expect(addMonths(day("2026-01-31"), 1).toISOString().slice(0, 10)).toBe("2026-02-28");
    expect(addMonths(day("2028-01-31"), 1).toISOString().slice(0, 10)).toBe("2028-02-29");
  });
});

describe("readiness of the fleet", () => {
  it("counts the driver's own vehicles by state, leaving out retired ones", async () => {
    await fittedVehicle({ forDriver: true }); // ready
    await fittedVehicle({ forDriver: true, skip: ["drawers"] }); // limited
    await fittedVehicle({ forDriver: true, tracks: 1 }); // not ready
    await fittedVehicle({ forDriver: true, state: "grounded" }); // not ready
    await fittedVehicle({ forDriver: true, state: "retired" }); // not counted
    expect(await fleetReadinessCounts(database, driver, NOW)).toEqual({ ready: 1, limited: 1, notReady: 2, total: 4 });
  });

  it("counts every non-retired vehicle of the organisation once for a manager, and none of another's", async () => {
    const counts = await fleetReadinessCounts(database, manager, NOW);
    const [n] = await database.select({ n: count() }).from(vehicles).where(and(eq(vehicles.orgId, org), ne(vehicles.state, "retired")));
    expect(counts.total).toBe(n!.n);
    expect(counts.ready + counts.limited + counts.notReady).toBe(counts.total);
    const fleet = await loadFleetReadiness(database, manager, NOW);
    expect(new Set(fleet.map((r) => r.vehicleId)).size).toBe(fleet.length);
  });

  it("runs the same number of queries for one vehicle as for the whole organisation", async () => {
    let queries = 0;
    // The same libSQL connection, with a logger that counts every statement.
    const client = (database as unknown as { $client: Client }).$client;
    const counting = drizzle(client, { schema, logger: { logQuery: () => void queries++ } }) as unknown as Database;
    await loadFleetReadiness(counting, manager, NOW);
    const fleet = queries;
    queries = 0;
    await loadVehicleReadiness(counting, manager, (await loadFleetReadiness(database, manager, NOW))[0]!.vehicleId, NOW);
    expect(fleet).toBeGreaterThan(0);
    expect(queries).toBe(fleet);
  });

  it("counts the fleet in brief with a number of queries that does not grow with the fleet", async () => {
    let queries = 0;
    const client = (database as unknown as { $client: Client }).$client;
    const counting = drizzle(client, { schema, logger: { logQuery: () => void queries++ } }) as unknown as Database;
    const warmCount = async () => {
      await fleetReadinessCounts(database, manager, NOW); // judges and stores what is not yet summarised
      queries = 0;
      const counts = await fleetReadinessCounts(counting, manager, NOW);
      return { counts, queries };
    };
    const before = await warmCount();
    for (let i = 0; i < 5; i++) await fittedVehicle({ tracks: 1 });
    await makeVehicle(database, org, { editionId: null });
    const after = await warmCount();
    expect(after.counts.total).toBe(before.counts.total + 6);
    expect(after.queries).toBe(before.queries);
  });
});

describe("GET /api/vehicles/{id}/readiness", () => {
  it("answers the readiness to an assigned driver, 404 to another driver and to another organisation", async () => {
    // The route judges at the real time of the call: dates far from it keep the case stable.
    const id = await fittedVehicle({ forDriver: true, tracks: 1, registrationExpiry: day("2099-01-01"), extinguisher: { fittedAt: new Date() } });
    const driverUser = { ...driver, email: DRIVER_EMAIL, name: "Test Readiness Driver", orgName: "Mirrabel", timeZone: "Australia/Darwin", via: "session" as const, ability: defineAbilityFor(driver) };
    const mine = await callRoute(readinessRoute, { user: driverUser, params: { id } });
    expect(mine.status).toBe(200);
    expect(mine.json).toMatchObject({ vehicleId: id, state: "not_ready", reasons: [{ code: "critical_line_short" }] });
    expect((await callRoute(readinessRoute, { user: await signedInAs(database, "driver@mirrabel-health.example"), params: { id } })).status).toBe(404);
    expect((await callRoute(readinessRoute, { user: await signedInAs(database, "manager@gidgee-trust.example"), params: { id } })).status).toBe(404);
    expect(await userId(database, DRIVER_EMAIL)).toBe(driver.userId);
  });
});
