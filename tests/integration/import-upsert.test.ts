import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { and, eq } from "drizzle-orm";
import { afterAll, describe, expect, it, vi } from "vitest";
import { POST as importRoute } from "@/app/api/vehicles/import/route";
import { auditEntries, depots, platforms, vehicles } from "@/db/schema";
import type { ImportResult } from "@/lib/commands/imports";
import { diskStorage, setStorageForTests } from "@/lib/server/storage";
import type { SignedIn } from "@/lib/server/session";
import { useTestDatabase } from "../helpers/db";
import { callRoute, requestUser } from "../helpers/route";
import { signedInAs } from "../helpers/users";

vi.mock("@/lib/server/session", async (original) => ({
  ...(await original<typeof import("@/lib/server/session")>()),
  currentUser: async () => requestUser.current,
}));

const database = await useTestDatabase();
const filesDir = mkdtempSync(join(tmpdir(), "rigline-import-upsert-"));
setStorageForTests(diskStorage(filesDir));
afterAll(() => {
  setStorageForTests(undefined);
  rmSync(filesDir, { recursive: true, force: true });
});

const manager = await signedInAs(database, "manager@mirrabel-health.example");
const otherManager = await signedInAs(database, "manager@gidgee-trust.example");

const csv = (lines: string[]) => Buffer.from(lines.join("\n") + "\n", "utf8");

async function upload(bytes: Buffer, fields: Record<string, string>, user: SignedIn = manager) {
  const body = new FormData();
  body.set("file", new File([new Uint8Array(bytes)], "register.csv"));
  for (const [name, value] of Object.entries(fields)) body.set(name, value);
  const { status, json } = await callRoute(importRoute, { user, body, url: "http://localhost/api/vehicles/import" });
  return { status, result: json as ImportResult };
}

async function vehicleByFleet(fleetNumber: string, orgId = manager.orgId) {
  const [row] = await database
    .select({ vehicle: vehicles, platform: platforms, depot: depots })
    .from(vehicles)
    .innerJoin(platforms, eq(platforms.id, vehicles.platformId))
    .leftJoin(depots, eq(depots.id, vehicles.depotId))
    .where(and(eq(vehicles.orgId, orgId), eq(vehicles.fleetNumber, fleetNumber)));
  return row;
}

describe("upsert into the seeded register", () => {
  it("updates a vehicle found by fleet number, listing each change, and bumps its version", async () => {
    const before = (await vehicleByFleet("MH-001"))!;
    const file = csv(["Fleet number,Odometer (km),Cost centre", `MH-001,${before.vehicle.odometerKm! + 1500},CC-NEW-01`]);
    const dry = await upload(file, { dryRun: "1" });
    expect(dry.result.rows).toEqual([
      {
        row: 2,
        action: "update",
        fleetNumber: "MH-001",
        vehicleId: before.vehicle.id,
        changes: [
          { field: "costCentre", label: "Cost centre", before: before.vehicle.costCentre, after: "CC-NEW-01" },
          { field: "odometerKm", label: "Odometer", before: before.vehicle.odometerKm, after: before.vehicle.odometerKm! + 1500 },
        ],
        warnings: [],
      },
    ]);
    const { result } = await upload(file, { mode: "good_rows" });
    expect([result.created, result.updated, result.unchanged]).toEqual([0, 1, 0]);
    const after = (await vehicleByFleet("MH-001"))!;
    expect(after.vehicle).toMatchObject({ odometerKm: before.vehicle.odometerKm! + 1500, costCentre: "CC-NEW-01", version: before.vehicle.version + 1 });
    // Unnamed columns keep their stored values: an empty cell never clears anything.
    expect(after.vehicle.vin).toBe(before.vehicle.vin);
    expect(after.vehicle.registration).toBe(before.vehicle.registration);
    const [entry] = await database
      .select()
      .from(auditEntries)
      .where(and(eq(auditEntries.entityId, before.vehicle.id), eq(auditEntries.action, "vehicle.update")));
    expect(entry).toMatchObject({
      actorId: manager.userId,
      reason: "Imported from register.csv",
      before: { costCentre: before.vehicle.costCentre, odometerKm: before.vehicle.odometerKm },
      after: { costCentre: "CC-NEW-01", odometerKm: before.vehicle.odometerKm! + 1500 },
    });
  });

  it("finds a vehicle by VIN first, so a new fleet number renumbers it (with a warning)", async () => {
    const before = (await vehicleByFleet("MH-002"))!;
    const file = csv(["Fleet number,VIN", `MH-902,${before.vehicle.vin!.toLowerCase()}`]);
    const { result } = await upload(file, { mode: "good_rows" });
    expect(result.rows[0]).toMatchObject({ action: "update", vehicleId: before.vehicle.id, warnings: ["Fleet number changes from MH-002 to MH-902"] });
    expect((await vehicleByFleet("MH-902"))!.vehicle.id).toBe(before.vehicle.id);
    expect(await vehicleByFleet("MH-002")).toBeUndefined();
  });

  it("matches depots by code or by name, ignoring case; an unknown depot is a row error naming the value", async () => {
    const file = csv([
      "Fleet number,Depot",
      "MH-003,spc",
      "MH-004,salt pan creek",
      "MH-005,Quartz Hill",
    ]);
    const { result } = await upload(file, { mode: "good_rows" });
    expect(result.errors).toEqual([
      { row: 4, column: "Depot", message: 'Depot "Quartz Hill" is not a depot of this organisation (by name or code); correct the cell or have the depot added under Depots' },
    ]);
    expect((await vehicleByFleet("MH-003"))!.depot!.code).toBe("SPC");
    expect((await vehicleByFleet("MH-004"))!.depot!.code).toBe("SPC");
    // Depot changes read as names in the outcome, not ids.
    const mh3 = result.rows.find((r) => r.fleetNumber === "MH-003");
    expect(mh3?.changes.find((c) => c.field === "depot")?.after).toBe("Salt Pan Creek (SPC)");
  });

  it("never reaches another organisation's depots or vehicles", async () => {
    const file = csv(["Fleet number,Depot,Make,Model", "MH-006,BWX,Corvane,Trailhand 79"]);
    const { result } = await upload(file, { dryRun: "1" });
    expect(result.errors.map((e) => e.message)).toEqual([
      'Depot "BWX" is not a depot of this organisation (by name or code); correct the cell or have the depot added under Depots',
    ]);
    // The other organisation importing MH-007 creates its own vehicle; ours is untouched.
    const ours = (await vehicleByFleet("MH-007"))!;
    const theirs = await upload(csv(["Fleet number,Make,Model,Odometer (km)", "MH-007,Corvane,Trailhand 79,5"]), { mode: "good_rows" }, otherManager);
    expect(theirs.result.created).toBe(1);
    expect((await vehicleByFleet("MH-007"))!.vehicle).toEqual(ours.vehicle);
    expect((await vehicleByFleet("MH-007", otherManager.orgId))!.vehicle.odometerKm).toBe(5);
  });

  it("a make and model nobody has yet creates a platform marked ratings missing", async () => {
    const file = csv([
      "Fleet number,Make,Model,Variant,GVM (kg),Kerb mass (kg)",
      "NX-001,Tjilpa,Ridgeback 5,Cab chassis,3400,2150",
      "NX-002,TJILPA,ridgeback 5,cab chassis,,",
    ]);
    const dry = await upload(file, { dryRun: "1" });
    expect(dry.result.newPlatforms).toEqual([
      {
        make: "Tjilpa",
        model: "Ridgeback 5",
        variant: "Cab chassis",
        rowNumbers: [2, 3],
        ratings: { kerbMassKg: 2150, gvmKg: 3400, frontAxleRatingKg: null, rearAxleRatingKg: null },
        missingRatings: ["frontAxleRatingKg", "rearAxleRatingKg"],
        ratingsMissing: true,
      },
    ]);
    const { result } = await upload(file, { mode: "good_rows" });
    expect(result.created).toBe(2);
    const one = (await vehicleByFleet("NX-001"))!;
    const two = (await vehicleByFleet("NX-002"))!;
    // One platform for both spellings (case ignored).
    expect(two.platform.id).toBe(one.platform.id);
    expect(one.platform).toMatchObject({ make: "Tjilpa", model: "Ridgeback 5", variant: "Cab chassis", gvmKg: 3400, kerbMassKg: 2150, frontAxleRatingKg: null, ratingsMissing: true });
    expect(await database.$count(platforms, and(eq(platforms.orgId, manager.orgId), eq(platforms.make, "Tjilpa")))).toBe(1);
  });

  it("a known make and model reuses the existing platform and leaves its ratings alone", async () => {
    const file = csv(["Fleet number,Make,Model,Variant,GVM (kg)", "NX-010,corvane,TRAILHAND 79,Single cab chassis,9999"]);
    const { result } = await upload(file, { mode: "good_rows" });
    expect(result.newPlatforms).toEqual([]);
    const row = (await vehicleByFleet("NX-010"))!;
    expect(row.platform).toMatchObject({ make: "Corvane", model: "Trailhand 79", gvmKg: 3510, ratingsMissing: false });
  });

  it("changing the model of an existing vehicle moves it to that platform", async () => {
    const file = csv(["Fleet number,Make,Model,Variant", "NX-010,Marrak,Outback 300,wagon"]);
    const { result } = await upload(file, { mode: "good_rows" });
    expect(result.updated).toBe(1);
    expect((await vehicleByFleet("NX-010"))!.platform).toMatchObject({ make: "Marrak", model: "Outback 300", ratingsMissing: false });
  });

  it("a new vehicle without make or model is a row error: it would have no platform", async () => {
    const { result } = await upload(csv(["Fleet number,Registration", "NX-020,1ZZ-001"]), { dryRun: "1" });
    expect(result.errors).toEqual([
      { row: 2, column: "Make", message: "Fleet number NX-020 is new, and a new vehicle needs its make and model (they name its platform)" },
    ]);
    expect(result.valid).toBe(0);
  });

  it("returns a grounded vehicle to service only from its page, and a retired one stays retired", async () => {
    const grounded = (await vehicleByFleet("MH-008"))!;
    const retired = (await vehicleByFleet("MH-040"))!;
    expect([grounded.vehicle.state, retired.vehicle.state]).toEqual(["grounded", "retired"]);
    const file = csv(["Fleet number,Status,Odometer (km)", "MH-008,in service,", "MH-040,active,", "MH-009,grounded,"]);
    const { result } = await upload(file, { mode: "good_rows" });
    expect(result.errors).toEqual([
      { row: 2, column: "Status", message: "Vehicle MH-008 is grounded; return it to service from its page, where the reason is recorded" },
      { row: 3, column: "Status", message: "Vehicle MH-040 is retired and stays retired" },
    ]);
    expect((await vehicleByFleet("MH-008"))!.vehicle.state).toBe("grounded");
    const nine = (await vehicleByFleet("MH-009"))!.vehicle;
    expect(nine.state).toBe("grounded");
    expect(nine.groundedReason).toBe("Grounded in the imported register (register.csv)");
  });

  it("a VIN already on another vehicle is a row error, not a second vehicle", async () => {
    const mh10 = (await vehicleByFleet("MH-010"))!;
    const { result } = await upload(csv(["Fleet number,VIN", `MH-011,${mh10.vehicle.vin}`]), { dryRun: "1" });
    expect(result.errors).toEqual([
      { row: 2, column: "Fleet number", message: `VIN ${mh10.vehicle.vin} is vehicle MH-010, but fleet number MH-011 is another vehicle; correct one of them` },
    ]);
  });
});
