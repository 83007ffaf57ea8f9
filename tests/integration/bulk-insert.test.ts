import { eq } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { insertMany } from "@/db/bulk-insert";
import { auditEntries, organisations, platforms, vehicles } from "@/db/schema";
import { useTestDatabase } from "../helpers/db";

const database = await useTestDatabase({ seed: false });

const [org] = await database.insert(organisations).values({ name: "Bulk Test Fleet", slug: "bulk-test" }).returning();
const orgId = org!.id;

/** Reads rows back without the columns each insert fills by itself. */
const strip = <T extends { id: string; createdAt?: Date; updatedAt?: Date; at?: Date }>(rows: T[]) =>
  rows.map(({ id: _id, createdAt: _c, updatedAt: _u, at: _a, ...rest }) => rest);

describe("insertMany (one JSON parameter per statement)", () => {
  it("stores exactly what Drizzle's own insert stores: timestamps, booleans, JSON, SQL defaults and nulls", async () => {
    const [platform] = await database.insert(platforms).values({ orgId, make: "Testmake", model: "Base", ratingsMissing: true }).returning();
    const rows = (prefix: string) =>
      [0, 1, 2].map((i) => ({
        orgId,
        fleetNumber: `${prefix}-${i}`,
        vin: i === 1 ? null : `VIN${prefix}${i}`,
        registration: `R${prefix}${i}`,
        registrationExpiry: new Date(Date.UTC(2027, i, 15)),
        platformId: platform!.id,
        odometerKm: 1000 * i,
        notes: i === 2 ? 'quoted "text", commas, and\na line break' : null,
      }));
    await database.insert(vehicles).values(rows("D"));
    await insertMany(database, vehicles, rows("B"));

    const byPrefix = async (prefix: string) =>
      strip((await database.select().from(vehicles).where(eq(vehicles.orgId, orgId))).filter((v) => v.fleetNumber.startsWith(prefix)))
        .map((v) => ({ ...v, fleetNumber: v.fleetNumber.slice(1), vin: v.vin?.replace(/^VIN./, "VIN") ?? null, registration: v.registration!.slice(2) }))
        .sort((a, b) => a.fleetNumber.localeCompare(b.fleetNumber));
    const viaDrizzle = await byPrefix("D");
    const viaBulk = await byPrefix("B");
    expect(viaBulk).toEqual(viaDrizzle);
    // The SQL defaults applied (state, version) and the JavaScript ones (ids, times) were made per row.
    expect(viaBulk.map((v) => [v.state, v.version])).toEqual([["in_service", 1], ["in_service", 1], ["in_service", 1]]);
    const ids = (await database.select({ id: vehicles.id }).from(vehicles)).map((v) => v.id);
    expect(new Set(ids).size).toBe(ids.length);
  });

  it("round-trips JSON columns", async () => {
    const after = { nested: { list: [1, "two", null] }, text: "a \"quoted\" value" };
    await insertMany(database, auditEntries, [{ orgId, action: "bulk.test", entityType: "vehicle", entityId: "x", before: null, after, reason: "test" }]);
    const [row] = await database.select().from(auditEntries).where(eq(auditEntries.action, "bulk.test"));
    expect(row!.after).toEqual(after);
    expect(row!.before).toBeNull();
    expect(row!.at).toBeInstanceOf(Date);
  });

  it("inserts more rows than one statement carries, and nothing for an empty list", async () => {
    const [platform] = await database.insert(platforms).values({ orgId, make: "Testmake", model: "Many" }).returning();
    await insertMany(database, vehicles, []);
    await insertMany(
      database,
      vehicles,
      Array.from({ length: 12_000 }, (_, i) => ({ orgId, fleetNumber: `M-${i}`, platformId: platform!.id })),
    );
    const count = (await database.select({ id: vehicles.id }).from(vehicles).where(eq(vehicles.platformId, platform!.id))).length;
    expect(count).toBe(12_000);
  });

  it("refuses a row that leaves out a column with an SQL default which the first row gives", async () => {
    const [platform] = await database.insert(platforms).values({ orgId, make: "Testmake", model: "Refuse" }).returning();
    await expect(
      insertMany(database, vehicles, [
        { orgId, fleetNumber: "S-1", platformId: platform!.id, state: "grounded" },
        { orgId, fleetNumber: "S-2", platformId: platform!.id },
      ]),
    ).rejects.toThrow(/row 1 lacks state/);
  });

  it("keeps a value that only a later row gives (the first row's columns are not the whole list)", async () => {
    const [platform] = await database.insert(platforms).values({ orgId, make: "Testmake", model: "Later" }).returning();
    await insertMany(database, vehicles, [
      { orgId, fleetNumber: "L-1", platformId: platform!.id },
      { orgId, fleetNumber: "L-2", platformId: platform!.id, notes: "only the second row has notes", odometerKm: 1234 },
    ]);
    const stored = await database.select().from(vehicles).where(eq(vehicles.platformId, platform!.id));
    const byFleet = new Map(stored.map((v) => [v.fleetNumber, v]));
    expect(byFleet.get("L-1")).toMatchObject({ notes: null, odometerKm: null, state: "in_service" });
    expect(byFleet.get("L-2")).toMatchObject({ notes: "only the second row has notes", odometerKm: 1234, state: "in_service" });
  });

  it("inserts all or nothing inside a transaction", async () => {
    const [platform] = await database.insert(platforms).values({ orgId, make: "Testmake", model: "Atomic" }).returning();
    await expect(
      database.transaction(async (tx) => {
        // The second row repeats a fleet number: the unique index refuses the statement.
        await insertMany(tx, vehicles, [
          { orgId, fleetNumber: "A-1", platformId: platform!.id },
          { orgId, fleetNumber: "A-1", platformId: platform!.id },
        ]);
      }),
    ).rejects.toThrow();
    const left = await database.select().from(vehicles).where(eq(vehicles.platformId, platform!.id));
    expect(left).toHaveLength(0);
  });
});
