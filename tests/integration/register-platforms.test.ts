import { and, eq } from "drizzle-orm";
import { describe, expect, it, vi } from "vitest";
import { GET as getPlatformRoute, PATCH as patchPlatformRoute } from "@/app/api/platforms/[id]/route";
import { GET as listPlatformsRoute, POST as createPlatformRoute } from "@/app/api/platforms/route";
import { auditEntries, platforms, vehicles } from "@/db/schema";
import { useTestDatabase } from "../helpers/db";
import { callRoute, requestUser } from "../helpers/route";
import { signedInAs } from "../helpers/users";

vi.mock("@/lib/server/session", async (original) => ({
  ...(await original<typeof import("@/lib/server/session")>()),
  currentUser: async () => requestUser.current,
}));

const database = await useTestDatabase();
const manager = await signedInAs(database, "manager@mirrabel-health.example");

/** An invented platform whose figures agree with each other. */
const sound = {
  make: "Quokka",
  model: "Ridgeback",
  variant: "wagon",
  kerbMassKg: 2150,
  kerbFrontKg: 1180,
  gvmKg: 3100,
  gcmKg: 5900,
  frontAxleRatingKg: 1350,
  rearAxleRatingKg: 1850,
  wheelbaseMm: 2900,
  rearOverhangMm: 1100,
  towingCapacityKg: 3000,
  towballLimitKg: 300,
  roofStaticKg: 240,
  roofDynamicKg: 80,
  standardTyreSize: "265/70R17",
  fuelCapacityL: 90,
  topSpeedKmh: 170,
};

type ErrorJson = { error: { code: string; message: string; details: { field?: string; message: string }[] } };
const fieldsOf = (json: unknown) => (json as ErrorJson).error.details.map((d) => d.field);

describe("platforms API", () => {
  it("creates a platform with every maker's figure and writes an audit entry", async () => {
    const { status, json } = await callRoute(createPlatformRoute, { user: manager, body: sound });
    expect(status).toBe(201);
    const id = (json as { id: string }).id;
    const row = await database.query.platforms.findFirst({ where: eq(platforms.id, id) });
    expect(row).toMatchObject({ ...sound, orgId: manager.orgId, ratingsMissing: false });
    const audit = await database.query.auditEntries.findFirst({ where: and(eq(auditEntries.entityId, id), eq(auditEntries.action, "platform.create")) });
    expect(audit?.actorId).toBe(manager.userId);
  });

  it("refuses axle ratings that together carry less than the GVM, naming both axle fields", async () => {
    const before = await database.select().from(platforms);
    const { status, json } = await callRoute(createPlatformRoute, {
      user: manager,
      body: { ...sound, model: "Ridgeback short", frontAxleRatingKg: 1300, rearAxleRatingKg: 1700 },
    });
    expect(status).toBe(422);
    expect(fieldsOf(json)).toEqual(["frontAxleRatingKg", "rearAxleRatingKg"]);
    expect((json as ErrorJson).error.details[0]!.message).toBe("The axle ratings add up to 3,000 kg, below the GVM of 3,100 kg");
    expect(await database.select().from(platforms)).toHaveLength(before.length);
  });

  it("refuses a GVM not above kerb, a GCM below GVM, non-positive masses and a bad tyre size", async () => {
    const cases: [Record<string, unknown>, string][] = [
      [{ gvmKg: 2150 }, "gvmKg"],
      [{ gcmKg: 3000 }, "gcmKg"],
      [{ kerbMassKg: 0 }, "kerbMassKg"],
      [{ rearAxleRatingKg: -5 }, "rearAxleRatingKg"],
      [{ standardTyreSize: "265/70X17" }, "standardTyreSize"],
      [{ gvmKg: "lots" }, "gvmKg"],
      [{ gvmKg: "" }, "gvmKg"],
    ];
    for (const [change, field] of cases) {
      const { status, json } = await callRoute(createPlatformRoute, { user: manager, body: { ...sound, model: "Odd one", ...change } });
      expect(status, JSON.stringify(change)).toBe(422);
      expect(fieldsOf(json), JSON.stringify(change)).toContain(field);
    }
  });

  it("refuses a second platform with the same make, model and variant with 409", async () => {
    const { status, json } = await callRoute(createPlatformRoute, { user: manager, body: sound });
    expect(status).toBe(409);
    expect(fieldsOf(json)).toEqual(["model"]);
  });

  it("lists platforms with how many vehicles use each", async () => {
    const { status, json } = await callRoute(listPlatformsRoute, { user: manager });
    expect(status).toBe(200);
    const items = (json as { items: { id: string; vehicleCount: number; make: string }[] }).items;
    const counted = await database.select({ platformId: vehicles.platformId }).from(vehicles).where(eq(vehicles.orgId, manager.orgId));
    for (const item of items) {
      expect(item.vehicleCount, item.make).toBe(counted.filter((v) => v.platformId === item.id).length);
    }
    // The demo fleet of 40 spread over four platforms, and the new one with none.
    expect(items.reduce((sum, i) => sum + i.vehicleCount, 0)).toBe(40);
    expect(items.find((i) => i.make === "Quokka")?.vehicleCount).toBe(0);
  });

  it("shows a driver only the platforms of their vehicles, and finance cannot create", async () => {
    const driver = await signedInAs(database, "driver@mirrabel-health.example");
    const { json } = await callRoute(listPlatformsRoute, { user: driver });
    const items = (json as { items: { vehicleCount: number }[] }).items;
    expect(items.length).toBeGreaterThan(0);
    expect(items.every((i) => i.vehicleCount > 0)).toBe(true);
    const quokka = await database.query.platforms.findFirst({ where: eq(platforms.make, "Quokka") });
    expect((await callRoute(getPlatformRoute, { user: driver, params: { id: quokka!.id } })).status).toBe(404);
    const finance = await signedInAs(database, "finance@mirrabel-health.example");
    expect((await callRoute(createPlatformRoute, { user: finance, body: { ...sound, model: "Finance" } })).status).toBe(403);
    expect((await callRoute(patchPlatformRoute, { user: finance, params: { id: quokka!.id }, method: "PATCH", body: { gvmKg: 3200 } })).status).toBe(403);
  });

  it("answers 404 for another organisation's platform", async () => {
    const other = await signedInAs(database, "manager@gidgee-trust.example");
    const quokka = await database.query.platforms.findFirst({ where: eq(platforms.make, "Quokka") });
    expect((await callRoute(getPlatformRoute, { user: other, params: { id: quokka!.id } })).status).toBe(404);
    expect((await callRoute(patchPlatformRoute, { user: other, params: { id: quokka!.id }, method: "PATCH", body: { gvmKg: 3200 } })).status).toBe(404);
  });

  it("keeps the ratings-missing flag until every rating is entered, then clears it", async () => {
    const [imported] = await database
      .insert(platforms)
      .values({ orgId: manager.orgId, make: "Bilby", model: "Scout", variant: "", ratingsMissing: true })
      .returning();
    const read = await callRoute(getPlatformRoute, { user: manager, params: { id: imported!.id } });
    expect((read.json as { missingRatings: string[] }).missingRatings).toEqual([
      "kerbMassKg",
      "gvmKg",
      "gcmKg",
      "frontAxleRatingKg",
      "rearAxleRatingKg",
      "wheelbaseMm",
    ]);
    const partial = await callRoute(patchPlatformRoute, { user: manager, method: "PATCH", params: { id: imported!.id }, body: { kerbMassKg: 2000, gvmKg: 2900 } });
    expect(partial.status).toBe(200);
    expect(partial.json).toMatchObject({ ratingsMissing: true, ratingsCompleted: false });
    const done = await callRoute(patchPlatformRoute, {
      user: manager,
      method: "PATCH",
      params: { id: imported!.id },
      body: { gcmKg: "5,500", frontAxleRatingKg: 1300, rearAxleRatingKg: 1700, wheelbaseMm: 2750 },
    });
    expect(done.status).toBe(200);
    expect(done.json).toMatchObject({ ratingsMissing: false, ratingsCompleted: true });
    const row = await database.query.platforms.findFirst({ where: eq(platforms.id, imported!.id) });
    expect(row).toMatchObject({ ratingsMissing: false, gcmKg: 5500, kerbMassKg: 2000 });
    const audit = await database.query.auditEntries.findFirst({ where: and(eq(auditEntries.entityId, imported!.id), eq(auditEntries.action, "platform.update")) });
    expect(audit).toBeTruthy();
  });

  it("does not let a complete platform lose a rating, and names the cleared field", async () => {
    const quokka = await database.query.platforms.findFirst({ where: eq(platforms.make, "Quokka") });
    const { status, json } = await callRoute(patchPlatformRoute, { user: manager, method: "PATCH", params: { id: quokka!.id }, body: { gcmKg: null } });
    expect(status).toBe(422);
    expect(fieldsOf(json)).toEqual(["gcmKg"]);
  });

  it("stores the tyre size in its standard writing", async () => {
    const quokka = await database.query.platforms.findFirst({ where: eq(platforms.make, "Quokka") });
    const { status } = await callRoute(patchPlatformRoute, { user: manager, method: "PATCH", params: { id: quokka!.id }, body: { standardTyreSize: "lt285/75r16" } });
    expect(status).toBe(200);
    const row = await database.query.platforms.findFirst({ where: eq(platforms.id, quokka!.id) });
    expect(row?.standardTyreSize).toBe("LT285/75R16");
  });
});
