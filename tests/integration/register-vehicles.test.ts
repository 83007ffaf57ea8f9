import { and, eq, inArray, sql } from "drizzle-orm";
import { beforeAll, describe, expect, it, vi } from "vitest";
import { GET as getVehicleRoute, PATCH as patchVehicleRoute } from "@/app/api/vehicles/[id]/route";
import { POST as bulkRoute } from "@/app/api/vehicles/bulk/route";
import { GET as listRoute, POST as createRoute } from "@/app/api/vehicles/route";
import {
  auditEntries,
  contractorFirms,
  depots,
  editionLines,
  editions,
  fitments,
  memberships,
  platforms,
  standards,
  users,
  vehicleDrivers,
  vehicles,
} from "@/db/schema";
import { groundVehicle, returnVehicleToService } from "@/lib/commands/vehicles";
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
const manager = await signedInAs(database, "manager@mirrabel-health.example");

type Row = {
  id: string;
  fleetNumber: string;
  vin: string | null;
  registration: string | null;
  state: string;
  odometerKm: number | null;
  updatedAt: string;
  version: number;
  platform: { id: string; make: string; model: string; variant: string };
  depot: { id: string; name: string } | null;
  edition: { id: string } | null;
  variance: string;
  drivers: { id: string; name: string }[];
};
type Page = { items: Row[]; page: number; pageSize: number; total: number; pageCount: number };
type ErrorJson = { error: { code: string; message: string; details: { field?: string; message: string }[] } };

async function list(user: SignedIn, params: Record<string, string | number> = {}) {
  const search = new URLSearchParams(Object.entries(params).map(([k, v]) => [k, String(v)]));
  const { status, json } = await callRoute(listRoute, { user, url: `http://localhost/api/vehicles?${search}` });
  return { status, page: json as Page, error: json as ErrorJson };
}

async function allOf(user: SignedIn, params: Record<string, string | number> = {}) {
  const { page } = await list(user, { ...params, pageSize: 100 });
  return page;
}

const orgVehicles = () => database.select().from(vehicles).where(eq(vehicles.orgId, manager.orgId));
const byFleet = async (fleetNumber: string) => (await database.query.vehicles.findFirst({ where: eq(vehicles.fleetNumber, fleetNumber) }))!;

let publishedEditionId: string;
let draftEditionId: string;
let standardId: string;

beforeAll(async () => {
  // An invented standard with one published edition of one must-fit line, and a draft.
  const [standard] = await database.insert(standards).values({ orgId: manager.orgId, name: "Register test standard" }).returning();
  standardId = standard!.id;
  const [published] = await database
    .insert(editions)
    .values({ orgId: manager.orgId, standardId, number: 1, status: "published", publishedAt: new Date() })
    .returning();
  publishedEditionId = published!.id;
  const [draft] = await database.insert(editions).values({ orgId: manager.orgId, standardId, number: 2, status: "draft" }).returning();
  draftEditionId = draft!.id;
  await database.insert(editionLines).values({
    orgId: manager.orgId,
    editionId: publishedEditionId,
    key: "reg-recovery-kit",
    code: "R1",
    category: "recovery",
    title: "Recovery kit",
    requirement: "must_fit",
    quantity: 1,
    massKg: 12,
  });
});

describe("the register: pagination", () => {
  it("pages through every vehicle of the organisation with the right totals", async () => {
    const seen = new Set<string>();
    const first = await list(manager, { pageSize: 7 });
    expect(first.status).toBe(200);
    expect(first.page).toMatchObject({ page: 1, pageSize: 7, total: 40, pageCount: 6 });
    for (let p = 1; p <= 6; p++) {
      const { page } = await list(manager, { pageSize: 7, page: p });
      expect(page.items.length).toBe(p < 6 ? 7 : 5);
      for (const item of page.items) seen.add(item.id);
    }
    expect(seen.size).toBe(40);
  });

  it("refuses a page size above 100 and a bad sort, naming the parameter", async () => {
    const big = await list(manager, { pageSize: 101 });
    expect(big.status).toBe(422);
    expect(big.error.error.details[0]!.field).toBe("pageSize");
    const sort = await list(manager, { sort: "colour" });
    expect(sort.status).toBe(422);
    expect(sort.error.error.details[0]!.field).toBe("sort");
  });

  it("answers the last page when asked for one past the end", async () => {
    const { page } = await list(manager, { pageSize: 25, page: 9 });
    expect(page.page).toBe(2);
    expect(page.items).toHaveLength(15);
  });
});

describe("the register: filters", () => {
  it("filters by depot", async () => {
    const depot = await database.query.depots.findFirst({ where: and(eq(depots.orgId, manager.orgId), eq(depots.code, "SPC")) });
    const page = await allOf(manager, { depotId: depot!.id });
    const expected = (await orgVehicles()).filter((v) => v.depotId === depot!.id);
    expect(page.total).toBe(expected.length);
    expect(page.items.every((i) => i.depot?.id === depot!.id)).toBe(true);
  });

  it("filters by platform", async () => {
    const platform = await database.query.platforms.findFirst({ where: and(eq(platforms.orgId, manager.orgId), eq(platforms.make, "Marrak")) });
    const page = await allOf(manager, { platformId: platform!.id });
    expect(page.total).toBe((await orgVehicles()).filter((v) => v.platformId === platform!.id).length);
    expect(page.items.every((i) => i.platform.id === platform!.id)).toBe(true);
  });

  it("filters by state", async () => {
    for (const state of ["in_service", "in_fitout", "grounded", "retired"] as const) {
      const page = await allOf(manager, { state });
      const expected = (await orgVehicles()).filter((v) => v.state === state).map((v) => v.fleetNumber).sort();
      expect(page.items.map((i) => i.fleetNumber), state).toEqual(expected);
    }
    // The demo seed grounds MH-008 and MH-024 and retires the last vehicle.
    expect((await allOf(manager, { state: "grounded" })).items.map((i) => i.fleetNumber)).toEqual(expect.arrayContaining(["MH-008", "MH-024"]));
    expect((await allOf(manager, { state: "retired" })).items.map((i) => i.fleetNumber)).toContain("MH-040");
  });

  it("filters by edition, standard and variance status, computed from fitments", async () => {
    const [a, b, c] = [await byFleet("MH-011"), await byFleet("MH-012"), await byFleet("MH-013")];
    const bulk = await callRoute(bulkRoute, {
      user: manager,
      body: { action: "assign_edition", vehicleIds: [a.id, b.id, c.id], editionId: publishedEditionId },
    });
    expect(bulk.status).toBe(200);
    // MH-011 and MH-013 carry the kit; MH-012 does not, so its line is short.
    await database.insert(fitments).values(
      [a, c].map((v) => ({ orgId: manager.orgId, vehicleId: v.id, lineKey: "reg-recovery-kit", label: "Recovery kit", fittedAt: new Date(Date.now() - 86_400_000) })),
    );
    const byEdition = await allOf(manager, { editionId: publishedEditionId });
    expect(byEdition.items.map((i) => i.fleetNumber)).toEqual(["MH-011", "MH-012", "MH-013"]);
    expect(byEdition.items.map((i) => i.variance)).toEqual(["meets_standard", "gaps", "meets_standard"]);
    const byStandard = await allOf(manager, { standardId });
    expect(byStandard.total).toBe(3);
    const meets = await allOf(manager, { standardId, variance: "meets_standard" });
    expect(meets.items.map((i) => i.fleetNumber)).toEqual(["MH-011", "MH-013"]);
    expect(meets.total).toBe(2);
    const gaps = await allOf(manager, { standardId, variance: "gaps" });
    expect(gaps.items.map((i) => i.fleetNumber)).toEqual(["MH-012"]);
    const withoutEdition = await allOf(manager, { variance: "no_edition" });
    const expected = (await orgVehicles()).filter((v) => v.editionId === null).length;
    expect(withoutEdition.total).toBe(expected);
    expect(withoutEdition.items.every((i) => i.edition === null && i.variance === "no_edition")).toBe(true);
  });

  it("pages a variance filter after filtering, with the right total", async () => {
    const first = await list(manager, { standardId, variance: "meets_standard", pageSize: 1, page: 2 });
    expect(first.page).toMatchObject({ total: 2, pageCount: 2, page: 2 });
    expect(first.page.items.map((i) => i.fleetNumber)).toEqual(["MH-013"]);
  });
});

describe("the register: sorting", () => {
  const monotonic = <T>(values: T[], dir: "asc" | "desc", cmp: (a: T, b: T) => number) =>
    values.every((v, i) => i === 0 || (dir === "asc" ? cmp(values[i - 1]!, v) <= 0 : cmp(values[i - 1]!, v) >= 0));
  const text = (a: string, b: string) => (a < b ? -1 : a > b ? 1 : 0);

  it("sorts by fleet number both ways", async () => {
    expect((await allOf(manager, { sort: "fleetNumber", dir: "desc" })).items[0]!.fleetNumber).toBe("MH-040");
    expect((await allOf(manager, { sort: "fleetNumber", dir: "asc" })).items[0]!.fleetNumber).toBe("MH-001");
  });

  it("sorts by registration, odometer and update time, empty values last", async () => {
    for (const dir of ["asc", "desc"] as const) {
      const rego = (await allOf(manager, { sort: "registration", dir })).items.map((i) => i.registration ?? "");
      expect(monotonic(rego, dir, text), `registration ${dir}`).toBe(true);
      const odo = (await allOf(manager, { sort: "odometerKm", dir })).items.map((i) => i.odometerKm ?? 0);
      expect(monotonic(odo, dir, (a, b) => a - b), `odometer ${dir}`).toBe(true);
      const updated = (await allOf(manager, { sort: "updatedAt", dir })).items.map((i) => Date.parse(i.updatedAt));
      expect(monotonic(updated, dir, (a, b) => a - b), `updatedAt ${dir}`).toBe(true);
    }
    const vehicle = await byFleet("MH-030");
    await database.update(vehicles).set({ odometerKm: null }).where(eq(vehicles.id, vehicle.id));
    for (const dir of ["asc", "desc"] as const) {
      const items = (await allOf(manager, { sort: "odometerKm", dir })).items;
      expect(items.at(-1)!.fleetNumber, dir).toBe("MH-030");
    }
  });

  it("sorts by platform and depot names", async () => {
    for (const dir of ["asc", "desc"] as const) {
      const plat = (await allOf(manager, { sort: "platform", dir })).items.map((i) => `${i.platform.make} ${i.platform.model}`);
      expect(monotonic(plat, dir, text), `platform ${dir}`).toBe(true);
      const depot = (await allOf(manager, { sort: "depot", dir })).items.map((i) => i.depot?.name ?? "");
      expect(monotonic(depot, dir, text), `depot ${dir}`).toBe(true);
    }
  });

  it("sorts by state in the order of the working day: in service, in fit-out, grounded, retired", async () => {
    const order = ["in_service", "in_fitout", "grounded", "retired"];
    const states = (await allOf(manager, { sort: "state", dir: "asc" })).items.map((i) => order.indexOf(i.state));
    expect(monotonic(states, "asc", (a, b) => a - b)).toBe(true);
    expect((await allOf(manager, { sort: "state", dir: "desc" })).items[0]!.state).toBe("retired");
  });
});

describe("the register: search", () => {
  it("finds a vehicle by its whole or partial VIN, in any case", async () => {
    const vehicle = await byFleet("MH-017");
    expect((await allOf(manager, { q: vehicle.vin! })).items.map((i) => i.fleetNumber)).toEqual(["MH-017"]);
    expect((await allOf(manager, { q: vehicle.vin!.slice(3, 11).toLowerCase() })).items.map((i) => i.fleetNumber)).toContain("MH-017");
  });

  it("finds a vehicle by registration, with or without its dash", async () => {
    const vehicle = await byFleet("MH-021");
    expect((await allOf(manager, { q: vehicle.registration! })).items.map((i) => i.fleetNumber)).toEqual(["MH-021"]);
    expect((await allOf(manager, { q: vehicle.registration!.replace("-", "") })).items.map((i) => i.fleetNumber)).toEqual(["MH-021"]);
  });

  it("finds vehicles by fleet number, and treats LIKE wildcards as plain text", async () => {
    expect((await allOf(manager, { q: "mh-03" })).items.map((i) => i.fleetNumber)).toEqual(
      ["MH-030", "MH-031", "MH-032", "MH-033", "MH-034", "MH-035", "MH-036", "MH-037", "MH-038", "MH-039"],
    );
    expect((await allOf(manager, { q: "%" })).total).toBe(0);
  });
});

describe("the register: who sees what", () => {
  it("shows a driver only the vehicles assigned to them", async () => {
    const driver = await signedInAs(database, "driver@mirrabel-health.example");
    const assigned = await database.select().from(vehicleDrivers).where(eq(vehicleDrivers.userId, driver.userId));
    expect(assigned.length).toBeGreaterThan(0);
    const page = await allOf(driver, {});
    expect(page.total).toBe(assigned.length);
    expect(page.items.map((i) => i.id).sort()).toEqual(assigned.map((a) => a.vehicleId).sort());
    expect(page.items.every((i) => i.drivers.some((d) => d.id === driver.userId))).toBe(true);
    const other = (await orgVehicles()).find((v) => !assigned.some((a) => a.vehicleId === v.id))!;
    expect((await callRoute(getVehicleRoute, { user: driver, params: { id: other.id } })).status).toBe(404);
  });

  it("shows a contractor whose firm has no jobs no vehicles at all", async () => {
    const [firm] = await database.insert(contractorFirms).values({ orgId: manager.orgId, name: "Gibber Plain Motors", email: "desk@gibber-plain.example" }).returning();
    const [user] = await database.insert(users).values({ email: "fitter@gibber-plain.example", name: "Wren Tulloch" }).returning();
    await database.insert(memberships).values({ orgId: manager.orgId, userId: user!.id, role: "contractor", firmId: firm!.id });
    const contractor = await signedInAs(database, "fitter@gibber-plain.example");
    const page = await allOf(contractor, {});
    expect(page).toMatchObject({ total: 0, items: [], pageCount: 0 });
  });

  it("answers 404 for another organisation's vehicle, and 403 to roles that may not write", async () => {
    const other = await signedInAs(database, "manager@gidgee-trust.example");
    const mine = await byFleet("MH-002");
    expect((await callRoute(getVehicleRoute, { user: other, params: { id: mine.id } })).status).toBe(404);
    const patch = await callRoute(patchVehicleRoute, { user: other, method: "PATCH", params: { id: mine.id }, body: { version: mine.version, odometerKm: 1 } });
    expect(patch.status).toBe(404);
    expect((await allOf(other, {})).items.every((i) => i.fleetNumber.startsWith("GT-"))).toBe(true);
    const finance = await signedInAs(database, "finance@mirrabel-health.example");
    expect((await callRoute(patchVehicleRoute, { user: finance, method: "PATCH", params: { id: mine.id }, body: { version: mine.version } })).status).toBe(403);
    const driver = await signedInAs(database, "driver@mirrabel-health.example");
    const platform = await database.query.platforms.findFirst({ where: eq(platforms.orgId, manager.orgId) });
    expect((await callRoute(createRoute, { user: driver, body: { fleetNumber: "MH-900", platformId: platform!.id } })).status).toBe(403);
    expect((await callRoute(bulkRoute, { user: driver, body: { action: "move_depot", vehicleIds: [mine.id], depotId: mine.depotId } })).status).toBe(403);
  });
});

describe("bulk actions", () => {
  it("moves vehicles to a depot in one transaction with one audit entry per vehicle", async () => {
    const depot = await database.query.depots.findFirst({ where: and(eq(depots.orgId, manager.orgId), eq(depots.code, "TRJ")) });
    const chosen = [await byFleet("MH-001"), await byFleet("MH-002")]; // at OCW and SPC
    const { status, json } = await callRoute(bulkRoute, { user: manager, body: { action: "move_depot", vehicleIds: chosen.map((v) => v.id), depotId: depot!.id } });
    expect(status).toBe(200);
    expect(json).toMatchObject({ action: "move_depot", requested: 2, updated: 2, unchanged: 0, target: "Tarrin Junction" });
    for (const v of chosen) {
      const after = await byFleet(v.fleetNumber);
      expect(after.depotId).toBe(depot!.id);
      expect(after.version).toBe(v.version + 1);
      const audit = await database.select().from(auditEntries).where(and(eq(auditEntries.entityId, v.id), eq(auditEntries.action, "vehicle.move_depot")));
      expect(audit).toHaveLength(1);
      expect(audit[0]!.before).toEqual({ depotId: v.depotId });
    }
  });

  it("refuses the whole request when one id is unknown or another organisation's, changing nothing", async () => {
    const mine = [await byFleet("MH-004"), await byFleet("MH-005")];
    const theirs = await byFleet("GT-001");
    const auditBefore = (await database.select({ n: sql<number>`count(*)` }).from(auditEntries))[0]!.n;
    for (const bad of ["no-such-vehicle", theirs.id]) {
      const { status, json } = await callRoute(bulkRoute, {
        user: manager,
        body: { action: "assign_edition", vehicleIds: [mine[0]!.id, bad, mine[1]!.id], editionId: publishedEditionId },
      });
      expect(status).toBe(404);
      expect((json as ErrorJson).error.details).toEqual([{ field: "vehicleIds.1", message: "No such vehicle in this organisation" }]);
    }
    const after = await database.select().from(vehicles).where(inArray(vehicles.id, mine.map((m) => m.id)));
    expect(after.map((v) => [v.id, v.editionId, v.version]).sort()).toEqual(mine.map((v) => [v.id, v.editionId, v.version]).sort());
    expect((await database.select({ n: sql<number>`count(*)` }).from(auditEntries))[0]!.n).toBe(auditBefore);
  });

  it("assigns only a published edition", async () => {
    const v = await byFleet("MH-006");
    const { status, json } = await callRoute(bulkRoute, { user: manager, body: { action: "assign_edition", vehicleIds: [v.id], editionId: draftEditionId } });
    expect(status).toBe(409);
    expect((json as ErrorJson).error.details[0]!.field).toBe("editionId");
    const missingTarget = await callRoute(bulkRoute, { user: manager, body: { action: "assign_edition", vehicleIds: [v.id] } });
    expect(missingTarget.status).toBe(422);
    expect((missingTarget.json as ErrorJson).error.details[0]!.field).toBe("editionId");
  });

  it("counts vehicles already there as unchanged", async () => {
    const v = await byFleet("MH-011");
    const { json } = await callRoute(bulkRoute, { user: manager, body: { action: "assign_edition", vehicleIds: [v.id], editionId: publishedEditionId } });
    expect(json).toMatchObject({ updated: 0, unchanged: 1 });
  });
});

describe("creating and editing a vehicle", () => {
  const platformId = async () => (await database.query.platforms.findFirst({ where: eq(platforms.orgId, manager.orgId) }))!.id;

  it("refuses a VIN with a letter a VIN never uses, naming its position", async () => {
    // ISO 3779 (S): 17 characters, letters I, O and Q never used.
    const { status, json } = await callRoute(createRoute, { user: manager, body: { fleetNumber: "MH-901", platformId: await platformId(), vin: "1G4AO59H45G118341" } });
    expect(status).toBe(422);
    const detail = (json as ErrorJson).error.details[0]!;
    expect(detail.field).toBe("vin");
    expect(detail.message).toContain("Position 5");
    // ISO 3779 (S): a VIN has 17 characters.
    const short = await callRoute(createRoute, { user: manager, body: { fleetNumber: "MH-901", platformId: await platformId(), vin: "1G4AH59H45G11834" } });
    expect(short.status).toBe(422);
    expect((short.json as ErrorJson).error.details[0]).toMatchObject({ field: "vin", message: expect.stringContaining("17 characters") });
    expect(await database.query.vehicles.findFirst({ where: eq(vehicles.fleetNumber, "MH-901") })).toBeUndefined();
  });

  it("accepts the published sample VIN and reports its check digit 4 as matching", async () => {
    const { status, json } = await callRoute(createRoute, {
      user: manager,
      body: { fleetNumber: "MH-902", platformId: await platformId(), vin: "1g4ah59h45g118341", registration: "1xy 902", odometerKm: "12,500", buildYear: "2024", registrationExpiry: "2027-03-31" },
    });
    expect(status).toBe(201);
    // 49 CFR 565 (S): 1G4AH59H45G118341 has weighted sum 411 and check digit 4.
    expect((json as { vinCheck: { checkDigit: { expected: string; matches: boolean } } }).vinCheck.checkDigit).toMatchObject({ expected: "4", actual: "4", matches: true });
    const row = await byFleet("MH-902");
    expect(row).toMatchObject({ vin: "1G4AH59H45G118341", registration: "1XY 902", odometerKm: 12500, buildYear: 2024, state: "in_service" });
    expect(row.registrationExpiry?.toISOString()).toBe("2027-03-31T00:00:00.000Z");
    const audit = await database.query.auditEntries.findFirst({ where: and(eq(auditEntries.entityId, row.id), eq(auditEntries.action, "vehicle.create")) });
    expect(audit?.actorId).toBe(manager.userId);
  });

  it("accepts a VIN whose check digit does not match, as information only", async () => {
    // 49 CFR 565 (S): the check digit of 1G4AH59H?5G118341 is 4, so 0 does not match; it is required only in North America.
    const { status, json } = await callRoute(createRoute, { user: manager, body: { fleetNumber: "MH-903", platformId: await platformId(), vin: "1G4AH59H05G118341" } });
    expect(status).toBe(201);
    const check = (json as { vinCheck: { checkDigit: { expected: string; actual: string; matches: boolean; note: string } } }).vinCheck.checkDigit;
    expect(check).toMatchObject({ expected: "4", actual: "0", matches: false });
    expect(check.note).toContain("not required outside North America");
  });

  it("refuses a fleet number or VIN already in the organisation, with a clear message on the field", async () => {
    const dupe = await callRoute(createRoute, { user: manager, body: { fleetNumber: "mh-001", platformId: await platformId() } });
    expect(dupe.status).toBe(409);
    expect((dupe.json as ErrorJson).error.details[0]).toEqual({ field: "fleetNumber", message: "Fleet number MH-001 is already used by another vehicle in this organisation" });
    const vin = await callRoute(createRoute, { user: manager, body: { fleetNumber: "MH-904", platformId: await platformId(), vin: "1G4AH59H45G118341" } });
    expect(vin.status).toBe(409);
    expect((vin.json as ErrorJson).error.details[0]).toEqual({ field: "vin", message: "This VIN is already recorded on MH-902" });
    // The other organisation may use the same fleet number.
    const other = await signedInAs(database, "manager@gidgee-trust.example");
    const theirPlatform = await database.query.platforms.findFirst({ where: eq(platforms.orgId, other.orgId) });
    expect((await callRoute(createRoute, { user: other, body: { fleetNumber: "MH-001", platformId: theirPlatform!.id } })).status).toBe(201);
  });

  it("refuses a platform, depot or driver from outside the organisation", async () => {
    const other = await signedInAs(database, "manager@gidgee-trust.example");
    const theirPlatform = await database.query.platforms.findFirst({ where: eq(platforms.orgId, other.orgId) });
    const theirDriver = await database.query.users.findFirst({ where: eq(users.email, "driver@gidgee-trust.example") });
    const { status, json } = await callRoute(createRoute, { user: manager, body: { fleetNumber: "MH-905", platformId: theirPlatform!.id, driverIds: [theirDriver!.id] } });
    expect(status).toBe(422);
    expect((json as ErrorJson).error.details.map((d) => d.field)).toEqual(["platformId", "driverIds"]);
  });

  it("edits with the version it was opened at, and refuses a stale version with 409", async () => {
    const v = await byFleet("MH-003");
    const driver2 = await database.query.users.findFirst({ where: eq(users.email, "driver2@mirrabel-health.example") });
    const first = await callRoute(patchVehicleRoute, {
      user: manager,
      method: "PATCH",
      params: { id: v.id },
      body: { version: v.version, odometerKm: 99_000, costCentre: "CC-TEST", state: "in_fitout", driverIds: [driver2!.id] },
    });
    expect(first.status).toBe(200);
    expect(first.json).toMatchObject({ version: v.version + 1 });
    const after = await byFleet("MH-003");
    expect(after).toMatchObject({ odometerKm: 99_000, costCentre: "CC-TEST", state: "in_fitout", registration: v.registration });
    const drivers = await database.select().from(vehicleDrivers).where(eq(vehicleDrivers.vehicleId, v.id));
    expect(drivers.map((d) => d.userId)).toEqual([driver2!.id]);
    const audit = await database.query.auditEntries.findFirst({ where: and(eq(auditEntries.entityId, v.id), eq(auditEntries.action, "vehicle.update")) });
    expect(audit?.before).toMatchObject({ odometerKm: v.odometerKm, state: "in_service" });
    expect(audit?.after).toMatchObject({ odometerKm: 99_000, state: "in_fitout", driverIds: [driver2!.id] });

    const stale = await callRoute(patchVehicleRoute, { user: manager, method: "PATCH", params: { id: v.id }, body: { version: v.version, odometerKm: 1 } });
    expect(stale.status).toBe(409);
    expect((stale.json as ErrorJson).error.message).toContain("changed by someone else since you opened it");
    expect((await byFleet("MH-003")).odometerKm).toBe(99_000);
  });

  it("refuses a bad VIN on edit with the position named, saving nothing", async () => {
    const v = await byFleet("MH-009");
    const { status, json } = await callRoute(patchVehicleRoute, { user: manager, method: "PATCH", params: { id: v.id }, body: { version: v.version, vin: "7RMQ0000000000001", odometerKm: 5 } });
    expect(status).toBe(422);
    expect((json as ErrorJson).error.details[0]).toMatchObject({ field: "vin", message: expect.stringContaining("Position 4") });
    expect(await byFleet("MH-009")).toMatchObject({ vin: v.vin, odometerKm: v.odometerKm, version: v.version });
  });
});

describe("grounding and returning to service", () => {
  async function failure(promise: Promise<unknown>): Promise<AppError> {
    try {
      await promise;
    } catch (error) {
      if (error instanceof AppError) return error;
      throw error;
    }
    throw new Error("expected a refusal");
  }

  it("grounds a vehicle with a reason and returns it to service with another, auditing both", async () => {
    const v = await byFleet("MH-010");
    await execute(groundVehicle, manager, { id: v.id, reason: "Cracked chassis rail found at service" });
    expect(await byFleet("MH-010")).toMatchObject({ state: "grounded", groundedReason: "Cracked chassis rail found at service" });
    expect((await failure(execute(groundVehicle, manager, { id: v.id, reason: "Again" }))).code).toBe("conflict");
    const noReason = await failure(execute(returnVehicleToService, manager, { id: v.id, reason: "" }));
    expect(noReason.code).toBe("validation_failed");
    expect(noReason.details[0]!.field).toBe("reason");
    await execute(returnVehicleToService, manager, { id: v.id, reason: "Rail plated and signed off by the engineer" });
    expect(await byFleet("MH-010")).toMatchObject({ state: "in_service", groundedReason: null });
    const entries = await database.select().from(auditEntries).where(eq(auditEntries.entityId, v.id));
    expect(entries.map((e) => [e.action, e.reason])).toEqual(
      expect.arrayContaining([
        ["vehicle.ground", "Cracked chassis rail found at service"],
        ["vehicle.return_to_service", "Rail plated and signed off by the engineer"],
      ]),
    );
    expect((await failure(execute(returnVehicleToService, manager, { id: v.id, reason: "Twice" }))).code).toBe("conflict");
  });

  it("does not let the edit form take a grounded vehicle back into service", async () => {
    const v = await byFleet("MH-008");
    const { status, json } = await callRoute(patchVehicleRoute, { user: manager, method: "PATCH", params: { id: v.id }, body: { version: v.version, state: "in_service" } });
    expect(status).toBe(409);
    expect((json as ErrorJson).error.details[0]!.field).toBe("state");
    expect((await byFleet("MH-008")).state).toBe("grounded");
  });

  it("refuses grounding to finance and drivers", async () => {
    const v = await byFleet("MH-014");
    for (const email of ["finance@mirrabel-health.example", "driver@mirrabel-health.example"]) {
      const error = await failure(execute(groundVehicle, await signedInAs(database, email), { id: v.id, reason: "Not mine to decide" }));
      expect(error.code, email).toBe("forbidden");
    }
  });
});
