import { eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { clearRegisterPages } from "@/db/register-cache";
import { editionLines, editions, fitments, standards, vehicles } from "@/db/schema";
import { listVehicles } from "@/lib/commands/vehicles";
import { execute } from "@/lib/server/operation";
import { statementsDuring as statementsSent, useTestDatabase } from "../helpers/db";
import { signedInAs } from "../helpers/users";

const database = await useTestDatabase();
const manager = await signedInAs(database, "manager@mirrabel-health.example");

beforeAll(async () => {
  // Every vehicle of the organisation on one invented edition; every other one carries the kit.
  const [standard] = await database.insert(standards).values({ orgId: manager.orgId, name: "Batch test standard" }).returning();
  const [edition] = await database
    .insert(editions)
    .values({ orgId: manager.orgId, standardId: standard!.id, number: 1, status: "published", publishedAt: new Date() })
    .returning();
  await database.insert(editionLines).values({
    orgId: manager.orgId,
    editionId: edition!.id,
    key: "batch-first-aid",
    code: "S1",
    category: "safety",
    title: "First-aid kit",
    requirement: "must_fit",
    massKg: 3,
  });
  await database.update(vehicles).set({ editionId: edition!.id }).where(eq(vehicles.orgId, manager.orgId));
  const all = await database.select({ id: vehicles.id, fleetNumber: vehicles.fleetNumber }).from(vehicles).where(eq(vehicles.orgId, manager.orgId));
  const carrying = all.filter((_, i) => i % 2 === 0);
  await database.insert(fitments).values(
    carrying.map((v) => ({ orgId: manager.orgId, vehicleId: v.id, lineKey: "batch-first-aid", label: "First-aid kit", fittedAt: new Date(Date.now() - 3_600_000) })),
  );
});

/** Statements sent to the database while `run` runs, computing every page afresh. */
async function statementsDuring(run: () => Promise<unknown>): Promise<number> {
  clearRegisterPages(database);
  return statementsSent(database, run);
}

describe("the register reads variance in one batch per page", () => {
  it("sends the same number of statements for a page of 5 as for a page of 40", async () => {
    const small = await statementsDuring(() => execute(listVehicles, manager, { pageSize: "5" }));
    const large = await statementsDuring(() => execute(listVehicles, manager, { pageSize: "40" }));
    expect(small).toBeGreaterThan(0);
    expect(large).toBe(small);
  });

  it("filters by variance status over the whole fleet with a fixed number of statements", async () => {
    let gaps: Awaited<ReturnType<typeof listVehicles.run>> | undefined;
    const filtered = await statementsDuring(async () => {
      gaps = await execute(listVehicles, manager, { variance: "gaps", pageSize: "5" });
    });
    const unfiltered = await statementsDuring(() => execute(listVehicles, manager, { pageSize: "5" }));
    expect(gaps!.total).toBe(20);
    expect(gaps!.items.every((i) => i.variance === "gaps")).toBe(true);
    const meets = await execute(listVehicles, manager, { variance: "meets_standard", pageSize: "100" });
    expect(meets.total).toBe(20);
    expect(filtered).toBeLessThanOrEqual(unfiltered + 1);
  });
});
